// Shop discount codes and needed-by dates through the real cart, checkout, payment fake and refunds.
//
// Money: two shops, two codes, one payment. The expected figures are worked by hand (the same way a
// shop's bookkeeper would, on paper) and written beside each check; nothing here is computed by the
// code under test. Fee 8 % (800 bps) rounded half away from zero; shares by largest remainder.
import crypto from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Db } from '../../server/db/client.ts';
import { checkouts, discountCodes, discountUses, ledger, listings, orderLines, orders, shops } from '../../server/db/schema.ts';
import { reserveUses } from '../../server/features/offers/index.ts';
import { addNameLine, checkoutAndPay, makeShopWithListing, makeWorld, shopperWithCart, type World, waitFor } from './checkout.fixtures.ts';

let w: World;
beforeAll(async () => {
  w = await makeWorld();
}, 30_000);
afterAll(async () => w?.teardown());

type Agent = Awaited<ReturnType<World['signIn']>>;

/** A second live listing in the same shop, a copy of the first at another base price. */
function secondListing(shop: Awaited<ReturnType<typeof makeShopWithListing>>, basePriceMinor: number): string {
  const id = crypto.randomUUID();
  const content = { ...shop.content, title: 'Named pouch', basePriceMinor };
  const at = Date.now();
  w.db
    .insert(listings)
    .values({
      id,
      shopId: shop.seller.shopId,
      slug: `pouch-${id.slice(0, 8)}`,
      state: 'live',
      draft: content as never,
      live: content as never,
      liveTitle: content.title,
      livePriceMinor: basePriceMinor,
      currency: 'USD',
      publishedAt: at,
      createdAt: at,
      updatedAt: at,
    })
    .run();
  return id;
}

async function sellerCode(shop: Awaited<ReturnType<typeof makeShopWithListing>>, body: Record<string, unknown>) {
  const seller = await w.signIn(shop.seller.email);
  const res = await seller.post('/api/seller/offers/discounts').send(body);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return seller;
}

const ledgerOf = (orderId: string, kind: string) =>
  w.db
    .select()
    .from(ledger)
    .where(eq(ledger.orderId, orderId))
    .all()
    .filter((r) => r.kind === kind)
    .reduce((a, r) => a + r.amountMinor, 0);

describe('when a shopper pays two shops at once, each with its own code', () => {
  it('then the charge, both orders, the platform fees, the transfers and two refunds add up to the cent', async () => {
    // shop A: tote 19.99 and pouch 12.50, shipping 4.50, code FERN15 = 15 % on the whole shop
    const a = await makeShopWithListing(w, { basePriceMinor: 1999, shippingMinor: 450, extraLayerPriceMinor: 0 });
    const pouch = secondListing(a, 1250);
    await sellerCode(a, { code: 'fern15', kind: 'percent', percentOff: 15 });
    // shop B: tee 24.00, shipping 3.00, code COMET5 = 5.00 off that listing, from 40.00 spent on it
    const b = await makeShopWithListing(w, { basePriceMinor: 2400, shippingMinor: 300, extraLayerPriceMinor: 0 });
    const sellerB = await sellerCode(b, { code: 'COMET5', kind: 'amount', amountOffMinor: 500, minSpendMinor: 4000, listingIds: [b.listingId] });

    const { agent } = await shopperWithCart(w, { listingId: a.listingId, name: 'Mira' }, { listingId: pouch, name: 'Theo', quantity: 3 }, { listingId: b.listingId, name: 'Ada' });
    const codeOn = (shopId: string, code: string) => agent.post(`/api/cart/shops/${shopId}/code`).send({ code });
    // B's code with one tee (24.00) does not apply yet, and says why
    let cart = (await codeOn(b.seller.shopId, 'comet5').expect(200)).body;
    const shopB = () => cart.shops.find((s: { shopId: string }) => s.shopId === b.seller.shopId);
    expect(shopB().discount).toMatchObject({ code: 'COMET5', applied: false, message: 'The code COMET5 needs $40.00 of the items it covers; you have $24.00. Add $16.00 more to use it.' });
    expect(shopB().totalMinor).toBe(2700);
    // a second tee: 48.00, and 5.00 comes off
    await addNameLine(agent, { listingId: b.listingId, name: 'Noor' });
    cart = (await codeOn(a.seller.shopId, 'FERN15').expect(200)).body;
    const shopA = cart.shops.find((s: { shopId: string }) => s.shopId === a.seller.shopId);
    // A: 19.99 + 3 × 12.50 = 57.49; 15 % = 8.6235 → 8.62; shares of 862 over 1999 : 3750 are
    // 299.73 and 562.27 → 300 and 562 (the leftover cent to the larger remainder)
    expect(shopA.discount).toMatchObject({ applied: true, discountMinor: 862 });
    expect(shopA.lines.map((l: { discountMinor: number }) => l.discountMinor)).toEqual([300, 562]);
    expect(shopA.totalMinor).toBe(5749 - 862 + 450); // 53.37
    expect(shopB().totalMinor).toBe(4800 - 500 + 300); // 46.00
    expect(cart.discountMinor).toBe(1362);
    expect(cart.totalMinor).toBe(9937);

    const { orders: made, started } = await checkoutAndPay(w, agent);
    // the payment page charged exactly the checkout's total
    const session = await w.stripe.checkout.sessions.retrieve(started.sessionId);
    expect(session.amount_total).toBe(9937);
    const byShop = (shopId: string) => {
      const id = made.map((m) => m.id).find((id) => w.db.select().from(orders).where(eq(orders.id, id)).get()!.shopId === shopId)!;
      return w.db.select().from(orders).where(eq(orders.id, id)).get()!;
    };
    const oa = byShop(a.seller.shopId);
    const ob = byShop(b.seller.shopId);
    // A: 57.49 − 8.62 + 4.50 = 53.37; fee 8 % of 53.37 = 4.2696 → 4.27; transfer 49.10
    expect(oa).toMatchObject({ subtotalMinor: 5749, discountMinor: 862, discountCode: 'FERN15', shippingMinor: 450, totalMinor: 5337, platformFeeMinor: 427 });
    // B: 48.00 − 5.00 + 3.00 = 46.00; fee 3.68; transfer 42.32
    expect(ob).toMatchObject({ subtotalMinor: 4800, discountMinor: 500, discountCode: 'COMET5', shippingMinor: 300, totalMinor: 4600, platformFeeMinor: 368 });
    await waitFor(() => w.db.select().from(orders).where(eq(orders.id, oa.id)).get()?.transferId && w.db.select().from(orders).where(eq(orders.id, ob.id)).get()?.transferId);
    expect(ledgerOf(oa.id, 'transfer')).toBe(4910);
    expect(ledgerOf(ob.id, 'transfer')).toBe(4232);
    // each line keeps what the shopper paid for it: A 16.99 and 31.88; B's 5.00 split 2.50 + 2.50
    const linesOf = (orderId: string) => w.db.select().from(orderLines).where(eq(orderLines.orderId, orderId)).all();
    expect(
      linesOf(oa.id)
        .map((l) => [l.totalMinor, l.discountMinor])
        .sort((x, y) => x[0]! - y[0]!),
    ).toEqual([
      [1699, 300],
      [3188, 562],
    ]);
    expect(linesOf(ob.id).map((l) => [l.totalMinor, l.discountMinor])).toEqual([
      [2150, 250],
      [2150, 250],
    ]);

    // refund A's pouches: 31.88 back; the shop gives back its share 31.88 × 49.10 / 53.37 = 29.329… → 29.33
    const sellerA = await w.signIn(a.seller.email);
    const pouchLine = linesOf(oa.id).find((l) => l.listingId === pouch)!;
    const r1 = await sellerA.post(`/api/orders/${oa.id}/refunds`).send({ lineId: pouchLine.id });
    expect(r1.status, JSON.stringify(r1.body)).toBe(201);
    expect(r1.body.amountMinor).toBe(3188);
    await waitFor(() => ledgerOf(oa.id, 'refund_reversal') === -2933);
    // then the rest of A: 16.99 + 4.50 shipping = 21.49; all of 53.37 is back and the transfer is reversed to nothing
    const r2 = await sellerA.post(`/api/orders/${oa.id}/refunds`).send({});
    expect(r2.body.amountMinor).toBe(2149);
    await waitFor(() => ledgerOf(oa.id, 'refund_reversal') === -4910);
    expect(ledgerOf(oa.id, 'charge') + ledgerOf(oa.id, 'refund')).toBe(0);
    expect(ledgerOf(oa.id, 'platform_fee')).toBe(0); // 4.27 earned, 4.27 returned
    const pi = await w.stripe.paymentIntents.retrieve(w.db.select().from(checkouts).where(eq(checkouts.id, oa.checkoutId)).get()!.paymentIntentId!);
    const charge = await w.stripe.charges.retrieve(pi.latest_charge as string);
    expect(charge.amount_refunded).toBe(5337);

    // B's margins count the discounted price as revenue (43.00 over two lines) and the fee on it
    const costs = (await sellerB.get(`/api/business/orders/${ob.id}/costs`).expect(200)).body.order;
    expect(costs.totals.revenueMinor).toBe(4300);
    expect(costs.totals.platformFeeMinor).toBe(368);
    // and the business view says what the code gave away
    const view = (await sellerB.get('/api/seller/offers/discounts').expect(200)).body;
    expect(view.givenAwayMinor).toBe(500);
    expect(view.codes[0]).toMatchObject({ code: 'COMET5', usedCount: 1, givenAwayMinor: 500 });
  }, 60_000);
});

describe('when more shoppers than a code allows check out at the same moment', () => {
  it('then exactly the limit get the code, the rest are told, and an expired payment page gives its use back', async () => {
    const shop = await makeShopWithListing(w, { basePriceMinor: 2000, shippingMinor: 0, extraLayerPriceMinor: 0 });
    const seller = await sellerCode(shop, { code: 'TWOONLY', kind: 'percent', percentOff: 10, usageLimit: 2 });
    const agents: Agent[] = [];
    for (let i = 0; i < 5; i++) {
      const { agent } = await shopperWithCart(w, { listingId: shop.listingId, name: `Kid${i}` });
      const cart = (await agent.post(`/api/cart/shops/${shop.seller.shopId}/code`).send({ code: 'TWOONLY' }).expect(200)).body;
      expect(cart.totalMinor).toBe(1800);
      agents.push(agent);
    }
    const results = await Promise.all(agents.map((a) => a.post('/api/checkout').send({})));
    const ok = results.filter((r) => r.status === 201);
    const refused = results.filter((r) => r.status === 409);
    expect(ok.length).toBe(2);
    expect(refused.length).toBe(3);
    // those whose cart was priced after the last use went are told it no longer applies; a cart priced
    // just before is stopped by the reservation itself: either way they pay nothing at a price they did not see
    for (const r of refused) expect(r.body.error.message).toMatch(/The code TWOONLY (from .+ )?has (just )?been used as many times as the shop allows/);
    const code = w.db.select().from(discountCodes).where(eq(discountCodes.shopId, shop.seller.shopId)).get()!;
    const uses = () => w.db.select().from(discountUses).where(eq(discountUses.codeId, code.id)).all();
    expect(uses().filter((u) => u.state === 'reserved').length).toBe(2);
    // a refused shopper's cart now says the code is used up
    const late = agents[results.indexOf(refused[0]!)]!;
    const lateCart = (await late.get('/api/cart').expect(200)).body;
    expect(lateCart.shops[0].discount).toMatchObject({ applied: false, message: 'The code TWOONLY has been used as many times as the shop allows.' });
    expect(lateCart.totalMinor).toBe(2000);

    // one payment page expires: its use is released, and a waiting shopper can use the code
    await w.stripe.checkout.sessions.expire(ok[0]!.body.sessionId);
    await waitFor(() => uses().some((u) => u.state === 'released'));
    const again = await late.post('/api/checkout').send({});
    expect(again.status, JSON.stringify(again.body)).toBe(201);
    expect(uses().filter((u) => u.state === 'reserved').length).toBe(2);

    // a code that has been used stays on record under its own text
    const del = await seller.delete(`/api/seller/offers/discounts/${code.id}`).expect(409);
    expect(del.body.error.message).toBe('TWOONLY has been used at checkout, so it stays on record. Pause it instead.');
    await seller.put(`/api/seller/offers/discounts/${code.id}`).send({ code: 'RENAMED', kind: 'percent', percentOff: 10, usageLimit: 2 }).expect(409);
    const paused = await seller.put(`/api/seller/offers/discounts/${code.id}`).send({ code: 'TWOONLY', kind: 'percent', percentOff: 10, usageLimit: 2, active: false }).expect(200);
    expect(paused.body.codes[0]).toMatchObject({ code: 'TWOONLY', active: false, reservedCount: 2 });
  }, 60_000);
});

describe('when another process takes the last use between pricing the cart and reserving', () => {
  it('then the reservation itself refuses, and the checkout row is not kept', async () => {
    const shop = await makeShopWithListing(w, { basePriceMinor: 2000 });
    await sellerCode(shop, { code: 'LASTONE', kind: 'amount', amountOffMinor: 200, usageLimit: 1 });
    const code = w.db.select().from(discountCodes).where(eq(discountCodes.shopId, shop.seller.shopId)).get()!;
    const { buyer } = await shopperWithCart(w, { listingId: shop.listingId, name: 'Uma' });
    const priced = {
      currency: 'USD',
      totalMinor: 1800,
      shops: [{ shopId: shop.seller.shopId, shopName: 'Shop', shippingMinor: 0, subtotalMinor: 2000, totalMinor: 1800, discount: { codeId: code.id, code: 'LASTONE', discountMinor: 200 }, lines: [] }],
    };
    const newCheckout = (cartId: string) => ({ id: crypto.randomUUID(), userId: buyer.id, cartId, cartVersion: 1, state: 'open', currency: 'USD', totalMinor: 1800, priced, createdAt: Date.now() });
    const reserveIn = (row: ReturnType<typeof newCheckout>) =>
      w.db.transaction(
        (tx) => {
          tx.insert(checkouts).values(row).run();
          reserveUses(tx as unknown as Db, row, Date.now());
        },
        { behavior: 'immediate' },
      );
    // the other process's checkout took the only use
    reserveIn(newCheckout(crypto.randomUUID()));
    const mine = newCheckout(crypto.randomUUID());
    expect(() => reserveIn(mine)).toThrow(/LASTONE .* has just been used as many times as the shop allows/);
    expect(w.db.select().from(checkouts).where(eq(checkouts.id, mine.id)).get()).toBeUndefined();
    expect(w.db.select().from(discountUses).where(eq(discountUses.codeId, code.id)).all().length).toBe(1);
  });
});

describe('when a shopper names a needed-by date for a shop', () => {
  it('then the cart says whether the shop can make it, and the order and the workroom carry it', async () => {
    const shop = await makeShopWithListing(w, { basePriceMinor: 2000, shippingMinor: 0, extraLayerPriceMinor: 0 });
    w.db.update(shops).set({ processingDays: 2, shippingDays: 2 }).where(eq(shops.id, shop.seller.shopId)).run();
    const { agent } = await shopperWithCart(w, { listingId: shop.listingId, name: 'Ivy' });
    const put = (neededBy: string) => agent.put(`/api/cart/shops/${shop.seller.shopId}/needed-by`).send({ neededBy });
    const farAway = '2027-06-30';
    let cart = (await put(farAway).expect(200)).body;
    const first = cart.shops[0].delivery;
    expect(first).toMatchObject({ neededBy: farAway, canMake: true });
    // the day before the earliest arrival cannot be made
    const dayBefore = new Date(`${first.arrival}T00:00:00Z`);
    dayBefore.setUTCDate(dayBefore.getUTCDate() - 1);
    const tooSoon = dayBefore.toISOString().slice(0, 10);
    // (2 processing + 2 post working days: the earliest arrival is at least 4 days out, so that day is still to come)
    cart = (await put(tooSoon).expect(200)).body;
    expect(cart.shops[0].delivery).toMatchObject({ neededBy: tooSoon, arrival: first.arrival, canMake: false });
    const past = await put('2020-01-01').expect(400);
    expect(past.body.error.fields.neededBy).toBe('Pick a day after today.');
    await put(farAway).expect(200);
    const { orders: made } = await checkoutAndPay(w, agent);
    const o = w.db.select().from(orders).where(eq(orders.id, made[0]!.id)).get()!;
    expect(o.neededBy).toBe(farAway);
    const seller = await w.signIn(shop.seller.email);
    const due = (await seller.get('/api/business/due').expect(200)).body;
    expect(due.lines[0]).toMatchObject({ neededBy: farAway, needMark: null, shipBy: o.shipByDate });
  }, 60_000);
});

describe('who may touch codes', () => {
  it('when another seller or a shopper asks, then they cannot read or change a shop’s codes', async () => {
    const shop = await makeShopWithListing(w, { basePriceMinor: 2000 });
    await sellerCode(shop, { code: 'MINE-1', kind: 'amount', amountOffMinor: 100 });
    const mine = w.db.select().from(discountCodes).where(eq(discountCodes.shopId, shop.seller.shopId)).get()!;
    const other = await makeShopWithListing(w, { basePriceMinor: 2000 });
    const otherSeller = await w.signIn(other.seller.email);
    expect((await otherSeller.get('/api/seller/offers/discounts').expect(200)).body.codes).toEqual([]);
    await otherSeller.put(`/api/seller/offers/discounts/${mine.id}`).send({ code: 'MINE-1', kind: 'amount', amountOffMinor: 9999 }).expect(404);
    await otherSeller.delete(`/api/seller/offers/discounts/${mine.id}`).expect(404);
    const { agent } = await shopperWithCart(w, { listingId: shop.listingId, name: 'Bo' });
    await agent.get('/api/seller/offers/discounts').expect(403);
    expect(w.db.select().from(discountCodes).where(eq(discountCodes.id, mine.id)).get()!.value).toBe(100);
    // a code of another shop does not work in this shop's part of the cart, and nothing is stored
    const res = await agent.post(`/api/cart/shops/${shop.seller.shopId}/code`).send({ code: 'NOPE-2' }).expect(400);
    expect(res.body.error.fields.code).toContain('has no code NOPE-2');
    expect((await agent.get('/api/cart').expect(200)).body.shops[0].discount).toBe(null);
  }, 60_000);
});
