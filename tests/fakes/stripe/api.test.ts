// The fake's /v1 API plumbing (fakes/stripe/api.ts): API keys and idempotent requests.
// Reference for the expected behaviour: Stripe API docs (authentication, "Idempotent requests"),
// as summarised in DEVELOPERS.md, "Money and payments".

import Stripe from 'stripe';
import { describe, expect, it } from 'vitest';
import { sessionParams, withStripeFakes } from './helpers.ts';

const { fake } = withStripeFakes();

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
