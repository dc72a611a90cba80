import crypto from 'node:crypto';
import request, { type Agent } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listings } from '../../server/db/schema.ts';
import { CATALOG_PAGE_SIZE } from '../../shared/schemas/catalog.ts';
import { listingInputSchema, liveColumns, OCCASIONS } from '../../shared/schemas/listing.ts';
import { makeTestApp, type TestApp } from '../factories/app.ts';
import { createListing, listingBody, liveListing } from './listings.fixtures.ts';

let t: TestApp;
let admin: Agent;
let fern: Agent;
const get = (query: Record<string, string | number>) => request(t.app).get('/api/listings').query(query);
type Item = { id: string; slug: string; title: string; priceMinor: number; occasions: string[]; shop: { slug: string; name: string }; thumbnailUrl: string | null };

beforeAll(async () => {
  t = await makeTestApp({ seed: true });
  [admin, fern] = await Promise.all([t.signIn('admin@namesake.test', 'namesake-demo'), t.signIn('fern@namesake.test', 'namesake-demo')]);
});
afterAll(async () => t.close());

describe('demo catalogue', () => {
  it('when seeded, then each live shop has ≥ 3 live listings, the five occasions are covered, Harbour Thread shows nothing', async () => {
    const res = await get({});
    const items: Item[] = res.body.items;
    const per = (slug: string) => items.filter((i) => i.shop.slug === slug).length;
    expect(per('fern-and-fable-goods')).toBeGreaterThanOrEqual(3);
    expect(per('little-comet-print-co')).toBeGreaterThanOrEqual(3);
    expect(per('harbour-thread')).toBe(0);
    expect(new Set(items.flatMap((i) => i.occasions))).toEqual(new Set(OCCASIONS));
    for (const i of items) expect(i.thumbnailUrl).toMatch(/^\/uploads\/[a-f0-9]{32}-t\.webp$/);
    const shops = (await admin.get('/api/moderation/queue/shops?limit=100')).body;
    const waiting = (await admin.get('/api/moderation/queue/listings?limit=100')).body;
    expect(shops.total).toBe(shops.items.length);
    expect(shops.items.map((s: { slug: string }) => s.slug)).toContain('harbour-thread');
    expect(waiting.items.filter((l: { shop: { slug: string } }) => l.shop.slug === 'harbour-thread').length).toBeGreaterThanOrEqual(1);
  });

  it('when a demo listing is opened, then it has fonts, colour choices, a motif with its geometry, and public material fields only', async () => {
    const slug = (await get({ q: 'fox' })).body.items[0].slug;
    const page = (await request(t.app).get(`/api/listings/${slug}`)).body;
    expect(page.content.personalisation.textFields[0].fontIds.length).toBeGreaterThan(1);
    expect(page.motifs[0].geometry.layers.map((l: { id: string }) => l.id)).toEqual(['body', 'face', 'acorn']);
    expect(page.materials.length).toBeGreaterThan(2);
    for (const m of page.materials) expect(Object.keys(m).sort()).toEqual(['colourHex', 'colourName', 'id', 'kind']);
    expect(page.content.blankCostMinor).toBeUndefined();
    expect(page.shop).toMatchObject({ slug: 'fern-and-fable-goods', processingDays: 3, shippingMinor: 450 });
    expect(page.careCard.join(' ')).toMatch(/24 hours/);
    expect(page.safetyNotes).toBeNull();
    expect(page.photos[0].url).toMatch(/^\/uploads\//);
    expect(page.descriptionHtml).toContain('<strong>fox holding an acorn</strong>');
  });

  it('when a listing has small decorations, then the page carries the small-parts warning (CPSC 16 CFR 1501) and defers to the seller', async () => {
    const slug = (await get({ q: 'ribbon bow' })).body.items[0].slug;
    const page = (await request(t.app).get(`/api/listings/${slug}`)).body;
    expect(page.safetyNotes.join(' ')).toMatch(/under 3/);
    expect(page.safetyNotes.join(' ')).toMatch(/16 CFR 1501/);
    expect(page.safetyNotes.join(' ')).toMatch(/seller/);
  });
});

describe('search (FTS5)', () => {
  it.each([
    ['a title word', 'snowman', 'Winter lights drawstring bag with snowman'],
    ['a description word', 'mittens', 'Winter lights drawstring bag with snowman'],
    ['a word prefix', 'pump', 'Harvest pumpkin drawstring bag with ribbon bow'],
    ['without the diaeresis', 'zoe', 'Winter lights balloon tee with outline'],
    ['an occasion tag', 'picnic', 'Whale zip pouch with a name'],
  ])('when searching by %s (%s), then the listing is found', async (_l, q, title) => {
    const res = await get({ q });
    expect(res.status).toBe(200);
    expect(res.body.items.map((i: Item) => i.title)).toContain(title);
  });

  it("when searching by shop name, then only that shop's listings come back", async () => {
    const items: Item[] = (await get({ q: 'little comet' })).body.items;
    expect(items.length).toBeGreaterThanOrEqual(3);
    expect(new Set(items.map((i) => i.shop.slug))).toEqual(new Set(['little-comet-print-co']));
  });

  it('when the query holds FTS syntax or quotes, then it is treated as words, not an error', async () => {
    for (const q of ['"fox', 'fox OR NEAR(', '*', 'tote) AND (', "'; drop table listings; --"]) {
      const res = await get({ q });
      expect(res.status).toBe(200);
      expect(typeof res.body.total).toBe('number');
    }
    expect((await get({})).body.total).toBeGreaterThan(0);
  });

  it('when the shop is renamed (and the new name approved), then search by the new name finds its listings', async () => {
    // a live shop's new name is public once a moderator approves it (server/features/shops)
    const rename = async (name: string) => {
      await fern.patch('/api/shop').send({ name });
      const change = (await admin.get('/api/moderation/queue/shop-changes')).body.items.find((c: { slug: string }) => c.slug === 'fern-and-fable-goods');
      await admin.post(`/api/moderation/shops/${change.id}/approve-change`).send({ revision: change.revision }).expect(200);
    };
    await rename('Fern & Fable Woodland Goods');
    expect((await get({ q: 'woodland' })).body.total).toBeGreaterThanOrEqual(4);
    await rename('Fern & Fable Goods');
    expect((await get({ q: 'woodland' })).body.total).toBe(0);
  });
});

describe('filters, sort, pages', () => {
  it('when filtering by occasion, blank, shop and price, then every item matches', async () => {
    const occ: Item[] = (await get({ occasion: 'autumn-harvest' })).body.items;
    expect(occ.length).toBeGreaterThan(0);
    for (const i of occ) expect(i.occasions).toContain('autumn-harvest');
    const pouches: Item[] = (await get({ blank: 'pouch' })).body.items;
    expect(pouches.map((i) => i.title)).toEqual(['Whale zip pouch with a name']);
    const shop: Item[] = (await get({ shop: 'little-comet-print-co' })).body.items;
    for (const i of shop) expect(i.shop.slug).toBe('little-comet-print-co');
    const priced: Item[] = (await get({ minPrice: 2000, maxPrice: 2400 })).body.items;
    expect(priced.length).toBeGreaterThan(0);
    for (const i of priced) expect(i.priceMinor).toBeGreaterThanOrEqual(2000), expect(i.priceMinor).toBeLessThanOrEqual(2400);
  });

  it('when sorting by price, then the order is by price both ways', async () => {
    const asc: number[] = (await get({ sort: 'price_asc' })).body.items.map((i: Item) => i.priceMinor);
    const desc: number[] = (await get({ sort: 'price_desc' })).body.items.map((i: Item) => i.priceMinor);
    expect(asc).toEqual([...asc].sort((x, y) => x - y));
    expect(desc).toEqual([...asc].sort((x, y) => y - x));
  });

  it('when filters are bad, then 400 naming them', async () => {
    const res = await get({ occasion: 'halloween', sort: 'random', page: 0, minPrice: 500, maxPrice: 100 });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['occasion', 'sort', 'page']));
    const range = await get({ minPrice: 500, maxPrice: 100 });
    expect(range.body.error.fields.minPrice).toBeTruthy();
  });

  it('when there are more listings than a page, then pages split them without overlap and total counts all', async () => {
    const first = t.db.select().from(listings).get();
    if (!first) throw new Error('The seeded catalogue has no listing.');
    const shopId = first.shopId;
    const body = listingInputSchema.parse({ ...(await listingBody(fern)), title: 'Pagination tote', occasions: ['birthday'] });
    const at = Date.now();
    for (let i = 0; i < 30; i++) {
      const content = { ...body, title: `Pagination tote ${i}` };
      t.db
        .insert(listings)
        .values({
          id: crypto.randomUUID(),
          shopId,
          slug: `pagination-${i}`,
          state: 'live',
          draft: content,
          live: content,
          ...liveColumns(body),
          liveTitle: `Pagination tote ${i}`,
          publishedAt: at + i,
          createdAt: at,
          updatedAt: at,
        })
        .run();
    }
    const p1 = (await get({ q: 'pagination' })).body;
    const p2 = (await get({ q: 'pagination', page: 2 })).body;
    expect(p1.total).toBe(30);
    expect(p1.items).toHaveLength(CATALOG_PAGE_SIZE);
    expect(p2.items).toHaveLength(30 - CATALOG_PAGE_SIZE);
    expect(p1.items[0].title).toBe('Pagination tote 29'); // newest first
    const ids = new Set([...p1.items, ...p2.items].map((i: Item) => i.id));
    expect(ids.size).toBe(30);
  });
});

describe('text stays text (no script from sellers)', () => {
  const evil = '<img src=x onerror=alert(1)> Mira <script>alert(2)</script>';
  it.each(['plain', 'markdown'] as const)('when a %s description holds HTML, then the page shows it as text', async (descriptionFormat) => {
    const l = await liveListing(t, fern, admin, { title: `Tote ${evil}`.slice(0, 100), description: `${evil}\n\n[click](javascript:alert(3))`, descriptionFormat });
    const page = (await request(t.app).get(`/api/listings/${l.slug}`)).body;
    expect(page.descriptionHtml).not.toMatch(/<img|<script|href="javascript:/i);
    expect(page.descriptionHtml).toContain('&#60;img src=x onerror=alert(1)&#62;');
    // JSON carries the title as data; the client renders it as a text node
    expect(page.content.title).toContain('<img src=x onerror=alert(1)>');
    expect((await request(t.app).get(`/api/listings/${l.slug}`)).headers['content-type']).toMatch(/application\/json/);
  });
});

describe('visibility', () => {
  it('when a listing is a draft, then its page is 404 for shoppers; its seller and admins may preview it', async () => {
    const l = await createListing(fern, { title: 'Secret draft tote' });
    expect((await request(t.app).get(`/api/listings/${l.slug}`)).status).toBe(404);
    expect((await request(t.app).get(`/api/listings/${l.slug}?version=draft`)).status).toBe(404);
    const comet = await t.signIn('comet@namesake.test', 'namesake-demo');
    expect((await comet.get(`/api/listings/${l.slug}?version=draft`)).status).toBe(404);
    expect((await fern.get(`/api/listings/${l.slug}?version=draft`)).body.content.title).toBe('Secret draft tote');
    expect((await admin.get(`/api/listings/${l.slug}?version=draft`)).status).toBe(200);
    expect((await get({ q: 'secret' })).body.total).toBe(0);
  });
});
