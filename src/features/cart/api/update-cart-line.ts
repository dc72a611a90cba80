import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Cart } from '../../../../shared/schemas/cart.ts';
import { apiRequest } from '../../../lib/api-client.ts';
import { cartKeys } from './keys.ts';

export const updateCartLine = ({ lineId, quantity }: { lineId: string; quantity: number }) =>
  apiRequest<Cart>(`/api/cart/lines/${encodeURIComponent(lineId)}`, { method: 'PATCH', body: { quantity } });

export function useUpdateCartLine() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: updateCartLine, onSuccess: () => qc.invalidateQueries({ queryKey: cartKeys.all }) });
}
