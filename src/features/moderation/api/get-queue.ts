import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { type Page, type PageInput, pageSearch } from '../../../../shared/schemas/pagination.ts';
import { api } from '../../../lib/api-client.ts';
import { moderationKeys } from './keys.ts';
import type { QueueListing, QueueShop, QueueShopChange } from './types.ts';

const withPage = (path: string, p: PageInput) => {
  const qs = pageSearch(p).toString();
  return qs ? `${path}?${qs}` : path;
};

/** GET /api/moderation/queue/listings: listings waiting for review, oldest first, a page at a time. */
export const getListingQueue = (p: PageInput, signal?: AbortSignal) => api.get<Page<QueueListing>>(withPage('/api/moderation/queue/listings', p), { signal });
export const getListingQueueQueryOptions = (p: PageInput = {}) =>
  queryOptions({ queryKey: moderationKeys.queueListings(p), queryFn: ({ signal }) => getListingQueue(p, signal), placeholderData: keepPreviousData, staleTime: 5_000 });
export const useListingQueue = (p: PageInput = {}) => useQuery(getListingQueueQueryOptions(p));

/** GET /api/moderation/queue/shops: shops waiting for their first review, oldest first, a page at a time. */
export const getShopQueue = (p: PageInput, signal?: AbortSignal) => api.get<Page<QueueShop>>(withPage('/api/moderation/queue/shops', p), { signal });
export const getShopQueueQueryOptions = (p: PageInput = {}) =>
  queryOptions({ queryKey: moderationKeys.queueShops(p), queryFn: ({ signal }) => getShopQueue(p, signal), placeholderData: keepPreviousData, staleTime: 5_000 });
export const useShopQueue = (p: PageInput = {}) => useQuery(getShopQueueQueryOptions(p));

/** GET /api/moderation/queue/shop-changes: live shops' name/description changes waiting, oldest first. */
export const getShopChangeQueue = (p: PageInput, signal?: AbortSignal) => api.get<Page<QueueShopChange>>(withPage('/api/moderation/queue/shop-changes', p), { signal });
export const getShopChangeQueueQueryOptions = (p: PageInput = {}) =>
  queryOptions({ queryKey: moderationKeys.queueShopChanges(p), queryFn: ({ signal }) => getShopChangeQueue(p, signal), placeholderData: keepPreviousData, staleTime: 5_000 });
export const useShopChangeQueue = (p: PageInput = {}) => useQuery(getShopChangeQueueQueryOptions(p));
