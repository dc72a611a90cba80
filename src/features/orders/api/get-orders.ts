import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OrderSummary } from '../../../../shared/schemas/order.ts';
import { api } from '../../../lib/api-client.ts';
import { orderKeys } from './keys.ts';

export const getOrders = (signal?: AbortSignal) => api.get<{ orders: OrderSummary[] }>('/api/orders', { signal });

export const getOrdersQueryOptions = () => queryOptions({ queryKey: orderKeys.list(), queryFn: ({ signal }) => getOrders(signal) });

export function useOrders() {
  return useQuery(getOrdersQueryOptions());
}
