// Refunds in the fake (fakes/stripe/resources/refunds.ts) and their `charge.refunded` events.
// Reference for the expected behaviour: Stripe API docs (Refunds) and stripe-node `src/Webhooks.ts`,
// as summarised in DEVELOPERS.md, "Money and payments".

import type Stripe from 'stripe';
import { describe, expect, it } from 'vitest';
import { paidSession, pay, SECRET, sessionParams, startReceiver, TOTAL, waitFor, withStripeFakes } from './helpers.ts';

const { fake, closers } = withStripeFakes();

describe('refunds', () => {
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
