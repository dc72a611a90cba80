// The business API on a fresh seeded database: calendar settings, ship-by marks, cost of goods
// from real cut sheets, the price check, the ledger (JSON and CSV), charts and the digest.
import crypto from 'node:crypto';
import { eq, like } from 'drizzle-orm';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { checkouts, cutSheets, jobRuns, orderLines, orders, shops, user } from '../../server/db/schema.ts';
import { runDigest } from '../../server/features/business/digest.ts';
import { createOrdersForCheckout, type PricedShop } from '../../server/features/orders/orders.service.ts';
import { sheetCostShares } from '../../shared/business/costs.ts';
import { DEFAULT_WEEDING_RATES, weedingMinutes, weedingWork } from '../../shared/business/labour.ts';
import { parsePathData, pathArea } from '../../shared/engine/path.ts';
import type { BusinessSettings, ChartsView, CostsView, DueView, LedgerView, PriceCheckResult } from '../../shared/schemas/business.ts';
import type { SellerListing } from '../../shared/schemas/listing.ts';
import { makeTestApp, type TestApp } from '../factories/app.ts';

const DEMO = 'namesake-demo';
let t: TestApp;
let clock = Date.now();
let fern: Awaited<ReturnType<TestApp['signIn']>>;
let comet: Awaited<ReturnType<TestApp['signIn']>>;
let fernShop: typeof shops.$inferSelect;
let danaId: string;

beforeAll(async () => {
  t = await makeTestApp({ seed: true, now: () => clock });
  fern = await t.signIn('fern@namesake.test', DEMO);
  comet = await t.signIn('comet@namesake.test', DEMO);
  const fernUser = t.db.select().from(user).where(eq(user.email, 'fern@namesake.test')).get()!;
  fernShop = t.db.select().from(shops).where(eq(shops.ownerId, fernUser.id)).get()!;
  danaId = t.db.select().from(user).where(eq(user.email, 'dana@namesake.test')).get()!.id;
}, 90_000);
afterAll(async () => t?.close());

/** A paid order of Fern's through the real order-creation code, one line copied from a seeded line. */
function makeOrder(paidAt: number): { orderId: string; lineId: string } {
  const shop = t.db.select().from(shops).where(eq(shops.id, fernShop.id)).get()!;
  const src = t.db.select({ line: orderLines }).from(orderLines).innerJoin(orders, eq(orders.id, orderLines.orderId)).where(eq(orders.shopId, shop.id)).all()[0]!.line;
  const snapshot = src.snapshot;
  const priced: PricedShop = {
    shopId: shop.id,
    shopName: shop.name,
    shippingMinor: 450,
    subtotalMinor: src.unitPriceMinor,
    totalMinor: src.unitPriceMinor + 450,
    lines: [{ listingId: src.listingId, title: src.listingTitle, quantity: 1, unitPriceMinor: src.unitPriceMinor, totalMinor: src.unitPriceMinor, snapshot }],
  };
  const checkoutId = crypto.randomUUID();
  t.db
    .insert(checkouts)
    .values({
      id: checkoutId,
      userId: danaId,
      cartId: crypto.randomUUID(),
      cartVersion: 1,
      state: 'paid',
      currency: 'USD',
      totalMinor: priced.totalMinor,
      priced: { currency: 'USD', totalMinor: priced.totalMinor, shops: [] },
      createdAt: paidAt,
      paidAt,
    })
    .run();
  const [o] = createOrdersForCheckout(t.db, { checkoutId, buyerId: danaId, currency: 'USD', shops: [priced], paidAt, feeBps: 800, paymentIntentId: null });
  const line = t.db.select().from(orderLines).where(eq(orderLines.orderId, o!.id)).get()!;
  return { orderId: o!.id, lineId: line.id };
}

describe('settings', () => {
  test('when Fern sets Sat+Sun off, 3 processing days and a rate, then they are saved and returned', async () => {
    const res = await fern.patch('/api/business/settings').send({ workingDays: [5, 1, 2, 3, 4, 4], daysOff: ['2026-12-25', '2026-12-24'], hourlyRateMinor: 1800, processingDays: 3 });
    expect(res.status).toBe(200);
    const s = res.body.settings as BusinessSettings;
    expect(s.workingDays).toEqual([1, 2, 3, 4, 5]);
    expect(s.daysOff).toEqual(['2026-12-24', '2026-12-25']);
    expect(s.hourlyRateMinor).toBe(1800);
    expect(s.fees).toEqual({ platformFeeBps: 800, paymentFeeBps: 290, paymentFeeFixedMinor: 30 });
    expect((await fern.get('/api/business/settings')).body.settings.hourlyRateMinor).toBe(1800);
  });

  test('when the input is bad, then 400 with field messages and nothing changes', async () => {
    const res = await fern.patch('/api/business/settings').send({ workingDays: [], daysOff: ['2026-02-30'], hourlyRateMinor: -1 });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toMatchObject({ workingDays: expect.any(String), 'daysOff.0': expect.stringMatching(/real date/), hourlyRateMinor: expect.any(String) });
    expect((await fern.get('/api/business/settings')).body.settings.hourlyRateMinor).toBe(1800);
  });

  test('when a shopper or a guest asks, then 403 / 401', async () => {
    const dana = await t.signIn('dana@namesake.test', DEMO);
    expect((await dana.get('/api/business/settings')).status).toBe(403);
    const { default: request } = await import('supertest');
    expect((await request(t.app).get('/api/business/due')).status).toBe(401);
  });
});

describe('ship-by dates and marks (Must show)', () => {
  test('when an order is paid Friday 16:00 at a Sat+Sun-off shop with 3 processing days, then it ships by Wednesday and is at risk on Tuesday if not cut', async () => {
    const paid = Date.UTC(2026, 11, 4, 16, 0); // Fri 4 Dec 2026
    const { orderId, lineId } = makeOrder(paid);
    expect(t.db.select().from(orders).where(eq(orders.id, orderId)).get()!.shipByDate).toBe('2026-12-09');
    const on = async (today: string) => ((await fern.get(`/api/business/due?today=${today}`)).body as DueView).lines.find((l) => l.lineId === lineId)!;
    expect((await on('2026-12-07')).mark).toBeNull();
    const tue = await on('2026-12-08');
    expect(tue).toMatchObject({ shipBy: '2026-12-09', mark: 'at_risk', workingDaysLeft: 1, state: 'awaiting_proof' });
    expect((await on('2026-12-09')).mark).toBe('due_today');
    expect((await on('2026-12-10')).mark).toBe('late');
    // once cut, Tuesday is no longer at risk
    t.db.update(orderLines).set({ state: 'cut' }).where(eq(orderLines.id, lineId)).run();
    expect((await on('2026-12-08')).mark).toBeNull();
    t.db.update(orderLines).set({ state: 'awaiting_proof' }).where(eq(orderLines.id, lineId)).run();
  });

  test('when the queue is read, then late lines come before due and at-risk ones, and another shop sees none of them', async () => {
    const view = (await fern.get('/api/business/due?today=2026-12-10')).body as DueView;
    const marks = view.lines.map((l) => l.mark);
    const firstUnmarked = marks.indexOf(null);
    if (firstUnmarked >= 0) expect(marks.slice(firstUnmarked).every((m) => m === null)).toBe(true);
    const theirs = (await comet.get('/api/business/due')).body as DueView;
    expect(theirs.lines.some((l) => view.lines.some((m) => m.lineId === l.lineId))).toBe(false);
  });

  test('when a day off is added, then unshipped orders move their ship-by date', async () => {
    const { orderId } = makeOrder(Date.UTC(2026, 11, 4, 16, 0));
    await fern.patch('/api/business/settings').send({ daysOff: ['2026-12-08', '2026-12-24', '2026-12-25'] });
    expect(t.db.select().from(orders).where(eq(orders.id, orderId)).get()!.shipByDate).toBe('2026-12-10');
    await fern.patch('/api/business/settings').send({ daysOff: ['2026-12-24', '2026-12-25'] });
    expect(t.db.select().from(orders).where(eq(orders.id, orderId)).get()!.shipByDate).toBe('2026-12-09');
  });
});

describe('cost of goods (Must show)', () => {
  test('when three orders share a cut sheet, then their vinyl costs add up to the sheet cost to the cent', async () => {
    const made = [0, 1, 2].map((k) => makeOrder(Date.UTC(2026, 11, 1, 9 + k)));
    const ids = made.map((m) => m.lineId);
    expect((await fern.post('/api/workroom/proofs/approve').send({ lineIds: ids })).status).toBe(200);
    const built = await fern.post('/api/workroom/cut-sheets').send({ lineIds: ids });
    expect(built.status).toBe(201);
    const sheetIds: string[] = built.body.sheets.map((s: { id: string }) => s.id);
    for (const id of sheetIds) expect((await fern.post(`/api/workroom/cut-sheets/${id}/cut`)).status).toBe(200);
    const sheets = sheetIds.map((id) => t.db.select().from(cutSheets).where(eq(cutSheets.id, id)).get()!);
    // at least one sheet holds pieces of all three orders
    const shared = sheets.find((s) => new Set(s.pieces.map((p) => p.lineId)).size === 3);
    expect(shared).toBeDefined();
    expect(shared!.costMinor).toBeGreaterThan(0);
    const shares = sheetCostShares(
      shared!.costMinor!,
      shared!.pieces.map((p) => ({ lineId: p.lineId, areaMm2: pathArea(parsePathData(p.path)) })),
    );
    expect([...shares.values()].reduce((a, b) => a + b, 0)).toBe(shared!.costMinor);

    const costs = (await fern.get('/api/business/costs')).body as CostsView;
    const lines = costs.orders.flatMap((o) => o.lines).filter((l) => ids.includes(l.lineId));
    expect(lines).toHaveLength(3);
    for (const l of lines) expect(l.vinylSource).toBe('cut');
    // these lines are on these sheets only: their vinyl costs sum to the sheets' costs exactly
    expect(lines.reduce((a, l) => a + l.vinylMinor, 0)).toBe(sheets.reduce((a, s) => a + s.costMinor!, 0));
    // and per order, the totals are the sums of the lines; margin = revenue + shipping − cost
    for (const o of costs.orders) {
      expect(o.totals.marginMinor).toBe(o.lines.reduce((a, l) => a + l.marginMinor, 0));
      const order = t.db.select().from(orders).where(eq(orders.id, o.orderId)).get()!;
      expect(o.totals.platformFeeMinor).toBe(order.platformFeeMinor);
      expect(o.totals.shippingMinor).toBe(order.shippingMinor);
    }
    // labour: the weeding minutes of the line's own pieces at the shop's rates × 18.00/h, rounded once
    const one = lines[0]!;
    expect(one.labourMinor).toBeGreaterThan(0);
    const row = t.db.select().from(orderLines).where(eq(orderLines.id, one.lineId)).get()!;
    const work = weedingWork(row.snapshot.geometry.pieces.map((p) => p.d));
    expect(one.labourMinor).toBe(Math.round((weedingMinutes(work, row.quantity) * 1800) / 60));
    // slower rates set by the seller: the labour follows them (a minute per piece and per counter, nothing else)
    const slow = { secondsPerPiece: 60, secondsPerCounter: 60, secondsPerSmallPart: 0, secondsPerMetre: 0 };
    expect((await fern.patch('/api/business/settings').send({ weedingRates: slow })).body.settings.weedingRates).toEqual(slow);
    const slower = ((await fern.get('/api/business/costs')).body as CostsView).orders.flatMap((o) => o.lines).find((l) => l.lineId === one.lineId)!;
    expect(slower.labourMinor).toBe(Math.round(((work.pieces + work.counters) * row.quantity * 1800) / 60));
    expect((await fern.patch('/api/business/settings').send({ weedingRates: { ...slow, secondsPerMetre: -1 } })).status).toBe(400);
    await fern.patch('/api/business/settings').send({ weedingRates: DEFAULT_WEEDING_RATES });
    const single = (await fern.get(`/api/business/orders/${made[0]!.orderId}/costs`)).body.order;
    expect(single.lines[0].vinylMinor).toBe(one.vinylMinor);
    expect((await comet.get(`/api/business/orders/${made[0]!.orderId}/costs`)).status).toBe(404);
  });

  test('when a line is not cut yet, then its vinyl is an estimate above zero', async () => {
    const { lineId } = makeOrder(Date.UTC(2026, 11, 2, 9));
    const costs = (await fern.get('/api/business/costs')).body as CostsView;
    const l = costs.orders.flatMap((o) => o.lines).find((x) => x.lineId === lineId)!;
    expect(l.vinylSource).toBe('estimate');
    expect(l.vinylMinor).toBeGreaterThan(0);
  });
});

describe('price check', () => {
  test('when the price is far too low, then the margin is negative and the longest name is warned about', async () => {
    const listing = (await fern.get('/api/seller/listings')).body.items[0] as SellerListing;
    const draft = { ...listing.draft, basePriceMinor: 100, blankCostMinor: 2500 };
    const res = await fern.post('/api/business/price-check').send({ draft, sampleName: 'Mira' });
    expect(res.status).toBe(200);
    const r = res.body as PriceCheckResult;
    expect(r.sample.name).toBe('Mira');
    expect(r.sample.marginMinor).toBe(r.sample.priceMinor - r.sample.costMinor);
    expect(r.sample.marginMinor).toBeLessThan(0);
    expect(r.longest!.name.length).toBe(listing.draft.personalisation.textFields[0]!.maxLength);
    expect(r.warnings.some((w) => /longest name/.test(w))).toBe(true);
  });

  test('when the price is healthy, then the margin is positive and no loss is warned about', async () => {
    const listing = (await fern.get('/api/seller/listings')).body.items[0] as SellerListing;
    const r = (await fern.post('/api/business/price-check').send({ draft: { ...listing.draft, basePriceMinor: 6000 }, sampleName: 'Theo' })).body as PriceCheckResult;
    expect(r.sample.marginMinor).toBeGreaterThan(0);
    expect(r.warnings.some((w) => /lose|longest/.test(w))).toBe(false);
  });

  test('when the sample name is too long for the field, then 400 names the sample field', async () => {
    const listing = (await fern.get('/api/seller/listings')).body.items[0] as SellerListing;
    const res = await fern.post('/api/business/price-check').send({ draft: listing.draft, sampleName: 'Bartholomew-Bartholomew-Bartholomew' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.sampleName).toMatch(/at most \d+ characters/);
  });
});

describe('ledger and charts', () => {
  test('when Fern reads the ledger, then charges, fees and transfers are signed from her side and months balance', async () => {
    const v = (await fern.get('/api/business/ledger')).body as LedgerView;
    expect(v.entries.length).toBeGreaterThan(0);
    const fee = v.entries.find((e) => e.kind === 'platform_fee')!;
    expect(fee.earnedMinor).toBe(-fee.amountMinor);
    const sumEarned = v.entries.reduce((a, e) => a + e.earnedMinor, 0);
    const sumPaid = v.entries.reduce((a, e) => a + e.paidOutMinor, 0);
    expect(v.months.at(-1)!.balanceMinor).toBe(sumEarned - sumPaid);
  });

  test('when filtered by dates, then only entries of those days come back; a reversed range is refused', async () => {
    const all = (await fern.get('/api/business/ledger')).body as LedgerView;
    const day = all.entries[0]!.day;
    const v = (await fern.get(`/api/business/ledger?from=${day}&to=${day}`)).body as LedgerView;
    expect(v.entries.length).toBeGreaterThan(0);
    expect(v.entries.every((e) => e.day === day)).toBe(true);
    expect((await fern.get('/api/business/ledger?from=2026-12-10&to=2026-12-01')).status).toBe(400);
    expect((await fern.get('/api/business/ledger?from=yesterday')).status).toBe(400);
  });

  test('when exported as CSV, then it parses back to the same rows', async () => {
    const res = await fern.get('/api/business/ledger.csv');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/attachment/);
    const rows = Papa.parse<string[]>(res.text.trim()).data;
    const v = (await fern.get('/api/business/ledger')).body as LedgerView;
    expect(rows.length - 1).toBe(v.entries.length);
    expect(rows[1]![3]).toBe((v.entries[0]!.amountMinor / 100).toFixed(2));
  });

  test('when the charts are read, then weeks, vinyl per material per month and listings are filled from real rows', async () => {
    const c = (await fern.get('/api/business/charts')).body as ChartsView;
    expect(c.weeks.length).toBeGreaterThan(0);
    expect(c.vinyl.length).toBeGreaterThan(0); // the sheets cut above
    expect(c.listings.length).toBeGreaterThan(0);
    const costs = (await fern.get('/api/business/costs')).body as CostsView;
    expect(c.weeks.reduce((a, w) => a + w.marginMinor, 0)).toBe(
      costs.orders
        .flatMap((o) => o.lines)
        .filter((l) => l.state !== 'cancelled')
        .reduce((a, l) => a + l.marginMinor, 0),
    );
  });
});

describe('morning digest', () => {
  test('when the digest runs twice on one day, then Fern gets one e-mail listing due and late lines; the next day she gets another', async () => {
    clock = Date.UTC(2026, 11, 10, 7, 0); // Thu 10 Dec 2026 07:00: the Friday orders above are late
    const before = (await t.mailTo('fern@namesake.test')).filter((m) => /your workroom for/.test(m.subject ?? '')).length;
    const first = await runDigest(t.deps);
    expect(first.sent).toContain(fernShop.id);
    const second = await runDigest(t.deps);
    expect(second.sent).not.toContain(fernShop.id);
    expect(second.skipped).toContain(fernShop.id);
    await new Promise((r) => setTimeout(r, 300));
    const mails = (await t.mailTo('fern@namesake.test')).filter((m) => /your workroom for 2026-12-10/.test(m.subject ?? ''));
    expect(mails.length).toBe(1);
    expect(mails[0]!.text).toMatch(/Late \(past the ship-by date\)/);
    expect(before).toBe(0);
    expect(
      t.db
        .select()
        .from(jobRuns)
        .where(like(jobRuns.key, 'digest:2026-12-10:%'))
        .all()
        .map((r) => r.key),
    ).toContain(`digest:2026-12-10:${fernShop.id}`);
    clock = Date.UTC(2026, 11, 11, 7, 0);
    expect((await runDigest(t.deps)).sent).toContain(fernShop.id);
  });
});
