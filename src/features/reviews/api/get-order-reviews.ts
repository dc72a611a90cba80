import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OrderReviewsView } from '../../../../shared/schemas/review.ts';
import { api } from '../../../lib/api-client.ts';
import { reviewKeys } from './keys.ts';

/** GET /api/orders/:id/reviews: the order's lines, whether each can be reviewed, and their reviews. */
export const getOrderReviews = (orderId: string, signal?: AbortSignal) => api.get<OrderReviewsView>(`/api/orders/${encodeURIComponent(orderId)}/reviews`, { signal });

export const getOrderReviewsQueryOptions = (orderId: string) => queryOptions({ queryKey: reviewKeys.order(orderId), queryFn: ({ signal }) => getOrderReviews(orderId, signal) });

export function useOrderReviews(orderId: string) {
  return useQuery(getOrderReviewsQueryOptions(orderId));
}
