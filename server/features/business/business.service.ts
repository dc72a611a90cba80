// The seller's business view: the working calendar and ship-by marks, cost of goods and margin per
// line, the listing editor's price check, the ledger and the charts. Rules live in shared/business
// (pure); this file gathers the rows and hands them over.

import {
  estimateVinyl,
  type FeeConfig,
  type LineCostInput,
  longestSampleName,
  type MaterialPrice,
  orderCosts,
  priceCheck as priceCheckPure,
  sheetCostShares,
  sumCosts,
} from '../../../shared/business/costs.ts';
import { DEFAULT_WEEDING_RATES, type WeedingRates, type WeedingWork, weedingMinutes, weedingRatesSchema, weedingWork } from '../../../shared/business/labour.ts';
import { balanceByMonth, type LedgerEntry, type LedgerKind, ledgerCsv, monthOf, signForShop } from '../../../shared/business/ledger.ts';
import { compareByShipBy, shipMark } from '../../../shared/business/marks.ts';
import { needMark } from '../../../shared/business/needed-by.ts';
import { ordersByListing, salesByWeek, vinylByMaterialMonth } from '../../../shared/business/reports.ts';
import { dayInZone, parseDay, shipByDate, type WorkCalendar, workingDaysBetween } from '../../../shared/business/working-days.ts';
import { parsePathData, pathArea, pathBBox } from '../../../shared/engine/path.ts';
import { materialLabel } from '../../../shared/material-label.ts';
import { minorDigits } from '../../../shared/money.ts';
import type {
  BusinessSettings,
  BusinessSettingsInput,
  ChartsView,
  CostsView,
  DueLine,
  DueView,
  LedgerQuery,
  LedgerView,
  LineCostView,
  OrderCostView,
  PriceCheckInput,
  PriceCheckResult,
} from '../../../shared/schemas/business.ts';
import { priceCheckSchema } from '../../../shared/schemas/business.ts';
import type { LineSnapshot } from '../../../shared/schemas/cart.ts';
import type { Choices } from '../../../shared/schemas/listing.ts';
import { isFinishedLine, UNCUT_LINE_STATES } from '../../../shared/schemas/order.ts';
import type { Db } from '../../db/client.ts';
import type { AppDeps } from '../../deps.ts';
import { AppError, badRequest } from '../../http/app-error.ts';
// The cart's mapping from a listing's personalisation to the engine is the one a real order goes
// through; the price check reuses it rather than keep a second copy that could drift.
import { buildSnapshotOffThread, snapshotLookups } from '../cart/index.ts';
import { type LineRow, type OrderRow, businessRepo as repo, type SheetRow, type ShopRow } from './business.repo.ts';

export type BusinessDeps = Pick<AppDeps, 'db' | 'env' | 'now'>;

export const calendarOf = (s: Pick<ShopRow, 'workingDays' | 'daysOff'>): WorkCalendar => ({
  workingDays: s.workingDays?.length ? s.workingDays : [1, 2, 3, 4, 5],
  daysOff: s.daysOff ?? [],
});

export const feesOf = (env: BusinessDeps['env']): FeeConfig => ({
  platformFeeBps: env.PLATFORM_FEE_BPS,
  paymentFeeBps: env.PAYMENT_FEE_BPS,
  paymentFeeFixedMinor: env.PAYMENT_FEE_FIXED_MINOR,
});

export const todayOf = (deps: BusinessDeps) => dayInZone(deps.now(), deps.env.BUSINESS_TIME_ZONE);

// ---------------------------------------------------------------- settings

export function settings(deps: BusinessDeps, shop: ShopRow): BusinessSettings {
  const cal = calendarOf(shop);
  return {
    workingDays: [...cal.workingDays],
    daysOff: [...cal.daysOff],
    hourlyRateMinor: shop.hourlyRateMinor,
    weedingRates: ratesOf(shop),
    processingDays: shop.processingDays,
    currency: shop.currency,
    timeZone: deps.env.BUSINESS_TIME_ZONE,
    fees: feesOf(deps.env),
  };
}

/**
 * Saves the calendar and rate. A changed calendar moves the ship-by dates of orders not yet
 * shipped (a holiday added today pushes this week's work out), never of shipped ones.
 */
export function updateSettings(deps: BusinessDeps, shop: ShopRow, input: BusinessSettingsInput & Record<string, unknown>): BusinessSettings {
  const set: Partial<ShopRow> = { updatedAt: deps.now() };
  if (input.workingDays) set.workingDays = input.workingDays as number[];
  if (input.daysOff) set.daysOff = input.daysOff as string[];
  if (input.hourlyRateMinor !== undefined) set.hourlyRateMinor = input.hourlyRateMinor;
  if (input.weedingRates) set.weedingRates = input.weedingRates as WeedingRates;
  if (input.processingDays !== undefined) set.processingDays = input.processingDays;
  const calendarChanged = !!(input.workingDays || input.daysOff || input.processingDays !== undefined);
  deps.db.transaction((tx) => {
    const t = tx as unknown as Db;
    repo.setShop(t, shop.id, set);
    if (calendarChanged) {
      const after = repo.shop(t, shop.id)!;
      for (const o of repo.ordersOfShop(t, shop.id)) {
        if (o.shippedAt) continue;
        repo.setOrder(t, o.id, { shipByDate: shipByDate(o.paidAt, after.processingDays, calendarOf(after), deps.env.BUSINESS_TIME_ZONE) });
      }
    }
  });
  return settings(deps, repo.shop(deps.db, shop.id)!);
}

// ---------------------------------------------------------------- ship-by and marks

/** The order's stored ship-by date, or (for an order made before dates were stored) one computed from its payment and saved. */
function shipByOf(deps: BusinessDeps, shop: ShopRow, order: OrderRow): string {
  if (order.shipByDate) return order.shipByDate;
  const d = shipByDate(order.paidAt, shop.processingDays, calendarOf(shop), deps.env.BUSINESS_TIME_ZONE);
  repo.setOrder(deps.db, order.id, { shipByDate: d });
  order.shipByDate = d;
  return d;
}

/** Open lines (not shipped, cancelled or refunded) with ship-by date and mark, most urgent first. */
export function due(deps: BusinessDeps, shop: ShopRow, today = todayOf(deps)): DueView {
  parseDay(today);
  const cal = calendarOf(shop);
  const lines: DueLine[] = [];
  for (const { line, order } of repo.linesOfShop(deps.db, shop.id)) {
    if (isFinishedLine(line.state)) continue;
    // a needed-by date earlier than the shop's own date moves the line up the queue (shared/business/needed-by.ts)
    const need = needMark({ state: line.state, shipBy: shipByOf(deps, shop, order), neededBy: order.neededBy, today, shippingDays: shop.shippingDays, calendar: cal });
    const shipBy = need.shipBy;
    lines.push({
      lineId: line.id,
      orderId: order.id,
      orderNumber: order.number,
      listingTitle: line.listingTitle,
      quantity: line.quantity,
      state: line.state,
      shipBy,
      mark: shipMark({ state: line.state, shipBy, today, calendar: cal }),
      workingDaysLeft: workingDaysBetween(today, shipBy, cal),
      neededBy: order.neededBy,
      needMark: need.mark,
    });
  }
  lines.sort((a, b) => compareByShipBy(a, b) || a.orderNumber.localeCompare(b.orderNumber));
  return { today, lines };
}

// ---------------------------------------------------------------- cost of goods

type ListingCosting = { blankCostMinor: number };

function costingOf(content: unknown): ListingCosting {
  const c = (content ?? {}) as Partial<ListingCosting>;
  return { blankCostMinor: typeof c.blankCostMinor === 'number' ? c.blankCostMinor : 0 };
}

/** Every cut sheet's cost shared by piece area: line id → vinyl cost (minor) and whether sheets of it are still planned. */
function cutVinylByLine(sheets: SheetRow[]): { cut: Map<string, number>; planned: Set<string> } {
  const cut = new Map<string, number>();
  const planned = new Set<string>();
  for (const s of sheets) {
    const pieces = s.pieces.map((p) => ({ lineId: p.lineId, areaMm2: safeArea(p.path) }));
    if (s.state !== 'cut' || s.costMinor === null) {
      for (const p of pieces) planned.add(p.lineId);
      continue;
    }
    for (const [lineId, share] of sheetCostShares(s.costMinor, pieces)) cut.set(lineId, (cut.get(lineId) ?? 0) + share);
  }
  return { cut, planned };
}

function safeArea(d: string): number {
  try {
    return Math.abs(pathArea(parsePathData(d)));
  } catch {
    return 0;
  }
}

/** The snapshot's pieces as boxes for the pre-cut estimate. */
export function snapshotPieces(s: LineSnapshot) {
  return s.geometry.pieces.map((p) => {
    try {
      const bb = pathBBox(parsePathData(p.d));
      return { materialId: p.materialId, widthMm: bb.maxX - bb.minX, heightMm: bb.maxY - bb.minY };
    } catch {
      return { materialId: p.materialId, widthMm: 0, heightMm: 0 };
    }
  });
}

/** The shop's weeding rates, or the defaults. */
const ratesOf = (shop: ShopRow): WeedingRates => {
  const r = weedingRatesSchema.safeParse(shop.weedingRates);
  return r.success ? r.data : DEFAULT_WEEDING_RATES;
};
/** A line's weeding work; its pieces never change within a version, so it is kept per line version. */
const workMemo = new Map<string, WeedingWork>();
function lineWork(l: LineRow): WeedingWork {
  const key = `${l.id}:${l.version}`;
  let w = workMemo.get(key);
  if (!w) {
    w = weedingWork((l.snapshot.geometry?.pieces ?? []).map((p) => p.d));
    if (workMemo.size >= 5000) workMemo.delete(workMemo.keys().next().value!);
    workMemo.set(key, w);
  }
  return w;
}

const priceMap = (mats: Array<{ id: string; rollWidthMm: number; pricePerMetreMinor: number }>) =>
  new Map<string, MaterialPrice>(mats.map((m) => [m.id, { rollWidthMm: m.rollWidthMm, pricePerMetreMinor: m.pricePerMetreMinor }]));

/** Cost and margin per line and per order (all the shop's orders, or one). */
export function costs(deps: BusinessDeps, shop: ShopRow, orderId?: string): CostsView {
  const rows = repo.linesOfShop(deps.db, shop.id).filter((r) => !orderId || r.order.id === orderId);
  if (orderId && rows.length === 0) throw new AppError(404, 'not_found', 'We could not find that order in your shop.');
  const listings = new Map(repo.listingsByIds(deps.db, [...new Set(rows.map((r) => r.line.listingId))]).map((l) => [l.id, costingOf(l.live ?? l.draft)]));
  const mats = priceMap(repo.materialsOfShop(deps.db, shop.id));
  const { cut, planned } = cutVinylByLine(repo.sheetsOfShop(deps.db, shop.id));
  const byOrder = new Map<string, { order: OrderRow; lines: LineRow[] }>();
  for (const { line, order } of rows) {
    const g = byOrder.get(order.id) ?? { order, lines: [] };
    g.lines.push(line);
    byOrder.set(order.id, g);
  }
  const fees = feesOf(deps.env);
  const orders: OrderCostView[] = [...byOrder.values()].map(({ order, lines }) => {
    const inputs: LineCostInput[] = lines.map((l) => {
      const s = l.snapshot;
      const c = listings.get(l.listingId) ?? { blankCostMinor: 0 };
      const isCut = cut.has(l.id) && (!planned.has(l.id) || !(UNCUT_LINE_STATES as readonly string[]).includes(l.state));
      return {
        lineId: l.id,
        totalMinor: l.totalMinor,
        refundedMinor: l.refundedMinor,
        quantity: l.quantity,
        layers: s.geometry?.layerCount ?? 1,
        blankCostMinor: c.blankCostMinor,
        labourMinutes: weedingMinutes(lineWork(l), l.quantity, ratesOf(shop)),
        vinylCutMinor: isCut ? cut.get(l.id)! : null,
        vinylEstimateExact: estimateVinyl(snapshotPieces(s), l.quantity, mats).costExact,
      };
    });
    const result = orderCosts(order, inputs, fees, shop.hourlyRateMinor);
    return {
      orderId: order.id,
      orderNumber: order.number,
      currency: order.currency,
      lines: result.lines.map((lc, i): LineCostView => ({ ...lc, listingTitle: lines[i]!.listingTitle, quantity: lines[i]!.quantity, state: lines[i]!.state })),
      totals: result.totals,
    };
  });
  return { currency: shop.currency, orders, totals: sumCosts(orders.map((o) => o.totals)) };
}

// ---------------------------------------------------------------- the listing editor's price check

/** The sample and the longest name are composed in the worker pool (plain data in and out), side by side. */
export async function priceCheck(deps: BusinessDeps & Pick<AppDeps, 'pool'>, shop: ShopRow, raw: PriceCheckInput): Promise<PriceCheckResult> {
  const input = priceCheckSchema.parse(raw);
  const { draft } = input;
  const p = draft.personalisation;
  const matRows = repo.materialsOfShop(deps.db, shop.id);
  const { materials, motifs } = snapshotLookups(
    p,
    matRows,
    repo.motifsOfShop(
      deps.db,
      shop.id,
      p.motifChoices.map((m) => m.motifId),
    ),
  );
  const content = { title: 'Price check', blank: draft.blank, basePriceMinor: draft.basePriceMinor, extraLayerPriceMinor: draft.extraLayerPriceMinor, personalisation: p };
  const fees = feesOf(deps.env);
  const prices = priceMap(matRows);
  const run = async (name: (maxLength: number) => string) => {
    const choices: Choices = { texts: {}, textColours: {}, motifId: p.motifChoices[0]?.motifId ?? null, motifColours: {}, outlineMaterialId: null, sizeId: null, colourId: null };
    p.textFields.forEach((f, i) => {
      if (i === 0 || f.required) choices.texts[f.id] = { text: name(f.maxLength), fontId: f.defaultFontId, letterHeightMm: f.defaultLetterHeightMm };
    });
    let snapshot: LineSnapshot;
    try {
      snapshot = await buildSnapshotOffThread({ pool: deps.pool, listing: { id: 'price-check', slug: 'price-check', shopId: shop.id, currency: shop.currency }, content, choices, materials, motifs });
    } catch (e) {
      // a refused name is the seller's to fix; a busy or timed-out pool stays what it is
      if (e instanceof AppError && e.status < 500) throw badRequest(e.message, { sampleName: e.message });
      throw e;
    }
    const result = priceCheckPure({
      priceMinor: snapshot.unitPriceMinor,
      layers: snapshot.geometry.layerCount,
      blankCostMinor: draft.blankCostMinor,
      labourMinutes: weedingMinutes(weedingWork(snapshot.geometry.pieces.map((pc) => pc.d)), 1, ratesOf(shop)),
      hourlyRateMinor: shop.hourlyRateMinor,
      vinylEstimateExact: estimateVinyl(snapshotPieces(snapshot), 1, prices).costExact,
      fees,
    });
    return { ...result, name: Object.values(choices.texts)[0]?.text ?? '' };
  };

  const sampleText = input.sampleName || 'Mira';
  const firstMax = p.textFields[0]?.maxLength;
  if (firstMax !== undefined && [...sampleText].length > firstMax) {
    throw badRequest(`This listing allows at most ${firstMax} characters in “${p.textFields[0]!.label}”.`, { sampleName: `Use at most ${firstMax} characters, as the listing allows.` });
  }
  const [sample, longest] = await Promise.all([run(() => sampleText), p.textFields.length ? run((max) => longestSampleName(max)) : null]);
  const digits = minorDigits(shop.currency);
  const money = (m: number) => `${m < 0 ? '-' : ''}${(Math.abs(m) / 10 ** digits).toFixed(digits)} ${shop.currency}`;
  const warnings: string[] = [];
  if (sample.marginMinor < 0) warnings.push(`At this price you lose ${money(-sample.marginMinor)} on “${sample.name}”.`);
  if (longest && longest.marginMinor < 0)
    warnings.push(
      `The longest name this listing allows (${[...longest.name].length} letters, e.g. “${longest.name}”) leaves a margin of ${money(longest.marginMinor)}: raise the price or shorten the maximum length.`,
    );
  if (shop.hourlyRateMinor === 0) warnings.push('Your hourly rate is 0, so labour counts as free. Set it in Business settings.');
  const unpriced = [...new Set(Object.values(p.textFields.flatMap((f) => f.colourChoices)))].filter((id) => prices.get(id)?.pricePerMetreMinor === 0);
  if (unpriced.length) warnings.push('Some colours offered have no price per metre yet, so their vinyl counts as free. Add prices on the Materials page.');
  return { currency: shop.currency, sample, longest, warnings };
}

// ---------------------------------------------------------------- ledger

/**
 * The shop's ledger between two calendar days (inclusive, in the shops' time zone). The monthly
 * balance runs from the shop's first entry, so a filtered view still shows what is owed at each
 * month's end; only the months touching the range are returned.
 */
export function ledgerView(deps: BusinessDeps, shop: ShopRow, q: LedgerQuery): LedgerView {
  const tz = deps.env.BUSINESS_TIME_ZONE;
  const all: LedgerEntry[] = repo.ledgerOfShop(deps.db, shop.id).map(({ entry: e, orderNumber }) => ({
    id: e.id,
    at: e.createdAt,
    day: dayInZone(e.createdAt, tz),
    kind: e.kind as LedgerKind,
    orderId: e.orderId,
    orderNumber: orderNumber ?? null,
    amountMinor: e.amountMinor,
    ...signForShop(e.kind, e.amountMinor),
    currency: e.currency,
    memo: e.memo,
  }));
  const inRange = (day: string) => (!q.from || day >= q.from) && (!q.to || day <= q.to);
  const monthIn = (month: string) => (!q.from || month >= q.from.slice(0, 7)) && (!q.to || month <= q.to.slice(0, 7));
  return { currency: shop.currency, entries: all.filter((e) => inRange(e.day)), months: balanceByMonth(all).filter((m) => monthIn(m.month)) };
}

export function ledgerCsvOf(deps: BusinessDeps, shop: ShopRow, q: LedgerQuery): string {
  return ledgerCsv(ledgerView(deps, shop, q).entries, minorDigits(shop.currency));
}

// ---------------------------------------------------------------- charts

export function charts(deps: BusinessDeps, shop: ShopRow): ChartsView {
  const tz = deps.env.BUSINESS_TIME_ZONE;
  const c = costs(deps, shop);
  const lineCost = new Map(c.orders.flatMap((o) => o.lines.map((l) => [l.lineId, l] as const)));
  const rows = repo.linesOfShop(deps.db, shop.id).filter((r) => r.line.state !== 'cancelled');
  const weeks = salesByWeek(
    rows.map(({ line, order }) => {
      const lc = lineCost.get(line.id)!;
      return { day: dayInZone(order.paidAt, tz), salesMinor: lc.revenueMinor + lc.shippingMinor, marginMinor: lc.marginMinor, quantity: line.quantity };
    }),
  );
  const mats = new Map(repo.materialsOfShop(deps.db, shop.id).map((m) => [m.id, materialLabel(m)]));
  const vinyl = vinylByMaterialMonth(
    repo
      .sheetsOfShop(deps.db, shop.id)
      .filter((s) => s.state === 'cut' && s.cutAt !== null)
      .map((s) => ({ month: monthOf(s.cutAt!, tz), materialId: s.materialId, material: mats.get(s.materialId) ?? 'a removed material', consumedMm: s.consumedMm ?? s.lengthMm })),
  );
  const listings = ordersByListing(
    rows.map(({ line, order }) => ({ listingId: line.listingId, title: line.listingTitle, orderId: order.id, quantity: line.quantity, salesMinor: line.totalMinor - line.refundedMinor })),
  );
  return { currency: shop.currency, weeks, vinyl, listings };
}
