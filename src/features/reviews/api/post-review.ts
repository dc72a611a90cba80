import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ReviewView } from '../../../../shared/schemas/review.ts';
import { upload } from '../../../lib/api-client.ts';
import { reviewKeys } from './keys.ts';

/** POST /api/orders/:id/lines/:lineId/review as multipart: rating, text, and a photo when one is chosen. */
export function postReview(orderId: string, lineId: string, input: { rating: number; body: string; photo: File | null }) {
  const form = new FormData();
  form.append('rating', String(input.rating));
  form.append('body', input.body);
  if (input.photo) form.append('file', input.photo);
  return upload<{ review: ReviewView }>(`/api/orders/${encodeURIComponent(orderId)}/lines/${encodeURIComponent(lineId)}/review`, form);
}

export function usePostReview(orderId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ lineId, ...input }: { lineId: string; rating: number; body: string; photo: File | null }) => postReview(orderId, lineId, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: reviewKeys.all }),
  });
}
