// A local stand-in for the subset of the Stripe API that Namesake uses (issue 5, point 2).
// The official `stripe` SDK talks to it with `new Stripe(key, { host: '127.0.0.1', port, protocol: 'http' })`.
// Behaviour follows the Stripe API docs (test cards, webhook signing, idempotency) and stripe-node's
// src/Webhooks.ts; where the fake is simpler than Stripe, a comment says so.
import http from 'node:http';
import { createHash, createHmac, randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { z } from 'zod';
import { FormParseError, parseForm } from './form.ts';
import { authPage, messagePage, payPage } from './html.ts';
import { listenLocal } from '../listen.ts';

export interface StripeFakeOptions {
  /** 0 or omitted: a free port. */
  port?: number;
  /** When `port` is taken, listen on a free port instead of failing (`url`/`port` tell which). */
  orFreePort?: boolean;
  /** State lives in `${dataDir}/stripe-state.json`. */
  dataDir: string;
  /** Where events are POSTed. Deliveries wait (without using up attempts) while no URL is set. */
  webhookUrl?: string;
  /** `whsec_…` secret used to sign deliveries. */
  webhookSecret: string;
  /** Base of the hosted payment page URLs; defaults to `http://127.0.0.1:<port>`. */
  publicUrl?: string;
  /** First retry delay; doubles each attempt (default 200 ms). */
  retryBaseMs?: number;
  /** Cap on the retry delay (default 60 s). */
  retryMaxMs?: number;
  /** Attempts per event before it is marked `failed` (default 12). */
  maxAttempts?: number;
  /** Per-attempt timeout (default 10 s). */
  deliveryTimeoutMs?: number;
  /** Clock for object timestamps and session expiry (ms). Tests use it to move time on. */
  now?: () => number;
  /** Logger; defaults to silence. */
  log?: (message: string) => void;
}

export interface StripeFake {
  url: string;
  port: number;
  close(): Promise<void>;
  setWebhookUrl(url: string): void;
}

// The API version the installed SDK pins; sent back when a request does not name one.
const DEFAULT_API_VERSION = '2026-10-28.endive';
const MAX_BODY = 1024 * 1024;
const IDEMPOTENCY_TTL_MS = 24 * 3600 * 1000; // Stripe keeps keys for at least 24 hours.

// Test cards (Stripe API docs, "Testing").
type CardBehaviour = 'succeed' | 'generic_decline' | 'insufficient_funds' | 'authenticate';
const TEST_CARDS: Record<string, CardBehaviour> = {
  '4242424242424242': 'succeed',
  '4000000000000002': 'generic_decline',
  '4000000000009995': 'insufficient_funds',
  '4000002760003184': 'authenticate',
};

// Stripe's minimum charge amounts for a few currencies (Stripe docs, "Minimum and maximum charge amounts").
const MIN_AMOUNT: Record<string, number> = { usd: 50, eur: 50, gbp: 30, cad: 50, aud: 50, jpy: 50 };
const MAX_AMOUNT = 99_999_999;

// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Obj = Record<string, any>;

interface PendingCard {
  last4: string;
  exp_month: number;
  exp_year: number;
  brand: string;
}

interface SessionExtra {
  line_items: Obj[];
  transfer_group: string | null;
  pi_metadata: Record<string, string>;
  pi_description: string | null;
  api_version: string;
  pending_auth: PendingCard | null;
  /** The address typed with the card, held while a card asks for the extra confirmation step. */
  pending_shipping?: ShippingDetails | null;
}

interface ShippingDetails {
  name: string;
  address: { line1: string; line2: string | null; city: string; postal_code: string; state: string | null; country: string };
}

interface DeliveryAttempt {
  at: number;
  status: number | null;
  error: string | null;
  duration_ms: number;
}

interface Delivery {
  event_id: string;
  status: 'pending' | 'delivered' | 'failed';
  attempts: number;
  next_attempt_at: number;
  delivered_at: number | null;
  last_url: string | null;
  attempts_log: DeliveryAttempt[];
}

interface IdempotencyRecord {
  fingerprint: string;
  method: string;
  path: string;
  status: number;
  body: string;
  created: number;
}

interface State {
  version: 1;
  checkout_sessions: Record<string, Obj>;
  session_extra: Record<string, SessionExtra>;
  payment_intents: Record<string, Obj>;
  charges: Record<string, Obj>;
  accounts: Record<string, Obj>;
  transfers: Record<string, Obj>;
  refunds: Record<string, Obj>;
  events: Record<string, Obj>;
  idempotency: Record<string, IdempotencyRecord>;
  deliveries: Record<string, Delivery>;
}

function emptyState(): State {
  return {
    version: 1,
    checkout_sessions: {},
    session_extra: {},
    payment_intents: {},
    charges: {},
    accounts: {},
    transfers: {},
    refunds: {},
    events: {},
    idempotency: {},
    deliveries: {},
  };
}

class ApiError extends Error {
  constructor(
    public status: number,
    public type: string,
    message: string,
    public extra: { code?: string; param?: string; decline_code?: string } = {},
  ) {
    super(message);
  }
  body(): Obj {
    return { error: { type: this.type, message: this.message, ...this.extra } };
  }
}

const invalid = (message: string, extra: ApiError['extra'] = {}) => new ApiError(400, 'invalid_request_error', message, extra);

const B62 = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';
function newId(prefix: string, length = 24): string {
  const bytes = randomBytes(length);
  let out = prefix;
  for (let i = 0; i < length; i++) out += B62[bytes[i]! % 62];
  return out;
}

const clone = <T>(v: T): T => JSON.parse(JSON.stringify(v)) as T;

function canonical(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(canonical).join(',')}]`;
  if (v && typeof v === 'object') {
    const o = v as Record<string, unknown>;
    return `{${Object.keys(o)
      .sort()
      .map((k) => `${JSON.stringify(k)}:${canonical(o[k])}`)
      .join(',')}}`;
  }
  return JSON.stringify(v);
}

function luhn(num: string): boolean {
  let sum = 0;
  let dbl = false;
  for (let i = num.length - 1; i >= 0; i--) {
    let d = num.charCodeAt(i) - 48;
    if (dbl) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
    dbl = !dbl;
  }
  return sum % 10 === 0;
}

function brandOf(num: string): string {
  if (num.startsWith('4')) return 'visa';
  if (/^5[1-5]|^2[2-7]/.test(num)) return 'mastercard';
  if (/^3[47]/.test(num)) return 'amex';
  return 'unknown';
}

// ---------- parameter schemas (zod) ----------
const intStr = z.string().regex(/^-?\d+$/, 'expected an integer');
const nonNegInt = intStr.transform(Number).pipe(z.number().int().min(0));
const posInt = intStr.transform(Number).pipe(z.number().int().min(1));
const currency = z
  .string()
  .regex(/^[a-zA-Z]{3}$/, 'expected a three-letter ISO currency code')
  .transform((s) => s.toLowerCase());
const metadata = z
  .record(z.string().max(40, 'metadata keys are at most 40 characters'), z.string().max(500, 'metadata values are at most 500 characters'))
  .refine((m) => Object.keys(m).length <= 50, 'at most 50 metadata keys');
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
const email = z.string().max(512).regex(/^[^\s@]+@[^\s@]+\.[^\s@]+$/, 'expected an e-mail address');
const expandList = z.array(z.string()).optional();
const listQuery = {
  limit: intStr.transform(Number).pipe(z.number().int().min(1).max(100)).optional(),
  starting_after: z.string().optional(),
  ending_before: z.string().optional(),
  expand: expandList,
};

const sessionCreateSchema = z.object({
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

const sessionListSchema = z.object({
  ...listQuery,
  payment_intent: z.string().optional(),
  status: z.enum(['open', 'complete', 'expired']).optional(),
});

const accountCreateSchema = z.object({
  type: z.enum(['express', 'standard', 'custom']).optional(),
  country: z
    .string()
    .regex(/^[A-Za-z]{2}$/, 'expected a two-letter country code')
    .transform((s) => s.toUpperCase())
    .optional(),
  email: email.optional(),
  business_type: z.enum(['individual', 'company', 'non_profit', 'government_entity']).optional(),
  business_profile: z
    .object({ name: z.string().max(200).optional(), url: z.string().max(500).optional(), product_description: z.string().optional(), mcc: z.string().optional() })
    .optional(),
  capabilities: z.record(z.string(), z.object({ requested: z.enum(['true', 'false']) })).optional(),
  metadata: metadata.optional(),
  expand: expandList,
});
const accountUpdateSchema = accountCreateSchema.omit({ type: true, country: true });

const transferCreateSchema = z.object({
  amount: posInt,
  currency,
  destination: z.string().min(1),
  transfer_group: z.string().max(500).optional(),
  source_transaction: z.string().optional(),
  description: z.string().max(1000).optional(),
  metadata: metadata.optional(),
  expand: expandList,
});
const transferListSchema = z.object({ ...listQuery, transfer_group: z.string().optional(), destination: z.string().optional() });
const reversalCreateSchema = z.object({ amount: posInt.optional(), metadata: metadata.optional(), expand: expandList });

const refundCreateSchema = z.object({
  payment_intent: z.string().optional(),
  charge: z.string().optional(),
  amount: posInt.optional(),
  reason: z.enum(['duplicate', 'fraudulent', 'requested_by_customer']).optional(),
  metadata: metadata.optional(),
  expand: expandList,
});
const refundListSchema = z.object({ ...listQuery, payment_intent: z.string().optional(), charge: z.string().optional() });
const chargeListSchema = z.object({ ...listQuery, payment_intent: z.string().optional(), transfer_group: z.string().optional() });
const eventListSchema = z.object({ ...listQuery, type: z.string().optional() });
const retrieveSchema = z.object({ expand: expandList });

const cardFormSchema = z.object({
  card_number: z.string().max(40).default(''),
  card_expiry: z.string().max(20).default(''),
  card_cvc: z.string().max(10).default(''),
});
const shippingFormSchema = z.object({
  ship_name: z.string().max(200).default(''),
  ship_line1: z.string().max(200).default(''),
  ship_line2: z.string().max(200).default(''),
  ship_city: z.string().max(200).default(''),
  ship_postal_code: z.string().max(40).default(''),
  ship_state: z.string().max(200).default(''),
  ship_country: z.string().max(10).default(''),
});
type ShippingForm = z.output<typeof shippingFormSchema>;
type ShippingField = keyof ShippingForm;

/** Checks the address typed on the payment page; every message says what to type. */
function checkShipping(raw: Record<string, unknown>, allowed: string[]): { values: ShippingForm; errors: Partial<Record<ShippingField, string>>; details: ShippingDetails | null } {
  const r = shippingFormSchema.safeParse(raw);
  const values: ShippingForm = r.success
    ? r.data
    : { ship_name: '', ship_line1: '', ship_line2: '', ship_city: '', ship_postal_code: '', ship_state: '', ship_country: '' };
  const t = (v: string) => v.trim().replace(/\s+/g, ' ');
  const errors: Partial<Record<ShippingField, string>> = {};
  if (!t(values.ship_name)) errors.ship_name = 'Enter the name of the person the parcel is for.';
  if (!t(values.ship_line1)) errors.ship_line1 = 'Enter the first line of the address, for example the house number and street.';
  if (!t(values.ship_city)) errors.ship_city = 'Enter the town or city.';
  if (!t(values.ship_postal_code)) errors.ship_postal_code = 'Enter the postal code.';
  else if (!/^[A-Za-z0-9][A-Za-z0-9 -]{1,11}$/.test(t(values.ship_postal_code))) errors.ship_postal_code = 'Enter the postal code using letters, digits, spaces or hyphens.';
  const country = t(values.ship_country).toUpperCase();
  if (!country) errors.ship_country = 'Choose the country the parcel goes to.';
  else if (!allowed.includes(country)) errors.ship_country = 'We can only send parcels to the countries in the list. Choose one of them.';
  if (Object.keys(errors).length > 0) return { values, errors, details: null };
  return {
    values,
    errors,
    details: {
      name: t(values.ship_name),
      address: {
        line1: t(values.ship_line1),
        line2: t(values.ship_line2) || null,
        city: t(values.ship_city),
        postal_code: t(values.ship_postal_code).toUpperCase(),
        state: t(values.ship_state) || null,
        country,
      },
    },
  };
}

const authFormSchema = z.object({ result: z.enum(['complete', 'fail']) });

function getAt(raw: unknown, p: PropertyKey[]): unknown {
  let cur: unknown = raw;
  for (const k of p) {
    if (cur === null || typeof cur !== 'object') return undefined;
    cur = (cur as Record<PropertyKey, unknown>)[k];
  }
  return cur;
}

function validate<S extends z.ZodType>(schema: S, raw: unknown): z.output<S> {
  const r = schema.safeParse(raw);
  if (r.success) return r.data;
  const issue = r.error.issues[0]!;
  const segs = issue.path.map(String);
  const param = segs.length ? segs[0] + segs.slice(1).map((s) => `[${s}]`).join('') : '';
  const missing = segs.length > 0 && getAt(raw, issue.path) === undefined;
  throw invalid(missing ? `Missing required param: ${param}.` : `Invalid ${param || 'request'}: ${issue.message}`, {
    code: missing ? 'parameter_missing' : 'parameter_invalid',
    ...(param ? { param } : {}),
  });
}

// ---------- the fake ----------

interface Ctx {
  params: Record<string, unknown>;
  match: RegExpExecArray;
  apiVersion: string;
  requestId: string;
  idempotencyKey: string | null;
}

type Handler = (ctx: Ctx) => Obj;

export async function startStripeFake(opts: StripeFakeOptions): Promise<StripeFake> {
  const now = opts.now ?? Date.now;
  const nowSec = () => Math.floor(now() / 1000);
  const log = opts.log ?? (() => {});
  const retryBaseMs = opts.retryBaseMs ?? 200;
  const retryMaxMs = opts.retryMaxMs ?? 60_000;
  const maxAttempts = opts.maxAttempts ?? 12;
  const deliveryTimeoutMs = opts.deliveryTimeoutMs ?? 10_000;
  let webhookUrl: string | null = opts.webhookUrl ?? null;

  fs.mkdirSync(opts.dataDir, { recursive: true });
  const stateFile = path.join(opts.dataDir, 'stripe-state.json');
  const state = loadState(stateFile);

  function save(): void {
    const tmp = `${stateFile}.${process.pid}.tmp`;
    fs.writeFileSync(tmp, JSON.stringify(state));
    fs.renameSync(tmp, stateFile); // rename is atomic: a crash leaves the old or the new file, never half of one
  }

  // Group commit: every change made in one turn of the event loop goes out in one write, and a
  // response waits for the write that holds its change, so what a client was told is on disk.
  let dirty = false;
  let flushing: Promise<void> | null = null;
  function persist(): Promise<void> {
    dirty = true;
    flushing ??= new Promise<void>((resolve, reject) =>
      setImmediate(() => {
        flushing = null;
        try {
          if (dirty && !closed) {
            // after close() the final state has been written already
            dirty = false;
            save();
          }
          resolve();
        } catch (e) {
          reject(e);
        }
      }),
    );
    return flushing;
  }

  // Drop idempotency records past their lifetime.
  for (const [k, rec] of Object.entries(state.idempotency)) {
    if (Date.now() - rec.created > IDEMPOTENCY_TTL_MS) delete state.idempotency[k];
  }

  let publicUrl = '';

  // ----- lookups -----
  const STORES: Array<[string, keyof State, string]> = [
    ['cs_', 'checkout_sessions', 'checkout.session'],
    ['pi_', 'payment_intents', 'payment_intent'],
    ['ch_', 'charges', 'charge'],
    ['acct_', 'accounts', 'account'],
    ['tr_', 'transfers', 'transfer'],
    ['re_', 'refunds', 'refund'],
    ['evt_', 'events', 'event'],
  ];
  function lookup(id: string): Obj | undefined {
    for (const [prefix, store] of STORES) {
      if (id.startsWith(prefix)) return (state[store] as Record<string, Obj>)[id];
    }
    return undefined;
  }
  function mustGet(store: keyof State, id: string, what: string, param = 'id'): Obj {
    const o = (state[store] as Record<string, Obj>)[id];
    if (!o) throw new ApiError(404, 'invalid_request_error', `No such ${what}: '${id}'`, { code: 'resource_missing', param });
    return o;
  }

  function lineItemsList(sessionId: string): Obj {
    const extra = state.session_extra[sessionId];
    const data = clone(extra?.line_items ?? []);
    return { object: 'list', data, has_more: false, url: `/v1/checkout/sessions/${sessionId}/line_items` };
  }

  function expandPath(o: unknown, segs: string[]): void {
    if (!o || typeof o !== 'object' || segs.length === 0) return;
    const obj = o as Obj;
    const [head, ...rest] = segs as [string, ...string[]];
    if (head === 'data' && obj.object === 'list' && Array.isArray(obj.data)) {
      for (const item of obj.data) expandPath(item, rest);
      return;
    }
    if (head === 'line_items' && obj.object === 'checkout.session') {
      obj.line_items = lineItemsList(obj.id);
      expandPath(obj.line_items, rest);
      return;
    }
    const v = obj[head];
    if (typeof v === 'string') {
      const found = lookup(v);
      if (found) obj[head] = clone(found);
    }
    expandPath(obj[head], rest);
  }
  function withExpand(o: Obj, expand: string[] | undefined): Obj {
    const out = clone(o);
    for (const p of expand ?? []) expandPath(out, p.split('.'));
    return out;
  }

  function listOf(items: Obj[], url: string, q: { limit?: number; starting_after?: string; ending_before?: string; expand?: string[] }): Obj {
    // Stripe lists newest first; stores keep insertion (creation) order.
    const all = [...items].reverse();
    const limit = q.limit ?? 10;
    let page: Obj[];
    let hasMore: boolean;
    if (q.starting_after) {
      const i = all.findIndex((x) => x.id === q.starting_after);
      if (i < 0) throw invalid(`No such object: '${q.starting_after}'`, { code: 'resource_missing', param: 'starting_after' });
      page = all.slice(i + 1, i + 1 + limit);
      hasMore = i + 1 + limit < all.length;
    } else if (q.ending_before) {
      const i = all.findIndex((x) => x.id === q.ending_before);
      if (i < 0) throw invalid(`No such object: '${q.ending_before}'`, { code: 'resource_missing', param: 'ending_before' });
      page = all.slice(Math.max(0, i - limit), i);
      hasMore = i - limit > 0;
    } else {
      page = all.slice(0, limit);
      hasMore = limit < all.length;
    }
    return withExpand({ object: 'list', data: page, has_more: hasMore, url }, q.expand);
  }

  // ----- events and webhook deliveries -----
  let deliveryTimer: NodeJS.Timeout | null = null;
  let closed = false;
  const inFlight = new Map<string, AbortController>();
  const inFlightDone = new Set<Promise<void>>();

  function emit(type: string, object: Obj, ctx: { apiVersion?: string; requestId?: string | null; idempotencyKey?: string | null }, previous?: Obj): void {
    const ev: Obj = {
      id: newId('evt_'),
      object: 'event',
      api_version: ctx.apiVersion ?? DEFAULT_API_VERSION,
      created: nowSec(),
      data: { object: clone(object), ...(previous ? { previous_attributes: previous } : {}) },
      livemode: false,
      pending_webhooks: 1,
      request: { id: ctx.requestId ?? null, idempotency_key: ctx.idempotencyKey ?? null },
      type,
    };
    state.events[ev.id] = ev;
    state.deliveries[ev.id] = {
      event_id: ev.id,
      status: 'pending',
      attempts: 0,
      next_attempt_at: Date.now(),
      delivered_at: null,
      last_url: null,
      attempts_log: [],
    };
    // Delivery starts on the next tick, after the caller has saved state.
    setImmediate(scheduleDeliveries);
  }

  function scheduleDeliveries(): void {
    if (closed) return;
    if (deliveryTimer) clearTimeout(deliveryTimer);
    deliveryTimer = null;
    if (!webhookUrl) return; // deliveries wait for an endpoint
    let next = Infinity;
    const t = Date.now();
    for (const d of Object.values(state.deliveries)) {
      if (d.status !== 'pending' || inFlight.has(d.event_id)) continue;
      if (d.next_attempt_at <= t) {
        const p = deliver(d).finally(() => inFlightDone.delete(p));
        inFlightDone.add(p);
      } else next = Math.min(next, d.next_attempt_at);
    }
    if (next !== Infinity) {
      deliveryTimer = setTimeout(scheduleDeliveries, Math.max(0, next - Date.now()));
      deliveryTimer.unref();
    }
  }

  async function deliver(d: Delivery): Promise<void> {
    const ev = state.events[d.event_id];
    const url = webhookUrl;
    if (!ev || !url) return;
    const ac = new AbortController();
    inFlight.set(d.event_id, ac);
    // Stripe sends the event pretty-printed; the same bytes each attempt, signed afresh with a new timestamp.
    const payload = JSON.stringify(ev, null, 2);
    const t = Math.floor(Date.now() / 1000);
    const v1 = createHmac('sha256', opts.webhookSecret).update(`${t}.${payload}`, 'utf8').digest('hex');
    const started = Date.now();
    let status: number | null = null;
    let error: string | null = null;
    const timeout = setTimeout(() => ac.abort(new Error('timed out')), deliveryTimeoutMs);
    try {
      const res = await fetch(url, {
        method: 'POST',
        headers: {
          'content-type': 'application/json; charset=utf-8',
          'stripe-signature': `t=${t},v1=${v1}`,
          'user-agent': 'Stripe/1.0 (+https://stripe.com/docs/webhooks)',
        },
        body: payload,
        signal: ac.signal,
        redirect: 'manual',
      });
      status = res.status;
      await res.arrayBuffer().catch(() => undefined);
    } catch (e) {
      error = e instanceof Error ? (e.cause instanceof Error ? e.cause.message : e.message) : String(e);
    } finally {
      clearTimeout(timeout);
      inFlight.delete(d.event_id);
    }
    if (closed) return; // an attempt cut short by close() does not count; it is retried after restart
    d.attempts += 1;
    d.last_url = url;
    d.attempts_log.push({ at: started, status, error, duration_ms: Date.now() - started });
    if (d.attempts_log.length > 20) d.attempts_log.shift();
    if (status !== null && status >= 200 && status < 300) {
      d.status = 'delivered';
      d.delivered_at = Date.now();
      ev.pending_webhooks = 0;
      log(`webhook ${ev.type} ${ev.id} delivered (${status})`);
    } else if (d.attempts >= maxAttempts) {
      d.status = 'failed';
      log(`webhook ${ev.type} ${ev.id} failed after ${d.attempts} attempts`);
    } else {
      d.next_attempt_at = Date.now() + Math.min(retryBaseMs * 2 ** (d.attempts - 1), retryMaxMs);
      log(`webhook ${ev.type} ${ev.id} attempt ${d.attempts}: ${status ?? error}; retrying`);
    }
    await persist();
    scheduleDeliveries();
  }

  // ----- expiry -----
  function expireSession(s: Obj, ctx: { apiVersion?: string; requestId?: string | null; idempotencyKey?: string | null }): void {
    s.status = 'expired';
    s.url = null;
    const extra = state.session_extra[s.id];
    if (extra) extra.pending_auth = null;
    if (s.payment_intent) {
      const pi = state.payment_intents[s.payment_intent];
      if (pi && pi.status !== 'succeeded' && pi.status !== 'canceled') {
        pi.status = 'canceled';
        pi.canceled_at = nowSec();
        pi.cancellation_reason = 'abandoned';
        pi.next_action = null;
      }
    }
    emit('checkout.session.expired', s, { apiVersion: extra?.api_version, ...ctx });
  }
  function sweepExpired(): void {
    let changed = false;
    const t = nowSec();
    for (const s of Object.values(state.checkout_sessions)) {
      if (s.status === 'open' && s.expires_at <= t) {
        expireSession(s, {});
        changed = true;
      }
    }
    if (changed) void persist().catch((e: unknown) => log(`stripe fake: cannot save state: ${String(e)}`));
  }

  // ----- payments -----
  function ensurePaymentIntent(s: Obj): Obj {
    if (s.payment_intent && state.payment_intents[s.payment_intent]) return state.payment_intents[s.payment_intent]!;
    const extra = state.session_extra[s.id]!;
    const id = newId('pi_');
    const pi: Obj = {
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
      created: nowSec(),
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
    };
    state.payment_intents[id] = pi;
    s.payment_intent = id;
    return pi;
  }

  function makeCharge(s: Obj, pi: Obj, card: PendingCard, failure: { code: string; decline_code: string; message: string } | null): Obj {
    const id = newId('ch_');
    const ok = failure === null;
    const ch: Obj = {
      id,
      object: 'charge',
      amount: pi.amount,
      amount_captured: ok ? pi.amount : 0,
      amount_refunded: 0,
      balance_transaction: ok ? newId('txn_') : null,
      billing_details: { email: s.customer_email, name: null, address: null, phone: null },
      captured: ok,
      created: nowSec(),
      currency: pi.currency,
      description: pi.description,
      failure_code: failure?.code ?? null,
      failure_message: failure?.message ?? null,
      livemode: false,
      metadata: clone(pi.metadata),
      outcome: ok
        ? { network_status: 'approved_by_network', reason: null, risk_level: 'normal', seller_message: 'Payment complete.', type: 'authorized' }
        : { network_status: 'declined_by_network', reason: failure.decline_code, risk_level: 'normal', seller_message: 'The bank did not return any further details with this decline.', type: 'issuer_declined' },
      paid: ok,
      payment_intent: pi.id,
      payment_method: pi.payment_method,
      payment_method_details: { type: 'card', card: { brand: card.brand, last4: card.last4, exp_month: card.exp_month, exp_year: card.exp_year, funding: 'credit', country: 'US' } },
      receipt_email: s.customer_email,
      refunded: false,
      refunds: { object: 'list', data: [], has_more: false, url: `/v1/charges/${id}/refunds` },
      status: ok ? 'succeeded' : 'failed',
      transfer_group: pi.transfer_group,
    };
    state.charges[id] = ch;
    return ch;
  }

  function succeed(s: Obj, card: PendingCard, shipping: ShippingDetails | null): void {
    const pi = ensurePaymentIntent(s);
    pi.payment_method = newId('pm_');
    const ch = makeCharge(s, pi, card, null);
    Object.assign(pi, { status: 'succeeded', amount_received: pi.amount, latest_charge: ch.id, last_payment_error: null, next_action: null });
    Object.assign(s, {
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
    const extra = state.session_extra[s.id]!;
    extra.pending_auth = null;
    extra.pending_shipping = null;
    emit('checkout.session.completed', s, { apiVersion: extra.api_version });
  }

  function decline(s: Obj, card: PendingCard | null, failure: { type: string; code: string; decline_code?: string; message: string }): void {
    const pi = ensurePaymentIntent(s);
    pi.payment_method = newId('pm_');
    let chargeId: string | null = null;
    if (card && failure.decline_code) {
      const ch = makeCharge(s, pi, card, { code: failure.code, decline_code: failure.decline_code, message: failure.message });
      chargeId = ch.id;
      pi.latest_charge = ch.id;
    }
    Object.assign(pi, {
      status: 'requires_payment_method',
      next_action: null,
      last_payment_error: { ...failure, charge: chargeId, payment_method: { id: pi.payment_method, object: 'payment_method', type: 'card' } },
    });
    state.session_extra[s.id]!.pending_auth = null;
    state.session_extra[s.id]!.pending_shipping = null;
  }

  function refundableCharge(pi: Obj | undefined, chargeId: string | undefined): Obj {
    let ch: Obj | undefined;
    if (chargeId) ch = mustGet('charges', chargeId, 'charge', 'charge');
    else if (pi) ch = pi.latest_charge ? state.charges[pi.latest_charge] : undefined;
    if (!ch || ch.status !== 'succeeded') {
      throw invalid(`This PaymentIntent (${pi?.id ?? '?'}) does not have a successful charge to refund.`, { code: 'charge_not_found', param: 'payment_intent' });
    }
    return ch;
  }

  function availableBalance(cur: string): number {
    // Simpler than Stripe: charge funds count as available at once (Stripe test mode holds them as
    // pending unless a transfer names its source_transaction).
    let bal = 0;
    for (const c of Object.values(state.charges)) if (c.status === 'succeeded' && c.currency === cur) bal += c.amount - c.amount_refunded;
    for (const t of Object.values(state.transfers)) if (t.currency === cur) bal -= t.amount - t.amount_reversed;
    return bal;
  }

  // ----- API routes -----
  const routes: Array<{ method: string; re: RegExp; handler: Handler }> = [];
  const route = (method: string, pattern: string, handler: Handler) =>
    routes.push({ method, re: new RegExp(`^${pattern.replace(/:(\w+)/g, '([^/]+)')}$`), handler });

  route('POST', '/v1/checkout/sessions', (ctx) => {
    const p = validate(sessionCreateSchema, ctx.params);
    if (p.mode !== 'payment') throw invalid(`This fake supports mode=payment only, not '${p.mode}'.`, { code: 'parameter_invalid', param: 'mode' });
    const cur = p.line_items[0]!.price_data.currency;
    p.line_items.forEach((li, i) => {
      if (li.price_data.currency !== cur) throw invalid('All line items must use the same currency.', { code: 'parameter_invalid', param: `line_items[${i}][price_data][currency]` });
    });
    const total = p.line_items.reduce((sum, li) => sum + li.price_data.unit_amount * li.quantity, 0);
    if (MIN_AMOUNT[cur] !== undefined && total < MIN_AMOUNT[cur]!) {
      throw invalid(`The Checkout Session's total amount due must add up to at least ${MIN_AMOUNT[cur]} in the smallest unit of ${cur}.`, { code: 'amount_too_small', param: 'line_items' });
    }
    if (total > MAX_AMOUNT) throw invalid(`The total amount due must be no more than ${MAX_AMOUNT} in the smallest currency unit.`, { code: 'amount_too_large', param: 'line_items' });
    const created = nowSec();
    let expiresAt = created + 24 * 3600;
    if (p.expires_at !== undefined) {
      // Stripe accepts 30 minutes to 24 hours after creation.
      if (p.expires_at < created + 30 * 60 - 5 || p.expires_at > created + 24 * 3600 + 5) {
        throw invalid('The `expires_at` timestamp must be between 30 minutes and 24 hours after the Checkout Session is created.', { code: 'parameter_invalid', param: 'expires_at' });
      }
      expiresAt = p.expires_at;
    }
    const id = newId('cs_test_', 56);
    const lineItems = p.line_items.map((li) => {
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
    });
    state.session_extra[id] = {
      line_items: lineItems,
      transfer_group: p.payment_intent_data?.transfer_group ?? null,
      pi_metadata: p.payment_intent_data?.metadata ?? {},
      pi_description: p.payment_intent_data?.description ?? null,
      api_version: ctx.apiVersion,
      pending_auth: null,
    };
    const s: Obj = {
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
      url: `${publicUrl}/pay/${id}`,
    };
    state.checkout_sessions[id] = s;
    return withExpand(s, p.expand);
  });

  route('GET', '/v1/checkout/sessions', (ctx) => {
    const q = validate(sessionListSchema, ctx.params);
    const items = Object.values(state.checkout_sessions).filter(
      (s) => (!q.payment_intent || s.payment_intent === q.payment_intent) && (!q.status || s.status === q.status),
    );
    return listOf(items, '/v1/checkout/sessions', q);
  });

  route('GET', '/v1/checkout/sessions/:id', (ctx) => {
    const q = validate(retrieveSchema, ctx.params);
    return withExpand(mustGet('checkout_sessions', ctx.match[1]!, 'checkout.session'), q.expand);
  });

  route('GET', '/v1/checkout/sessions/:id/line_items', (ctx) => {
    const q = validate(z.object(listQuery), ctx.params);
    const s = mustGet('checkout_sessions', ctx.match[1]!, 'checkout.session');
    return listOf([...(state.session_extra[s.id]?.line_items ?? [])].reverse(), `/v1/checkout/sessions/${s.id}/line_items`, q);
  });

  route('POST', '/v1/checkout/sessions/:id/expire', (ctx) => {
    const q = validate(retrieveSchema, ctx.params);
    const s = mustGet('checkout_sessions', ctx.match[1]!, 'checkout.session');
    if (s.status !== 'open') {
      throw invalid(`Only Checkout Sessions with a status in ["open"] can be expired. This session has status '${s.status}'.`, { code: 'checkout_session_not_open' });
    }
    expireSession(s, ctx);
    return withExpand(s, q.expand);
  });

  route('GET', '/v1/payment_intents/:id', (ctx) => {
    const q = validate(retrieveSchema, ctx.params);
    return withExpand(mustGet('payment_intents', ctx.match[1]!, 'payment_intent'), q.expand);
  });

  route('GET', '/v1/charges', (ctx) => {
    const q = validate(chargeListSchema, ctx.params);
    const items = Object.values(state.charges).filter(
      (c) => (!q.payment_intent || c.payment_intent === q.payment_intent) && (!q.transfer_group || c.transfer_group === q.transfer_group),
    );
    return listOf(items, '/v1/charges', q);
  });

  route('GET', '/v1/charges/:id', (ctx) => {
    const q = validate(retrieveSchema, ctx.params);
    return withExpand(mustGet('charges', ctx.match[1]!, 'charge'), q.expand);
  });

  // Connected accounts: simpler than Stripe, they are ready for transfers at once (no onboarding).
  route('POST', '/v1/accounts', (ctx) => {
    const p = validate(accountCreateSchema, ctx.params);
    const id = newId('acct_', 16);
    const country = p.country ?? 'US';
    const requested = Object.entries(p.capabilities ?? { transfers: { requested: 'true' } }).filter(([, v]) => v.requested === 'true');
    const acct: Obj = {
      id,
      object: 'account',
      business_profile: { name: null, url: null, product_description: null, mcc: null, ...(p.business_profile ?? {}) },
      business_type: p.business_type ?? null,
      capabilities: Object.fromEntries(requested.map(([k]) => [k, 'active'])),
      charges_enabled: true,
      country,
      created: nowSec(),
      default_currency: ({ US: 'usd', GB: 'gbp', CA: 'cad', AU: 'aud', JP: 'jpy' } as Record<string, string>)[country] ?? 'eur',
      details_submitted: true,
      email: p.email ?? null,
      metadata: p.metadata ?? {},
      payouts_enabled: true,
      type: p.type ?? 'standard',
    };
    state.accounts[id] = acct;
    return withExpand(acct, p.expand);
  });

  route('GET', '/v1/accounts', (ctx) => {
    const q = validate(z.object(listQuery), ctx.params);
    return listOf(Object.values(state.accounts), '/v1/accounts', q);
  });

  route('GET', '/v1/accounts/:id', (ctx) => {
    const q = validate(retrieveSchema, ctx.params);
    return withExpand(mustGet('accounts', ctx.match[1]!, 'account', 'account'), q.expand);
  });

  route('POST', '/v1/accounts/:id', (ctx) => {
    const p = validate(accountUpdateSchema, ctx.params);
    const acct = mustGet('accounts', ctx.match[1]!, 'account', 'account');
    if (p.email !== undefined) acct.email = p.email;
    if (p.business_type !== undefined) acct.business_type = p.business_type;
    if (p.business_profile) Object.assign(acct.business_profile, p.business_profile);
    if (p.metadata) Object.assign(acct.metadata, p.metadata);
    if (p.capabilities) for (const [k, v] of Object.entries(p.capabilities)) if (v.requested === 'true') acct.capabilities[k] = 'active';
    return withExpand(acct, p.expand);
  });

  route('POST', '/v1/transfers', (ctx) => {
    const p = validate(transferCreateSchema, ctx.params);
    const dest = state.accounts[p.destination];
    if (!dest) throw invalid(`No such destination: '${p.destination}'`, { code: 'resource_missing', param: 'destination' });
    if (p.source_transaction) {
      const ch = mustGet('charges', p.source_transaction, 'charge', 'source_transaction');
      if (ch.status !== 'succeeded') throw invalid(`The charge ${ch.id} has not succeeded.`, { code: 'parameter_invalid', param: 'source_transaction' });
      if (ch.currency !== p.currency) throw invalid(`The currency of source_transaction's balance transaction (${ch.currency}) must be the same as the transfer currency (${p.currency}).`, { code: 'parameter_invalid', param: 'currency' });
      const already = Object.values(state.transfers)
        .filter((t) => t.source_transaction === ch.id)
        .reduce((sum, t) => sum + t.amount - t.amount_reversed, 0);
      if (already + p.amount > ch.amount) {
        throw invalid(`Transfers using this source_transaction would total ${already + p.amount}, more than the charge's ${ch.amount}.`, { code: 'balance_insufficient', param: 'amount' });
      }
    }
    if (p.amount > availableBalance(p.currency)) {
      throw invalid('You have insufficient available funds in your Stripe account.', { code: 'balance_insufficient', param: 'amount' });
    }
    const id = newId('tr_');
    const tr: Obj = {
      id,
      object: 'transfer',
      amount: p.amount,
      amount_reversed: 0,
      balance_transaction: newId('txn_'),
      created: nowSec(),
      currency: p.currency,
      description: p.description ?? null,
      destination: dest.id,
      destination_payment: newId('py_'),
      livemode: false,
      metadata: p.metadata ?? {},
      reversals: { object: 'list', data: [], has_more: false, url: `/v1/transfers/${id}/reversals` },
      reversed: false,
      source_transaction: p.source_transaction ?? null,
      source_type: 'card',
      transfer_group: p.transfer_group ?? null,
    };
    state.transfers[id] = tr;
    return withExpand(tr, p.expand);
  });

  route('GET', '/v1/transfers', (ctx) => {
    const q = validate(transferListSchema, ctx.params);
    const items = Object.values(state.transfers).filter(
      (t) => (!q.transfer_group || t.transfer_group === q.transfer_group) && (!q.destination || t.destination === q.destination),
    );
    return listOf(items, '/v1/transfers', q);
  });

  route('GET', '/v1/transfers/:id', (ctx) => {
    const q = validate(retrieveSchema, ctx.params);
    return withExpand(mustGet('transfers', ctx.match[1]!, 'transfer'), q.expand);
  });

  route('POST', '/v1/transfers/:id/reversals', (ctx) => {
    const p = validate(reversalCreateSchema, ctx.params);
    const tr = mustGet('transfers', ctx.match[1]!, 'transfer');
    const remaining = tr.amount - tr.amount_reversed;
    const amount = p.amount ?? remaining;
    if (remaining === 0) throw invalid(`Transfer ${tr.id} has already been fully reversed.`, { code: 'transfer_already_reversed' });
    if (amount > remaining) throw invalid(`Reversal amount (${amount}) is greater than the amount not yet reversed (${remaining}).`, { code: 'amount_too_large', param: 'amount' });
    const rev: Obj = { id: newId('trr_'), object: 'transfer_reversal', amount, created: nowSec(), currency: tr.currency, metadata: p.metadata ?? {}, transfer: tr.id };
    tr.amount_reversed += amount;
    tr.reversed = tr.amount_reversed === tr.amount;
    tr.reversals.data.unshift(rev);
    return withExpand(rev, p.expand);
  });

  route('POST', '/v1/refunds', (ctx) => {
    const p = validate(refundCreateSchema, ctx.params);
    if (!p.payment_intent && !p.charge) throw invalid('Missing required param: payment_intent or charge.', { code: 'parameter_missing', param: 'payment_intent' });
    const pi = p.payment_intent ? mustGet('payment_intents', p.payment_intent, 'payment_intent', 'payment_intent') : undefined;
    const ch = refundableCharge(pi, p.charge);
    if (pi && ch.payment_intent !== pi.id) throw invalid(`Charge ${ch.id} does not belong to ${pi.id}.`, { code: 'parameter_invalid', param: 'charge' });
    const remaining = ch.amount - ch.amount_refunded;
    if (remaining <= 0) throw invalid(`Charge ${ch.id} has already been refunded.`, { code: 'charge_already_refunded' });
    const amount = p.amount ?? remaining;
    if (amount > remaining) {
      throw invalid(`Refund amount (${amount}) is greater than unrefunded amount on charge (${remaining}).`, { code: 'amount_too_large', param: 'amount' });
    }
    const re: Obj = {
      id: newId('re_'),
      object: 'refund',
      amount,
      balance_transaction: newId('txn_'),
      charge: ch.id,
      created: nowSec(),
      currency: ch.currency,
      metadata: p.metadata ?? {},
      payment_intent: ch.payment_intent,
      reason: p.reason ?? null,
      status: 'succeeded',
    };
    state.refunds[re.id] = re;
    const previous = { amount_refunded: ch.amount_refunded, refunded: ch.refunded };
    ch.amount_refunded += amount;
    ch.refunded = ch.amount_refunded === ch.amount;
    ch.refunds.data.unshift(clone(re));
    emit('charge.refunded', ch, ctx, previous);
    return withExpand(re, p.expand);
  });

  route('GET', '/v1/refunds', (ctx) => {
    const q = validate(refundListSchema, ctx.params);
    const items = Object.values(state.refunds).filter((r) => (!q.payment_intent || r.payment_intent === q.payment_intent) && (!q.charge || r.charge === q.charge));
    return listOf(items, '/v1/refunds', q);
  });

  route('GET', '/v1/refunds/:id', (ctx) => {
    const q = validate(retrieveSchema, ctx.params);
    return withExpand(mustGet('refunds', ctx.match[1]!, 'refund'), q.expand);
  });

  route('GET', '/v1/events', (ctx) => {
    const q = validate(eventListSchema, ctx.params);
    return listOf(Object.values(state.events).filter((e) => !q.type || e.type === q.type), '/v1/events', q);
  });

  route('GET', '/v1/events/:id', (ctx) => {
    const q = validate(retrieveSchema, ctx.params);
    return withExpand(mustGet('events', ctx.match[1]!, 'event'), q.expand);
  });

  route('GET', '/v1/balance', () => {
    const currencies = new Set(Object.values(state.charges).map((c) => c.currency as string));
    return {
      object: 'balance',
      available: [...currencies].map((c) => ({ amount: availableBalance(c), currency: c })),
      pending: [],
      livemode: false,
    };
  });

  // ----- HTTP plumbing -----
  function send(res: http.ServerResponse, status: number, body: string, headers: Record<string, string>): void {
    res.writeHead(status, { 'content-length': String(Buffer.byteLength(body)), ...headers });
    res.end(body);
  }
  const sendJson = (res: http.ServerResponse, status: number, body: unknown, headers: Record<string, string> = {}) =>
    send(res, status, JSON.stringify(body, null, 2), { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store', ...headers });
  const HTML_HEADERS = {
    'content-type': 'text/html; charset=utf-8',
    'cache-control': 'no-store',
    'x-content-type-options': 'nosniff',
    'referrer-policy': 'no-referrer',
    // No form-action: it would also block the redirect to the shop's success_url.
    'content-security-policy': "default-src 'none'; style-src 'unsafe-inline'; frame-ancestors 'none'; base-uri 'none'",
  };
  const sendHtml = (res: http.ServerResponse, status: number, html: string) => send(res, status, html, HTML_HEADERS);
  const redirect = (res: http.ServerResponse, location: string) => send(res, 303, '', { location, 'cache-control': 'no-store' });

  function readBody(req: http.IncomingMessage, limit: number): Promise<string> {
    return new Promise((resolve, reject) => {
      const chunks: Buffer[] = [];
      let size = 0;
      req.on('data', (c: Buffer) => {
        size += c.length;
        if (size > limit) {
          reject(new ApiError(413, 'invalid_request_error', 'Request body too large.'));
          req.destroy();
          return;
        }
        chunks.push(c);
      });
      req.on('end', () => resolve(Buffer.concat(chunks).toString('utf8')));
      req.on('error', reject);
    });
  }

  function checkAuth(req: http.IncomingMessage): void {
    const h = req.headers.authorization ?? '';
    let key = '';
    const bearer = /^Bearer\s+(\S+)$/i.exec(h);
    const basic = /^Basic\s+(\S+)$/i.exec(h);
    if (bearer) key = bearer[1]!;
    else if (basic) key = Buffer.from(basic[1]!, 'base64').toString('utf8').split(':')[0] ?? '';
    if (!key) throw new ApiError(401, 'invalid_request_error', 'You did not provide an API key. Send it as `Authorization: Bearer sk_test_...`.');
    if (!/^sk_test_\S+$/.test(key)) {
      throw new ApiError(401, 'invalid_request_error', `Invalid API Key provided: ${key.slice(0, 8)}****. The local Stripe fake takes secret test keys (sk_test_...) only.`, { code: 'api_key_invalid' });
    }
  }

  async function handleApi(req: http.IncomingMessage, res: http.ServerResponse, url: URL, pathname: string): Promise<void> {
    const method = (req.method ?? 'GET').toUpperCase();
    const requestId = newId('req_', 14);
    const apiVersion = typeof req.headers['stripe-version'] === 'string' ? req.headers['stripe-version'] : DEFAULT_API_VERSION;
    const idemHeader = req.headers['idempotency-key'];
    const idempotencyKey = method === 'POST' && typeof idemHeader === 'string' && idemHeader ? idemHeader : null;
    const headers: Record<string, string> = { 'request-id': requestId, 'stripe-version': apiVersion };
    if (idempotencyKey) headers['idempotency-key'] = idempotencyKey;
    try {
      const raw = method === 'POST' ? await readBody(req, MAX_BODY) : '';
      checkAuth(req);
      if (idempotencyKey && idempotencyKey.length > 255) throw invalid('Idempotency-Key must be at most 255 characters.', { code: 'parameter_invalid' });
      let params: Record<string, unknown>;
      try {
        params = parseForm(method === 'POST' ? raw : url.search.slice(1));
      } catch (e) {
        if (e instanceof FormParseError) throw invalid(e.message, { code: 'parameter_invalid' });
        throw e;
      }
      const r = routes.find((x) => x.method === method && x.re.test(pathname));
      if (!r) throw new ApiError(404, 'invalid_request_error', `Unrecognized request URL (${method}: ${pathname}).`);
      const match = r.re.exec(pathname)!;

      let fingerprint = '';
      if (idempotencyKey) {
        fingerprint = createHash('sha256').update(`${method} ${pathname} ${canonical(params)}`).digest('hex');
        const rec = state.idempotency[idempotencyKey];
        if (rec) {
          if (rec.fingerprint !== fingerprint) {
            throw new ApiError(
              400,
              'idempotency_error',
              `Keys for idempotent requests can only be used with the same parameters they were first used with. Try using a key other than '${idempotencyKey}' if you meant to execute a different request.`,
            );
          }
          if (flushing) await flushing;
          send(res, rec.status, rec.body, { 'content-type': 'application/json; charset=utf-8', ...headers, 'idempotent-replayed': 'true' });
          return;
        }
      }
      // Handlers are synchronous, so no other request runs between the key check and its record.
      const body = r.handler({ params, match, apiVersion, requestId, idempotencyKey });
      const text = JSON.stringify(body, null, 2);
      if (idempotencyKey) {
        state.idempotency[idempotencyKey] = { fingerprint, method, path: pathname, status: 200, body: text, created: Date.now() };
      }
      if (method === 'POST') await persist();
      send(res, 200, text, { 'content-type': 'application/json; charset=utf-8', ...headers });
    } catch (e) {
      if (e instanceof ApiError) {
        sendJson(res, e.status, e.body(), headers);
        return;
      }
      throw e;
    }
  }

  // ----- hosted payment page -----
  function pageItems(s: Obj) {
    return (state.session_extra[s.id]?.line_items ?? []).map((li) => ({ name: li.description as string, quantity: li.quantity as number, amount: li.amount_total as number }));
  }
  function successUrl(s: Obj): string {
    return String(s.success_url).replaceAll('{CHECKOUT_SESSION_ID}', s.id).replaceAll('%7BCHECKOUT_SESSION_ID%7D', s.id);
  }
  function renderPay(res: http.ServerResponse, s: Obj, status: number, extra: Partial<Parameters<typeof payPage>[0]> = {}): void {
    sendHtml(
      res,
      status,
      payPage({
        sessionId: s.id,
        action: `/pay/${s.id}`,
        amount: s.amount_total,
        currency: s.currency,
        items: pageItems(s),
        email: s.customer_email,
        cancelUrl: s.cancel_url,
        shippingCountries: s.shipping_address_collection?.allowed_countries ?? null,
        ...extra,
      }),
    );
  }
  function closedPage(res: http.ServerResponse, s: Obj, method: string): void {
    if (s.status === 'complete') {
      // A second tab or a resubmitted form lands on the shop's success page: one payment, never two.
      if (method === 'POST') return redirect(res, successUrl(s));
      return sendHtml(res, 200, messagePage('This payment is complete', 'This payment has already been made. Nothing more to do here.', { href: successUrl(s), text: 'Continue to the shop' }));
    }
    return sendHtml(
      res,
      410,
      messagePage('This payment page has expired', 'This payment page is no longer open, so nothing was charged. Start the payment again from your cart.', s.cancel_url ? { href: s.cancel_url, text: 'Go back to your cart' } : null),
    );
  }

  const DECLINE_TEXT: Record<string, string> = {
    generic_decline: 'Your card was declined, so nothing was charged. Try another card, or go back to your cart.',
    insufficient_funds: "Your card was declined because it doesn't have enough funds, so nothing was charged. Try another card, or go back to your cart.",
    test_mode_live_card: 'This is a test payment page: it takes only the test card numbers listed below. Nothing was charged.',
    authentication_failed: 'The extra confirmation was not completed, so nothing was charged. Try again, or use another card.',
  };

  async function handlePage(req: http.IncomingMessage, res: http.ServerResponse, pathname: string): Promise<void> {
    const method = (req.method ?? 'GET').toUpperCase();
    const m = /^\/pay\/([^/]+)(\/authenticate)?$/.exec(pathname);
    const s = m ? state.checkout_sessions[m[1]!] : undefined;
    if (!m || !s) return sendHtml(res, 404, messagePage('Payment not found', 'There is no payment at this address.'));
    const isAuth = Boolean(m[2]);
    if (method === 'GET') {
      if (s.status !== 'open') return closedPage(res, s, method);
      if (isAuth) return redirect(res, `/pay/${s.id}`);
      return renderPay(res, s, 200);
    }
    if (method !== 'POST') return send(res, 405, 'Method not allowed', { allow: 'GET, POST', 'content-type': 'text/plain' });
    let form: Record<string, unknown>;
    try {
      form = parseForm(await readBody(req, 16 * 1024));
    } catch {
      return renderPay(res, s, 400, { error: 'The form could not be read. Please try again.' });
    }
    if (s.status !== 'open') return closedPage(res, s, method);
    const extra = state.session_extra[s.id]!;

    if (isAuth) {
      const r = authFormSchema.safeParse(form);
      if (!extra.pending_auth || !r.success) return redirect(res, `/pay/${s.id}`);
      if (r.data.result === 'complete') {
        succeed(s, extra.pending_auth, extra.pending_shipping ?? null);
        await persist();
        return redirect(res, successUrl(s));
      }
      decline(s, null, {
        type: 'invalid_request_error',
        code: 'payment_intent_authentication_failure',
        message: 'We are unable to authenticate your payment method. Please choose a different payment method and try again.',
      });
      await persist();
      return renderPay(res, s, 402, { error: DECLINE_TEXT.authentication_failed });
    }

    const f = cardFormSchema.safeParse(form);
    const values = f.success ? f.data : { card_number: '', card_expiry: '', card_cvc: '' };
    const fieldErrors: NonNullable<Parameters<typeof payPage>[0]['fieldErrors']> = {};
    const number = values.card_number.replace(/[\s-]/g, '');
    if (!/^\d{12,19}$/.test(number)) fieldErrors.card_number = 'Enter the card number: 16 digits, spaces allowed.';
    else if (!luhn(number)) fieldErrors.card_number = "That card number isn't valid. Check the digits and try again.";
    const exp = /^\s*(\d{1,2})\s*\/\s*(\d{2}|\d{4})\s*$/.exec(values.card_expiry);
    let expMonth = 0;
    let expYear = 0;
    if (exp) {
      expMonth = Number(exp[1]);
      expYear = exp[2]!.length === 2 ? 2000 + Number(exp[2]) : Number(exp[2]);
    }
    const today = new Date(now());
    if (!exp || expMonth < 1 || expMonth > 12) fieldErrors.card_expiry = 'Enter the expiry date as MM/YY, for example 12/34.';
    else if (expYear * 12 + expMonth < today.getUTCFullYear() * 12 + today.getUTCMonth() + 1) fieldErrors.card_expiry = 'This card has expired. Enter a month and year that have not passed.';
    if (!/^\d{3,4}$/.test(values.card_cvc.trim())) fieldErrors.card_cvc = 'Enter the 3 or 4 digits of the security code.';
    const allowed: string[] | null = s.shipping_address_collection?.allowed_countries ?? null;
    const ship = allowed ? checkShipping(form, allowed) : null;
    if (ship) Object.assign(fieldErrors, ship.errors);
    if (Object.keys(fieldErrors).length > 0) {
      return renderPay(res, s, 400, {
        error: ship && Object.keys(ship.errors).length > 0 ? 'Please correct the details marked below.' : 'Please correct the card details marked below.',
        fieldErrors,
        values: { card_number: values.card_number, card_expiry: values.card_expiry, ...(ship ? ship.values : {}) },
      });
    }
    const shipping = ship?.details ?? null;
    const card: PendingCard = { last4: number.slice(-4), exp_month: expMonth, exp_year: expYear, brand: brandOf(number) };
    const behaviour = TEST_CARDS[number];
    if (behaviour === 'succeed') {
      succeed(s, card, shipping);
      await persist();
      return redirect(res, successUrl(s));
    }
    if (behaviour === 'authenticate') {
      const pi = ensurePaymentIntent(s);
      Object.assign(pi, { status: 'requires_action', payment_method: newId('pm_'), next_action: { type: 'use_stripe_sdk', use_stripe_sdk: {} }, last_payment_error: null });
      extra.pending_auth = card;
      extra.pending_shipping = shipping;
      await persist();
      return sendHtml(res, 200, authPage({ action: `/pay/${s.id}/authenticate`, amount: s.amount_total, currency: s.currency, cancelUrl: s.cancel_url }));
    }
    const declineCode: string = behaviour ?? 'test_mode_live_card';
    const message =
      declineCode === 'insufficient_funds' ? 'Your card has insufficient funds.' : declineCode === 'test_mode_live_card' ? 'Your card was declined. Your request was in test mode, but used a non test card.' : 'Your card was declined.';
    decline(s, card, { type: 'card_error', code: 'card_declined', decline_code: declineCode, message });
    await persist();
    return renderPay(res, s, 402, { error: DECLINE_TEXT[declineCode] ?? DECLINE_TEXT.generic_decline });
  }

  // ----- test-only endpoints -----
  async function handleFake(req: http.IncomingMessage, res: http.ServerResponse, pathname: string): Promise<void> {
    const method = (req.method ?? 'GET').toUpperCase();
    if (method === 'GET' && pathname === '/_fake/health') return sendJson(res, 200, { ok: true });
    if (method === 'GET' && pathname === '/_fake/events') {
      const data = Object.values(state.events)
        .reverse()
        .map((ev) => ({ id: ev.id, type: ev.type, created: ev.created, object_id: ev.data.object.id, delivery: state.deliveries[ev.id] ?? null, event: ev }));
      return sendJson(res, 200, { object: 'list', data, has_more: false, webhook_url: webhookUrl });
    }
    const m = /^\/_fake\/events\/([^/]+)\/retry$/.exec(pathname);
    if (method === 'POST' && m) {
      await readBody(req, 1024);
      const d = state.deliveries[m[1]!];
      if (!d) return sendJson(res, 404, { error: { type: 'invalid_request_error', code: 'resource_missing', message: `No such event: '${m[1]}'` } });
      if (!inFlight.has(d.event_id)) Object.assign(d, { status: 'pending', attempts: 0, next_attempt_at: Date.now() });
      await persist();
      scheduleDeliveries();
      return sendJson(res, 200, { delivery: d });
    }
    return sendJson(res, 404, { error: { type: 'invalid_request_error', message: `Unrecognized request URL (${method}: ${pathname}).` } });
  }

  const server = http.createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://127.0.0.1');
    const pathname = url.pathname.length > 1 ? url.pathname.replace(/\/+$/, '') : url.pathname;
    let work: Promise<void>;
    try {
      sweepExpired();
      if (pathname.startsWith('/v1/')) work = handleApi(req, res, url, pathname);
      else if (pathname.startsWith('/pay/')) work = handlePage(req, res, pathname);
      else if (pathname.startsWith('/_fake/')) work = handleFake(req, res, pathname);
      else work = Promise.resolve(sendJson(res, 404, { error: { type: 'invalid_request_error', message: `Unrecognized request URL (${req.method}: ${pathname}).` } }));
    } catch (e) {
      work = Promise.reject(e);
    }
    work.catch((e: unknown) => {
      if (e instanceof ApiError && !res.headersSent) return sendJson(res, e.status, e.body());
      log(`stripe fake: internal error: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}`);
      if (!res.headersSent) sendJson(res, 500, { error: { type: 'api_error', message: 'Internal error in the Stripe fake.' } }, { 'stripe-should-retry': 'false' });
      else res.destroy();
    });
  });

  const port = await listenLocal(server, () => server.address(), opts.port ?? 0, opts.orFreePort);
  const url = `http://127.0.0.1:${port}`;
  publicUrl = (opts.publicUrl ?? url).replace(/\/+$/, '');
  // Open sessions made under an earlier port point at the current one after a restart.
  for (const s of Object.values(state.checkout_sessions)) if (s.status === 'open') s.url = `${publicUrl}/pay/${s.id}`;
  save();

  const sweepTimer = setInterval(sweepExpired, 1000);
  sweepTimer.unref();
  scheduleDeliveries(); // resume deliveries left pending by an earlier run

  return {
    url,
    port,
    setWebhookUrl(next: string) {
      webhookUrl = next;
      scheduleDeliveries();
    },
    async close() {
      if (closed) return;
      closed = true;
      clearInterval(sweepTimer);
      if (deliveryTimer) clearTimeout(deliveryTimer);
      for (const ac of inFlight.values()) ac.abort(new Error('stripe fake closing'));
      await Promise.allSettled([...inFlightDone]);
      save();
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
    },
  };
}

function loadState(file: string): State {
  if (!fs.existsSync(file)) return emptyState();
  const text = fs.readFileSync(file, 'utf8');
  try {
    const parsed = JSON.parse(text) as Partial<State>;
    return { ...emptyState(), ...parsed, version: 1 };
  } catch (e) {
    throw new Error(`Stripe fake: cannot read ${file} (${e instanceof Error ? e.message : String(e)}). Move it away to start with empty state.`);
  }
}
