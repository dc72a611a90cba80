import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Cart } from '../../../../shared/schemas/cart.ts';
import { api } from '../../../lib/api-client.ts';
import { cartKeys } from './keys.ts';

export const getCart = (signal?: AbortSignal) => api.get<Cart>('/api/cart', { signal });

export const getCartQueryOptions = (viewer: string) => queryOptions({ queryKey: cartKeys.current(viewer), queryFn: ({ signal }) => getCart(signal), staleTime: 5_000 });

export function useCart(viewer: string) {
  return useQuery(getCartQueryOptions(viewer));
}
