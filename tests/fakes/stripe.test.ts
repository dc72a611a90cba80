// The local Stripe fake, driven through the official `stripe` SDK (23.1.0) and plain HTTP.
// Reference for the expected behaviour: Stripe API docs (test cards, webhook signatures,
// idempotent requests, Connect "separate charges and transfers") and stripe-node `src/Webhooks.ts`,
// as summarised in DEVELOPERS.md, "Money and payments".
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { spawn } from 'node:child_process';
import Stripe from 'stripe';
import { startStripeFake, type StripeFake, type StripeFakeOptions } from '../../fakes/stripe/server.ts';
import { parseForm } from '../../fakes/stripe/http.ts';

const SECRET = 'whsec_test_secret_for_fake';
const KEY = 'sk_test_namesake_fake';

interface Received {
  body: string;
  signature: string;
}

/** A tiny webhook endpoint; `answer` decides each reply's status. */
async function startReceiver(answer: (n: number) => number = () => 200) {
  const received: Received[] = [];
  const server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      received.push({ body: Buffer.concat(chunks).toString('utf8'), signature: String(req.headers['stripe-signature'] ?? '') });
      res.statusCode = answer(received.length);
      res.end('ok');
    });
  });
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  const port = (server.address() as AddressInfo).port;
  return {
    url: `http://127.0.0.1:${port}/webhooks/stripe`,
    port,
    received,
    close: () =>
      new Promise<void>((r) => {
        server.close(() => r());
        server.closeAllConnections();
      }),
  };
}

async function waitFor<T>(fn: () => T | undefined | false | Promise<T | undefined | false>, ms = 8000): Promise<T> {
  const start = Date.now();
  for (;;) {
    const v = await fn();
    if (v) return v;
    if (Date.now() - start > ms) throw new Error('timed out waiting');
    await new Promise((r) => setTimeout(r, 25));
  }
}

function pay(url: string, card: string, expiry = '12/34', cvc = '123') {
  return fetch(url, {
    method: 'POST',
    body: new URLSearchParams({ card_number: card, card_expiry: expiry, card_cvc: cvc }),
    redirect: 'manual',
  });
}

let dir: string;
const fakes: StripeFake[] = [];
const closers: Array<() => Promise<void>> = [];

async function fake(extra: Partial<StripeFakeOptions> = {}) {
  const f = await startStripeFake({ port: 0, dataDir: dir, webhookSecret: SECRET, retryBaseMs: 20, retryMaxMs: 200, ...extra });
  fakes.push(f);
  const stripe = new Stripe(KEY, { host: '127.0.0.1', port: f.port, protocol: 'http', maxNetworkRetries: 0 });
  return { f, stripe };
}

function sessionParams(over: Partial<Stripe.Checkout.SessionCreateParams> = {}): Stripe.Checkout.SessionCreateParams {
  return {
    mode: 'payment',
    success_url: 'http://127.0.0.1:9/checkout/success?session_id={CHECKOUT_SESSION_ID}',
    cancel_url: 'http://127.0.0.1:9/cart?cancelled=1',
    customer_email: 'parent@example.test',
    metadata: { checkout_id: 'chk_1' },
    payment_intent_data: { transfer_group: 'chk_1' },
    line_items: [
      { price_data: { currency: 'usd', unit_amount: 2400, product_data: { name: 'Holiday tote, "Mila"' } }, quantity: 1 },
      { price_data: { currency: 'usd', unit_amount: 1250, product_data: { name: 'Kids tee, "Mila"' } }, quantity: 2 },
    ],
    ...over,
  };
}
const TOTAL = 2400 + 1250 * 2;

beforeEach(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'stripe-fake-'));
});
afterEach(async () => {
  for (const f of fakes.splice(0)) await f.close();
  for (const c of closers.splice(0)) await c();
  fs.rmSync(dir, { recursive: true, force: true });
});

describe('form parser', () => {
  it('when a Stripe-style body has bracket keys, then it nests hashes and indexed arrays', () => {
    const p = parseForm('line_items[0][price_data][unit_amount]=1999&line_items[1][quantity]=2&expand[]=a&expand[]=b&metadata[0]=x&name=Mila+Ann%20B%26co');
    expect(p).toEqual({
      line_items: [{ price_data: { unit_amount: '1999' } }, { quantity: '2' }],
      expand: ['a', 'b'],
      metadata: { '0': 'x' },
      name: 'Mila Ann B&co',
    });
  });
  it('when a key tries to reach the prototype, then no prototype is polluted', () => {
    const p = parseForm('__proto__[polluted]=yes&a[__proto__][x]=1');
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(Object.getPrototypeOf(p)).toBe(Object.prototype);
  });
  it('when a key is both a value and a hash, then it is refused', () => {
    expect(() => parseForm('a=1&a[b]=2')).toThrow(/hash/);
  });
});

describe('checkout sessions and the hosted page', () => {
  it('when a session is created, then it is open, totals the line items and points to the fake hosted page', async () => {
    const { f, stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams());
    expect(s.id).toMatch(/^cs_test_/);
    expect(s.object).toBe('checkout.session');
    expect(s.status).toBe('open');
    expect(s.payment_status).toBe('unpaid');
    expect(s.amount_total).toBe(TOTAL);
    expect(s.metadata).toEqual({ checkout_id: 'chk_1' });
    expect(s.url).toBe(`${f.url}/pay/${s.id}`);
    const items = await stripe.checkout.sessions.listLineItems(s.id);
    expect(items.data.map((i) => [i.description, i.quantity, i.amount_total])).toEqual([
      ['Holiday tote, "Mila"', 1, 2400],
      ['Kids tee, "Mila"', 2, 2500],
    ]);

    const page = await fetch(s.url!);
    const html = await page.text();
    expect(page.status).toBe(200);
    expect(html).toContain('<h1>Namesake test payment</h1>');
    expect(html).toContain('Test mode: no real money moves');
    expect(html).toContain('$49.00'); // 4900 minor units of USD (ISO 4217: 2 decimals)
    expect(html).toContain('Holiday tote, &quot;Mila&quot;'); // escaped
    for (const id of ['card_number', 'card_expiry', 'card_cvc']) {
      expect(html).toMatch(new RegExp(`<label for="${id}">`));
      expect(html).toMatch(new RegExp(`<input id="${id}" name="${id}"`));
    }
    expect(html).not.toContain('id="ship_name"'); // no shipping_address_collection, no address fields
    expect(html).toMatch(/background: #fbf7f0/);
    expect(html).toMatch(/color: #1f2a44/);
    expect(html).toMatch(/background: #e0a526/);
    expect(html).toContain('href="http://127.0.0.1:9/cart?cancelled=1"');
  });

  it('when JPY is used, then the page shows no decimals (zero-decimal currency, ISO 4217 / Stripe "Currencies")', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(
      sessionParams({ line_items: [{ price_data: { currency: 'jpy', unit_amount: 3200, product_data: { name: 'Pouch' } }, quantity: 1 }] }),
    );
    const html = await (await fetch(s.url!)).text();
    expect(html).toContain('¥3,200');
  });

  it('when paid with 4242 4242 4242 4242, then the session completes, a charge exists and the shopper goes to success_url', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams());
    const res = await pay(s.url!, '4242 4242 4242 4242');
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe(`http://127.0.0.1:9/checkout/success?session_id=${s.id}`);

    const done = await stripe.checkout.sessions.retrieve(s.id, { expand: ['payment_intent.latest_charge'] });
    expect(done.status).toBe('complete');
    expect(done.payment_status).toBe('paid');
    expect(done.url).toBeNull();
    const pi = done.payment_intent as Stripe.PaymentIntent;
    expect(pi.id).toMatch(/^pi_/);
    expect(pi.status).toBe('succeeded');
    expect(pi.amount_received).toBe(TOTAL);
    expect(pi.transfer_group).toBe('chk_1');
    const ch = pi.latest_charge as Stripe.Charge;
    expect(ch.id).toMatch(/^ch_/);
    expect(ch.status).toBe('succeeded');
    expect(ch.amount).toBe(TOTAL);
    expect(ch.payment_method_details?.card?.last4).toBe('4242');
    const again = await stripe.paymentIntents.retrieve(pi.id);
    expect(again.latest_charge).toBe(ch.id);
  });

  it('when a second tab posts the card after the payment went through, then it lands on success_url and nothing is charged twice', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams());
    expect((await pay(s.url!, '4242424242424242')).status).toBe(303);
    const second = await pay(s.url!, '4242424242424242');
    expect(second.status).toBe(303);
    expect(second.headers.get('location')).toContain(s.id);
    const done = await stripe.checkout.sessions.retrieve(s.id);
    const charges = await stripe.charges.list({ payment_intent: done.payment_intent as string });
    expect(charges.data).toHaveLength(1);
  });

  it('when two tabs submit the card at the same moment, then there is one charge', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams());
    const res = await Promise.all([pay(s.url!, '4242424242424242'), pay(s.url!, '4242424242424242')]);
    expect(res.map((r) => r.status)).toEqual([303, 303]);
    const pi = (await stripe.checkout.sessions.retrieve(s.id)).payment_intent as string;
    expect((await stripe.charges.list({ payment_intent: pi })).data).toHaveLength(1);
  });

  it('when paid with 4000 0000 0000 0002, then it is declined with card_declined, the page says so and the session stays open', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams());
    const res = await pay(s.url!, '4000 0000 0000 0002');
    const html = await res.text();
    expect(res.status).toBe(402);
    expect(html).toContain('role="alert"');
    expect(html).toContain('Your card was declined');
    expect(html).toContain('Go back to your cart');
    expect(html).toContain('href="http://127.0.0.1:9/cart?cancelled=1"');
    const open = await stripe.checkout.sessions.retrieve(s.id, { expand: ['payment_intent'] });
    expect(open.status).toBe('open');
    expect(open.payment_status).toBe('unpaid');
    const pi = open.payment_intent as Stripe.PaymentIntent;
    expect(pi.status).toBe('requires_payment_method');
    expect(pi.last_payment_error?.code).toBe('card_declined');
    expect(pi.last_payment_error?.decline_code).toBe('generic_decline');

    // The shopper may retry on the same session.
    expect((await pay(s.url!, '4242424242424242')).status).toBe(303);
    expect((await stripe.checkout.sessions.retrieve(s.id)).status).toBe('complete');
  });

  it('when paid with 4000 0000 0000 9995, then it is declined for insufficient_funds and can be retried', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams());
    const res = await pay(s.url!, '4000000000009995');
    const html = await res.text();
    expect(res.status).toBe(402);
    expect(html).toContain('doesn&#39;t have enough funds');
    expect(html).toContain('href="http://127.0.0.1:9/cart?cancelled=1"');
    expect(html).toContain('name="card_number"'); // the form is still there to retry
    const open = await stripe.checkout.sessions.retrieve(s.id, { expand: ['payment_intent.latest_charge'] });
    expect(open.status).toBe('open');
    const pi = open.payment_intent as Stripe.PaymentIntent;
    expect(pi.last_payment_error?.code).toBe('card_declined');
    expect(pi.last_payment_error?.decline_code).toBe('insufficient_funds');
    expect((pi.latest_charge as Stripe.Charge).status).toBe('failed');
  });

  it('when paid with 4000 0027 6000 3184, then an extra confirmation step comes first; failing it keeps the session open, completing it pays', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams());
    const first = await pay(s.url!, '4000 0027 6000 3184');
    const html = await first.text();
    expect(first.status).toBe(200);
    expect(html).toContain('Complete authentication');
    expect(html).toContain('Fail authentication');
    let cur = await stripe.checkout.sessions.retrieve(s.id, { expand: ['payment_intent'] });
    expect(cur.status).toBe('open');
    expect((cur.payment_intent as Stripe.PaymentIntent).status).toBe('requires_action');

    const failed = await fetch(`${s.url}/authenticate`, { method: 'POST', body: new URLSearchParams({ result: 'fail' }), redirect: 'manual' });
    expect(failed.status).toBe(402);
    expect(await failed.text()).toContain('extra confirmation was not completed');
    cur = await stripe.checkout.sessions.retrieve(s.id, { expand: ['payment_intent'] });
    expect(cur.status).toBe('open');
    const pi = cur.payment_intent as Stripe.PaymentIntent;
    expect(pi.status).toBe('requires_payment_method');
    expect(pi.last_payment_error?.code).toBe('payment_intent_authentication_failure');

    await pay(s.url!, '4000002760003184');
    const ok = await fetch(`${s.url}/authenticate`, { method: 'POST', body: new URLSearchParams({ result: 'complete' }), redirect: 'manual' });
    expect(ok.status).toBe(303);
    expect(ok.headers.get('location')).toContain(s.id);
    cur = await stripe.checkout.sessions.retrieve(s.id, { expand: ['payment_intent'] });
    expect(cur.status).toBe('complete');
    expect((cur.payment_intent as Stripe.PaymentIntent).status).toBe('succeeded');
  });

  it('when the card details are malformed, then fields are marked in text and nothing is attempted', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams());
    const res = await pay(s.url!, '4242 4242 4242 4241', '13/20', '1');
    const html = await res.text();
    expect(res.status).toBe(400);
    expect(html).toContain('That card number isn&#39;t valid');
    expect(html).toContain('Enter the expiry date as MM/YY');
    expect(html).toContain('Enter the 3 or 4 digits');
    expect(html.match(/ aria-invalid="true">/g)).toHaveLength(3);
    expect((await stripe.checkout.sessions.retrieve(s.id)).payment_intent).toBeNull();
    const past = await pay(s.url!, '4242424242424242', '01/20');
    expect(await past.text()).toContain('This card has expired');
  });

  // Stripe API docs, Checkout Session: `shipping_address_collection.allowed_countries` makes the hosted
  // page ask for an address; the result is `collected_information.shipping_details` (`shipping_details` in older versions).
  it('when shipping_address_collection is set, then the page asks for the address, checks it and stores it on the session', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams({ shipping_address_collection: { allowed_countries: ['GB', 'US'] } }));
    expect(s.shipping_address_collection?.allowed_countries).toEqual(['GB', 'US']);
    const page = await (await fetch(s.url!)).text();
    for (const id of ['ship_name', 'ship_line1', 'ship_line2', 'ship_city', 'ship_postal_code', 'ship_state', 'ship_country']) expect(page).toContain(`id="${id}"`);
    expect(page).toContain('<option value="GB">United Kingdom</option>');
    expect(page).not.toContain('<option value="FR">');

    const card = { card_number: '4242 4242 4242 4242', card_expiry: '12/34', card_cvc: '123' };
    const post = (form: Record<string, string>) => fetch(s.url!, { method: 'POST', body: new URLSearchParams(form), redirect: 'manual' });
    // no address at all: each required field is marked, the optional ones are not, and nothing is charged
    const bare = await post(card);
    const bareHtml = await bare.text();
    expect(bare.status).toBe(400);
    expect(bareHtml).toContain('Enter the name of the person the parcel is for.');
    expect(bareHtml).toContain('Enter the first line of the address');
    expect(bareHtml).toContain('Enter the town or city.');
    expect(bareHtml).toContain('Enter the postal code.');
    expect(bareHtml).toContain('Choose the country the parcel goes to.');
    expect(bareHtml).not.toContain('id="ship_line2-error"');
    expect(bareHtml).not.toContain('id="ship_state-error"');
    // a country outside the list is refused, and what was typed comes back in the fields
    const address = { ship_name: 'Dana Field', ship_line1: '12 Acorn Lane', ship_line2: '', ship_city: 'Harbourtown', ship_postal_code: 'ht1 2ab', ship_state: '' };
    const wrong = await post({ ...card, ...address, ship_country: 'FR' });
    const wrongHtml = await wrong.text();
    expect(wrong.status).toBe(400);
    expect(wrongHtml).toContain('We can only send parcels to the countries in the list.');
    expect(wrongHtml).toContain('value="12 Acorn Lane"');
    expect((await stripe.checkout.sessions.retrieve(s.id)).payment_intent).toBeNull();

    const ok = await post({ ...card, ...address, ship_country: 'GB' });
    expect(ok.status).toBe(303);
    const done = await stripe.checkout.sessions.retrieve(s.id);
    const expected = { name: 'Dana Field', address: { line1: '12 Acorn Lane', line2: null, city: 'Harbourtown', postal_code: 'HT1 2AB', state: null, country: 'GB' } };
    expect(done.status).toBe('complete');
    expect(done.collected_information?.shipping_details).toEqual(expected);
    expect((done as unknown as { shipping_details: unknown }).shipping_details).toEqual(expected);
  });

  it('when a card needs the extra confirmation, then the address typed with it is kept until the payment completes', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams({ shipping_address_collection: { allowed_countries: ['US'] } }));
    const form = { ship_name: 'Priya Lane', ship_line1: '7 Lantern Row', ship_line2: 'Unit 2', ship_city: 'Springfield', ship_postal_code: '12345', ship_state: 'OR', ship_country: 'US', card_number: '4000 0027 6000 3184', card_expiry: '12/34', card_cvc: '123' };
    expect((await fetch(s.url!, { method: 'POST', body: new URLSearchParams(form), redirect: 'manual' })).status).toBe(200);
    expect((await fetch(`${s.url}/authenticate`, { method: 'POST', body: new URLSearchParams({ result: 'complete' }), redirect: 'manual' })).status).toBe(303);
    const done = await stripe.checkout.sessions.retrieve(s.id);
    expect(done.collected_information?.shipping_details?.address).toEqual({ line1: '7 Lantern Row', line2: 'Unit 2', city: 'Springfield', postal_code: '12345', state: 'OR', country: 'US' });
  });

  it('when shipping_address_collection names a country badly, then the API answers 400 naming the parameter', async () => {
    const { stripe } = await fake();
    await expect(stripe.checkout.sessions.create(sessionParams({ shipping_address_collection: { allowed_countries: ['gbr' as 'GB'] } }))).rejects.toMatchObject({
      statusCode: 400,
      param: 'shipping_address_collection[allowed_countries][0]',
    });
  });

  it('when a session is expired through the API, then the page refuses payment and the session cannot be expired twice', async () => {
    const receiver = await startReceiver();
    closers.push(receiver.close);
    const { stripe } = await fake({ webhookUrl: receiver.url });
    const s = await stripe.checkout.sessions.create(sessionParams());
    const expired = await stripe.checkout.sessions.expire(s.id);
    expect(expired.status).toBe('expired');
    expect(expired.url).toBeNull();
    const res = await pay(s.url!, '4242424242424242');
    expect(res.status).toBe(410);
    expect(await res.text()).toContain('This payment page has expired');
    await expect(stripe.checkout.sessions.expire(s.id)).rejects.toMatchObject({ type: 'StripeInvalidRequestError', statusCode: 400 });
    const got = await waitFor(() => receiver.received.find((r) => r.body.includes('checkout.session.expired')));
    const ev = stripe.webhooks.constructEvent(got.body, got.signature, SECRET);
    expect(ev.type).toBe('checkout.session.expired');
    expect((ev.data.object as Stripe.Checkout.Session).id).toBe(s.id);
  });

  it('when expires_at passes, then an open session becomes expired by itself', async () => {
    let clock = Date.now();
    const { stripe } = await fake({ now: () => clock });
    const s = await stripe.checkout.sessions.create(sessionParams({ expires_at: Math.floor(clock / 1000) + 3600 }));
    expect(s.expires_at).toBe(Math.floor(clock / 1000) + 3600);
    clock += 3601 * 1000;
    expect((await stripe.checkout.sessions.retrieve(s.id)).status).toBe('expired');
    // Stripe accepts expires_at only 30 min – 24 h ahead.
    await expect(stripe.checkout.sessions.create(sessionParams({ expires_at: Math.floor(clock / 1000) + 60 }))).rejects.toMatchObject({ param: 'expires_at' });
  });

  it('when sessions are listed, then the newest come first and has_more pages through them', async () => {
    const { stripe } = await fake();
    const ids: string[] = [];
    for (let i = 0; i < 3; i++) ids.push((await stripe.checkout.sessions.create(sessionParams())).id);
    const page1 = await stripe.checkout.sessions.list({ limit: 2 });
    expect(page1.object).toBe('list');
    expect(page1.data.map((s) => s.id)).toEqual([ids[2], ids[1]]);
    expect(page1.has_more).toBe(true);
    const page2 = await stripe.checkout.sessions.list({ limit: 2, starting_after: ids[1] });
    expect(page2.data.map((s) => s.id)).toEqual([ids[0]]);
    expect(page2.has_more).toBe(false);
  });

  it('when parameters are missing or wrong, then Stripe-shaped 400 errors name the parameter', async () => {
    const { stripe } = await fake();
    await expect(stripe.checkout.sessions.create({ ...sessionParams(), line_items: [] })).rejects.toMatchObject({ statusCode: 400, param: 'line_items' });
    await expect(
      stripe.checkout.sessions.create(sessionParams({ line_items: [{ price_data: { currency: 'usd', unit_amount: 10, product_data: { name: 'x' } }, quantity: 1 }] })),
    ).rejects.toMatchObject({ code: 'amount_too_small' });
    await expect(stripe.checkout.sessions.retrieve('cs_test_nope')).rejects.toMatchObject({ statusCode: 404, code: 'resource_missing' });
  });
});

describe('authentication', () => {
  it('when no key or a non-test key is sent, then the API answers 401', async () => {
    const { f } = await fake();
    const none = await fetch(`${f.url}/v1/checkout/sessions`);
    expect(none.status).toBe(401);
    expect(((await none.json()) as { error: { type: string } }).error.type).toBe('invalid_request_error');
    const live = new Stripe('sk_live_abc', { host: '127.0.0.1', port: f.port, protocol: 'http' });
    await expect(live.accounts.list()).rejects.toMatchObject({ type: 'StripeAuthenticationError', statusCode: 401 });
    const ok = await fetch(`${f.url}/v1/accounts`, { headers: { authorization: 'Bearer sk_test_anything' } });
    expect(ok.status).toBe(200);
  });
});

describe('idempotency', () => {
  it('when a POST is repeated with the same key and parameters, then the first response is replayed', async () => {
    const { stripe } = await fake();
    const a = await stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: 'cart-42-attempt-1' });
    const b = await stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: 'cart-42-attempt-1' });
    expect(b.id).toBe(a.id);
    expect(b.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect(a.lastResponse.headers['idempotent-replayed']).toBeUndefined();
    expect((await stripe.checkout.sessions.list()).data).toHaveLength(1);
  });

  it('when the same key arrives several times at once, then exactly one session is made', async () => {
    const { stripe } = await fake();
    const all = await Promise.all(Array.from({ length: 6 }, () => stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: 'burst' })));
    expect(new Set(all.map((s) => s.id)).size).toBe(1);
    expect(all.filter((s) => s.lastResponse.headers['idempotent-replayed'] === 'true')).toHaveLength(5);
    expect((await stripe.checkout.sessions.list()).data).toHaveLength(1);
  });

  it('when a key is reused with different parameters, then the fake answers 400 idempotency_error', async () => {
    const { stripe } = await fake();
    await stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: 'k-1' });
    const err = await stripe.checkout.sessions.create(sessionParams({ metadata: { checkout_id: 'other' } }), { idempotencyKey: 'k-1' }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    expect(err).toMatchObject({ statusCode: 400, rawType: 'idempotency_error' });
  });
});

describe('connected accounts, transfers and refunds', () => {
  async function paidSession(stripe: Stripe) {
    const s = await stripe.checkout.sessions.create(sessionParams());
    await pay(s.url!, '4242424242424242');
    const done = await stripe.checkout.sessions.retrieve(s.id, { expand: ['payment_intent'] });
    return done.payment_intent as Stripe.PaymentIntent;
  }

  it('when transfers are made per shop, then listing by transfer_group returns exactly that group', async () => {
    const { stripe } = await fake();
    const shopA = await stripe.accounts.create({ type: 'express', country: 'US', email: 'a@shop.test', metadata: { shop: 'a' } });
    const shopB = await stripe.accounts.create({ type: 'express', country: 'US', email: 'b@shop.test' });
    expect(shopA.id).toMatch(/^acct_/);
    expect((await stripe.accounts.retrieve(shopA.id)).metadata).toEqual({ shop: 'a' });
    const pi = await paidSession(stripe);
    const tA = await stripe.transfers.create({ amount: 2208, currency: 'usd', destination: shopA.id, transfer_group: 'chk_1', metadata: { order: 'o1' } });
    const tB = await stripe.transfers.create({ amount: 2300, currency: 'usd', destination: shopB.id, transfer_group: 'chk_1', source_transaction: pi.latest_charge as string });
    await stripe.transfers.create({ amount: 100, currency: 'usd', destination: shopB.id, transfer_group: 'other' });
    expect(tA.id).toMatch(/^tr_/);
    const group = await stripe.transfers.list({ transfer_group: 'chk_1' });
    expect(group.data.map((t) => t.id).sort()).toEqual([tA.id, tB.id].sort());
    expect(group.data.reduce((s, t) => s + t.amount, 0)).toBe(4508);
    expect(group.data.find((t) => t.id === tA.id)?.destination).toBe(shopA.id);

    await expect(stripe.transfers.create({ amount: 100, currency: 'usd', destination: 'acct_missing' })).rejects.toMatchObject({ code: 'resource_missing', param: 'destination' });
    // The platform balance left is 4900 − 4608 = 292.
    await expect(stripe.transfers.create({ amount: 293, currency: 'usd', destination: shopA.id })).rejects.toMatchObject({ code: 'balance_insufficient' });
  });

  it('when refunds are made, then the charge tracks them and an over-refund is refused', async () => {
    const receiver = await startReceiver();
    closers.push(receiver.close);
    const { stripe } = await fake({ webhookUrl: receiver.url });
    const pi = await paidSession(stripe);
    const r1 = await stripe.refunds.create({ payment_intent: pi.id, amount: 1250 });
    expect(r1.id).toMatch(/^re_/);
    expect(r1.status).toBe('succeeded');
    expect(r1.amount).toBe(1250);
    let ch = await stripe.charges.retrieve(pi.latest_charge as string);
    expect(ch.amount_refunded).toBe(1250);
    expect(ch.refunded).toBe(false);

    await expect(stripe.refunds.create({ payment_intent: pi.id, amount: TOTAL - 1250 + 1 })).rejects.toMatchObject({ statusCode: 400, code: 'amount_too_large' });
    const r2 = await stripe.refunds.create({ payment_intent: pi.id });
    expect(r2.amount).toBe(TOTAL - 1250);
    ch = await stripe.charges.retrieve(pi.latest_charge as string);
    expect(ch.refunded).toBe(true);
    await expect(stripe.refunds.create({ payment_intent: pi.id, amount: 1 })).rejects.toMatchObject({ code: 'charge_already_refunded' });
    expect((await stripe.refunds.list({ payment_intent: pi.id })).data.map((r) => r.id)).toEqual([r2.id, r1.id]);

    const refundedEvents = await waitFor(() => {
      const got = receiver.received.filter((r) => r.body.includes('"charge.refunded"'));
      return got.length === 2 && got;
    });
    const events = refundedEvents.map((r) => stripe.webhooks.constructEvent(r.body, r.signature, SECRET));
    expect(events.map((e) => (e.data.object as Stripe.Charge).amount_refunded).sort((a, b) => a - b)).toEqual([1250, TOTAL]);
  });

  it('when a payment has not succeeded, then it cannot be refunded', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams());
    await pay(s.url!, '4000000000000002');
    const pi = (await stripe.checkout.sessions.retrieve(s.id)).payment_intent as string;
    await expect(stripe.refunds.create({ payment_intent: pi })).rejects.toMatchObject({ statusCode: 400 });
  });
});

describe('webhooks', () => {
  it('when a payment completes, then checkout.session.completed arrives signed so that the SDK verifies it, and a tampered body fails', async () => {
    const receiver = await startReceiver();
    closers.push(receiver.close);
    const { stripe } = await fake({ webhookUrl: receiver.url });
    const s = await stripe.checkout.sessions.create(sessionParams());
    await pay(s.url!, '4242424242424242');
    const got = await waitFor(() => receiver.received[0]);

    const ev = stripe.webhooks.constructEvent(got.body, got.signature, SECRET);
    expect(ev.id).toMatch(/^evt_/);
    expect(ev.type).toBe('checkout.session.completed');
    const obj = ev.data.object as Stripe.Checkout.Session;
    expect(obj.id).toBe(s.id);
    expect(obj.payment_status).toBe('paid');
    expect(obj.metadata).toEqual({ checkout_id: 'chk_1' });

    // Header shape per Stripe: t=<unix seconds>,v1=<hex HMAC-SHA256>.
    const m = /^t=(\d+),v1=([0-9a-f]{64})$/.exec(got.signature);
    expect(m).not.toBeNull();
    expect(Math.abs(Number(m![1]) - Date.now() / 1000)).toBeLessThan(10);

    const tampered = got.body.replace('"paid"', '"unpaid"');
    expect(tampered).not.toBe(got.body);
    expect(() => stripe.webhooks.constructEvent(tampered, got.signature, SECRET)).toThrow(Stripe.errors.StripeSignatureVerificationError);
    expect(() => stripe.webhooks.constructEvent(got.body, got.signature, 'whsec_wrong')).toThrow(Stripe.errors.StripeSignatureVerificationError);
  });

  it('when the endpoint answers 500 twice, then the fake retries with back-off and stops after the first 2xx', async () => {
    const receiver = await startReceiver((n) => (n <= 2 ? 500 : 200));
    closers.push(receiver.close);
    const { f, stripe } = await fake({ webhookUrl: receiver.url, retryBaseMs: 50 });
    const s = await stripe.checkout.sessions.create(sessionParams());
    await pay(s.url!, '4242424242424242');
    const ours = await waitFor(async () => {
      const list = (await (await fetch(`${f.url}/_fake/events`)).json()) as { data: Array<{ type: string; delivery: { status: string; attempts: number; attempts_log: Array<{ at: number; status: number }> } }> };
      const e = list.data.find((x) => x.type === 'checkout.session.completed');
      return e?.delivery.status === 'delivered' && e;
    });
    expect(ours.delivery.attempts).toBe(3);
    expect(ours.delivery.attempts_log.map((a) => a.status)).toEqual([500, 500, 200]);
    const gaps = [1, 2].map((i) => ours.delivery.attempts_log[i]!.at - ours.delivery.attempts_log[i - 1]!.at);
    expect(gaps[0]).toBeGreaterThanOrEqual(50);
    expect(gaps[1]).toBeGreaterThanOrEqual(100); // doubled
    await new Promise((r) => setTimeout(r, 400));
    expect(receiver.received).toHaveLength(3); // nothing after the 2xx
    const ids = receiver.received.map((r) => stripe.webhooks.constructEvent(r.body, r.signature, SECRET).id);
    expect(new Set(ids).size).toBe(1); // the same event each time, each attempt validly signed
  });

  it('when the endpoint never succeeds, then delivery stops after maxAttempts and is marked failed', async () => {
    const receiver = await startReceiver(() => 503);
    closers.push(receiver.close);
    const { f, stripe } = await fake({ webhookUrl: receiver.url, retryBaseMs: 10, retryMaxMs: 20, maxAttempts: 4 });
    const s = await stripe.checkout.sessions.create(sessionParams());
    await pay(s.url!, '4242424242424242');
    await waitFor(async () => {
      const list = (await (await fetch(`${f.url}/_fake/events`)).json()) as { data: Array<{ delivery: { status: string } }> };
      return list.data[0]?.delivery.status === 'failed';
    });
    await new Promise((r) => setTimeout(r, 150));
    expect(receiver.received).toHaveLength(4);
  });

  it('when the endpoint is unreachable at first, then the event is delivered once it is reachable', async () => {
    const down = await startReceiver();
    const deadUrl = down.url;
    await down.close(); // nothing listens there now
    const { f, stripe } = await fake({ webhookUrl: deadUrl, retryBaseMs: 20 });
    const s = await stripe.checkout.sessions.create(sessionParams());
    await pay(s.url!, '4242424242424242');
    await waitFor(async () => {
      const list = (await (await fetch(`${f.url}/_fake/events`)).json()) as { data: Array<{ delivery: { attempts: number; attempts_log: Array<{ error: string | null }> } }> };
      return (list.data[0]?.delivery.attempts ?? 0) >= 2 && list.data[0]!.delivery.attempts_log[0]!.error;
    });
    const receiver = await startReceiver();
    closers.push(receiver.close);
    f.setWebhookUrl(receiver.url);
    const got = await waitFor(() => receiver.received[0]);
    expect(stripe.webhooks.constructEvent(got.body, got.signature, SECRET).type).toBe('checkout.session.completed');
  });
});

describe('persistence', () => {
  it('when the fake restarts on the same dataDir, then sessions, idempotency records and pending webhooks survive', async () => {
    const failing = await startReceiver(() => 500);
    closers.push(failing.close);
    const first = await fake({ webhookUrl: failing.url, retryBaseMs: 5000 });
    const s = await first.stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: 'restart-key' });
    await pay(s.url!, '4242424242424242');
    await waitFor(() => failing.received.length >= 1); // first attempt failed; the next is 5 s away
    await first.f.close();
    fakes.splice(fakes.indexOf(first.f), 1);

    const file = path.join(dir, 'stripe-state.json');
    expect(fs.existsSync(file)).toBe(true);
    expect(fs.readdirSync(dir).filter((n) => n.endsWith('.tmp'))).toEqual([]);

    const receiver = await startReceiver();
    closers.push(receiver.close);
    const second = await fake({ webhookUrl: receiver.url });
    const again = await second.stripe.checkout.sessions.retrieve(s.id);
    expect(again.status).toBe('complete');
    expect(again.amount_total).toBe(TOTAL);
    const replay = await second.stripe.checkout.sessions.create(sessionParams(), { idempotencyKey: 'restart-key' });
    expect(replay.id).toBe(s.id);
    expect(replay.lastResponse.headers['idempotent-replayed']).toBe('true');

    // The pending delivery resumes against the new endpoint after the restart.
    const got = await waitFor(() => receiver.received[0]);
    const ev = second.stripe.webhooks.constructEvent(got.body, got.signature, SECRET);
    expect(ev.type).toBe('checkout.session.completed');
    expect((ev.data.object as Stripe.Checkout.Session).id).toBe(s.id);
  });

  it('when main.ts runs from env, then it serves the API and stops cleanly on SIGTERM', async () => {
    const child = spawn(path.resolve('node_modules/.bin/tsx'), ['fakes/stripe/main.ts'], {
      env: { ...process.env, STRIPE_FAKE_PORT: '0', DATA_DIR: dir, STRIPE_WEBHOOK_SECRET: SECRET },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let out = '';
    child.stdout.on('data', (c: Buffer) => (out += c.toString()));
    const exited = new Promise<number | null>((r) => child.on('exit', (code) => r(code)));
    try {
      const url = await waitFor(() => /listening on (http:\/\/127\.0\.0\.1:\d+)/.exec(out)?.[1], 15000);
      const port = Number(new URL(url).port);
      const stripe = new Stripe(KEY, { host: '127.0.0.1', port, protocol: 'http' });
      const acct = await stripe.accounts.create({ type: 'express' });
      expect(acct.id).toMatch(/^acct_/);
    } finally {
      child.kill('SIGTERM');
    }
    expect(await exited).toBe(0);
    const saved = JSON.parse(fs.readFileSync(path.join(dir, 'stripe', 'stripe-state.json'), 'utf8')) as { accounts: Record<string, unknown> };
    expect(Object.keys(saved.accounts)).toHaveLength(1);
  });
});
