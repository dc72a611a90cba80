import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SellerListing } from '../../../../shared/schemas/listing.ts';
import { api } from '../../../lib/api-client.ts';
import { sellerListingKeys } from './keys.ts';

export async function getSellerListing(id: string, signal?: AbortSignal): Promise<SellerListing> {
  return (await api.get<{ listing: SellerListing }>(`/api/seller/listings/${encodeURIComponent(id)}`, { signal })).listing;
}

export const getSellerListingQueryOptions = (id: string) => queryOptions({ queryKey: sellerListingKeys.detail(id), queryFn: ({ signal }) => getSellerListing(id, signal) });

export function useSellerListing(id: string | undefined) {
  return useQuery({ ...getSellerListingQueryOptions(id ?? ''), enabled: Boolean(id) });
}
