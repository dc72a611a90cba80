import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SellerListing } from '../../../../shared/schemas/listing.ts';
import { api } from '../../../lib/api-client.ts';
import { sellerListingKeys } from './keys.ts';

export type ListingAction = 'submit' | 'pause' | 'unpause';

/** POST /api/seller/listings/:id/(submit|pause|unpause) */
export async function runListingAction({ id, action }: { id: string; action: ListingAction }): Promise<SellerListing> {
  return (await api.post<{ listing: SellerListing }>(`/api/seller/listings/${encodeURIComponent(id)}/${action}`)).listing;
}

export function useListingAction() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: runListingAction,
    onSuccess: (l) => {
      queryClient.setQueryData(sellerListingKeys.detail(l.id), l);
      void queryClient.invalidateQueries({ queryKey: sellerListingKeys.all });
    },
  });
}

export async function deleteListing(id: string): Promise<{ deleted: boolean }> {
  return api.delete<{ deleted: boolean }>(`/api/seller/listings/${encodeURIComponent(id)}`);
}

export function useDeleteListing() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: deleteListing, onSuccess: () => queryClient.invalidateQueries({ queryKey: sellerListingKeys.all }) });
}
