import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ThreadView } from '../../../../shared/schemas/message.ts';
import { api } from '../../../lib/api-client.ts';
import { messageKeys } from './keys.ts';

/** GET /api/orders/:id/messages: the order's thread (its shopper, its shop, admins). */
export const getThread = (orderId: string, signal?: AbortSignal) => api.get<ThreadView>(`/api/orders/${encodeURIComponent(orderId)}/messages`, { signal });

export const getThreadQueryOptions = (orderId: string) => queryOptions({ queryKey: messageKeys.thread(orderId), queryFn: ({ signal }) => getThread(orderId, signal) });

export function useThread(orderId: string) {
  return useQuery(getThreadQueryOptions(orderId));
}
