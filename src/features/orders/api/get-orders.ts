import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { OrderSummary } from '../../../../shared/schemas/order.ts';
import { type Page, type PageInput, pageSearch } from '../../../../shared/schemas/pagination.ts';
import { api } from '../../../lib/api-client.ts';
import { orderKeys } from './keys.ts';

/** GET /api/orders: one page of the shopper's orders, newest first. */
export const getOrders = (p: PageInput, signal?: AbortSignal) => {
  const qs = pageSearch(p).toString();
  return api.get<Page<OrderSummary>>(`/api/orders${qs ? `?${qs}` : ''}`, { signal });
};

export const getOrdersQueryOptions = (p: PageInput = {}) =>
  // the last page stays on screen while the next one loads
  queryOptions({ queryKey: orderKeys.list(p), queryFn: ({ signal }) => getOrders(p, signal), placeholderData: keepPreviousData });

export function useOrders(p: PageInput = {}) {
  return useQuery(getOrdersQueryOptions(p));
}
