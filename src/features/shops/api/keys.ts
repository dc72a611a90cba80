export const shopKeys = {
  all: ['shops'] as const,
  detail: (slug: string) => [...shopKeys.all, 'detail', slug] as const,
};
