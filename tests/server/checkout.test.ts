// Checkout across shops, end to end against the Stripe fake (fakes/stripe). Expected behaviour from
// the Stripe API docs ("separate charges and transfers", test cards, idempotent requests) as
// summarised in DEVELOPERS.md, "Money and payments"; amounts are integer minor units (ISO 4217: USD 2).

import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cartLines, checkouts, ledger, orderLines, orders } from '../../server/db/schema.ts';
import { addNameLine, CARDS, makeShopWithListing, makeWorld, nameChoices, payOnPage, shopperWithCart, type World, waitFor } from './checkout.fixtures.ts';

let w: World;
beforeAll(async () => {
  w = await makeWorld();
}, 30_000);
afterAll(async () => w?.teardown());

describe('checkout across two shops', () => {
  it('when a two-shop cart is paid with 4242, then two orders, two transfers whose sum + fee = the charge, and the e-mails', async () => {
    const fern = await makeShopWithListing(w, { shopName: 'Fern & Fable Goods', shippingMinor: 450, basePriceMinor: 2400 });
    const comet = await makeShopWithListing(w, { shopName: 'Little Comet Print Co.', shippingMinor: 399, basePriceMinor: 1850, outline: true, extraLayerPriceMinor: 275 });
    const buyer = await w.makeUser('shopper', { name: 'Dana' });
    const agent = await w.signIn(buyer.email);

    expect((await agent.post('/api/cart/lines').send({ listingId: fern.listingId, quantity: 2, choices: nameChoices('Mira', fern.gold) })).status).toBe(201);
    const added = await agent.post('/api/cart/lines').send({ listingId: comet.listingId, quantity: 1, choices: nameChoices('Theo') });
    expect(added.status).toBe(201);
    const cart = added.body;
    expect(cart.shops).toHaveLength(2);
    // Fern: 2 × 2400 + 450 shipping; Comet: 1850 + one extra layer (outline) 275 + 399 shipping
    expect(cart.totalMinor).toBe(2 * 2400 + 450 + (1850 + 275) + 399);

    const started = await agent.post('/api/checkout').send({});
    expect(started.status).toBe(201);
    const pay = await payOnPage(started.body.url, CARDS.ok);
    expect(pay.status).toBe(303);
    expect(pay.headers.get('location')).toContain(`/checkout/return?session_id=${started.body.sessionId}`);

    const status = await waitFor(async () => {
      const s = await agent.get(`/api/checkout/${started.body.sessionId}/status?wait=2000`);
      return s.body.state === 'paid' && s.body.orders.length === 2 && s.body;
    });
    expect(status.orders.map((o: { shopName: string }) => o.shopName).sort()).toEqual(['Fern & Fable Goods', 'Little Comet Print Co.']);

    const checkout = w.db.select().from(checkouts).where(eq(checkouts.id, started.body.checkoutId)).get()!;
    const os = w.db.select().from(orders).where(eq(orders.checkoutId, checkout.id)).all();
    expect(os).toHaveLength(2);
    // both parcels go to the address typed on the payment page (see payOnPage in checkout.fixtures); empty optional fields are null
    for (const o of os) {
      expect(o.shipTo).toEqual({ name: 'Dana Field', line1: '12 Acorn Lane', line2: 'Flat 3', city: 'Harbourtown', postalCode: 'HT1 2AB', state: null, country: 'GB' });
    }
    const lines = w.db
      .select()
      .from(orderLines)
      .all()
      .filter((l) => os.some((o) => o.id === l.orderId));
    expect(lines.every((l) => l.state === 'awaiting_proof')).toBe(true);

    // transfers happen after the commit; wait until both orders carry one
    await waitFor(() =>
      w.db
        .select()
        .from(orders)
        .where(eq(orders.checkoutId, checkout.id))
        .all()
        .every((o) => o.transferId),
    );
    const charge = (await w.stripe.paymentIntents.retrieve(checkout.paymentIntentId!)).amount_received;
    const transfers = (await w.stripe.transfers.list({ transfer_group: `checkout_${checkout.id}` })).data;
    expect(transfers).toHaveLength(2);
    const fees = w.db
      .select()
      .from(orders)
      .where(eq(orders.checkoutId, checkout.id))
      .all()
      .map((o) => o.platformFeeMinor);
    expect(transfers.reduce((a, t) => a + t.amount, 0) + fees.reduce((a, b) => a + b, 0)).toBe(charge);
    expect(charge).toBe(cart.totalMinor);
    // fee per shop = round(shop total × 800 / 10000): Fern 5250 → 420, Comet 2524 → 201.92 → 202
    expect(fees.sort((a, b) => a - b)).toEqual([202, 420]);
    // each transfer went to the shop's own connected account
    const fernOrder = os.find((o) => o.shopId === fern.seller.shopId)!;
    const fernTransfer = transfers.find((t) => t.metadata.orderId === fernOrder.id)!;
    expect(fernTransfer.amount).toBe(5250 - 420);

    // ledger: charge, platform_fee and transfer per shop; for each shop fee + transfer = charge
    for (const o of os) {
      const rows = w.db.select().from(ledger).where(eq(ledger.orderId, o.id)).all();
      const by = (k: string) => rows.filter((r) => r.kind === k).reduce((a, r) => a + r.amountMinor, 0);
      expect(rows.map((r) => r.kind).sort()).toEqual(['charge', 'platform_fee', 'transfer']);
      expect(by('platform_fee') + by('transfer')).toBe(by('charge'));
    }

    // the cart is empty afterwards
    expect(
      w.db
        .select()
        .from(cartLines)
        .all()
        .filter((l) => l.cartId === cart.id),
    ).toHaveLength(0);
    expect((await agent.get('/api/cart')).body.itemCount).toBe(0);

    // e-mails: confirmation listing both shops' parts and the personalisation; one per shop owner
    const conf = await waitFor(async () => (await w.mailTo(buyer.email)).find((m) => /order/i.test(m.subject)));
    expect(conf.text).toContain('Fern & Fable Goods');
    expect(conf.text).toContain('Little Comet Print Co.');
    expect(conf.text).toContain('Name: Mira');
    expect(conf.text).toContain('Name: Theo');
    expect(conf.text).toContain('Paid in total: $77.74'); // 5250 + 2524 minor units
    expect(conf.html).toContain('Fern &#38; Fable Goods'); // escaped in HTML
    for (const s of [fern, comet]) {
      const mail = await waitFor(async () => (await w.mailTo(s.seller.email)).find((m) => /New order NS-/.test(m.subject)));
      expect(mail.text).toContain(s === fern ? 'Name: Mira' : 'Name: Theo');
    }
  });
});

describe('checkout safety', () => {
  it('when two tabs start checkout for one cart and both pay, then there is one session and one charge', async () => {
    const shop = await makeShopWithListing(w);
    const { agent } = await shopperWithCart(w, { listingId: shop.listingId, name: 'Anouk' });

    const [a, b] = await Promise.all([agent.post('/api/checkout').send({}), agent.post('/api/checkout').send({})]);
    expect(a.status).toBe(201);
    expect(b.status).toBe(201);
    expect(b.body.sessionId).toBe(a.body.sessionId);
    expect(b.body.checkoutId).toBe(a.body.checkoutId);

    const [p1, p2] = await Promise.all([payOnPage(a.body.url, CARDS.ok), payOnPage(b.body.url, CARDS.ok)]);
    expect([p1.status, p2.status]).toEqual([303, 303]);
    await waitFor(async () => (await agent.get(`/api/checkout/${a.body.sessionId}/status?wait=2000`)).body.state === 'paid');
    const c = w.db.select().from(checkouts).where(eq(checkouts.id, a.body.checkoutId)).get()!;
    const charges = await w.stripe.charges.list({ payment_intent: c.paymentIntentId! });
    expect(charges.data.filter((x) => x.status === 'succeeded')).toHaveLength(1);
    expect(w.db.select().from(orders).where(eq(orders.checkoutId, c.id)).all()).toHaveLength(1);
    // a third click after paying does not open a new payment
    const again = await agent.post('/api/checkout').send({});
    expect(again.status).toBe(400); // the cart is empty now
  });

  it('when the client posts a lower price, then the server price stands in the cart and in the charge', async () => {
    const shop = await makeShopWithListing(w, { basePriceMinor: 2600, shippingMinor: 500 });
    const buyer = await w.makeUser('shopper');
    const agent = await w.signIn(buyer.email);
    const res = await agent.post('/api/cart/lines').send({ listingId: shop.listingId, quantity: 1, choices: nameChoices('Kai'), unitPriceMinor: 1, priceMinor: 1, totalMinor: 1 });
    expect(res.status).toBe(201);
    expect(res.body.shops[0].lines[0].unitPriceMinor).toBe(2600);
    expect(res.body.totalMinor).toBe(3100);
    const started = await agent.post('/api/checkout').send({ totalMinor: 1, amount: 1 });
    const session = await w.stripe.checkout.sessions.retrieve(started.body.sessionId);
    expect(session.amount_total).toBe(3100);
  });

  it('when the card is declined, then the cart is untouched and the reason comes back in our words', async () => {
    const shop = await makeShopWithListing(w);
    const { agent } = await shopperWithCart(w, { listingId: shop.listingId, name: 'Priya', colour: shop.gold, quantity: 3 });
    const before = (await agent.get('/api/cart')).body;

    const started = await agent.post('/api/checkout').send({});
    const declined = await payOnPage(started.body.url, CARDS.declined);
    expect(declined.status).toBe(402);
    let latest = (await agent.get('/api/checkout/latest')).body.checkout;
    expect(latest.state).toBe('open');
    expect(latest.problem).toMatch(/declined the card/);
    expect(latest.problem).toMatch(/Nothing was charged/);

    const noFunds = await payOnPage(started.body.url, CARDS.noFunds);
    expect(noFunds.status).toBe(402);
    latest = (await agent.get('/api/checkout/latest')).body.checkout;
    expect(latest.problem).toMatch(/not enough money/);

    const after = (await agent.get('/api/cart')).body;
    expect(after).toEqual(before);
    expect(w.db.select().from(orders).where(eq(orders.checkoutId, started.body.checkoutId)).all()).toHaveLength(0);

    // the shopper can still pay for the same cart afterwards
    const again = await agent.post('/api/checkout').send({});
    expect(again.body.sessionId).toBe(started.body.sessionId);
    expect((await payOnPage(again.body.url, CARDS.ok)).status).toBe(303);
    await waitFor(async () => (await agent.get(`/api/checkout/${again.body.sessionId}/status?wait=2000`)).body.state === 'paid');
  });

  it('when a guest tries to check out, then they are asked to sign in and their cart stays', async () => {
    const shop = await makeShopWithListing(w);
    const guest = request.agent(w.app);
    await addNameLine(guest, { listingId: shop.listingId, name: 'Leon' });
    const res = await guest.post('/api/checkout').send({});
    expect(res.status).toBe(401);
    expect(res.body.error.message).toMatch(/Sign in/);
    expect((await guest.get('/api/cart')).body.itemCount).toBe(1);
  });

  it('when the shopper comes back from the payment page without paying, then the cart page hears that nothing was charged', async () => {
    const shop = await makeShopWithListing(w);
    const { agent } = await shopperWithCart(w, { listingId: shop.listingId, name: 'Zoë' });
    await agent.post('/api/checkout').send({}).expect(201);
    const latest = (await agent.get('/api/checkout/latest')).body.checkout;
    expect(latest.problem).toMatch(/left the payment page before paying/);
    expect((await agent.get('/api/cart')).body.itemCount).toBe(1);
  });
});

describe('checkout after the cart changed', () => {
  it('when the cart changes after a payment page was opened, then the old page is closed and only the new one can be paid', async () => {
    const shop = await makeShopWithListing(w);
    const { agent } = await shopperWithCart(w, { listingId: shop.listingId, name: 'Mira' });
    const first = (await agent.post('/api/checkout').send({})).body;
    await addNameLine(agent, { listingId: shop.listingId, name: 'Theo' });
    const second = (await agent.post('/api/checkout').send({})).body;
    expect(second.sessionId).not.toBe(first.sessionId);
    expect((await w.stripe.checkout.sessions.retrieve(first.sessionId)).status).toBe('expired');
    expect((await payOnPage(first.url, CARDS.ok)).status).toBe(410);
    expect((await payOnPage(second.url, CARDS.ok)).status).toBe(303);
    const s = await waitFor(async () => {
      const r = await agent.get(`/api/checkout/${second.sessionId}/status?wait=2000`);
      return r.body.state === 'paid' && r.body;
    });
    expect(s.orders).toHaveLength(1);
    expect(s.totalMinor).toBe(2 * 2400 + 450);
  });
});
