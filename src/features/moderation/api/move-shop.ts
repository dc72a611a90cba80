import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { moderationKeys } from './keys.ts';
import type { ShopMove } from './types.ts';

/** POST /api/moderation/shops/:id/(approve|reject|suspend|restore); reject and suspend need a reason. */
export async function moveShop({ id, move, reason }: { id: string; move: ShopMove; reason?: string }) {
  return (await api.post<{ shop: { id: string; state: string; stateReason: string | null } }>(`/api/moderation/shops/${encodeURIComponent(id)}/${move}`, reason ? { reason } : {})).shop;
}

export function useMoveShop() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: moveShop, onSuccess: () => queryClient.invalidateQueries({ queryKey: moderationKeys.all }) });
}
