export const mailKeys = {
  all: ['mail'] as const,
  list: () => [...mailKeys.all, 'list'] as const,
  detail: (id: string) => [...mailKeys.all, 'detail', id] as const,
};
