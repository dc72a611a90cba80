// Webhook signing, delivery and retries in the fake (fakes/stripe/webhooks.ts).
// Reference for the expected behaviour: Stripe API docs (webhook signatures) and stripe-node `src/Webhooks.ts`,
// as summarised in DEVELOPERS.md, "Money and payments".

import Stripe from 'stripe';
import { describe, expect, it } from 'vitest';
import { pay, SECRET, sessionParams, startReceiver, waitFor, withStripeFakes } from './helpers.ts';

const { fake, closers } = withStripeFakes();

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
      const list = (await (await fetch(`${f.url}/_fake/events`)).json()) as {
        data: Array<{ type: string; delivery: { status: string; attempts: number; attempts_log: Array<{ at: number; status: number }> } }>;
      };
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
