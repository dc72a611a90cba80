import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { moderationKeys } from './keys.ts';

type Decision = { id: string; state: string; pendingReview: boolean; rejectionReason?: string | null };

export async function approveListing(id: string): Promise<Decision> {
  return (await api.post<{ listing: Decision }>(`/api/moderation/listings/${encodeURIComponent(id)}/approve`)).listing;
}
export async function rejectListing({ id, reason }: { id: string; reason: string }): Promise<Decision> {
  return (await api.post<{ listing: Decision }>(`/api/moderation/listings/${encodeURIComponent(id)}/reject`, { reason })).listing;
}

export function useApproveListing() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: approveListing, onSuccess: () => queryClient.invalidateQueries({ queryKey: moderationKeys.all }) });
}
export function useRejectListing() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: rejectListing, onSuccess: () => queryClient.invalidateQueries({ queryKey: moderationKeys.all }) });
}
