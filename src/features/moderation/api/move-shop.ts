import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { moderationKeys } from './keys.ts';
import type { ShopMove } from './types.ts';

/**
 * POST /api/moderation/shops/:id/(approve|reject|suspend|restore); reject and suspend need a reason.
 * Approving from the queue names the revision of the name/description shown (409 when stale).
 */
export async function moveShop({ id, move, reason, revision }: { id: string; move: ShopMove; reason?: string; revision?: number }) {
  const body = { ...(reason ? { reason } : {}), ...(move === 'approve' && revision !== undefined ? { revision } : {}) };
  return (await api.post<{ shop: { id: string; state: string; stateReason: string | null } }>(`/api/moderation/shops/${encodeURIComponent(id)}/${move}`, body)).shop;
}

export function useMoveShop() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: moveShop, onSettled: () => queryClient.invalidateQueries({ queryKey: moderationKeys.all }) });
}
