// /v1/balance: the platform's available funds per currency.
import type { Handler } from '../api.ts';
import type { Store } from '../store.ts';
import type { Balance } from '../types.ts';

/**
 * Succeeded charges less refunds, less transfers not reversed. Simpler than Stripe: charge funds count
 * as available at once (Stripe test mode holds them as pending unless a transfer names its
 * source_transaction).
 */
export function availableBalance(store: Store, cur: string): number {
  let bal = 0;
  for (const c of store.all('charges')) if (c.status === 'succeeded' && c.currency === cur) bal += c.amount - c.amount_refunded;
  for (const t of store.all('transfers')) if (t.currency === cur) bal -= t.amount - t.amount_reversed;
  return bal;
}

export const retrieveBalance: Handler = (fake): Balance => {
  const currencies = new Set(fake.store.all('charges').map((c) => c.currency));
  return {
    object: 'balance',
    available: [...currencies].map((c) => ({ amount: availableBalance(fake.store, c), currency: c })),
    pending: [],
    livemode: false,
  };
};
