import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ListingPage } from '../../../../shared/schemas/catalog.ts';
import { api } from '../../../lib/api-client.ts';
import { catalogKeys } from './keys.ts';

/** GET /api/listings/:slug: the approved copy of a live listing (404 for anything else). */
export async function getListing(slug: string, signal?: AbortSignal): Promise<ListingPage> {
  return api.get<ListingPage>(`/api/listings/${encodeURIComponent(slug)}`, { signal });
}

export const getListingQueryOptions = (slug: string) => queryOptions({ queryKey: catalogKeys.listing(slug), queryFn: ({ signal }) => getListing(slug, signal) });

export function useListing(slug: string) {
  return useQuery(getListingQueryOptions(slug));
}
