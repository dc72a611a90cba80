import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Cart } from '../../../../shared/schemas/cart.ts';
import { apiRequest } from '../../../lib/api-client.ts';
import { cartKeys } from './keys.ts';

export const removeCartLine = (lineId: string) => apiRequest<Cart>(`/api/cart/lines/${encodeURIComponent(lineId)}`, { method: 'DELETE' });

export function useRemoveCartLine() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: removeCartLine, onSuccess: () => qc.invalidateQueries({ queryKey: cartKeys.all }) });
}
