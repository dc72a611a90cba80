import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ReviewView } from '../../../../shared/schemas/review.ts';
import { api } from '../../../lib/api-client.ts';
import { reviewKeys } from './keys.ts';

/** POST /api/reviews/:id/reply: the shop's one reply. */
export const replyToReview = (id: string, reply: string) => api.post<{ review: ReviewView }>(`/api/reviews/${encodeURIComponent(id)}/reply`, { reply });

export function useReplyToReview() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: ({ id, reply }: { id: string; reply: string }) => replyToReview(id, reply), onSuccess: () => qc.invalidateQueries({ queryKey: reviewKeys.all }) });
}
