// The Stripe SDK client. STRIPE_API_BASE points it at the local fake (fakes/stripe) or, when empty,
// at the real Stripe API; nothing else changes between the two (only the SDK's host, port and
// protocol options; DEVELOPERS.md, "Decisions").
import Stripe from 'stripe';
import type { Env } from '../env.ts';

export type Payments = Stripe;

const clients = new Map<string, Stripe>();

/** One client per key + base (the SDK keeps its own keep-alive agent). */
export function paymentsClient(env: Pick<Env, 'STRIPE_SECRET_KEY' | 'STRIPE_API_BASE'>): Stripe {
  const cacheKey = `${env.STRIPE_SECRET_KEY}|${env.STRIPE_API_BASE}`;
  const hit = clients.get(cacheKey);
  if (hit) return hit;
  const base: Stripe.StripeConfig = { telemetry: false, maxNetworkRetries: 2, timeout: 20_000 };
  let client: Stripe;
  if (env.STRIPE_API_BASE) {
    const u = new URL(env.STRIPE_API_BASE);
    const protocol = u.protocol === 'https:' ? 'https' : 'http';
    client = new Stripe(env.STRIPE_SECRET_KEY, { ...base, host: u.hostname, port: Number(u.port || (protocol === 'https' ? 443 : 80)), protocol });
  } else {
    client = new Stripe(env.STRIPE_SECRET_KEY, base);
  }
  clients.set(cacheKey, client);
  return client;
}

/** Verifies a webhook's signature and age (300 s, the SDK's default) on the raw bytes. Throws when wrong. */
export function verifyWebhook(env: Pick<Env, 'STRIPE_SECRET_KEY' | 'STRIPE_API_BASE' | 'STRIPE_WEBHOOK_SECRET'>, rawBody: Buffer, signature: string, nowMs?: number): Stripe.Event {
  const stripe = paymentsClient(env);
  // constructEvent(payload, header, secret, tolerance, cryptoProvider, receivedAt in ms)
  return stripe.webhooks.constructEvent(rawBody, signature, env.STRIPE_WEBHOOK_SECRET, 300, undefined, nowMs);
}

/**
 * True when the provider answered that a request did not and will not happen (a 4xx such as an
 * invalid request, a missing account or a declined card): the claim for it can be released and a
 * later attempt made under a new Idempotency-Key. Anything else (no answer, a timeout, a 5xx, a
 * concurrent request with the same key, a rate limit) may still have happened: the claim is kept and
 * retried with the same key and parameters (Stripe API docs, "Idempotent requests" and "Errors").
 */
export function isDefiniteFailure(e: unknown): boolean {
  if (!(e instanceof Stripe.errors.StripeError)) return false;
  const status = e.statusCode ?? 0;
  return status >= 400 && status < 500 && status !== 409 && status !== 429;
}

/** The provider's own words for a failure, for logs and for the people who asked. */
export function providerMessage(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}
