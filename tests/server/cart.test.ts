// The cart: guest carts by HttpOnly cookie (OWASP ASVS 3.3.4), merged on sign-in, lines priced by
// the server from the live listing and the engine's composition of the choices.

import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { carts, listings } from '../../server/db/schema.ts';
import { makeTestApp, type TestApp } from '../factories/app.ts';
import { makeShopWithListing, nameChoices } from './checkout.fixtures.ts';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
}, 30_000);
afterAll(async () => t?.close());

describe('cart', () => {
  it('when a guest adds a line, then an HttpOnly cookie keeps the cart across visits', async () => {
    const shop = await makeShopWithListing(t);
    const guest = request.agent(t.app);
    const res = await guest.post('/api/cart/lines').send({ listingId: shop.listingId, quantity: 2, choices: nameChoices('Mira', shop.gold) });
    expect(res.status).toBe(201);
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/ns_cart=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    // a "reload": the same cookie, a fresh request
    const again = await guest.get('/api/cart');
    expect(again.body.itemCount).toBe(2);
    expect(again.body.shops[0].lines[0].snapshot.summary).toContainEqual({ label: 'Name', value: 'Mira' });
    expect(again.body.shops[0].lines[0].snapshot.summary).toContainEqual({ label: 'Name colour', value: 'Gold (glitter)' });
    // a different visitor sees nothing of it
    expect((await request(t.app).get('/api/cart')).body.itemCount).toBe(0);
  });

  it('when a guest with a cart signs in, then the lines move into the account cart', async () => {
    const a = await makeShopWithListing(t);
    const b = await makeShopWithListing(t);
    const user = await t.makeUser('shopper');
    const signedIn = await t.signIn(user.email);
    await signedIn
      .post('/api/cart/lines')
      .send({ listingId: a.listingId, choices: nameChoices('Theo') })
      .expect(201);

    const guest = request.agent(t.app);
    await guest
      .post('/api/cart/lines')
      .send({ listingId: b.listingId, choices: nameChoices('Kai') })
      .expect(201);
    await guest.post('/api/auth/sign-in/email').send({ email: user.email, password: user.password }).expect(200);
    const merged = await guest.get('/api/cart');
    expect(merged.body.itemCount).toBe(2);
    expect(merged.body.shops.map((s: { shopId: string }) => s.shopId).sort()).toEqual([a.seller.shopId, b.seller.shopId].sort());
    // only one cart is left for the user; the guest cart is gone
    expect(t.db.select().from(carts).where(eq(carts.userId, user.id)).all()).toHaveLength(1);
    expect((await signedIn.get('/api/cart')).body.itemCount).toBe(2);
  });

  it("when lines come from two shops, then they are grouped by shop with each shop's shipping and totals in minor units", async () => {
    const a = await makeShopWithListing(t, { shippingMinor: 450, basePriceMinor: 2400, extraLayerPriceMinor: 300, outline: true });
    const b = await makeShopWithListing(t, { shippingMinor: 0, basePriceMinor: 1999 });
    const agent = request.agent(t.app);
    await agent
      .post('/api/cart/lines')
      .send({ listingId: a.listingId, quantity: 2, choices: nameChoices('Anouk') })
      .expect(201);
    const res = await agent.post('/api/cart/lines').send({ listingId: b.listingId, quantity: 1, choices: nameChoices('Leon') });
    const [sa, sb] = res.body.shops;
    // outline + name = 2 layers → base + one extra layer
    expect(sa.lines[0].unitPriceMinor).toBe(2700);
    expect(sa.lines[0].snapshot.geometry.layerCount).toBe(2);
    expect(sa).toMatchObject({ subtotalMinor: 5400, shippingMinor: 450, totalMinor: 5850 });
    expect(sb).toMatchObject({ subtotalMinor: 1999, shippingMinor: 0, totalMinor: 1999 });
    expect(res.body.totalMinor).toBe(7849);
    // the snapshot keeps the engine's pieces (outline below the name), in mm, for the preview
    const pieces = sa.lines[0].snapshot.geometry.pieces;
    expect(pieces).toHaveLength(2);
    expect(pieces[0].colourHex).toBe('#d4a017'); // outline: first outline colour (gold)
    expect(pieces[1].d).toMatch(/^M/);
    expect(sa.lines[0].snapshot.geometry.widthMm).toBeGreaterThan(50);
    expect(sa.lines[0].snapshot.geometry.widthMm).toBeLessThanOrEqual(250);
  });

  it('when the quantity changes or a line is removed, then the cart follows and its version moves on', async () => {
    const shop = await makeShopWithListing(t, { basePriceMinor: 1500, shippingMinor: 300 });
    const agent = request.agent(t.app);
    const added = (await agent.post('/api/cart/lines').send({ listingId: shop.listingId, choices: nameChoices('Priya') })).body;
    const lineId = added.shops[0].lines[0].id;
    const patched = await agent.patch(`/api/cart/lines/${lineId}`).send({ quantity: 3 });
    expect(patched.status).toBe(200);
    expect(patched.body.totalMinor).toBe(3 * 1500 + 300);
    expect(patched.body.version).toBeGreaterThan(added.version);
    expect((await agent.patch(`/api/cart/lines/${lineId}`).send({ quantity: 0 })).status).toBe(400);
    expect((await agent.patch(`/api/cart/lines/${lineId}`).send({ quantity: 21 })).status).toBe(400);
    // someone else's line id is not found in my cart
    expect((await request.agent(t.app).delete(`/api/cart/lines/${lineId}`)).status).toBe(404);
    const removed = await agent.delete(`/api/cart/lines/${lineId}`);
    expect(removed.body.itemCount).toBe(0);
    expect(removed.body.shops).toHaveLength(0);
  });

  it("when the choices break the listing's rules, then 400 with a message per field and nothing added", async () => {
    const shop = await makeShopWithListing(t);
    const agent = request.agent(t.app);
    const tooLong = await agent.post('/api/cart/lines').send({ listingId: shop.listingId, choices: nameChoices('Bartholomew-Jr') });
    expect(tooLong.status).toBe(400);
    expect(tooLong.body.error.fields['choices.texts.name.text']).toMatch(/at most 12/);
    const badColour = await agent.post('/api/cart/lines').send({ listingId: shop.listingId, choices: nameChoices('Mira', 'not-a-material') });
    expect(badColour.status).toBe(400);
    expect(badColour.body.error.fields['choices.textColours.name']).toBeTruthy();
    const empty = await agent.post('/api/cart/lines').send({ listingId: shop.listingId, choices: nameChoices('   ') });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields['choices.texts.name.text']).toMatch(/Enter the name/);
    expect((await agent.get('/api/cart')).body.itemCount).toBe(0);
  });

  it('when the font cannot draw a character, then the shopper is told which one', async () => {
    const shop = await makeShopWithListing(t);
    const res = await request(t.app)
      .post('/api/cart/lines')
      .send({ listingId: shop.listingId, choices: nameChoices('Mira★') });
    expect(res.status).toBe(400);
    expect(res.body.error.message).toContain('★');
  });

  it('when a listing is not live, then it cannot be added, and a line already in the cart cannot be checked out', async () => {
    const shop = await makeShopWithListing(t);
    const agent = request.agent(t.app);
    await agent
      .post('/api/cart/lines')
      .send({ listingId: shop.listingId, choices: nameChoices('Zoë') })
      .expect(201);
    t.db.update(listings).set({ state: 'paused' }).where(eq(listings.id, shop.listingId)).run();
    expect((await agent.post('/api/cart/lines').send({ listingId: shop.listingId, choices: nameChoices('Kai') })).status).toBe(404);
    const cart = (await agent.get('/api/cart')).body;
    expect(cart.shops[0].lines[0].available).toBe(false);
    expect(cart.totalMinor).toBe(0);
  });
});
