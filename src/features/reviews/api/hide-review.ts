import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ReviewView } from '../../../../shared/schemas/review.ts';
import { api } from '../../../lib/api-client.ts';
import { reviewKeys } from './keys.ts';

/** POST /api/reviews/:id/hide: an admin hides a review with a reason (recorded in the audit log). */
export const hideReview = (id: string, reason: string) => api.post<{ review: ReviewView }>(`/api/reviews/${encodeURIComponent(id)}/hide`, { reason });

export function useHideReview() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: ({ id, reason }: { id: string; reason: string }) => hideReview(id, reason), onSuccess: () => qc.invalidateQueries({ queryKey: reviewKeys.all }) });
}
