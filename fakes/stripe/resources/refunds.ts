// /v1/refunds: create against a PaymentIntent or a charge (partial or whole, never more than is left),
// list, retrieve. Each refund updates its charge and sends `charge.refunded`.
import { z } from 'zod';
import type { Handler } from '../api.ts';
import type { Fake } from '../context.ts';
import { invalid } from '../http.ts';
import { listOf, withExpand } from '../lists.ts';
import { expandList, listQuery, metadata, posInt, retrieveSchema, validate } from '../params.ts';
import { clone, newId } from '../store.ts';
import type { Charge, PaymentIntent, Refund } from '../types.ts';

const createSchema = z.object({
  payment_intent: z.string().optional(),
  charge: z.string().optional(),
  amount: posInt.optional(),
  reason: z.enum(['duplicate', 'fraudulent', 'requested_by_customer']).optional(),
  metadata: metadata.optional(),
  expand: expandList,
});
const listRefundsSchema = z.object({ ...listQuery, payment_intent: z.string().optional(), charge: z.string().optional() });

/** The succeeded charge a refund comes out of: the one named, or the PaymentIntent's latest. */
function refundableCharge(fake: Fake, pi: PaymentIntent | undefined, chargeId: string | undefined): Charge {
  let ch: Charge | undefined;
  if (chargeId) ch = fake.store.mustGet('charges', chargeId, 'charge', 'charge');
  else if (pi?.latest_charge) ch = fake.store.get('charges', pi.latest_charge);
  if (ch?.status !== 'succeeded') {
    throw invalid(`This PaymentIntent (${pi?.id ?? '?'}) does not have a successful charge to refund.`, { code: 'charge_not_found', param: 'payment_intent' });
  }
  return ch;
}

export const createRefund: Handler = (fake, call) => {
  const p = validate(createSchema, call.params);
  if (!p.payment_intent && !p.charge) throw invalid('Missing required param: payment_intent or charge.', { code: 'parameter_missing', param: 'payment_intent' });
  const pi = p.payment_intent ? fake.store.mustGet('payment_intents', p.payment_intent, 'payment_intent', 'payment_intent') : undefined;
  const ch = refundableCharge(fake, pi, p.charge);
  if (pi && ch.payment_intent !== pi.id) throw invalid(`Charge ${ch.id} does not belong to ${pi.id}.`, { code: 'parameter_invalid', param: 'charge' });
  const remaining = ch.amount - ch.amount_refunded;
  if (remaining <= 0) throw invalid(`Charge ${ch.id} has already been refunded.`, { code: 'charge_already_refunded' });
  const amount = p.amount ?? remaining;
  if (amount > remaining) {
    throw invalid(`Refund amount (${amount}) is greater than unrefunded amount on charge (${remaining}).`, { code: 'amount_too_large', param: 'amount' });
  }
  const re: Refund = fake.store.insert('refunds', {
    id: newId('re_'),
    object: 'refund',
    amount,
    balance_transaction: newId('txn_'),
    charge: ch.id,
    created: fake.nowSec(),
    currency: ch.currency,
    metadata: p.metadata ?? {},
    payment_intent: ch.payment_intent,
    reason: p.reason ?? null,
    status: 'succeeded',
  });
  const previous = { amount_refunded: ch.amount_refunded, refunded: ch.refunded };
  ch.amount_refunded += amount;
  ch.refunded = ch.amount_refunded === ch.amount;
  ch.refunds.data.unshift(clone(re));
  fake.webhooks.emit('charge.refunded', ch, call, previous);
  return withExpand(fake.store, re, p.expand);
};

export const listRefunds: Handler = (fake, call) => {
  const q = validate(listRefundsSchema, call.params);
  const items = fake.store.all('refunds').filter((r) => (!q.payment_intent || r.payment_intent === q.payment_intent) && (!q.charge || r.charge === q.charge));
  return listOf(fake.store, items, '/v1/refunds', q);
};

export const retrieveRefund: Handler = (fake, call) => {
  const q = validate(retrieveSchema, call.params);
  return withExpand(fake.store, fake.store.mustGet('refunds', call.id, 'refund'), q.expand);
};
