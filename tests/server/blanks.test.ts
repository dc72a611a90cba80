// Blank types, sizes, colours and stock: the seller's routes, the listing's offer, the size's price
// difference in the cart, and stock held at checkout — the race for the last item, release when the
// payment session expires (through the Stripe fake's expire call and its signed webhook), sale on payment.

import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { blankStock, listings, orderLines, stockHolds } from '../../server/db/schema.ts';
import type { SellerBlankType } from '../../shared/schemas/blanks.ts';
import { CARDS, makeShopWithListing, makeWorld, nameChoices, payOnPage, type World, waitFor } from './checkout.fixtures.ts';

let w: World;
beforeAll(async () => {
  w = await makeWorld();
}, 30_000);
afterAll(async () => w?.teardown());

const teeInput = {
  name: 'Tee',
  shape: 'kids_tee',
  sizes: [
    { label: '2T', widthMm: 140, heightMm: 160, topOffsetMm: 40, priceDiffMinor: 0, chestMm: 280, lengthMm: 380 },
    { label: '4T', widthMm: 160, heightMm: 180, topOffsetMm: 45, priceDiffMinor: 0 },
    { label: '10', widthMm: 220, heightMm: 240, topOffsetMm: 60, priceDiffMinor: 300 },
  ],
  colours: [
    { name: 'Heather grey', hex: '#8D8F91' },
    { name: 'White', hex: '#ffffff' },
  ],
};

/** A shop with a live name listing offering the tee in all sizes and colours; `stock` per "label:colour". */
async function shopWithTee(stock: Record<string, number>) {
  const shop = await makeShopWithListing(w, { basePriceMinor: 2200, shippingMinor: 0 });
  const seller = await w.signIn(shop.seller.email);
  const created = await seller.post('/api/seller/blanks').send(teeInput).expect(201);
  const type = created.body.blankType as SellerBlankType;
  const size = (l: string) => type.sizes.find((s) => s.label === l)!.id;
  const colour = (n: string) => type.colours.find((c) => c.name === n)!.id;
  const rows = Object.entries(stock).map(([k, quantity]) => {
    const [l, n] = k.split(':') as [string, string];
    return { sizeId: size(l), colourId: colour(n), quantity, lowStock: 1 };
  });
  await seller.put(`/api/seller/blanks/${type.id}/stock`).send({ rows }).expect(200);
  const blankOffer = { blankTypeId: type.id, sizeIds: type.sizes.map((s) => s.id), colourIds: type.colours.map((c) => c.id), defaultColourId: colour('Heather grey'), intendedPairs: [] };
  const content = { ...shop.content, blankOffer };
  w.db
    .update(listings)
    .set({ draft: content as never, live: content as never })
    .where(eq(listings.id, shop.listingId))
    .run();
  return { ...shop, sellerAgent: seller, type, size, colour };
}

const teeChoices = (tee: { size: (l: string) => string; colour: (n: string) => string }, name: string, size: string, colour: string) => ({
  ...nameChoices(name),
  sizeId: tee.size(size),
  colourId: tee.colour(colour),
});

const freeCount = (typeId: string, sizeId: string, colourId: string) =>
  w.db
    .select()
    .from(blankStock)
    .where(eq(blankStock.blankTypeId, typeId))
    .all()
    .find((r) => r.sizeId === sizeId && r.colourId === colourId)?.quantity;

describe('blank types for the seller', () => {
  it('when a seller saves a blank type, then it comes back with ids, a stock grid and the low-stock mark; bad input names its field', async () => {
    const tee = await shopWithTee({ '2T:White': 2 });
    const list = (await tee.sellerAgent.get('/api/seller/blanks').expect(200)).body.blankTypes as SellerBlankType[];
    expect(list).toHaveLength(1);
    expect(list[0]!.colours[0]!.hex).toBe('#8d8f91');
    expect(list[0]!.stock).toHaveLength(6);
    expect(list[0]!.stock.find((r) => r.sizeId === tee.size('2T') && r.colourId === tee.colour('White'))).toMatchObject({ quantity: 2, lowStock: 1, held: 0 });

    const bad = await tee.sellerAgent.post('/api/seller/blanks').send({ ...teeInput, sizes: [{ ...teeInput.sizes[0], widthMm: 5 }] });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toContain('sizes.0.widthMm');

    // renaming keeps the ids of the rows kept, so listings and stock still point at them
    const renamed = await tee.sellerAgent
      .put(`/api/seller/blanks/${tee.type.id}`)
      .send({ ...teeInput, name: 'Kids tee', sizes: tee.type.sizes, colours: tee.type.colours })
      .expect(200);
    expect(renamed.body.blankType.sizes.map((s: { id: string }) => s.id)).toEqual(tee.type.sizes.map((s) => s.id));
  });

  it('when someone else asks, then a guest gets 401, a shopper 403 and another seller 404', async () => {
    const tee = await shopWithTee({});
    expect((await request(w.app).get('/api/seller/blanks')).status).toBe(401);
    const shopper = await w.makeUser('shopper');
    expect((await (await w.signIn(shopper.email)).get('/api/seller/blanks')).status).toBe(403);
    const other = await w.makeSeller();
    const otherAgent = await w.signIn(other.email);
    expect((await otherAgent.put(`/api/seller/blanks/${tee.type.id}`).send(teeInput)).status).toBe(404);
    expect((await otherAgent.put(`/api/seller/blanks/${tee.type.id}/stock`).send({ rows: [] })).status).toBe(404);
    expect((await otherAgent.get('/api/seller/blanks')).body.blankTypes).toEqual([]);
  });
});

describe('sizes and colours in the cart', () => {
  it('when a shopper picks a size with a price difference, then the server prices it and the line carries size and colour; a sold-out pair is refused', async () => {
    const tee = await shopWithTee({ '10:Heather grey': 3, '4T:White': 0 });
    const page = (
      await request(w.app)
        .get(`/api/listings/${w.db.select().from(listings).where(eq(listings.id, tee.listingId)).get()!.slug}`)
        .expect(200)
    ).body;
    expect(page.blankOffer.name).toBe('Tee');
    expect(page.blankOffer.soldOut).toContain(`${tee.size('4T')}:${tee.colour('White')}`);
    expect(page.blankOffer.soldOut).not.toContain(`${tee.size('10')}:${tee.colour('Heather grey')}`);

    const buyer = await w.makeUser('shopper');
    const agent = await w.signIn(buyer.email);
    // the posted price is ignored: 2200 base + 300 for size 10
    const res = await agent
      .post('/api/cart/lines')
      .send({ listingId: tee.listingId, choices: teeChoices(tee, 'Mira', '10', 'Heather grey'), unitPriceMinor: 1 })
      .expect(201);
    const line = res.body.shops[0].lines[0];
    expect(line.unitPriceMinor).toBe(2500);
    expect(line.snapshot.blank).toMatchObject({ sizeLabel: '10', colourName: 'Heather grey', widthMm: 220, heightMm: 240 });
    expect(line.snapshot.summary.slice(0, 2)).toEqual([
      { label: 'Size', value: '10' },
      { label: 'Tee colour', value: 'Heather grey' },
    ]);

    const sold = await agent.post('/api/cart/lines').send({ listingId: tee.listingId, choices: teeChoices(tee, 'Mira', '4T', 'White') });
    expect(sold.status).toBe(400);
    expect(sold.body.error.fields['choices.sizeId']).toMatch(/4T in white is sold out/);
    const noSize = await agent.post('/api/cart/lines').send({ listingId: tee.listingId, choices: { ...nameChoices('Mira'), colourId: tee.colour('White') } });
    expect(noSize.body.error.fields['choices.sizeId']).toBe('Pick a size.');
  });
});

describe('stock held at checkout', () => {
  it('when two shoppers race for the last 4T in grey, then exactly one gets it and the other is told before paying; expiry gives it back; payment sells it', async () => {
    const tee = await shopWithTee({ '4T:Heather grey': 1 });
    const [s, c] = [tee.size('4T'), tee.colour('Heather grey')];
    const shoppers = await Promise.all(
      [0, 1].map(async () => {
        const u = await w.makeUser('shopper');
        const agent = await w.signIn(u.email);
        await agent
          .post('/api/cart/lines')
          .send({ listingId: tee.listingId, choices: teeChoices(tee, 'Bartholomew', '4T', 'Heather grey') })
          .expect(201);
        return agent;
      }),
    );
    const results = await Promise.all(shoppers.map((a) => a.post('/api/checkout').send({})));
    expect(results.map((r) => r.status).sort()).toEqual([201, 409]);
    const winner = results.findIndex((r) => r.status === 201);
    const loser = results[1 - winner]!;
    expect(loser.body.error.message).toMatch(/in size 4T, heather grey, has just sold out/);
    expect(loser.body.error.message).toMatch(/Nothing was charged/);
    expect(freeCount(tee.type.id, s, c)).toBe(0);
    const seen = (await tee.sellerAgent.get('/api/seller/blanks')).body.blankTypes[0] as SellerBlankType;
    expect(seen.stock.find((r) => r.sizeId === s && r.colourId === c)).toMatchObject({ quantity: 0, held: 1 });

    // the winner's payment page expires (the provider's expired webhook): the 4T grey is on sale again
    const session = results[winner]!.body.sessionId as string;
    await w.stripe.checkout.sessions.expire(session);
    await waitFor(() => freeCount(tee.type.id, s, c) === 1);
    expect(w.db.select().from(stockHolds).where(eq(stockHolds.checkoutId, results[winner]!.body.checkoutId)).get()!.state).toBe('released');

    // now the other shopper gets it and pays; the hold is sold and the count stays at 0
    const second = await shoppers[1 - winner]!.post('/api/checkout').send({});
    expect(second.status).toBe(201);
    expect(freeCount(tee.type.id, s, c)).toBe(0);
    expect((await payOnPage(second.body.url, CARDS.ok)).status).toBe(303);
    await waitFor(() => w.db.select().from(stockHolds).where(eq(stockHolds.checkoutId, second.body.checkoutId)).get()?.state === 'sold');
    expect(freeCount(tee.type.id, s, c)).toBe(0);
    const lines = w.db.select().from(orderLines).where(eq(orderLines.listingId, tee.listingId)).all();
    expect(lines).toHaveLength(1);
    expect(lines[0]!.snapshot.blank).toMatchObject({ sizeLabel: '4T', colourName: 'Heather grey' });

    // a text correction keeps the size and colour paid for, whatever the edit sends
    await tee.sellerAgent.post(`/api/workroom/lines/${lines[0]!.id}/request-change`).send({ message: 'Is the spelling right?' }).expect(200);
    const buyer = shoppers[1 - winner]!;
    const form = (await buyer.get(`/api/order-lines/${lines[0]!.id}/personalisation`).expect(200)).body;
    await buyer
      .put(`/api/order-lines/${lines[0]!.id}/personalisation`)
      .send({ choices: { ...form.choices, sizeId: tee.size('10'), texts: { name: { ...form.choices.texts.name, text: 'Bart' } } } })
      .expect(200);
    const edited = w.db.select().from(orderLines).where(eq(orderLines.id, lines[0]!.id)).get()!;
    expect(edited.snapshot.blank).toMatchObject({ sizeLabel: '4T', colourName: 'Heather grey' });
    expect(edited.snapshot.summary[0]).toEqual({ label: 'Size', value: '4T' });
    expect(edited.unitPriceMinor).toBe(2200);

    // the first shopper's cart version is stale; trying again now is refused before any payment
    const late = await shoppers[winner]!.post('/api/checkout').send({});
    expect(late.status).toBe(409);
  });
});
