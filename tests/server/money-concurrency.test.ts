// Money under concurrency, through the real Stripe fake (fakes/stripe): refunds sent at the same
// moment never give back more than was paid, the same refund twice is made once, a refund whose
// local write was lost is recorded from the charge.refunded webhook, payouts are net of refunds
// whether the refund comes before or after the transfer (or after a transfer that failed), and the
// webhook believes the provider's Checkout Session, not the posted body.
//
// The ledger must add up for every order: charge − refunds = transfers − reversals + platform fees
// (net of the fee returned on refunded parts), and the provider's own figures (the charge's
// amount_refunded, each transfer's amount − amount_reversed) must equal what the ledger says.

import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkouts, ledger, orders, refundIntents, refunds, shops, user } from '../../server/db/schema.ts';
import { refundOrder } from '../../server/features/refunds/refunds.service.ts';
import { CARDS, makeShopWithListing, makeWorld, paidTwoLineOrder, payOnPage, shopperWithCart, WEBHOOK_SECRET, type World, waitFor } from './checkout.fixtures.ts';

let w: World;
beforeAll(async () => {
  w = await makeWorld();
}, 30_000);
afterAll(async () => w?.teardown());

type Agent = Awaited<ReturnType<World['signIn']>>;

/** One paid order of 6500 (see `paidTwoLineOrder`: transfer 5980, fee 520). */
const paidOrder = (opts: { brokenAccount?: boolean } = {}) => paidTwoLineOrder(w, opts);

const order = (id: string) => w.db.select().from(orders).where(eq(orders.id, id)).get()!;
const checkoutOf = (orderId: string) =>
  w.db
    .select()
    .from(checkouts)
    .where(eq(checkouts.id, order(orderId).checkoutId))
    .get()!;
const ledgerSum = (orderId: string, kind: string) =>
  w.db
    .select()
    .from(ledger)
    .where(eq(ledger.orderId, orderId))
    .all()
    .filter((r) => r.kind === kind)
    .reduce((a, r) => a + r.amountMinor, 0);
const recordedRefunds = (orderId: string) => w.db.select().from(refunds).where(eq(refunds.orderId, orderId)).all();

async function admin(): Promise<Agent> {
  return w.signIn((await w.makeUser('admin')).email);
}

/** The ledger adds up, and agrees with the provider's own figures for the charge and the transfers. */
async function expectLedgerMatchesProvider(orderId: string) {
  const sum = (k: string) => ledgerSum(orderId, k);
  expect(sum('charge') + sum('refund')).toBe(sum('transfer') + sum('refund_reversal') + sum('platform_fee'));
  const c = checkoutOf(orderId);
  const pi = await w.stripe.paymentIntents.retrieve(c.paymentIntentId!);
  const charge = await w.stripe.charges.retrieve(pi.latest_charge as string);
  expect(charge.amount_refunded).toBe(-sum('refund'));
  expect(charge.amount_refunded).toBeLessThanOrEqual(charge.amount);
  const providerRefunds = (await w.stripe.refunds.list({ payment_intent: c.paymentIntentId!, limit: 100 })).data;
  expect(providerRefunds.reduce((a, r) => a + r.amount, 0)).toBe(-sum('refund'));
  const transfers = (await w.stripe.transfers.list({ transfer_group: `checkout_${c.id}`, limit: 100 })).data.filter((t) => t.metadata.orderId === orderId);
  expect(transfers.reduce((a, t) => a + t.amount - t.amount_reversed, 0)).toBe(sum('transfer') + sum('refund_reversal'));
  return { refunded: -sum('refund'), transfers };
}

describe('refunds at the same moment', () => {
  it('when a line refund and a whole-order refund are sent together, then no more than was paid goes back and the ledger adds up', async () => {
    const { orderId, theo, seller } = await paidOrder();
    const boss = await admin();
    const [a, b] = await Promise.all([seller.post(`/api/orders/${orderId}/refunds`).send({ lineId: theo }), boss.post(`/api/orders/${orderId}/refunds`).send({})]);
    expect([a.status, b.status].every((s) => s === 201 || s === 409)).toBe(true);
    expect([a.status, b.status]).toContain(201);
    const { refunded } = await expectLedgerMatchesProvider(orderId);
    // whichever was claimed first, what is left afterwards is claimed by the other: 6500 in all
    expect(refunded).toBe(6500);
    expect(recordedRefunds(orderId).reduce((x, r) => x + r.amountMinor, 0)).toBe(6500);
    // every refund taken back from the shop in full: the transfer of 5980 is reversed to nothing
    const t = await w.stripe.transfers.retrieve(order(orderId).transferId!);
    expect(t.amount - t.amount_reversed).toBe(0);
  });

  it('when the same line refund is sent twice at once, then the provider makes one refund and both answers name it', async () => {
    const { orderId, theo, seller } = await paidOrder();
    const replies = await Promise.all([seller.post(`/api/orders/${orderId}/refunds`).send({ lineId: theo }), seller.post(`/api/orders/${orderId}/refunds`).send({ lineId: theo })]);
    const ok = replies.filter((r) => r.status === 201);
    expect(ok.length).toBeGreaterThanOrEqual(1);
    expect(replies.every((r) => r.status === 201 || r.status === 409)).toBe(true);
    expect(new Set(ok.map((r) => r.body.refundId)).size).toBe(1);
    const providerRefunds = (await w.stripe.refunds.list({ payment_intent: checkoutOf(orderId).paymentIntentId! })).data;
    expect(providerRefunds.map((r) => r.amount)).toEqual([4000]);
    expect(recordedRefunds(orderId)).toHaveLength(1);
    await expectLedgerMatchesProvider(orderId);
    // shop total 6500, transfer 5980: the line's share round(4000 × 5980 / 6500) = 3680 comes back
    expect(ledgerSum(orderId, 'refund_reversal')).toBe(-3680);
    // the fee on the refunded part is returned: 4000 − 3680 = 320
    expect(ledgerSum(orderId, 'platform_fee')).toBe(520 - 320);
    // and once it is done, the same request is refused
    expect((await seller.post(`/api/orders/${orderId}/refunds`).send({ lineId: theo })).status).toBe(409);
  });

  it('when three whole-order refunds race, then exactly one refund of 6500 is made', async () => {
    const { orderId, seller } = await paidOrder();
    const boss = await admin();
    const replies = await Promise.all([
      seller.post(`/api/orders/${orderId}/refunds`).send({}),
      boss.post(`/api/orders/${orderId}/refunds`).send({}),
      seller.post(`/api/orders/${orderId}/refunds`).send({}),
    ]);
    expect(replies.every((r) => r.status === 201 || r.status === 409)).toBe(true);
    expect(new Set(replies.filter((r) => r.status === 201).map((r) => r.body.refundId)).size).toBe(1);
    expect((await w.stripe.refunds.list({ payment_intent: checkoutOf(orderId).paymentIntentId! })).data.map((r) => r.amount)).toEqual([6500]);
    await expectLedgerMatchesProvider(orderId);
  });

  it('when the provider refuses a refund, then the claim is released with the reason, and a later attempt goes through', async () => {
    const { orderId, mira, seller } = await paidOrder();
    const c = checkoutOf(orderId);
    w.db.update(checkouts).set({ paymentIntentId: 'pi_unknownpayment00001' }).where(eq(checkouts.id, c.id)).run();
    const refused = await seller.post(`/api/orders/${orderId}/refunds`).send({ lineId: mira });
    expect(refused.status).toBe(502);
    expect(refused.body.error.message).toMatch(/refused the refund: No such payment_intent.*Nothing was refunded/);
    expect(
      w.db
        .select()
        .from(refundIntents)
        .where(eq(refundIntents.orderId, orderId))
        .all()
        .map((i) => i.state),
    ).toEqual(['failed']);
    expect(recordedRefunds(orderId)).toHaveLength(0);

    w.db.update(checkouts).set({ paymentIntentId: c.paymentIntentId }).where(eq(checkouts.id, c.id)).run();
    const again = await seller.post(`/api/orders/${orderId}/refunds`).send({ lineId: mira });
    expect(again.status).toBe(201);
    expect(again.body.amountMinor).toBe(2000);
    await expectLedgerMatchesProvider(orderId);
  });
});

describe('payouts net of refunds', () => {
  it('when a transfer fails, then a refund is made, then the next payout is the transfer less the refunded share', async () => {
    const { shop, orderId, theo, seller, sessionId } = await paidOrder({ brokenAccount: true });
    expect(order(orderId).transferId).toBeNull();
    const res = await seller.post(`/api/orders/${orderId}/refunds`).send({ lineId: theo });
    expect(res.status).toBe(201);
    expect(order(orderId).transferId).toBeNull();
    expect(ledgerSum(orderId, 'refund_reversal')).toBe(0); // nothing was paid out to take back

    // the account is put right; the provider's retry of the payment event makes the next payout
    w.db.update(shops).set({ paymentAccountId: null }).where(eq(shops.id, shop.seller.shopId)).run();
    const ev = ((await (await fetch(`${w.fake.url}/_fake/events`)).json()) as { data: Array<{ id: string; type: string; object_id: string }> }).data.find(
      (e) => e.type === 'checkout.session.completed' && e.object_id === sessionId,
    )!;
    await fetch(`${w.fake.url}/_fake/events/${ev.id}/retry`, { method: 'POST' });
    await waitFor(() => order(orderId).transferId);

    const { transfers } = await expectLedgerMatchesProvider(orderId);
    // 5980 − round(4000 × 5980 / 6500) = 5980 − 3680 = 2300, paid once and never reversed
    expect(transfers.map((t) => [t.amount, t.amount_reversed])).toEqual([[2300, 0]]);
  });

  it('when the whole order is refunded before the transfer, then the shop is paid nothing and the ledger still adds up', async () => {
    const { shop, orderId, seller, sessionId } = await paidOrder({ brokenAccount: true });
    expect((await seller.post(`/api/orders/${orderId}/refunds`).send({})).status).toBe(201);
    w.db.update(shops).set({ paymentAccountId: null }).where(eq(shops.id, shop.seller.shopId)).run();
    const ev = ((await (await fetch(`${w.fake.url}/_fake/events`)).json()) as { data: Array<{ id: string; type: string; object_id: string; delivery: { status: string } }> }).data.find(
      (e) => e.type === 'checkout.session.completed' && e.object_id === sessionId,
    )!;
    await fetch(`${w.fake.url}/_fake/events/${ev.id}/retry`, { method: 'POST' });
    await waitFor(
      async () =>
        ((await (await fetch(`${w.fake.url}/_fake/events`)).json()) as { data: Array<{ id: string; delivery: { status: string } }> }).data.find((e) => e.id === ev.id)?.delivery.status === 'delivered',
    );
    expect(order(orderId).transferId).toBeNull();
    const { transfers, refunded } = await expectLedgerMatchesProvider(orderId);
    expect(refunded).toBe(6500);
    expect(transfers).toHaveLength(0);
    expect(ledgerSum(orderId, 'platform_fee')).toBe(0); // 520 charged, 520 returned
  });

  it('when a refund comes after the transfer, then the shop’s share is reversed from it', async () => {
    const { orderId, mira, seller } = await paidOrder();
    expect((await seller.post(`/api/orders/${orderId}/refunds`).send({ lineId: mira })).status).toBe(201);
    const { transfers } = await expectLedgerMatchesProvider(orderId);
    // round(2000 × 5980 / 6500) = 1840 taken back from the transfer of 5980
    expect(transfers.map((t) => [t.amount, t.amount_reversed])).toEqual([[5980, 1840]]);
  });
});

describe('refund recorded from the charge.refunded webhook', () => {
  it('when the provider refunded but our write failed, then the webhook records it once and nothing is refunded again', async () => {
    const { orderId, theo, shop } = await paidOrder();
    const sellerUser = w.db.select().from(user).where(eq(user.email, shop.seller.email)).get()!;
    const actor = { id: sellerUser.id, email: sellerUser.email, name: sellerUser.name, role: 'seller' } as Parameters<typeof refundOrder>[1];
    await w.stopApp(); // the webhook waits at the provider until the app is back
    const failing = {
      ...w.deps,
      beforeLocalWrite: () => {
        throw new Error('disk full');
      },
    };
    await expect(refundOrder(failing, actor, orderId, { lineId: theo })).rejects.toThrow('disk full');
    expect(recordedRefunds(orderId)).toHaveLength(0);
    expect(w.db.select().from(refundIntents).where(eq(refundIntents.orderId, orderId)).get()!.state).toBe('pending');

    await w.startApp();
    await waitFor(() => recordedRefunds(orderId).length === 1, 15_000);
    await waitFor(() => ledgerSum(orderId, 'refund_reversal') === -3680);
    const intent = w.db.select().from(refundIntents).where(eq(refundIntents.orderId, orderId)).get()!;
    expect(intent.state).toBe('succeeded');
    expect(recordedRefunds(orderId)[0]!.providerRefundId).toBe(intent.providerRefundId);
    await expectLedgerMatchesProvider(orderId);
    expect((await w.stripe.refunds.list({ payment_intent: checkoutOf(orderId).paymentIntentId! })).data).toHaveLength(1);
    // asking again is refused; still one refund at the provider
    const seller = await w.signIn(shop.seller.email);
    expect((await seller.post(`/api/orders/${orderId}/refunds`).send({ lineId: theo })).status).toBe(409);
    expect((await w.stripe.refunds.list({ payment_intent: checkoutOf(orderId).paymentIntentId! })).data).toHaveLength(1);
  });
});

describe('the webhook believes the provider, not the posted body', () => {
  const post = (payload: string) =>
    fetch(`${w.appUrl}/api/payments/webhook`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'stripe-signature': w.stripe.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET }) },
      body: payload,
    });
  const completed = (id: string, object: Record<string, unknown>) =>
    JSON.stringify({ id, object: 'event', type: 'checkout.session.completed', created: Math.floor(Date.now() / 1000), data: { object: { object: 'checkout.session', ...object } } });

  async function openCheckout() {
    const shop = await makeShopWithListing(w);
    const { agent } = await shopperWithCart(w, { listingId: shop.listingId, name: 'Ida' });
    const started = (await agent.post('/api/checkout').send({}).expect(201)).body as { checkoutId: string; sessionId: string; url: string };
    return { started, total: w.db.select().from(checkouts).where(eq(checkouts.id, started.checkoutId)).get()!.totalMinor };
  }

  it('when a signed body names a paid session but another checkout, or an unpaid session as paid, then nothing is created', async () => {
    const victim = await openCheckout();
    const paid = await openCheckout();
    await payOnPage(paid.started.url, CARDS.ok);
    await waitFor(() => w.db.select().from(orders).where(eq(orders.checkoutId, paid.started.checkoutId)).get());
    const before = w.db.select().from(orders).all().length;

    // a signed "completed" event that says session `sessionId` paid the victim's checkout in full
    const claimPaid = (eventId: string, sessionId: string, extra: Record<string, unknown> = {}) =>
      post(
        completed(eventId, {
          id: sessionId,
          metadata: { checkoutId: victim.started.checkoutId },
          payment_status: 'paid',
          status: 'complete',
          amount_total: victim.total,
          currency: 'usd',
          ...extra,
        }),
      );
    // the real paid session, relabelled as the victim's checkout
    const relabelled = await claimPaid('evt_forged_relabel', paid.started.sessionId);
    expect(relabelled.status).toBe(200);
    expect((await relabelled.json()).outcome).toBe('rejected');
    // the victim's own session, which nobody paid, posted as paid
    const unpaid = await claimPaid('evt_forged_unpaid', victim.started.sessionId, { payment_intent: 'pi_madeup' });
    expect((await unpaid.json()).outcome).toBe('rejected');
    // a session the provider never made
    const madeUp = await claimPaid('evt_forged_madeup', 'cs_test_madeup');
    expect((await madeUp.json()).outcome).toBe('rejected');

    expect(w.db.select().from(orders).all()).toHaveLength(before);
    expect(w.db.select().from(orders).where(eq(orders.checkoutId, victim.started.checkoutId)).all()).toHaveLength(0);
    expect(w.db.select().from(checkouts).where(eq(checkouts.id, victim.started.checkoutId)).get()!.state).toBe('open');
    expect(w.db.select().from(orders).where(eq(orders.checkoutId, paid.started.checkoutId)).all()).toHaveLength(1);
  });
});
