import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { SellerListing } from '../../../../shared/schemas/listing.ts';
import { type Page, pageSearch } from '../../../../shared/schemas/pagination.ts';
import { api } from '../../../lib/api-client.ts';
import { type SellerListingsFilters, sellerListingKeys } from './keys.ts';

/** GET /api/seller/listings: one page of the shop's listings, last changed first. */
export async function getSellerListings(filters: SellerListingsFilters, signal?: AbortSignal): Promise<Page<SellerListing>> {
  const params = pageSearch(filters);
  if (filters.state) params.set('state', filters.state);
  const qs = params.toString();
  return api.get<Page<SellerListing>>(`/api/seller/listings${qs ? `?${qs}` : ''}`, { signal });
}

export const getSellerListingsQueryOptions = (filters: SellerListingsFilters = {}) =>
  queryOptions({ queryKey: sellerListingKeys.list(filters), queryFn: ({ signal }) => getSellerListings(filters, signal), placeholderData: keepPreviousData });

export function useSellerListings(filters: SellerListingsFilters = {}) {
  return useQuery(getSellerListingsQueryOptions(filters));
}
