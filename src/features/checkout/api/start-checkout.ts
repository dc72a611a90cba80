import { useMutation } from '@tanstack/react-query';
import type { CheckoutStarted } from '../../../../shared/schemas/checkout.ts';
import { api } from '../../../lib/api-client.ts';

export const startCheckout = () => api.post<CheckoutStarted>('/api/checkout', {});

/** On success the caller sends the browser to the payment page (`url`). */
export function useStartCheckout() {
  return useMutation({ mutationFn: startCheckout });
}
