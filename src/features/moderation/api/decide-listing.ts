import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { moderationKeys } from './keys.ts';

type Decision = { id: string; state: string; pendingReview: boolean; rejectionReason?: string | null };

/** Both decisions name the revision the moderator was shown; a newer one answers 409 (stale_revision). */
export async function approveListing({ id, revision }: { id: string; revision: number }): Promise<Decision> {
  return (await api.post<{ listing: Decision }>(`/api/moderation/listings/${encodeURIComponent(id)}/approve`, { revision })).listing;
}
export async function rejectListing({ id, revision, reason }: { id: string; revision: number; reason: string }): Promise<Decision> {
  return (await api.post<{ listing: Decision }>(`/api/moderation/listings/${encodeURIComponent(id)}/reject`, { revision, reason })).listing;
}

export function useApproveListing() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: approveListing, onSuccess: () => queryClient.invalidateQueries({ queryKey: moderationKeys.all }) });
}
export function useRejectListing() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: rejectListing, onSuccess: () => queryClient.invalidateQueries({ queryKey: moderationKeys.all }) });
}
