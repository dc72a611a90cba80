// Shared set-up for the Stripe fake tests: a fake per test on a fresh data directory, driven through
// the official `stripe` SDK (23.1.0) and plain HTTP, and a tiny webhook receiver.

import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import Stripe from 'stripe';
import { afterEach, beforeEach } from 'vitest';
import { type StripeFake, type StripeFakeOptions, startStripeFake } from '../../../fakes/stripe/server.ts';

export const SECRET = 'whsec_test_secret_for_fake';
export const KEY = 'sk_test_namesake_fake';

interface Received {
  body: string;
  signature: string;
}

/** A tiny webhook endpoint; `answer` decides each reply's status. */
export async function startReceiver(answer: (n: number) => number = () => 200) {
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

export async function waitFor<T>(fn: () => T | undefined | false | Promise<T | undefined | false>, ms = 8000): Promise<T> {
  const start = Date.now();
  for (;;) {
    const v = await fn();
    if (v) return v;
    if (Date.now() - start > ms) throw new Error('timed out waiting');
    await new Promise((r) => setTimeout(r, 25));
  }
}

export function pay(url: string, card: string, expiry = '12/34', cvc = '123') {
  return fetch(url, {
    method: 'POST',
    body: new URLSearchParams({ card_number: card, card_expiry: expiry, card_cvc: cvc }),
    redirect: 'manual',
  });
}

export function sessionParams(over: Partial<Stripe.Checkout.SessionCreateParams> = {}): Stripe.Checkout.SessionCreateParams {
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
export const TOTAL = 2400 + 1250 * 2;

/**
 * Registers the per-test lifecycle: a fresh data directory before each test; after it, every fake
 * started with `fake()` is closed, then every function in `closers` runs, then the directory goes.
 */
export function withStripeFakes() {
  const env = {
    dir: '',
    fakes: [] as StripeFake[],
    closers: [] as Array<() => Promise<void>>,
    async fake(extra: Partial<StripeFakeOptions> = {}) {
      const f = await startStripeFake({ port: 0, dataDir: env.dir, webhookSecret: SECRET, retryBaseMs: 20, retryMaxMs: 200, ...extra });
      env.fakes.push(f);
      const stripe = new Stripe(KEY, { host: '127.0.0.1', port: f.port, protocol: 'http', maxNetworkRetries: 0 });
      return { f, stripe };
    },
  };
  beforeEach(() => {
    env.dir = fs.mkdtempSync(path.join(os.tmpdir(), 'stripe-fake-'));
  });
  afterEach(async () => {
    for (const f of env.fakes.splice(0)) await f.close();
    for (const c of env.closers.splice(0)) await c();
    fs.rmSync(env.dir, { recursive: true, force: true });
  });
  return env;
}

/** A session paid with the succeeding test card; its PaymentIntent. */
export async function paidSession(stripe: Stripe) {
  const s = await stripe.checkout.sessions.create(sessionParams());
  await pay(s.url!, '4242424242424242');
  const done = await stripe.checkout.sessions.retrieve(s.id, { expand: ['payment_intent'] });
  return done.payment_intent as Stripe.PaymentIntent;
}
