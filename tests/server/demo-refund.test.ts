// The demo orders are real payments at the payment fake: the seed pays them the way a shopper does,
// so an admin can refund one (before, every refund of a demo order failed with "No such
// payment_intent"), and the shop's transfer is reversed for its share.

import { eq } from 'drizzle-orm';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkouts, ledger, orderLines, orders } from '../../server/db/schema.ts';
import { makeTestApp, type TestApp } from '../factories/app.ts';

let t: TestApp;
let stripe: Stripe;
beforeAll(async () => {
  t = await makeTestApp({ seed: true });
  const base = new URL(t.env.STRIPE_API_BASE);
  stripe = new Stripe(t.env.STRIPE_SECRET_KEY, { host: base.hostname, port: Number(base.port), protocol: 'http' });
}, 90_000);
afterAll(async () => t?.close());

describe('demo orders', () => {
  it('when seeded, then every demo order is paid at the provider, paid out to the shop and in the states the workroom expects', async () => {
    const all = t.db.select().from(orders).all();
    // four single-name purchases, the five of the Saturday run, and an older one shipped and reviewed (server/db/seed-reviews.ts)
    expect(all).toHaveLength(10);
    for (const o of all) {
      const c = t.db.select().from(checkouts).where(eq(checkouts.id, o.checkoutId)).get()!;
      const pi = await stripe.paymentIntents.retrieve(c.paymentIntentId!);
      expect(pi.status).toBe('succeeded');
      expect(pi.amount).toBe(o.totalMinor);
      const tr = await stripe.transfers.retrieve(o.transferId!);
      expect(tr.amount).toBe(o.totalMinor - o.platformFeeMinor);
      expect(o.shipTo).toMatchObject({ name: 'Dana Whitlock', country: 'GB' });
      // paid some days back, as the scenario tells it
      expect(Date.now() - o.paidAt).toBeGreaterThan(20 * 3_600_000);
    }
    const states = t.db
      .select()
      .from(orderLines)
      .all()
      .map((l) => l.state);
    expect(states.filter((s) => s === 'approved')).toHaveLength(41);
    expect(states.filter((s) => s === 'awaiting_proof')).toHaveLength(3);
    expect(states.filter((s) => s === 'shipped')).toHaveLength(5);
  });

  it('when the admin refunds a demo order line, then the provider refunds it and the transfer is reversed for the shop’s share', async () => {
    const admin = await t.signIn('admin@namesake.test', 'namesake-demo');
    const o = t.db.select().from(orders).all()[0]!;
    const line = t.db.select().from(orderLines).where(eq(orderLines.orderId, o.id)).all()[0]!;
    const res = await admin.post(`/api/orders/${o.id}/refunds`).send({ lineId: line.id, reason: 'Demo refund' });
    expect(res.status).toBe(201);
    expect(res.body.amountMinor).toBe(line.totalMinor);
    const c = t.db.select().from(checkouts).where(eq(checkouts.id, o.checkoutId)).get()!;
    expect((await stripe.refunds.list({ payment_intent: c.paymentIntentId! })).data.map((r) => r.amount)).toEqual([line.totalMinor]);
    const tr = await stripe.transfers.retrieve(o.transferId!);
    const rows = t.db.select().from(ledger).where(eq(ledger.orderId, o.id)).all();
    const sum = (k: string) => rows.filter((r) => r.kind === k).reduce((a, r) => a + r.amountMinor, 0);
    expect(tr.amount_reversed).toBe(-sum('refund_reversal'));
    expect(tr.amount_reversed).toBeGreaterThan(0);
    expect(sum('charge') + sum('refund')).toBe(sum('transfer') + sum('refund_reversal') + sum('platform_fee'));
  });
});
