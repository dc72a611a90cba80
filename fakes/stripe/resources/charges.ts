// /v1/charges: list and retrieve, and the charge the hosted page makes for each card attempt.
import { z } from 'zod';
import type { Handler } from '../api.ts';
import type { Fake } from '../context.ts';
import { listOf, withExpand } from '../lists.ts';
import { listQuery, retrieveSchema, validate } from '../params.ts';
import { clone, newId, type PendingCard } from '../store.ts';
import type { Charge, CheckoutSession, PaymentIntent } from '../types.ts';

const listChargesSchema = z.object({ ...listQuery, payment_intent: z.string().optional(), transfer_group: z.string().optional() });

export const listCharges: Handler = (fake, call) => {
  const q = validate(listChargesSchema, call.params);
  const items = fake.store.all('charges').filter((c) => (!q.payment_intent || c.payment_intent === q.payment_intent) && (!q.transfer_group || c.transfer_group === q.transfer_group));
  return listOf(fake.store, items, '/v1/charges', q);
};

export const retrieveCharge: Handler = (fake, call) => {
  const q = validate(retrieveSchema, call.params);
  return withExpand(fake.store, fake.store.mustGet('charges', call.id, 'charge'), q.expand);
};

/** A charge for one card attempt on `pi`: succeeded when `failure` is null, else failed with its decline. */
export function makeCharge(fake: Fake, s: CheckoutSession, pi: PaymentIntent, card: PendingCard, failure: { code: string; decline_code: string; message: string } | null): Charge {
  const id = newId('ch_');
  const ok = failure === null;
  return fake.store.insert('charges', {
    id,
    object: 'charge',
    amount: pi.amount,
    amount_captured: ok ? pi.amount : 0,
    amount_refunded: 0,
    balance_transaction: ok ? newId('txn_') : null,
    billing_details: { email: s.customer_email, name: null, address: null, phone: null },
    captured: ok,
    created: fake.nowSec(),
    currency: pi.currency,
    description: pi.description,
    failure_code: failure?.code ?? null,
    failure_message: failure?.message ?? null,
    livemode: false,
    metadata: clone(pi.metadata),
    outcome: ok
      ? { network_status: 'approved_by_network', reason: null, risk_level: 'normal', seller_message: 'Payment complete.', type: 'authorized' }
      : {
          network_status: 'declined_by_network',
          reason: failure.decline_code,
          risk_level: 'normal',
          seller_message: 'The bank did not return any further details with this decline.',
          type: 'issuer_declined',
        },
    paid: ok,
    payment_intent: pi.id,
    payment_method: pi.payment_method,
    payment_method_details: { type: 'card', card: { brand: card.brand, last4: card.last4, exp_month: card.exp_month, exp_year: card.exp_year, funding: 'credit', country: 'US' } },
    receipt_email: s.customer_email,
    refunded: false,
    refunds: { object: 'list', data: [], has_more: false, url: `/v1/charges/${id}/refunds` },
    status: ok ? 'succeeded' : 'failed',
    transfer_group: pi.transfer_group,
  });
}
