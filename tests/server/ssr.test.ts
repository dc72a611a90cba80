// Server-rendered public pages, what crawlers and shared links read, and the transport around them
// (issue 13): each request is made as a crawler makes it, without running any JavaScript.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listings, shops } from '../../server/db/schema.ts';
import type { SsrEntry } from '../../shared/ssr-contract.ts';
import { makeTestApp } from '../factories/app.ts';

// The vocabulary's own property lists (schema.org, version 29), including what each type inherits
// from Thing. Product: https://schema.org/Product — Offer: https://schema.org/Offer
const THING_PROPERTIES = [
  'additionalType',
  'alternateName',
  'description',
  'disambiguatingDescription',
  'identifier',
  'image',
  'mainEntityOfPage',
  'name',
  'potentialAction',
  'sameAs',
  'subjectOf',
  'url',
];
const PRODUCT_PROPERTIES = [
  ...THING_PROPERTIES,
  'additionalProperty',
  'aggregateRating',
  'asin',
  'audience',
  'award',
  'brand',
  'category',
  'color',
  'colorSwatch',
  'countryOfAssembly',
  'countryOfLastProcessing',
  'countryOfOrigin',
  'depth',
  'funding',
  'gtin',
  'gtin12',
  'gtin13',
  'gtin14',
  'gtin8',
  'hasAdultConsideration',
  'hasCertification',
  'hasEnergyConsumptionDetails',
  'hasMeasurement',
  'hasMerchantReturnPolicy',
  'height',
  'inProductGroupWithID',
  'isAccessoryOrSparePartFor',
  'isConsumableFor',
  'isFamilyFriendly',
  'isRelatedTo',
  'isSimilarTo',
  'isVariantOf',
  'itemCondition',
  'keywords',
  'logo',
  'manufacturer',
  'material',
  'mobileUrl',
  'model',
  'mpn',
  'negativeNotes',
  'nsn',
  'offers',
  'pattern',
  'positiveNotes',
  'productID',
  'productionDate',
  'purchaseDate',
  'releaseDate',
  'review',
  'size',
  'sku',
  'slogan',
  'weight',
  'width',
];
const OFFER_PROPERTIES = [
  ...THING_PROPERTIES,
  'acceptedPaymentMethod',
  'addOn',
  'advanceBookingRequirement',
  'aggregateRating',
  'areaServed',
  'asin',
  'availability',
  'availabilityEnds',
  'availabilityStarts',
  'availableAtOrFrom',
  'availableDeliveryMethod',
  'businessFunction',
  'category',
  'checkoutPageURLTemplate',
  'deliveryLeadTime',
  'eligibleCustomerType',
  'eligibleDuration',
  'eligibleQuantity',
  'eligibleRegion',
  'eligibleTransactionVolume',
  'gtin',
  'gtin12',
  'gtin13',
  'gtin14',
  'gtin8',
  'hasAdultConsideration',
  'hasGS1DigitalLink',
  'hasMeasurement',
  'hasMerchantReturnPolicy',
  'includesObject',
  'ineligibleRegion',
  'inventoryLevel',
  'isFamilyFriendly',
  'itemCondition',
  'itemOffered',
  'leaseLength',
  'mobileUrl',
  'mpn',
  'offeredBy',
  'price',
  'priceCurrency',
  'priceSpecification',
  'priceValidUntil',
  'review',
  'seller',
  'serialNumber',
  'shippingDetails',
  'sku',
  'validFrom',
  'validThrough',
  'warranty',
];
// https://schema.org/ItemAvailability: the enumeration's members
const ITEM_AVAILABILITY = ['BackOrder', 'Discontinued', 'InStock', 'InStoreOnly', 'LimitedAvailability', 'MadeToOrder', 'OnlineOnly', 'OutOfStock', 'PreOrder', 'PreSale', 'Reserved', 'SoldOut'].map(
  (m) => `https://schema.org/${m}`,
);

const BASE = 'http://localhost:3000';
const template = fs.readFileSync(path.resolve(import.meta.dirname, '../../index.html'), 'utf8');
const entry = async () => (await import('../../src/app/ssr/entry-server.tsx')).entry as SsrEntry;

let t: Awaited<ReturnType<typeof makeTestApp>>;
let clientDir: string;
const FOX = 'autumn-fox-tote-with-a-name';

beforeAll(async () => {
  // a client build in miniature: the shell, one hashed asset
  clientDir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-client-'));
  fs.mkdirSync(path.join(clientDir, 'assets'));
  fs.writeFileSync(path.join(clientDir, 'index.html'), template);
  fs.writeFileSync(path.join(clientDir, 'assets', 'app-Ab12Cd34.js'), `console.log(${JSON.stringify('x'.repeat(4000))});`);
  t = await makeTestApp({ seed: true, app: { clientDir, ssr: { template, entry } } });
});
afterAll(async () => {
  await t?.close();
  fs.rmSync(clientDir, { recursive: true, force: true });
});

function jsonLd(html: string): Record<string, unknown>[] {
  return [...html.matchAll(/<script type="application\/ld\+json">(.*?)<\/script>/gs)].map((m) => JSON.parse(m[1]!) as Record<string, unknown>);
}
const meta = (html: string, attr: 'name' | 'property', key: string) => html.match(new RegExp(`<meta ${attr}="${key}" content="([^"]*)"`))?.[1];

describe('a listing as a crawler reads it (no JavaScript)', () => {
  it('when a listing is fetched, then its title, price, description, picture and Product data are in the HTML', async () => {
    const api = (await request(t.app).get(`/api/listings/${FOX}`)).body;
    const res = await request(t.app).get(`/listings/${FOX}`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    const html = res.text;
    expect(html).toContain(`<title>${api.content.title} · Fern &amp; Fable Goods · Namesake</title>`);
    expect(html).toMatch(new RegExp(`<h1[^>]*>${api.content.title}</h1>`));
    expect(html).toContain('$24.00');
    expect(html).toContain('A sturdy cotton tote');
    expect(meta(html, 'name', 'description')).toMatch(/^A sturdy cotton tote/);
    expect(html).toContain(`<link rel="canonical" href="${BASE}/listings/${FOX}" />`);
    expect(meta(html, 'property', 'og:image')).toBe(`${BASE}/listing-images/${FOX}.png`);
    expect(meta(html, 'name', 'twitter:card')).toBe('summary_large_image');
    expect(meta(html, 'name', 'twitter:image')).toBe(`${BASE}/listing-images/${FOX}.png`);
    // the shell's own title and description are replaced, not repeated
    expect(html.match(/<title>/g)).toHaveLength(1);
    expect(html.match(/<meta name="description"/g)).toHaveLength(1);
  });

  it('when a listing is fetched, then its Product JSON-LD uses only schema.org Product and Offer properties, with price, currency and availability', async () => {
    const html = (await request(t.app).get(`/listings/${FOX}`)).text;
    const [product] = jsonLd(html);
    expect(product?.['@context']).toBe('https://schema.org');
    expect(product?.['@type']).toBe('Product');
    const props = Object.keys(product!).filter((k) => !k.startsWith('@'));
    expect(props.filter((p) => !PRODUCT_PROPERTIES.includes(p))).toEqual([]);
    const offer = product!.offers as Record<string, unknown>;
    expect(offer['@type']).toBe('Offer');
    expect(Object.keys(offer).filter((k) => !k.startsWith('@') && !OFFER_PROPERTIES.includes(k))).toEqual([]);
    expect(offer).toMatchObject({ price: '24.00', priceCurrency: 'USD' });
    expect(ITEM_AVAILABILITY).toContain(offer.availability);
    expect(product!.name).toBe('Autumn fox tote with a name');
    expect(product!.image).toContain(`${BASE}/listing-images/${FOX}.png`);
  });

  it('when a listing has reviews, then its Product carries an AggregateRating with the page’s average and count', async () => {
    // AggregateRating's own properties: https://schema.org/AggregateRating (ratingValue, reviewCount, bestRating, worstRating)
    const slugs = t.db
      .select({ slug: listings.slug })
      .from(listings)
      .all()
      .map((l) => l.slug);
    let checked = 0;
    for (const slug of slugs) {
      const api = await request(t.app).get(`/api/listings/${slug}`);
      if (api.status !== 200) continue;
      const [product] = jsonLd((await request(t.app).get(`/listings/${slug}`)).text);
      if (api.body.rating.count > 0) {
        expect(product?.aggregateRating).toEqual({ '@type': 'AggregateRating', ratingValue: api.body.rating.average, reviewCount: api.body.rating.count, bestRating: 5, worstRating: 1 });
        checked++;
      } else expect(product?.aggregateRating).toBeUndefined();
    }
    expect(checked).toBeGreaterThanOrEqual(2);
  });

  it('when a listing is fetched, then the first paint has the design for the default name as SVG, and the page data for hydration', async () => {
    const html = (await request(t.app).get(`/listings/${FOX}`)).text;
    const preview = html.match(/<div[^>]*data-testid="listing-preview"[^>]*>(.*?)<\/div>/s)?.[1] ?? '';
    expect(preview).toMatch(/^<svg[^>]*role="img"[^>]*aria-label="[^"]*Mira/);
    // the blank's outline plus the composed pieces (letters and motif), all as path data
    expect((preview.match(/<path d="M/g) ?? []).length).toBeGreaterThan(4);
    const state = JSON.parse(html.match(/<script type="application\/json" id="namesake-ssr-state">(.*?)<\/script>/s)![1]!);
    const keys = state.queries.map((q: { queryKey: unknown[] }) => JSON.stringify(q.queryKey));
    expect(keys).toContain(JSON.stringify(['catalog', 'listing', FOX]));
    expect(keys).toContain(JSON.stringify(['auth', 'me']));
  });

  it('when a description holds markup, then the page carries it as text only, also in the JSON for hydration', async () => {
    const slug = FOX;
    const row = t.db.select().from(listings).where(eq(listings.slug, slug)).get()!;
    const live = { ...row.live!, title: 'Fox </script><script>alert(1)</script>', description: '<img src=x onerror=alert(1)>' };
    t.db.update(listings).set({ live, liveTitle: live.title }).where(eq(listings.slug, slug)).run();
    try {
      const html = (await request(t.app).get(`/listings/${slug}`)).text;
      expect(html).not.toContain('<script>alert(1)');
      expect(html).not.toContain('<img src=x');
      expect(html).toContain('Fox &lt;/script&gt;&lt;script&gt;alert(1)&lt;/script&gt;');
    } finally {
      t.db.update(listings).set({ live: row.live, liveTitle: row.liveTitle }).where(eq(listings.slug, slug)).run();
    }
  });
});

describe('the other public pages', () => {
  it('when the home page is fetched, then its shelves hold live listings and it has its card tags', async () => {
    const html = (await request(t.app).get('/')).text;
    expect(html).toContain('Autumn fox tote with a name');
    expect(html).toContain(`<link rel="canonical" href="${BASE}/" />`);
    expect(meta(html, 'property', 'og:image')).toBe(`${BASE}/social-card.png`);
    expect(meta(html, 'property', 'og:title')).toMatch(/Namesake/);
  });

  it('when a search is fetched, then the matching listings are in the HTML and the rest are not', async () => {
    const html = (await request(t.app).get('/search?q=fox')).text;
    expect(html).toContain('Autumn fox tote with a name');
    expect(html).not.toContain('Rocket name tee for kids');
    expect(html).toContain('<title>Results for “fox” · Namesake</title>');
    expect(html).toContain(`<link rel="canonical" href="${BASE}/search?q=fox" />`);
  });

  it('when a shop page is fetched, then its name and live listings are in the HTML', async () => {
    const html = (await request(t.app).get('/shops/fern-and-fable-goods')).text;
    expect(html).toContain('<title>Fern &amp; Fable Goods · Namesake</title>');
    expect(html).toContain('Autumn fox tote with a name');
  });

  it.each([['/listings/no-such-listing'], ['/shops/no-such-shop'], ['/no/such/page']])('when %s is fetched, then HTTP 404 with the not-found page, not indexed', async (url) => {
    const res = await request(t.app).get(url);
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    expect(res.text).toContain('This page has slipped off the press');
    expect(meta(res.text, 'name', 'robots')).toBe('noindex');
  });

  it('when a page behind sign-in is fetched, then the plain client shell comes, without data', async () => {
    const res = await request(t.app).get('/workroom');
    expect(res.status).toBe(200);
    expect(res.text).toContain('<div id="root"></div>');
    expect(res.text).not.toContain('namesake-ssr-state');
  });

  it('when a seller is signed in, then the server render already knows them (no guest header)', async () => {
    const agent = await t.signIn('fern@namesake.test', 'namesake-demo');
    const html = (await agent.get('/')).text;
    const state = JSON.parse(html.match(/id="namesake-ssr-state">(.*?)<\/script>/s)![1]!);
    const me = state.queries.find((q: { queryKey: unknown[] }) => JSON.stringify(q.queryKey) === '["auth","me"]');
    expect(me.state.data.user.email).toBe('fern@namesake.test');
  });
});

describe('robots.txt and sitemap.xml', () => {
  it('when robots.txt is fetched, then it is text naming the sitemap', async () => {
    const res = await request(t.app).get('/robots.txt');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/plain/);
    expect(res.text).toContain(`Sitemap: ${BASE}/sitemap.xml`);
  });

  it('when sitemap.xml is fetched, then it lists every live listing and live shop, and follows a pause at once', async () => {
    const live = t.db
      .select({ slug: listings.slug })
      .from(listings)
      .innerJoin(shops, eq(shops.id, listings.shopId))
      .where(eq(listings.state, 'live'))
      .all()
      .filter((l) => l.slug);
    const liveShops = t.db.select({ slug: shops.slug }).from(shops).where(eq(shops.state, 'live')).all();
    expect(live.length).toBeGreaterThan(2);
    const res = await request(t.app).get('/sitemap.xml');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/application\/xml/);
    const locs = [...res.text.matchAll(/<loc>([^<]+)<\/loc>/g)].map((m) => m[1]);
    for (const l of live) expect(locs).toContain(`${BASE}/listings/${l.slug}`);
    for (const s of liveShops) expect(locs).toContain(`${BASE}/shops/${s.slug}`);
    const notLive = t.db.select({ slug: shops.slug }).from(shops).where(eq(shops.state, 'in_review')).all();
    for (const s of notLive) expect(locs).not.toContain(`${BASE}/shops/${s.slug}`);

    t.db.update(listings).set({ state: 'paused' }).where(eq(listings.slug, FOX)).run();
    try {
      const after = (await request(t.app).get('/sitemap.xml')).text;
      expect(after).not.toContain(`/listings/${FOX}<`);
      expect((await request(t.app).get(`/listings/${FOX}`)).status).toBe(404);
    } finally {
      t.db.update(listings).set({ state: 'live' }).where(eq(listings.slug, FOX)).run();
    }
  });
});

describe('transport: compression and caching', () => {
  it.each([
    ['br', 'br'],
    ['gzip', 'gzip'],
    ['gzip, deflate, br', 'br'],
  ])('when a client accepts %s, then the page comes %s-encoded', async (accept, encoding) => {
    const res = await request(t.app)
      .get('/')
      .set('Accept-Encoding', accept)
      .buffer(true)
      .parse((r, cb) => {
        r.on('data', () => {});
        r.on('end', () => cb(null, null));
      });
    expect(res.headers['content-encoding']).toBe(encoding);
  });

  it('when an HTML page is fetched, then no-cache with an ETag, and a repeat with If-None-Match gets 304', async () => {
    const first = await request(t.app).get(`/listings/${FOX}`);
    expect(first.headers['cache-control']).toBe('no-cache');
    expect(first.headers.etag).toBeTruthy();
    const again = await request(t.app).get(`/listings/${FOX}`).set('If-None-Match', first.headers.etag!);
    expect(again.status).toBe(304);
  });

  it('when a hashed asset is fetched, then it may be cached for a year, immutable, and is compressed', async () => {
    const res = await request(t.app).get('/assets/app-Ab12Cd34.js').set('Accept-Encoding', 'gzip');
    expect(res.status).toBe(200);
    expect(res.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(res.headers['content-encoding']).toBe('gzip');
  });
});

describe('guest /api/me', () => {
  it('when a guest asks /api/me, then 200 with no user (no failed request on public pages)', async () => {
    const res = await request(t.app).get('/api/me');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ user: null, shop: null });
  });
});

describe("a listing's picture (design on its blank, by sharp)", () => {
  it('when the PNG is fetched, then it is a 1200×630 picture holding the design colours, cached by content', async () => {
    const res = await request(t.app).get(`/listing-images/${FOX}.png`).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/png');
    const img = sharp(res.body as Buffer);
    expect(await img.metadata()).toMatchObject({ format: 'png', width: 1200, height: 630 });
    // the fox motif's orange (a material colour of the listing) is drawn on the blank
    const { data, info } = await img.raw().toBuffer({ resolveWithObject: true });
    const api = (await request(t.app).get(`/api/listings/${FOX}`)).body as { materials: { colourHex: string }[] };
    const colours = api.materials.map((m) => [1, 3, 5].map((i) => Number.parseInt(m.colourHex.slice(i, i + 2), 16)));
    let hits = 0;
    for (let p = 0; p < data.length; p += info.channels) if (colours.some(([r, g, b]) => Math.abs(data[p]! - r!) + Math.abs(data[p + 1]! - g!) + Math.abs(data[p + 2]! - b!) < 12)) hits++;
    expect(hits).toBeGreaterThan(1000);

    const files = fs.readdirSync(path.join(t.env.dataDir, 'listing-images'));
    expect(files.filter((f) => f.endsWith('.png'))).toHaveLength(1);
    const again = await request(t.app).get(`/listing-images/${FOX}.png`).set('If-None-Match', res.headers.etag!);
    expect(again.status).toBe(304);
    expect(fs.readdirSync(path.join(t.env.dataDir, 'listing-images'))).toEqual(files);
  });

  it('when the WebP is fetched, then WebP of the same size', async () => {
    const res = await request(t.app).get(`/listing-images/${FOX}.webp`).buffer(true);
    expect(res.status).toBe(200);
    expect(await sharp(res.body as Buffer).metadata()).toMatchObject({ format: 'webp', width: 1200, height: 630 });
  });

  it('when the browse card is fetched, then a 480 × 360 WebP that differs from the social card', async () => {
    const res = await request(t.app).get(`/listing-images/${FOX}.card.webp`).buffer(true);
    expect(res.status).toBe(200);
    expect(await sharp(res.body as Buffer).metadata()).toMatchObject({ format: 'webp', width: 480, height: 360 });
    const social = await request(t.app).get(`/listing-images/${FOX}.webp`);
    expect(res.headers.etag).not.toBe(social.headers.etag);
  });

  it.each([['no-such-listing.png'], ['../secret.png'], [`${FOX}.gif`], [`${FOX}.card.gif`], [`${FOX}.thumb.webp`]])('when %s is asked for, then 404', async (file) => {
    expect((await request(t.app).get(`/listing-images/${file}`)).status).toBe(404);
  });
});
