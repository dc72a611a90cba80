import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Cart } from '../../../../shared/schemas/cart.ts';
import type { DiscountCodeValues, DiscountsView, ListingDelivery, OrderByDate, OrderByDateInput } from '../../../../shared/schemas/offers.ts';
import { api } from '../../../lib/api-client.ts';

export const offersKeys = {
  all: ['offers'] as const,
  listing: (slug: string, neededBy: string | null) => [...offersKeys.all, 'listing', slug, neededBy ?? ''] as const,
  discounts: () => [...offersKeys.all, 'discounts'] as const,
  delivery: () => [...offersKeys.all, 'delivery'] as const,
};

const shopPath = (shopId: string) => `/api/cart/shops/${encodeURIComponent(shopId)}`;

// ---------------------------------------------------------------- the shopper's cart (the route refreshes the cart with `onCart`)

export const applyCode = ({ shopId, code }: { shopId: string; code: string }) => api.post<Cart>(`${shopPath(shopId)}/code`, { code });
export const removeCode = (shopId: string) => api.delete<Cart>(`${shopPath(shopId)}/code`);
export const putNeededBy = ({ shopId, neededBy }: { shopId: string; neededBy: string | null }) => api.put<Cart>(`${shopPath(shopId)}/needed-by`, { neededBy });

// ---------------------------------------------------------------- the listing page

export const listingDeliveryQuery = (slug: string, neededBy: string | null) =>
  queryOptions({
    queryKey: offersKeys.listing(slug, neededBy),
    queryFn: ({ signal }) => api.get<ListingDelivery>(`/api/offers/listings/${encodeURIComponent(slug)}/delivery${neededBy ? `?neededBy=${neededBy}` : ''}`, { signal }),
    staleTime: 60_000,
  });
export const useListingDelivery = (slug: string, neededBy: string | null) => useQuery(listingDeliveryQuery(slug, neededBy));

// ---------------------------------------------------------------- the seller's codes and dates

export const useDiscounts = () => useQuery({ queryKey: offersKeys.discounts(), queryFn: ({ signal }) => api.get<DiscountsView>('/api/seller/offers/discounts', { signal }) });

export type DeliverySettings = { shippingDays: number; processingDays: number; orderBy: OrderByDate[] };
export const useDeliverySettings = () => useQuery({ queryKey: offersKeys.delivery(), queryFn: ({ signal }) => api.get<DeliverySettings>('/api/seller/offers/delivery', { signal }) });

function useOffersMutation<I, O>(fn: (input: I) => Promise<O>) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: fn, onSuccess: () => qc.invalidateQueries({ queryKey: offersKeys.all }) });
}

export const useSaveCode = () =>
  useOffersMutation(({ id, values }: { id: string | null; values: DiscountCodeValues }) =>
    id ? api.put<DiscountsView>(`/api/seller/offers/discounts/${encodeURIComponent(id)}`, values) : api.post<DiscountsView>('/api/seller/offers/discounts', values),
  );
export const useDeleteCode = () => useOffersMutation((id: string) => api.delete<DiscountsView>(`/api/seller/offers/discounts/${encodeURIComponent(id)}`));
export const useSaveShippingDays = () => useOffersMutation((shippingDays: number) => api.put<{ shippingDays: number }>('/api/seller/offers/shipping-days', { shippingDays }));
export const useAddOrderByDate = () => useOffersMutation((input: OrderByDateInput) => api.post<{ orderBy: OrderByDate[] }>('/api/seller/offers/order-by-dates', input));
export const useDeleteOrderByDate = () => useOffersMutation((id: string) => api.delete<{ orderBy: OrderByDate[] }>(`/api/seller/offers/order-by-dates/${encodeURIComponent(id)}`));

/** The seller's listings to pick from for a per-listing code (the first 100, newest first). */
export const useOwnListings = () =>
  useQuery({
    queryKey: [...offersKeys.all, 'listings'],
    queryFn: ({ signal }) => api.get<{ items: Array<{ id: string; draft: { title: string } }> }>('/api/seller/listings?limit=100', { signal }),
    staleTime: 60_000,
  });
