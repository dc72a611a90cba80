import type { CatalogQuery } from '../../../../shared/schemas/catalog.ts';

export type CatalogFilters = Partial<CatalogQuery>;

export const catalogKeys = {
  all: ['catalog'] as const,
  lists: () => [...catalogKeys.all, 'list'] as const,
  list: (filters: CatalogFilters) => [...catalogKeys.lists(), filters] as const,
  listing: (slug: string) => [...catalogKeys.all, 'listing', slug] as const,
  shop: (slug: string) => [...catalogKeys.all, 'shop', slug] as const,
};
