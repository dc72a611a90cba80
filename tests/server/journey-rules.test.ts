// Rules a parent met on the seeded demo (a fresh database for this file): the "from" price is what the
// cheapest design really costs, and approving a proof e-mails the shopper that the item is in production.

import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { listings, motifs, orderLines, orders, shops } from '../../server/db/schema.ts';
import { insertMotif } from '../../server/features/uploads/uploads.repo.ts';
import type { CatalogItem, ListingPage } from '../../shared/schemas/catalog.ts';
import { type Choices, cheapestChoices, checkChoices, type PricedContent, priceForChoices } from '../../shared/schemas/listing.ts';
import type { WorkLine } from '../../shared/schemas/workroom.ts';
import { eventually, makeTestApp, type TestApp } from '../factories/app.ts';

const DEMO = 'namesake-demo';
let t: TestApp;

beforeAll(async () => {
  t = await makeTestApp({ seed: true });
}, 60_000);
afterAll(async () => t?.close());

async function liveListings(): Promise<CatalogItem[]> {
  const out: CatalogItem[] = [];
  for (let page = 1; ; page++) {
    const res = await request(t.app).get('/api/listings').query({ page, limit: 100 });
    expect(res.status).toBe(200);
    out.push(...(res.body.items as CatalogItem[]));
    if (out.length >= res.body.total || res.body.items.length === 0) return out;
  }
}

/**
 * Every design a shopper can make on a listing, by plain enumeration (the check does not reuse the
 * search in cheapest-design.ts): each motif (or none when optional), each colour of each choosable
 * layer, each text field filled or, when optional, left empty. Demo listings are small enough.
 */
function everyDesign(content: PricedContent): Choices[] {
  const p = content.personalisation;
  let designs: Choices[] = [{ texts: {}, textColours: {}, motifId: null, motifColours: {}, outlineMaterialId: null, sizeId: null, colourId: null }];
  const fork = (options: ((c: Choices) => Choices)[]) => {
    designs = designs.flatMap((d) => options.map((o) => o(d)));
  };
  fork([...(p.motifRequired ? [] : [(c: Choices) => c]), ...p.motifChoices.map((m) => (c: Choices) => ({ ...c, motifId: m.motifId }))]);
  for (const m of p.motifChoices)
    for (const l of m.layers)
      if (l.mode === 'shopper') fork((l.colourChoices ?? []).map((colour) => (c: Choices) => (c.motifId === m.motifId ? { ...c, motifColours: { ...c.motifColours, [l.layerId]: colour } } : c)));
  for (const f of p.textFields) {
    const filled = f.colourChoices.map((colour) => (c: Choices) => ({
      ...c,
      texts: { ...c.texts, [f.id]: { text: 'A', fontId: f.defaultFontId, letterHeightMm: f.defaultLetterHeightMm } },
      textColours: { ...c.textColours, [f.id]: colour },
    }));
    fork(f.required ? filled : [(c: Choices) => c, ...filled]);
  }
  if (p.outline) fork(p.outline.colourChoices.map((colour) => (c: Choices) => ({ ...c, outlineMaterialId: colour })));
  // a design with nothing on it cannot be made
  return designs.filter((d) => d.motifId !== null || Object.keys(d.texts).length > 0).filter((d) => Object.keys(checkChoices(content, d)).length === 0);
}

describe('the "from" price', () => {
  test('when every demo listing is priced, then its "from" price is the price of the cheapest design a shopper can make', async () => {
    const items = await liveListings();
    expect(items.length).toBeGreaterThanOrEqual(6);
    for (const item of items) {
      const page = (await request(t.app).get(`/api/listings/${item.slug}`)).body as ListingPage;
      const cheapest = Math.min(...everyDesign(page.content).map((d) => priceForChoices(page.content, d)));
      expect(item.priceMinor, `${item.title}: card`).toBe(cheapest);
      expect(page.priceMinor, `${item.title}: listing page`).toBe(cheapest);
    }
  });

  test('when the fox tote is shown "from $24.00", then a design at $24.00 goes into the cart at that price', async () => {
    const fox = (await liveListings()).find((i) => i.title === 'Autumn fox tote with a name')!;
    expect(fox.priceMinor).toBe(2400);
    const page = (await request(t.app).get(`/api/listings/${fox.slug}`)).body as ListingPage;
    const guest = request.agent(t.app);
    const choices = cheapestChoices(page.content);
    choices.texts.name = { ...choices.texts.name!, text: 'Mira' };
    const res = await guest.post('/api/cart/lines').send({ listingId: page.id, quantity: 1, choices });
    expect(res.status).toBe(201);
    const cart = (await guest.get('/api/cart')).body;
    expect(cart.shops[0].lines[0].unitPriceMinor).toBe(2400);
  });

  test('when the name is cut in a colour the fox does not use, then that one layer is charged, and only that one', async () => {
    const fox = (await liveListings()).find((i) => i.title === 'Autumn fox tote with a name')!;
    const page = (await request(t.app).get(`/api/listings/${fox.slug}`)).body as ListingPage;
    const id = (name: string) => page.materials.find((m) => m.colourName === name)!.id;
    const design = (nameColour: string): Choices => ({
      texts: { name: { text: 'Mira', fontId: 'baloo-bold', letterHeightMm: 50 } },
      textColours: { name: id(nameColour) },
      motifId: page.content.personalisation.motifChoices[0]!.motifId,
      motifColours: { body: id('Fox orange') },
      outlineMaterialId: null,
      sizeId: null,
      colourId: null,
    });
    // the fox is three layers the shopper never chose (body, white face, brown acorn): all in the base price
    expect(priceForChoices(page.content, design('Fox orange'))).toBe(2400);
    // a navy name is a fourth layer: $24.00 + $3.00 (the listing's extra-layer price)
    expect(page.content.extraLayerPriceMinor).toBe(300);
    expect(priceForChoices(page.content, design('Ink navy'))).toBe(2700);
  });
});

describe('the demo timeline', () => {
  test('when the demo is seeded, then every listing comes after its shop opened, and every order after its listings went live', () => {
    const shopOpened = new Map(
      t.db
        .select()
        .from(shops)
        .all()
        .map((s) => [s.id, s.createdAt]),
    );
    const listed = t.db.select().from(listings).all();
    expect(listed.length).toBeGreaterThan(0);
    for (const l of listed) expect(l.createdAt, `${l.slug} after its shop opened`).toBeGreaterThanOrEqual(shopOpened.get(l.shopId)!);
    const published = new Map(listed.map((l) => [l.id, l.publishedAt]));
    const paid = t.db.select({ listingId: orderLines.listingId, paidAt: orders.paidAt }).from(orderLines).innerJoin(orders, eq(orders.id, orderLines.orderId)).all();
    expect(paid.length).toBeGreaterThan(0);
    for (const p of paid) expect(p.paidAt!).toBeGreaterThanOrEqual(published.get(p.listingId)!);
  });
});

describe('moderation', () => {
  test('when a shop is still in review, then it cannot be suspended (it is approved or rejected), and stays in review', async () => {
    const admin = request.agent(t.app);
    expect((await admin.post('/api/auth/sign-in/email').send({ email: 'admin@namesake.test', password: DEMO })).status).toBe(200);
    const harbour = t.db.select().from(shops).where(eq(shops.slug, 'harbour-thread')).get()!;
    expect(harbour.state).toBe('in_review');
    const res = await admin.post(`/api/moderation/shops/${harbour.id}/suspend`).send({ reason: 'Nothing to suspend yet.' });
    expect(res.status).toBe(409);
    expect(t.db.select().from(shops).where(eq(shops.id, harbour.id)).get()!.state).toBe('in_review');
  });
});

describe('the audit log', () => {
  test('when filtered by an action, then only that action is listed; an unknown action is a 400 naming the field', async () => {
    const admin = request.agent(t.app);
    expect((await admin.post('/api/auth/sign-in/email').send({ email: 'admin@namesake.test', password: DEMO })).status).toBe(200);
    const comet = t.db.select().from(shops).where(eq(shops.slug, 'little-comet-print-co')).get()!;
    expect((await admin.post(`/api/moderation/shops/${comet.id}/suspend`).send({ reason: 'Checking a report.' })).status).toBe(200);
    expect((await admin.post(`/api/moderation/shops/${comet.id}/restore`).send({ reason: 'All fine.' })).status).toBe(200);
    const suspends = await admin.get('/api/moderation/audit').query({ action: 'shop.suspend' });
    expect(suspends.status).toBe(200);
    expect(suspends.body.total).toBe(1);
    expect(suspends.body.items[0]).toMatchObject({ action: 'shop.suspend', subject: { label: comet.name, href: `/shops/${comet.slug}` } });
    expect((await admin.get('/api/moderation/audit')).body.total).toBeGreaterThanOrEqual(2);
    const bad = await admin.get('/api/moderation/audit').query({ action: 'shop.delete' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('action');
  });
});

describe('motif reuse', () => {
  test("when a listing in review uses another shop's motif file again, then the review names that shop; artwork of its own is not flagged", async () => {
    const admin = request.agent(t.app);
    expect((await admin.post('/api/auth/sign-in/email').send({ email: 'admin@namesake.test', password: DEMO })).status).toBe(200);
    const harbour = t.db.select().from(shops).where(eq(shops.slug, 'harbour-thread')).get()!;
    const comet = t.db.select().from(shops).where(eq(shops.slug, 'little-comet-print-co')).get()!;
    const waiting = t.db
      .select()
      .from(listings)
      .where(eq(listings.shopId, harbour.id))
      .all()
      .find((l) => l.state === 'in_review')!;
    // the demo's new shop uploaded the same whale file Little Comet sells with
    const cometWhale = t.db
      .select()
      .from(motifs)
      .where(eq(motifs.shopId, comet.id))
      .all()
      .find((m) => m.name === 'Whale')!;
    const harbourWhale = t.db
      .select()
      .from(motifs)
      .where(eq(motifs.shopId, harbour.id))
      .all()
      .find((m) => m.name === 'Whale')!;
    const flagged = await admin.get(`/api/moderation/listings/${waiting.id}`);
    expect(flagged.status).toBe(200);
    expect(flagged.body.motifReuse).toEqual([{ motifId: harbourWhale.id, motifName: 'Whale', otherShop: { name: comet.name, slug: comet.slug }, otherMotifName: cometWhale.name }]);
    // artwork of its own (here: the same shapes drawn at another size) is not flagged
    const own = { ...harbourWhale.geometry, widthMm: harbourWhale.geometry.widthMm + 5 };
    const ownId = crypto.randomUUID();
    insertMotif(t.db, { id: ownId, shopId: harbour.id, name: 'Our whale', geometry: own, createdAt: Date.now() });
    const draft = { ...waiting.draft, personalisation: { ...waiting.draft.personalisation, motifChoices: [{ ...waiting.draft.personalisation.motifChoices[0]!, motifId: ownId }] } };
    t.db.update(listings).set({ draft }).where(eq(listings.id, waiting.id)).run();
    expect((await admin.get(`/api/moderation/listings/${waiting.id}`)).body.motifReuse).toEqual([]);
    t.db.update(listings).set({ draft: waiting.draft }).where(eq(listings.id, waiting.id)).run();
  });
});

describe('the approval e-mail', () => {
  test('when the shop approves a proof, then the shopper is e-mailed that the item is in production, naming the order and the text', async () => {
    const fern = request.agent(t.app);
    expect((await fern.post('/api/auth/sign-in/email').send({ email: 'fern@namesake.test', password: DEMO })).status).toBe(200);
    const waiting = (await fern.get('/api/workroom/lines').query({ state: 'awaiting_proof', limit: 100 })).body.items as WorkLine[];
    const line = waiting.find((l) => l.text === 'mIRA')!;
    expect(line).toBeTruthy();
    const before = (await t.mailTo('dana@namesake.test')).length;
    const res = await fern.post(`/api/workroom/lines/${line.id}/approve`);
    expect(res.status).toBe(200);
    const mail = await eventually(async () => (await t.mailTo('dana@namesake.test')).find((m) => /In production/.test(m.subject) && m.subject.includes(line.orderNumber)));
    expect(mail.text).toContain('“mIRA”');
    expect(mail.text).toContain(`/orders/${line.orderId}`);
    // one approval, one e-mail; the seeded approvals sent none
    expect((await t.mailTo('dana@namesake.test')).length).toBe(before + 1);
  });
});
