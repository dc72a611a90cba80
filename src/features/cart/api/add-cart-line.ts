import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AddCartLineInput, Cart } from '../../../../shared/schemas/cart.ts';
import { api } from '../../../lib/api-client.ts';
import { cartKeys } from './keys.ts';

/** The server prices the line itself; nothing price-like is sent. */
export const addCartLine = (input: AddCartLineInput) => api.post<Cart>('/api/cart/lines', input);

export function useAddCartLine() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: addCartLine, onSuccess: () => qc.invalidateQueries({ queryKey: cartKeys.all }) });
}
