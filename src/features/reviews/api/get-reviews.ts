import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { pageSearch } from '../../../../shared/schemas/pagination.ts';
import type { ReviewsPage } from '../../../../shared/schemas/review.ts';
import { api } from '../../../lib/api-client.ts';
import { type ReviewSource, reviewKeys } from './keys.ts';

/** GET /api/reviews/listings/:slug or /api/reviews/shops/:slug: one page of visible reviews, newest first, with the summary. */
export const getReviews = (source: ReviewSource, page: number, signal?: AbortSignal) => {
  const qs = pageSearch({ page }).toString();
  return api.get<ReviewsPage>(`/api/reviews/${source.kind}/${encodeURIComponent(source.slug)}${qs ? `?${qs}` : ''}`, { signal });
};

export const getReviewsQueryOptions = (source: ReviewSource, page: number) =>
  queryOptions({ queryKey: reviewKeys.list(source, page), queryFn: ({ signal }) => getReviews(source, page, signal), placeholderData: keepPreviousData });

export function useReviews(source: ReviewSource, page: number) {
  return useQuery(getReviewsQueryOptions(source, page));
}
