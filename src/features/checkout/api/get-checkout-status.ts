import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CheckoutStatus } from '../../../../shared/schemas/checkout.ts';
import { api } from '../../../lib/api-client.ts';
import { checkoutKeys } from './keys.ts';

/** The server holds the request up to `wait` ms for the payment notice, so one call usually suffices. */
export const getCheckoutStatus = (sessionId: string, signal?: AbortSignal) => api.get<CheckoutStatus>(`/api/checkout/${encodeURIComponent(sessionId)}/status?wait=8000`, { signal });

export const getCheckoutStatusQueryOptions = (sessionId: string) =>
  queryOptions({
    queryKey: checkoutKeys.status(sessionId),
    queryFn: ({ signal }) => getCheckoutStatus(sessionId, signal),
    // keep asking while the payment is in but the orders are not made yet
    refetchInterval: (q) => (q.state.data && q.state.data.state === 'open' && q.state.data.paymentReceived ? 1500 : false),
    staleTime: 0,
  });

export function useCheckoutStatus(sessionId: string) {
  return useQuery({ ...getCheckoutStatusQueryOptions(sessionId), enabled: sessionId !== '' });
}
