// /v1/payment_intents/:id, and what happens to a session's PaymentIntent when the hosted page takes a
// card: it is made on the first attempt, succeeds (with a charge and `checkout.session.completed`), asks
// for the extra confirmation step, or is declined and may be tried again.
import type { Handler } from '../api.ts';
import type { Fake } from '../context.ts';
import { withExpand } from '../lists.ts';
import { retrieveSchema, validate } from '../params.ts';
import { clone, newId, type PendingCard, patch, type SessionExtra } from '../store.ts';
import type { CheckoutSession, PaymentFailure, PaymentIntent, ShippingDetails } from '../types.ts';
import { makeCharge } from './charges.ts';

export const retrievePaymentIntent: Handler = (fake, call) => {
  const q = validate(retrieveSchema, call.params);
  return withExpand(fake.store, fake.store.mustGet('payment_intents', call.id, 'payment_intent'), q.expand);
};

function sessionExtra(fake: Fake, s: CheckoutSession): SessionExtra {
  const extra = fake.store.state.session_extra[s.id];
  if (!extra) throw new Error(`stripe fake: session ${s.id} has no stored line items`);
  return extra;
}

/** The session's PaymentIntent, made on the first payment attempt. */
export function ensurePaymentIntent(fake: Fake, s: CheckoutSession): PaymentIntent {
  const existing = s.payment_intent ? fake.store.get('payment_intents', s.payment_intent) : undefined;
  if (existing) return existing;
  const extra = sessionExtra(fake, s);
  const id = newId('pi_');
  const pi = fake.store.insert('payment_intents', {
    id,
    object: 'payment_intent',
    amount: s.amount_total,
    amount_capturable: 0,
    amount_received: 0,
    canceled_at: null,
    cancellation_reason: null,
    capture_method: 'automatic_async',
    client_secret: `${id}_secret_${newId('', 24)}`,
    confirmation_method: 'automatic',
    created: fake.nowSec(),
    currency: s.currency,
    customer: null,
    description: extra.pi_description,
    last_payment_error: null,
    latest_charge: null,
    livemode: false,
    metadata: clone(extra.pi_metadata),
    next_action: null,
    payment_method: null,
    payment_method_types: ['card'],
    receipt_email: s.customer_email,
    status: 'requires_payment_method',
    transfer_group: extra.transfer_group,
  });
  s.payment_intent = id;
  return pi;
}

/** An expired session's unfinished PaymentIntent is canceled as abandoned. */
export function cancelPaymentIntent(fake: Fake, id: string): void {
  const pi = fake.store.get('payment_intents', id);
  if (pi && pi.status !== 'succeeded' && pi.status !== 'canceled') {
    pi.status = 'canceled';
    pi.canceled_at = fake.nowSec();
    pi.cancellation_reason = 'abandoned';
    pi.next_action = null;
  }
}

/** The card asks for the extra confirmation step; the card and address wait for its answer. */
export function requireAction(fake: Fake, s: CheckoutSession, card: PendingCard, shipping: ShippingDetails | null): void {
  const pi = ensurePaymentIntent(fake, s);
  patch(pi, { status: 'requires_action', payment_method: newId('pm_'), next_action: { type: 'use_stripe_sdk', use_stripe_sdk: {} }, last_payment_error: null });
  const extra = sessionExtra(fake, s);
  extra.pending_auth = card;
  extra.pending_shipping = shipping;
}

/** The payment goes through: a succeeded charge, a complete session, `checkout.session.completed`. */
export function succeedPayment(fake: Fake, s: CheckoutSession, card: PendingCard, shipping: ShippingDetails | null): void {
  const pi = ensurePaymentIntent(fake, s);
  pi.payment_method = newId('pm_');
  const ch = makeCharge(fake, s, pi, card, null);
  patch(pi, { status: 'succeeded', amount_received: pi.amount, latest_charge: ch.id, last_payment_error: null, next_action: null });
  patch(s, {
    status: 'complete',
    payment_status: 'paid',
    url: null,
    customer_details: { email: s.customer_email, name: shipping?.name ?? null, address: null, phone: null, tax_exempt: 'none', tax_ids: [] },
  });
  if (shipping) {
    // Newer API versions put it under collected_information; older ones read `shipping_details`.
    s.collected_information = { shipping_details: clone(shipping) };
    s.shipping_details = clone(shipping);
  }
  const extra = sessionExtra(fake, s);
  extra.pending_auth = null;
  extra.pending_shipping = null;
  fake.webhooks.emit('checkout.session.completed', s, { apiVersion: extra.api_version });
}

/** The attempt fails: a failed charge when a card was declined, and the session stays open for another try. */
export function declinePayment(fake: Fake, s: CheckoutSession, card: PendingCard | null, failure: PaymentFailure): void {
  const pi = ensurePaymentIntent(fake, s);
  pi.payment_method = newId('pm_');
  let chargeId: string | null = null;
  if (card && failure.decline_code) {
    const ch = makeCharge(fake, s, pi, card, { code: failure.code, decline_code: failure.decline_code, message: failure.message });
    chargeId = ch.id;
    pi.latest_charge = ch.id;
  }
  patch(pi, {
    status: 'requires_payment_method',
    next_action: null,
    last_payment_error: { ...failure, charge: chargeId, payment_method: { id: pi.payment_method, object: 'payment_method', type: 'card' } },
  });
  const extra = sessionExtra(fake, s);
  extra.pending_auth = null;
  extra.pending_shipping = null;
}
