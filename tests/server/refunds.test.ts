// Refunds through the Stripe fake: the charge is refunded, the shop's transfer reversed for its
// part ("separate charges and transfers": the platform bears refunds; Stripe Connect docs).

import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkouts, ledger, orderLines, orders, refundIntents } from '../../server/db/schema.ts';
import { makeShopWithListing, makeWorld, paidTwoLineOrder, type World, waitFor } from './checkout.fixtures.ts';

let w: World;
beforeAll(async () => {
  w = await makeWorld();
}, 30_000);
afterAll(async () => w?.teardown());

describe('refunds', () => {
  it('when the seller refunds one line, then the provider refunds it, the transfer is reversed pro rata, the line is refunded and the shopper is told', async () => {
    const { seller, buyer, orderId, theo } = await paidTwoLineOrder(w);
    const res = await seller.post(`/api/orders/${orderId}/refunds`).send({ lineId: theo, reason: 'Misspelt on our side' });
    expect(res.status).toBe(201);
    expect(res.body.amountMinor).toBe(4000);

    const o = w.db.select().from(orders).where(eq(orders.id, orderId)).get()!;
    const c = w.db.select().from(checkouts).where(eq(checkouts.id, o.checkoutId)).get()!;
    const refunds = await w.stripe.refunds.list({ payment_intent: c.paymentIntentId! });
    expect(refunds.data.map((r) => r.amount)).toEqual([4000]);
    // shop total 6500, fee round(6500 × 0.08) = 520, transfer 5980; the line's share: round(4000 × 5980 / 6500) = 3680
    const transfer = await w.stripe.transfers.retrieve(o.transferId!);
    expect(transfer.amount).toBe(5980);
    expect(transfer.amount_reversed).toBe(3680);
    const rows = w.db.select().from(ledger).where(eq(ledger.orderId, orderId)).all();
    expect(rows.find((r) => r.kind === 'refund')!.amountMinor).toBe(-4000);
    expect(rows.find((r) => r.kind === 'refund_reversal')!.amountMinor).toBe(-3680);

    const line = res.body.order.lines.find((l: { id: string }) => l.id === theo);
    expect(line.state).toBe('refunded');
    expect(line.history.at(-1)).toMatchObject({ fromState: 'awaiting_proof', toState: 'refunded', message: 'Misspelt on our side', actor: 'shop' });
    expect(res.body.order.lines.find((l: { id: string }) => l.id !== theo).state).toBe('awaiting_proof');

    const mail = await waitFor(async () => (await w.mailTo(buyer.email)).find((m) => /Refund/.test(m.subject)));
    expect(mail.subject).toContain('$40.00');
    expect(mail.text).toContain('Misspelt on our side');

    // the same line twice → 409, nothing more refunded
    expect((await seller.post(`/api/orders/${orderId}/refunds`).send({ lineId: theo })).status).toBe(409);
    expect((await w.stripe.refunds.list({ payment_intent: c.paymentIntentId! })).data).toHaveLength(1);
  });

  it('when an admin refunds the whole order after a line refund, then the rest (shipping included) goes back and the transfer is fully reversed', async () => {
    const { orderId, mira } = await paidTwoLineOrder(w);
    const shopOwner = w.db.select().from(orders).where(eq(orders.id, orderId)).get()!;
    const admin = await w.signIn((await w.makeUser('admin')).email);
    expect((await admin.post(`/api/orders/${orderId}/refunds`).send({ lineId: mira })).body.amountMinor).toBe(2000);
    const all = await admin.post(`/api/orders/${orderId}/refunds`).send({});
    expect(all.status).toBe(201);
    expect(all.body.amountMinor).toBe(6500 - 2000);
    expect(all.body.order.lines.every((l: { state: string }) => l.state === 'refunded')).toBe(true);
    expect(all.body.order.refundedMinor).toBe(6500);
    const transfer = await w.stripe.transfers.retrieve(shopOwner.transferId!);
    expect(transfer.amount_reversed).toBe(transfer.amount);
    expect((await admin.post(`/api/orders/${orderId}/refunds`).send({})).status).toBe(409);
  });

  it('when someone else tries, then another seller gets 404 and the buyer 403, and nothing is refunded', async () => {
    const { agent, orderId } = await paidTwoLineOrder(w);
    const other = await makeShopWithListing(w);
    const otherSeller = await w.signIn(other.seller.email);
    expect((await otherSeller.post(`/api/orders/${orderId}/refunds`).send({})).status).toBe(404);
    expect((await agent.post(`/api/orders/${orderId}/refunds`).send({})).status).toBe(403);
    expect(
      w.db
        .select()
        .from(ledger)
        .where(eq(ledger.orderId, orderId))
        .all()
        .some((r) => r.kind === 'refund'),
    ).toBe(false);
  });

  it('when a line the state table may not refund is refunded, then 409 before the provider is asked, and nothing is claimed', async () => {
    const { seller, orderId, mira } = await paidTwoLineOrder(w);
    // nothing in the app cancels a line yet; the table makes `cancelled` final
    w.db.update(orderLines).set({ state: 'cancelled' }).where(eq(orderLines.id, mira)).run();
    const res = await seller.post(`/api/orders/${orderId}/refunds`).send({ lineId: mira });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toBe('This item is cancelled; nothing more can happen to it.');
    const o = w.db.select().from(orders).where(eq(orders.id, orderId)).get()!;
    const c = w.db.select().from(checkouts).where(eq(checkouts.id, o.checkoutId)).get()!;
    expect((await w.stripe.refunds.list({ payment_intent: c.paymentIntentId! })).data).toEqual([]);
    expect(w.db.select().from(refundIntents).where(eq(refundIntents.orderId, orderId)).all()).toEqual([]);
    expect(w.db.select().from(orderLines).where(eq(orderLines.id, mira)).get()!.state).toBe('cancelled');
  });
});
