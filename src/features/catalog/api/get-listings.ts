import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { type CatalogPage, catalogPageSchema } from '../../../../shared/schemas/catalog.ts';
import { api } from '../../../lib/api-client.ts';
import { type CatalogFilters, catalogKeys } from './keys.ts';

function toQueryString(filters: CatalogFilters): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filters)) if (value !== undefined && value !== '') params.set(key, String(value));
  const qs = params.toString();
  return qs ? `?${qs}` : '';
}

/** GET /api/listings: live listings of live shops, filtered, sorted and paged by the server. */
export async function getListings(filters: CatalogFilters, signal?: AbortSignal): Promise<CatalogPage> {
  return catalogPageSchema.parse(await api.get<unknown>(`/api/listings${toQueryString(filters)}`, { signal }));
}

export const getListingsQueryOptions = (filters: CatalogFilters) =>
  queryOptions({
    queryKey: catalogKeys.list(filters),
    queryFn: ({ signal }) => getListings(filters, signal),
    // keep the last page on screen while the next one loads, so the grid doesn't flash empty
    placeholderData: keepPreviousData,
  });

export function useListings(filters: CatalogFilters) {
  return useQuery(getListingsQueryOptions(filters));
}
