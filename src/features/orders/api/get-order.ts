import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OrderDetail } from '../../../../shared/schemas/order.ts';
import { api } from '../../../lib/api-client.ts';
import { orderKeys } from './keys.ts';

export const getOrder = (id: string, signal?: AbortSignal) => api.get<OrderDetail>(`/api/orders/${encodeURIComponent(id)}`, { signal });

export const getOrderQueryOptions = (id: string) => queryOptions({ queryKey: orderKeys.detail(id), queryFn: ({ signal }) => getOrder(id, signal) });

export function useOrder(id: string) {
  return useQuery(getOrderQueryOptions(id));
}
