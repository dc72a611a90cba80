import type { PageInput } from '../../../../shared/schemas/pagination.ts';

export type MaterialFilters = { archived?: boolean };

export const materialKeys = {
  all: ['materials'] as const,
  list: (filters: MaterialFilters & PageInput = {}) => [...materialKeys.all, 'list', { ...filters, page: filters.page ?? 1 }] as const,
  /** every page at once (the listing editor's pickers) */
  every: (filters: MaterialFilters = {}) => [...materialKeys.all, 'every', filters] as const,
};
