import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { moderationKeys } from './keys.ts';

type Result = { id: string; name: string; description: string };

/** POST /api/moderation/shops/:id/(approve|reject)-change, naming the revision shown. */
export async function decideShopChange({ id, revision, reason }: { id: string; revision: number; reason?: string }): Promise<Result> {
  const path = `/api/moderation/shops/${encodeURIComponent(id)}/${reason === undefined ? 'approve-change' : 'reject-change'}`;
  return (await api.post<{ shop: Result }>(path, reason === undefined ? { revision } : { revision, reason })).shop;
}

export function useDecideShopChange() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: decideShopChange, onSettled: () => queryClient.invalidateQueries({ queryKey: moderationKeys.all }) });
}
