import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CheckoutStatus } from '../../../../shared/schemas/checkout.ts';
import { api } from '../../../lib/api-client.ts';
import { checkoutKeys } from './keys.ts';

export const getLatestCheckout = (signal?: AbortSignal) => api.get<{ checkout: CheckoutStatus | null }>('/api/checkout/latest', { signal, redirectOn401: false });

export const getLatestCheckoutQueryOptions = (viewer: string) => queryOptions({ queryKey: checkoutKeys.latest(viewer), queryFn: ({ signal }) => getLatestCheckout(signal), staleTime: 0 });

/** Why the shopper came back from the payment page (declined, or left it); only asked after a return. */
export function useLatestCheckout(viewer: string, enabled: boolean) {
  return useQuery({ ...getLatestCheckoutQueryOptions(viewer), enabled });
}
