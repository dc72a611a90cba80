import type { PageInput } from '../../../../shared/schemas/pagination.ts';

export const mailKeys = {
  all: ['mail'] as const,
  lists: () => [...mailKeys.all, 'list'] as const,
  list: (p: PageInput = {}) => [...mailKeys.lists(), { page: p.page ?? 1, limit: p.limit ?? null }] as const,
  detail: (id: string) => [...mailKeys.all, 'detail', id] as const,
};
