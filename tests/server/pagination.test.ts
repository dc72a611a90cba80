// Every list that grows comes a page at a time (shared/schemas/pagination.ts): more rows than a
// page are made straight in the database, then each list route is walked page by page. The pages
// must hold every row of the caller's once (no gap, no repeat), in the list's order, with the
// total the database counts, and never a row of another shop or shopper. Bad page input is a 400
// naming the field.

import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { and, eq } from 'drizzle-orm';
import type { Agent } from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { auditLog, checkouts, cutSheets, listings, materials, orderLines, orders, shops, user } from '../../server/db/schema.ts';
import type { LineSnapshot } from '../../shared/schemas/cart.ts';
import { PAGE_LIMIT_MAX } from '../../shared/schemas/pagination.ts';
import type { WorkLine } from '../../shared/schemas/workroom.ts';
import { makeTestApp, type TestApp } from '../factories/app.ts';

const DEMO = 'namesake-demo';
let t: TestApp;
let fern: Agent;
let comet: Agent;
let admin: Agent;
let fernShop: string;
let cometShop: string;

beforeAll(async () => {
  t = await makeTestApp({ seed: true });
  fern = await t.signIn('fern@namesake.test', DEMO);
  comet = await t.signIn('comet@namesake.test', DEMO);
  admin = await t.signIn('admin@namesake.test', DEMO);
  fernShop = t.db.select().from(shops).where(eq(shops.slug, 'fern-and-fable-goods')).get()!.id;
  cometShop = t.db.select().from(shops).where(eq(shops.slug, 'little-comet-print-co')).get()!.id;
}, 120_000);
afterAll(async () => t?.close());

type PageBody<T> = { items: T[]; total: number; page: number; limit: number };

/** Walks a list route page by page with `limit`, checking each page's envelope; returns every item in order. */
async function walk<T>(agent: Agent, url: string, limit: number, query: Record<string, string | number> = {}): Promise<{ items: T[]; total: number; pages: PageBody<T>[] }> {
  const pages: PageBody<T>[] = [];
  for (let page = 1; page < 1000; page++) {
    const res = await agent.get(url).query({ ...query, page, limit });
    expect(res.status, `${url} page ${page}`).toBe(200);
    const body = (url.endsWith('/stock') ? res.body.sheets : res.body) as PageBody<T>;
    expect(body).toMatchObject({ page, limit });
    pages.push(body);
    if (body.items.length < limit) break;
  }
  const total = pages[0]!.total;
  for (const p of pages) expect(p.total).toBe(total);
  // every page but the last is full; the last holds the rest
  pages.slice(0, -1).forEach((p) => expect(p.items).toHaveLength(limit));
  expect(pages.at(-1)!.items).toHaveLength(total - limit * (pages.length - 1));
  return { items: pages.flatMap((p) => p.items), total, pages };
}
const ids = (xs: Array<{ id: string }>) => xs.map((x) => x.id);
const noRepeats = (xs: string[]) => expect(new Set(xs).size).toBe(xs.length);

/** paid orders of `buyerId` in `shopId`, one line each, copying a demo line of that shop */
function makeOrders(buyerId: string, shopId: string, n: number, at: number, state = 'awaiting_proof'): string[] {
  // a demo line's snapshot; the listing is one of the shop's own
  const model = t.db.select().from(orderLines).get()!;
  const listing = t.db.select().from(listings).where(eq(listings.shopId, shopId)).get()!;
  const made: string[] = [];
  for (let i = 0; i < n; i++) {
    const checkoutId = crypto.randomUUID();
    const orderId = crypto.randomUUID();
    const paidAt = at + i * 60_000;
    t.db
      .insert(checkouts)
      .values({
        id: checkoutId,
        userId: buyerId,
        cartId: crypto.randomUUID(),
        cartVersion: 1,
        state: 'paid',
        currency: 'USD',
        totalMinor: 2000,
        priced: { currency: 'USD', totalMinor: 2000, shops: [] },
        createdAt: paidAt,
        paidAt,
      })
      .run();
    t.db
      .insert(orders)
      .values({
        id: orderId,
        number: `NS-T${crypto.randomBytes(5).toString('hex')}`,
        checkoutId,
        shopId,
        buyerId,
        currency: 'USD',
        subtotalMinor: 1600,
        shippingMinor: 400,
        platformFeeMinor: 160,
        totalMinor: 2000,
        shipByDate: new Date(paidAt + 5 * 86_400_000).toISOString().slice(0, 10),
        paidAt,
        createdAt: paidAt,
      })
      .run();
    t.db
      .insert(orderLines)
      .values({
        id: crypto.randomUUID(),
        orderId,
        listingId: listing.id,
        listingTitle: listing.liveTitle ?? 'A listing',
        quantity: 1,
        unitPriceMinor: 1600,
        totalMinor: 1600,
        state,
        snapshot: model.snapshot,
        version: 1,
        createdAt: paidAt,
        updatedAt: paidAt,
      })
      .run();
    made.push(orderId);
  }
  return made;
}

describe('bad page input', () => {
  const routes: Array<[string, () => Agent]> = [
    ['/api/orders', () => fern],
    ['/api/workroom/lines', () => fern],
    ['/api/workroom/stock', () => fern],
    ['/api/seller/listings', () => fern],
    ['/api/materials', () => fern],
    ['/api/moderation/queue/listings', () => admin],
    ['/api/moderation/queue/shops', () => admin],
    ['/api/moderation/shops', () => admin],
    ['/api/moderation/audit', () => admin],
    ['/api/admin/mail', () => admin],
    ['/api/listings', () => admin],
  ];
  test.each(routes)('when %s is asked for limit=10000, page=-1 or junk, then 400 naming the field', async (url, who) => {
    const cases: Array<[Record<string, string>, 'page' | 'limit']> = [
      [{ limit: '10000' }, 'limit'],
      [{ limit: String(PAGE_LIMIT_MAX + 1) }, 'limit'],
      [{ limit: '0' }, 'limit'],
      [{ limit: '2.5' }, 'limit'],
      [{ limit: 'lots' }, 'limit'],
      [{ page: '-1' }, 'page'],
      [{ page: '0' }, 'page'],
      [{ page: 'two' }, 'page'],
      [{ page: '1e9' }, 'page'],
    ];
    for (const [query, field] of cases) {
      const res = await who().get(url).query(query);
      expect(res.status, `${url} ${JSON.stringify(query)}`).toBe(400);
      expect(res.body.error.code).toBe('invalid_input');
      expect(typeof res.body.error.fields[field], `${url} ${JSON.stringify(query)}`).toBe('string');
    }
    expect((await who().get(url).query({ page: 1, limit: PAGE_LIMIT_MAX })).status).toBe(200);
  });
});

describe("a shopper's orders", () => {
  test('when a shopper has 23 orders, then pages of 20 and of 5 hold each once, newest first, with nobody else’s', async () => {
    const buyer = await t.makeUser('shopper');
    const other = await t.makeUser('shopper');
    const at = Date.parse('2025-03-01T09:00:00Z');
    const mine = [...makeOrders(buyer.id, fernShop, 12, at), ...makeOrders(buyer.id, cometShop, 11, at + 30_000)];
    const theirs = makeOrders(other.id, fernShop, 3, at);
    const agent = await t.signIn(buyer.email);

    const first = (await agent.get('/api/orders')).body as PageBody<{ id: string; paidAt: number }>;
    expect(first).toMatchObject({ total: 23, page: 1, limit: 20 });
    expect(first.items).toHaveLength(20);
    const second = (await agent.get('/api/orders?page=2')).body as PageBody<{ id: string; paidAt: number }>;
    expect(second.items).toHaveLength(3);
    const all = [...first.items, ...second.items];
    noRepeats(ids(all));
    expect(new Set(ids(all))).toEqual(new Set(mine));
    expect(ids(all).some((id) => theirs.includes(id))).toBe(false);
    // newest first across the page boundary
    const paid = all.map((o) => o.paidAt);
    expect(paid).toEqual([...paid].sort((a, b) => b - a));

    const walked = await walk<{ id: string }>(agent, '/api/orders', 5);
    expect(walked.pages).toHaveLength(5);
    expect(ids(walked.items)).toEqual(ids(all));
    // past the end: an empty page that still says how many there are
    expect((await agent.get('/api/orders?page=9')).body).toMatchObject({ items: [], total: 23, page: 9 });
  });
});

describe("the workroom's lines", () => {
  let fernMade: string[];
  let cometMade: string[];
  beforeAll(async () => {
    const buyer = await t.makeUser('shopper');
    const at = Date.parse('2025-04-01T09:00:00Z');
    fernMade = [...makeOrders(buyer.id, fernShop, 40, at), ...makeOrders(buyer.id, fernShop, 15, at + 3_600_000, 'shipped')];
    cometMade = makeOrders(buyer.id, cometShop, 12, at);
  });
  const linesOf = (shopId: string) => t.db.select({ line: orderLines, order: orders }).from(orderLines).innerJoin(orders, eq(orders.id, orderLines.orderId)).where(eq(orders.shopId, shopId)).all();

  test('when Fern walks her lines 7 at a time, then she gets each of her lines once and none of Comet’s; Comet the reverse', async () => {
    const { items, total } = await walk<WorkLine>(fern, '/api/workroom/lines', 7);
    const expected = linesOf(fernShop).map((r) => r.line.id);
    expect(total).toBe(expected.length);
    noRepeats(ids(items));
    expect(new Set(ids(items))).toEqual(new Set(expected));
    const cometIds = new Set(linesOf(cometShop).map((r) => r.line.id));
    expect(items.some((l) => cometIds.has(l.id))).toBe(false);
    expect(items.filter((l) => fernMade.includes(l.orderId))).toHaveLength(fernMade.length);

    const theirs = await walk<WorkLine>(comet, '/api/workroom/lines', 9);
    expect(new Set(ids(theirs.items))).toEqual(cometIds);
    expect(theirs.items.filter((l) => cometMade.includes(l.orderId))).toHaveLength(cometMade.length);
  });

  test('when the lines are paged, then open lines come before finished ones and by ship-by date, across pages', async () => {
    const { items } = await walk<WorkLine>(fern, '/api/workroom/lines', 10);
    const byId = new Map(linesOf(fernShop).map((r) => [r.line.id, r]));
    const finished = (s: string) => ['shipped', 'cancelled', 'refunded'].includes(s);
    const keys = items.map((l) => {
      const r = byId.get(l.id)!;
      return `${finished(r.line.state) ? 1 : 0}|${r.order.shipByDate ?? '9999-12-31'}`;
    });
    expect(keys).toEqual([...keys].sort());
  });

  test('when filtered by state, listing, material or time paid, then the pages hold exactly the lines that match', async () => {
    const rows = linesOf(fernShop);
    const approved = await walk<WorkLine>(fern, '/api/workroom/lines', 4, { state: 'approved' });
    expect(new Set(ids(approved.items))).toEqual(new Set(rows.filter((r) => r.line.state === 'approved').map((r) => r.line.id)));

    const listingId = rows[0]!.line.listingId;
    const byListing = await walk<WorkLine>(fern, '/api/workroom/lines', 25, { listing: listingId });
    expect(new Set(ids(byListing.items))).toEqual(new Set(rows.filter((r) => r.line.listingId === listingId).map((r) => r.line.id)));

    // the material a line uses, read from its snapshot here (not by the server's JSON query)
    const uses = (r: (typeof rows)[number], m: string) => (r.line.snapshot as LineSnapshot).geometry.pieces.some((p) => p.materialId === m);
    const used = [...new Set(rows.flatMap((r) => (r.line.snapshot as LineSnapshot).geometry.pieces.map((p) => p.materialId)))].filter((m): m is string => !!m);
    expect(used.length).toBeGreaterThanOrEqual(2);
    for (const m of used) {
      const page = await walk<WorkLine>(fern, '/api/workroom/lines', 30, { material: m });
      expect(new Set(ids(page.items))).toEqual(new Set(rows.filter((r) => uses(r, m)).map((r) => r.line.id)));
      for (const l of page.items) expect(l.materials.map((x) => x.id)).toContain(m);
    }

    const from = Date.parse('2025-04-01T09:10:00Z');
    const to = Date.parse('2025-04-01T09:29:59Z');
    const window = await walk<WorkLine>(fern, '/api/workroom/lines', 6, { paidFrom: from, paidTo: to });
    expect(new Set(ids(window.items))).toEqual(new Set(rows.filter((r) => r.order.paidAt >= from && r.order.paidAt <= to).map((r) => r.line.id)));
    expect(window.total).toBe(20);
    const backwards = await fern.get('/api/workroom/lines').query({ paidFrom: to, paidTo: from });
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.fields.paidFrom).toBeTruthy();
    expect((await fern.get('/api/workroom/lines?state=lost')).body.error.fields.state).toBeTruthy();
  });

  test('when the filters are offered, then they list only Fern’s own materials and sold listings; the counts stay whole', async () => {
    const res = (await fern.get('/api/workroom/lines?limit=1')).body;
    const ownMaterials = new Set(
      t.db
        .select()
        .from(materials)
        .where(eq(materials.shopId, fernShop))
        .all()
        .map((m) => m.id),
    );
    expect(res.options.materials.length).toBe(ownMaterials.size);
    for (const m of res.options.materials) expect(ownMaterials.has(m.id)).toBe(true);
    const sold = new Set(linesOf(fernShop).map((r) => r.line.listingId));
    expect(new Set(res.options.listings.map((l: { id: string }) => l.id))).toEqual(sold);
    // the summary counts every line, not a page of them
    const counts = (await fern.get('/api/workroom/summary')).body.counts;
    expect(counts.shipped).toBe(linesOf(fernShop).filter((r) => r.line.state === 'shipped').length);
    expect(counts.awaiting_proof).toBe(linesOf(fernShop).filter((r) => r.line.state === 'awaiting_proof').length);
  });
});

describe("a seller's listings and materials", () => {
  test('when a shop has 27 listings, then pages of 25 hold each once, last changed first, and the state filter counts its own', async () => {
    const seller = await t.makeSeller({ name: 'Wren Pages' });
    const model = t.db.select().from(listings).where(eq(listings.shopId, fernShop)).get()!;
    const at = Date.parse('2025-05-01T00:00:00Z');
    const made: string[] = Array.from({ length: 27 }, (_, i) => {
      const id = crypto.randomUUID();
      t.db
        .insert(listings)
        .values({ ...model, id, shopId: seller.shopId, slug: `wren-${id.slice(0, 8)}`, state: i % 3 === 0 ? 'paused' : 'draft', createdAt: at, updatedAt: at + i * 1000 })
        .run();
      return id;
    });
    const agent = await t.signIn(seller.email);
    const p1 = (await agent.get('/api/seller/listings')).body as PageBody<{ id: string; updatedAt: number }>;
    expect(p1).toMatchObject({ total: 27, page: 1, limit: 25 });
    const p2 = (await agent.get('/api/seller/listings?page=2')).body as PageBody<{ id: string; updatedAt: number }>;
    expect(p2.items).toHaveLength(2);
    expect(ids([...p1.items, ...p2.items])).toEqual([...made].reverse());
    const paused = await walk<{ id: string; state: string }>(agent, '/api/seller/listings', 4, { state: 'paused' });
    expect(paused.total).toBe(9);
    expect(paused.items.every((l) => l.state === 'paused')).toBe(true);
    // another shop's seller sees none of them on any page
    const theirs = await walk<{ id: string }>(fern, '/api/seller/listings', 100);
    expect(theirs.items.some((l) => made.includes(l.id))).toBe(false);
    expect(theirs.total).toBe(t.db.select().from(listings).where(eq(listings.shopId, fernShop)).all().length);
  });

  test('when a shop has 55 materials, then pages of 50 hold each once by kind and colour; archived filters count', async () => {
    const seller = await t.makeSeller({ name: 'Moth Pages' });
    const kinds = ['smooth', 'glitter', 'flock', 'metallic', 'patterned'];
    const made: string[] = Array.from({ length: 55 }, (_, i) => {
      const id = crypto.randomUUID();
      t.db
        .insert(materials)
        .values({
          id,
          shopId: seller.shopId,
          kind: kinds[i % 5]!,
          colourName: `Colour ${String(i).padStart(2, '0')}`,
          colourHex: '#112233',
          rollWidthMm: 305,
          stockMm: 5000,
          pressProfile: {} as never,
          archived: i < 6,
          createdAt: Date.now(),
        })
        .run();
      return id;
    });
    const agent = await t.signIn(seller.email);
    const p1 = (await agent.get('/api/materials')).body as PageBody<{ id: string; kind: string; colourName: string }>;
    expect(p1).toMatchObject({ total: 55, limit: 50 });
    const p2 = (await agent.get('/api/materials?page=2')).body as PageBody<{ id: string; kind: string; colourName: string }>;
    expect(p2.items).toHaveLength(5);
    const all = [...p1.items, ...p2.items];
    expect(new Set(ids(all))).toEqual(new Set(made));
    const order = all.map((m) => `${m.kind}|${m.colourName}`);
    expect(order).toEqual([...order].sort());
    expect((await agent.get('/api/materials?archived=true')).body.total).toBe(6);
    expect((await agent.get('/api/materials?archived=false&limit=10&page=5')).body).toMatchObject({ total: 49, page: 5 });
    expect((await agent.get('/api/materials?archived=false&limit=10&page=5')).body.items).toHaveLength(9);
    const theirs = await walk<{ id: string }>(comet, '/api/materials', 100);
    expect(theirs.items.some((m) => made.includes(m.id))).toBe(false);
  });
});

describe('stock', () => {
  test("when a shop has 30 cut sheets, then the sheets' use pages 25 at a time, newest first; planned length counts every uncut sheet", async () => {
    const mats = t.db
      .select()
      .from(materials)
      .where(and(eq(materials.shopId, fernShop), eq(materials.archived, false)))
      .all();
    const at = Date.parse('2025-06-01T00:00:00Z');
    for (let i = 0; i < 30; i++) {
      t.db
        .insert(cutSheets)
        .values({
          id: crypto.randomUUID(),
          shopId: fernShop,
          materialId: mats[i % mats.length]!.id,
          batchId: `page-batch-${Math.floor(i / 10)}`,
          rollWidthMm: 305,
          lengthMm: 100 + i,
          utilisation: 0.5,
          pieces: [],
          state: i % 2 ? 'cut' : 'planned',
          createdAt: at + i * 1000,
        })
        .run();
    }
    const sheets = t.db.select().from(cutSheets).where(eq(cutSheets.shopId, fernShop)).all();
    const { items, total } = await walk<{ id: string; createdAt: number }>(fern, '/api/workroom/stock', 25);
    expect(total).toBe(sheets.length);
    expect(new Set(ids(items))).toEqual(new Set(ids(sheets)));
    const made = items.map((s) => s.createdAt);
    expect(made).toEqual([...made].sort((a, b) => b - a));
    // planned: each uncut sheet's length plus the 25 mm trim, summed here from every sheet
    const stock = (await fern.get('/api/workroom/stock?page=2')).body;
    for (const m of stock.materials as Array<{ id: string; plannedMm: number }>) {
      const want = sheets.filter((s) => s.materialId === m.id && s.state !== 'cut').reduce((a, s) => a + s.lengthMm + 25, 0);
      expect(m.plannedMm).toBeCloseTo(want, 3);
    }
    const theirs = await walk<{ id: string }>(comet, '/api/workroom/stock', 100);
    expect(theirs.items.some((s) => sheets.some((x) => x.id === s.id))).toBe(false);
  });
});

describe('the moderation desk', () => {
  test('when 23 shops and 22 listings wait, then each queue pages 20 at a time, oldest first, and a listing opens by id', async () => {
    const before = Date.now();
    for (let i = 0; i < 23; i++) await t.makeSeller({ name: `Queue Shop ${i}`, state: 'in_review' });
    const model = t.db.select().from(listings).where(eq(listings.shopId, fernShop)).get()!;
    const waiting: string[] = Array.from({ length: 22 }, (_, i) => {
      const id = crypto.randomUUID();
      t.db
        .insert(listings)
        .values({ ...model, id, slug: `queue-${id.slice(0, 8)}`, state: 'in_review', pendingReview: false, createdAt: before, updatedAt: before + i })
        .run();
      return id;
    });
    const shopsWaiting = t.db.select().from(shops).where(eq(shops.state, 'in_review')).all();
    const sq = await walk<{ id: string; createdAt: number }>(admin, '/api/moderation/queue/shops', 20);
    expect(sq.total).toBe(shopsWaiting.length);
    expect(new Set(ids(sq.items))).toEqual(new Set(ids(shopsWaiting)));
    expect(sq.items.map((s) => s.createdAt)).toEqual(sq.items.map((s) => s.createdAt).sort((a, b) => a - b));

    const lq = await walk<{ id: string; submittedAt: number }>(admin, '/api/moderation/queue/listings', 20);
    const listingsWaiting = t.db
      .select()
      .from(listings)
      .all()
      .filter((l) => l.state === 'in_review' || l.pendingReview);
    expect(lq.total).toBe(listingsWaiting.length);
    expect(new Set(ids(lq.items))).toEqual(new Set(ids(listingsWaiting)));
    expect(ids(lq.items).filter((id) => waiting.includes(id))).toEqual(waiting); // oldest first
    const last = waiting.at(-1)!;
    expect((await admin.get(`/api/moderation/queue/listings/${last}`)).body.listing).toEqual(lq.items.find((l) => l.id === last));
    const live = t.db
      .select()
      .from(listings)
      .where(and(eq(listings.state, 'live'), eq(listings.pendingReview, false)))
      .get()!;
    expect((await admin.get(`/api/moderation/queue/listings/${live.id}`)).status).toBe(404);
  });

  test('when the audit log has more than a page, then pages of 50 hold each entry once, newest first', async () => {
    const actor = t.db.select().from(user).where(eq(user.email, 'admin@namesake.test')).get()!;
    const at = Date.parse('2025-07-01T00:00:00Z');
    for (let i = 0; i < 61; i++)
      t.db
        .insert(auditLog)
        .values({ id: crypto.randomUUID(), actorId: actor.id, action: 'shop.approve', subjectType: 'shop', subjectId: fernShop, reason: null, createdAt: at + i })
        .run();
    const all = t.db.select().from(auditLog).all();
    const first = (await admin.get('/api/moderation/audit')).body as PageBody<{ id: string; at: number }>;
    expect(first).toMatchObject({ total: all.length, limit: 50 });
    const { items } = await walk<{ id: string; at: number }>(admin, '/api/moderation/audit', 50);
    expect(ids(items.slice(0, 50))).toEqual(ids(first.items));
    expect(new Set(ids(items))).toEqual(new Set(ids(all)));
    const when = items.map((e) => e.at);
    expect(when).toEqual([...when].sort((a, b) => b - a));
  });
});

describe('captured mail', () => {
  test('when more messages are stored than a page, then pages of 50 hold each once, newest first', async () => {
    fs.mkdirSync(t.mailDir, { recursive: true });
    for (let i = 0; i < 57; i++) {
      const id = `2030010100${String(i).padStart(4, '0')}-${crypto.randomBytes(4).toString('hex')}`;
      const eml = `From: Namesake <hello@namesake.test>\r\nTo: page${i}@namesake.test\r\nSubject: Page test ${i}\r\nDate: Tue, 01 Jan 2030 00:00:00 +0000\r\n\r\nBody ${i}\r\n`;
      fs.writeFileSync(path.join(t.mailDir, `${id}.eml`), eml);
    }
    const stored = fs.readdirSync(t.mailDir).filter((f) => f.endsWith('.eml'));
    const { items, total } = await walk<{ id: string; subject: string }>(admin, '/api/admin/mail', 50);
    expect(total).toBe(stored.length);
    noRepeats(ids(items));
    expect(new Set(items.map((m) => `${m.id}.eml`))).toEqual(new Set(stored));
    // newest first: the last file written (the highest id) leads page 1
    expect(items[0]!.subject).toBe('Page test 56');
    expect(items.map((m) => m.id)).toEqual([...items.map((m) => m.id)].sort().reverse());
  });
});
