// /v1/checkout/sessions: create (payment mode, inline price_data, shipping address collection),
// list, retrieve, line items, expire; and the expiry of open sessions whose `expires_at` has passed.
import { z } from 'zod';
import type { Handler } from '../api.ts';
import type { Fake } from '../context.ts';
import { invalid } from '../http.ts';
import { listOf, withExpand } from '../lists.ts';
import { currency, email, expandList, intStr, listQuery, listSchema, metadata, nonNegInt, posInt, retrieveSchema, validate } from '../params.ts';
import { newId } from '../store.ts';
import type { CheckoutSession, EventCause, LineItem } from '../types.ts';
import { cancelPaymentIntent } from './payment-intents.ts';

// Stripe's minimum charge amounts for a few currencies (Stripe docs, "Minimum and maximum charge amounts").
const MIN_AMOUNT: Record<string, number> = { usd: 50, eur: 50, gbp: 30, cad: 50, aud: 50, jpy: 50 };
const MAX_AMOUNT = 99_999_999;

const httpUrl = z
  .string()
  .max(5000)
  .refine((s) => {
    try {
      const u = new URL(s.replaceAll('{CHECKOUT_SESSION_ID}', 'x'));
      return u.protocol === 'http:' || u.protocol === 'https:';
    } catch {
      return false;
    }
  }, 'expected an http(s) URL');

const createSchema = z.object({
  mode: z.enum(['payment', 'setup', 'subscription']),
  line_items: z
    .array(
      z.object({
        price: z.string().optional(),
        price_data: z.object({
          currency,
          unit_amount: nonNegInt,
          product_data: z.object({
            name: z.string().min(1).max(250),
            description: z.string().max(500).optional(),
            images: z.array(z.string()).max(8).optional(),
            metadata: metadata.optional(),
          }),
        }),
        quantity: posInt,
      }),
    )
    .min(1)
    .max(100),
  success_url: httpUrl,
  cancel_url: httpUrl.optional(),
  metadata: metadata.optional(),
  customer_email: email.optional(),
  client_reference_id: z.string().max(200).optional(),
  payment_intent_data: z
    .object({
      transfer_group: z.string().max(500).optional(),
      metadata: metadata.optional(),
      description: z.string().max(1000).optional(),
    })
    .optional(),
  expires_at: intStr.transform(Number).optional(),
  locale: z.string().optional(),
  // Stripe API docs, Checkout Session create: `shipping_address_collection[allowed_countries][]`.
  shipping_address_collection: z
    .object({
      allowed_countries: z
        .array(z.string().regex(/^[A-Z]{2}$/, 'expected two-letter ISO 3166-1 country codes in capitals'))
        .min(1)
        .max(250),
    })
    .optional(),
  expand: expandList,
});
type CreateParams = z.output<typeof createSchema>;

const listSessionsSchema = z.object({
  ...listQuery,
  payment_intent: z.string().optional(),
  status: z.enum(['open', 'complete', 'expired']).optional(),
});

function lineItem(li: CreateParams['line_items'][number], cur: string): LineItem {
  const amount = li.price_data.unit_amount * li.quantity;
  return {
    id: newId('li_'),
    object: 'item',
    amount_discount: 0,
    amount_subtotal: amount,
    amount_tax: 0,
    amount_total: amount,
    currency: cur,
    description: li.price_data.product_data.name,
    quantity: li.quantity,
    price: {
      id: newId('price_'),
      object: 'price',
      active: false,
      currency: cur,
      type: 'one_time',
      unit_amount: li.price_data.unit_amount,
      product: {
        id: newId('prod_'),
        object: 'product',
        name: li.price_data.product_data.name,
        description: li.price_data.product_data.description ?? null,
        images: li.price_data.product_data.images ?? [],
        metadata: li.price_data.product_data.metadata ?? {},
      },
    },
  };
}

/** The total in minor units, after checking the currency and Stripe's limits. */
function checkedTotal(p: CreateParams): { cur: string; total: number } {
  if (p.mode !== 'payment') throw invalid(`This fake supports mode=payment only, not '${p.mode}'.`, { code: 'parameter_invalid', param: 'mode' });
  const cur = p.line_items[0]!.price_data.currency;
  p.line_items.forEach((li, i) => {
    if (li.price_data.currency !== cur) throw invalid('All line items must use the same currency.', { code: 'parameter_invalid', param: `line_items[${i}][price_data][currency]` });
  });
  const total = p.line_items.reduce((sum, li) => sum + li.price_data.unit_amount * li.quantity, 0);
  const min = MIN_AMOUNT[cur];
  if (min !== undefined && total < min) {
    throw invalid(`The Checkout Session's total amount due must add up to at least ${min} in the smallest unit of ${cur}.`, { code: 'amount_too_small', param: 'line_items' });
  }
  if (total > MAX_AMOUNT) throw invalid(`The total amount due must be no more than ${MAX_AMOUNT} in the smallest currency unit.`, { code: 'amount_too_large', param: 'line_items' });
  return { cur, total };
}

/** `expires_at`, defaulting to 24 hours; Stripe accepts 30 minutes to 24 hours after creation. */
function checkedExpiry(p: CreateParams, created: number): number {
  if (p.expires_at === undefined) return created + 24 * 3600;
  if (p.expires_at < created + 30 * 60 - 5 || p.expires_at > created + 24 * 3600 + 5) {
    throw invalid('The `expires_at` timestamp must be between 30 minutes and 24 hours after the Checkout Session is created.', { code: 'parameter_invalid', param: 'expires_at' });
  }
  return p.expires_at;
}

export const createSession: Handler = (fake, call) => {
  const p = validate(createSchema, call.params);
  const { cur, total } = checkedTotal(p);
  const created = fake.nowSec();
  const expiresAt = checkedExpiry(p, created);
  const id = newId('cs_test_', 56);
  fake.store.state.session_extra[id] = {
    line_items: p.line_items.map((li) => lineItem(li, cur)),
    transfer_group: p.payment_intent_data?.transfer_group ?? null,
    pi_metadata: p.payment_intent_data?.metadata ?? {},
    pi_description: p.payment_intent_data?.description ?? null,
    api_version: call.apiVersion,
    pending_auth: null,
  };
  const s: CheckoutSession = {
    id,
    object: 'checkout.session',
    amount_subtotal: total,
    amount_total: total,
    cancel_url: p.cancel_url ?? null,
    client_reference_id: p.client_reference_id ?? null,
    collected_information: null,
    created,
    currency: cur,
    customer: null,
    customer_details: null,
    customer_email: p.customer_email ?? null,
    expires_at: expiresAt,
    livemode: false,
    locale: p.locale ?? null,
    metadata: p.metadata ?? {},
    mode: 'payment',
    payment_intent: null,
    payment_method_types: ['card'],
    payment_status: 'unpaid',
    shipping_address_collection: p.shipping_address_collection ? { allowed_countries: [...new Set(p.shipping_address_collection.allowed_countries)] } : null,
    shipping_details: null,
    status: 'open',
    success_url: p.success_url,
    total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
    ui_mode: 'hosted',
    url: `${fake.publicUrl}/pay/${id}`,
  };
  fake.store.insert('checkout_sessions', s);
  return withExpand(fake.store, s, p.expand);
};

export const listSessions: Handler = (fake, call) => {
  const q = validate(listSessionsSchema, call.params);
  const items = fake.store.all('checkout_sessions').filter((s) => (!q.payment_intent || s.payment_intent === q.payment_intent) && (!q.status || s.status === q.status));
  return listOf(fake.store, items, '/v1/checkout/sessions', q);
};

export const retrieveSession: Handler = (fake, call) => {
  const q = validate(retrieveSchema, call.params);
  return withExpand(fake.store, fake.store.mustGet('checkout_sessions', call.id, 'checkout.session'), q.expand);
};

export const listSessionLineItems: Handler = (fake, call) => {
  const q = validate(listSchema, call.params);
  const s = fake.store.mustGet('checkout_sessions', call.id, 'checkout.session');
  const items = [...(fake.store.state.session_extra[s.id]?.line_items ?? [])].reverse();
  return listOf(fake.store, items, `/v1/checkout/sessions/${s.id}/line_items`, q);
};

export const expireSessionNow: Handler = (fake, call) => {
  const q = validate(retrieveSchema, call.params);
  const s = fake.store.mustGet('checkout_sessions', call.id, 'checkout.session');
  if (s.status !== 'open') {
    throw invalid(`Only Checkout Sessions with a status in ["open"] can be expired. This session has status '${s.status}'.`, { code: 'checkout_session_not_open' });
  }
  expireSession(fake, s, call);
  return withExpand(fake.store, s, q.expand);
};

/** Closes an open session: its page stops taking payment and `checkout.session.expired` goes out. */
export function expireSession(fake: Fake, s: CheckoutSession, cause: EventCause): void {
  s.status = 'expired';
  s.url = null;
  const extra = fake.store.state.session_extra[s.id];
  if (extra) extra.pending_auth = null;
  if (s.payment_intent) cancelPaymentIntent(fake, s.payment_intent);
  fake.webhooks.emit('checkout.session.expired', s, { apiVersion: extra?.api_version, ...cause });
}

/** Expires the open sessions whose `expires_at` has passed on the fake's clock; true when any did. */
export function sweepExpired(fake: Fake): boolean {
  let changed = false;
  const t = fake.nowSec();
  for (const s of fake.store.all('checkout_sessions')) {
    if (s.status === 'open' && s.expires_at <= t) {
      expireSession(fake, s, {});
      changed = true;
    }
  }
  return changed;
}
