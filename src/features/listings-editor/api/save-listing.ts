import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ListingInput, SellerListing } from '../../../../shared/schemas/listing.ts';
import { api } from '../../../lib/api-client.ts';
import { sellerListingKeys } from './keys.ts';

export async function createListing(input: ListingInput): Promise<SellerListing> {
  return (await api.post<{ listing: SellerListing }>('/api/seller/listings', input)).listing;
}

export async function updateListing({ id, input }: { id: string; input: ListingInput }): Promise<SellerListing> {
  return (await api.put<{ listing: SellerListing }>(`/api/seller/listings/${encodeURIComponent(id)}`, input)).listing;
}

export function useCreateListing() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createListing,
    onSuccess: (l) => {
      queryClient.setQueryData(sellerListingKeys.detail(l.id), l);
      void queryClient.invalidateQueries({ queryKey: sellerListingKeys.all });
    },
  });
}

export function useUpdateListing() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateListing,
    onSuccess: (l) => {
      queryClient.setQueryData(sellerListingKeys.detail(l.id), l);
      void queryClient.invalidateQueries({ queryKey: sellerListingKeys.all });
    },
  });
}
