import type { PageInput } from '../../../../shared/schemas/pagination.ts';

export const orderKeys = {
  all: ['orders'] as const,
  lists: () => [...orderKeys.all, 'list'] as const,
  list: (p: PageInput = {}) => [...orderKeys.lists(), { page: p.page ?? 1, limit: p.limit ?? null }] as const,
  detail: (id: string) => [...orderKeys.all, 'detail', id] as const,
};
