import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SellerListing } from '../../../../shared/schemas/listing.ts';
import { api } from '../../../lib/api-client.ts';
import { sellerListingKeys } from './keys.ts';

export async function getSellerListings(filters: { state?: string }, signal?: AbortSignal): Promise<SellerListing[]> {
  const qs = filters.state ? `?state=${encodeURIComponent(filters.state)}` : '';
  return (await api.get<{ listings: SellerListing[] }>(`/api/seller/listings${qs}`, { signal })).listings;
}

export const getSellerListingsQueryOptions = (filters: { state?: string } = {}) =>
  queryOptions({ queryKey: sellerListingKeys.list(filters), queryFn: ({ signal }) => getSellerListings(filters, signal) });

export function useSellerListings(filters: { state?: string } = {}) {
  return useQuery(getSellerListingsQueryOptions(filters));
}
