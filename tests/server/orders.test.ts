// Shoppers' order pages: own orders only (OWASP ASVS 8.2.2, no IDOR: another's order is a 404).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkoutAndPay, makeShopWithListing, makeWorld, nameChoices, type World } from './checkout.fixtures.ts';

let w: World;
beforeAll(async () => {
  w = await makeWorld();
}, 30_000);
afterAll(async () => w?.teardown());

describe('orders for shoppers', () => {
  it('when a shopper has paid, then the list and the detail show each line with its state and history; others get 404', async () => {
    const a = await makeShopWithListing(w, { shopName: 'Fern & Fable Goods' });
    const b = await makeShopWithListing(w, { shopName: 'Little Comet Print Co.' });
    const buyer = await w.makeUser('shopper');
    const agent = await w.signIn(buyer.email);
    await agent
      .post('/api/cart/lines')
      .send({ listingId: a.listingId, quantity: 2, choices: nameChoices('Mira') })
      .expect(201);
    await agent
      .post('/api/cart/lines')
      .send({ listingId: b.listingId, choices: nameChoices('Theo') })
      .expect(201);
    const { orders } = await checkoutAndPay(w, agent);
    expect(orders).toHaveLength(2);

    const list = (await agent.get('/api/orders')).body.items;
    expect(list).toHaveLength(2);
    expect(list.map((o: { number: string }) => o.number).sort()).toEqual(orders.map((o) => o.number).sort());
    expect(list.every((o: { number: string }) => /^NS-\d{4,}$/.test(o.number))).toBe(true);

    const fernOrder = list.find((o: { shop: { name: string } }) => o.shop.name === 'Fern & Fable Goods');
    const detail = (await agent.get(`/api/orders/${fernOrder.id}`)).body;
    expect(detail.lines).toHaveLength(1);
    expect(detail.lines[0]).toMatchObject({ quantity: 2, state: 'awaiting_proof', version: 1 });
    expect(detail.lines[0].snapshot.summary).toContainEqual({ label: 'Name', value: 'Mira' });
    expect(detail.lines[0].history).toHaveLength(1);
    expect(detail.lines[0].history[0]).toMatchObject({ fromState: null, toState: 'awaiting_proof' });
    expect(detail.totalMinor).toBe(detail.subtotalMinor + detail.shippingMinor);
    // the address typed on the payment page (checkout.fixtures payOnPage) comes back on the order
    expect(detail.shipTo).toEqual({ name: 'Dana Field', line1: '12 Acorn Lane', line2: 'Flat 3', city: 'Harbourtown', postalCode: 'HT1 2AB', state: null, country: 'GB' });

    const stranger = await w.signIn((await w.makeUser('shopper')).email);
    expect((await stranger.get(`/api/orders/${fernOrder.id}`)).status).toBe(404);
    expect((await stranger.get('/api/orders')).body).toMatchObject({ items: [], total: 0 });
    // and a guest is asked to sign in
    expect((await (await import('supertest')).default(w.app).get('/api/orders')).status).toBe(401);
  });
});
