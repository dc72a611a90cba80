import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { moderationKeys } from './keys.ts';
import type { ListingReview } from './types.ts';

/**
 * GET /api/moderation/listings/:id: the listing waiting for review, its revision and its page as a
 * shopper would see it, all from one read; the decision sends back this revision.
 */
export const getListingReview = (id: string, signal?: AbortSignal) => api.get<ListingReview>(`/api/moderation/listings/${encodeURIComponent(id)}`, { signal });

export const getListingReviewQueryOptions = (id: string) => queryOptions({ queryKey: moderationKeys.review(id), queryFn: ({ signal }) => getListingReview(id, signal), staleTime: 0, retry: false });

export function useListingReview(id: string | undefined) {
  return useQuery({ ...getListingReviewQueryOptions(id ?? ''), enabled: Boolean(id) });
}
