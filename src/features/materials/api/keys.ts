export const materialKeys = {
  all: ['materials'] as const,
  list: (filters: { archived?: boolean } = {}) => [...materialKeys.all, 'list', filters] as const,
};
