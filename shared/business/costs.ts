/**
 * Cost of goods and margin, in integer minor units. Every amount of a line is rounded once; an
 * order's amounts are the sums of its lines, and amounts that exist only per order or per sheet
 * (a sheet's vinyl cost, the platform fee, the payment fee, shipping) are split across lines with
 * the largest-remainder method so the parts add up to the whole exactly.
 */
import { bpsOf, platformFee } from '../money.ts';

// ---------------------------------------------------------------- exact splitting

/**
 * Splits `amount` (an integer) in proportion to `weights` (≥ 0, any real numbers). Weights are
 * scaled to integers (1/1000 of a unit, plenty for mm²) and the arithmetic is in BigInt, so no
 * floating-point product decides a cent. Largest remainder; ties go to the earlier part.
 */
export function splitExact(amount: number, weights: readonly number[]): number[] {
  if (!Number.isSafeInteger(amount)) throw new Error(`amount must be an integer, got ${amount}`);
  if (weights.some((w) => !(w >= 0) || !Number.isFinite(w))) throw new Error('weights must be finite and ≥ 0');
  const w = weights.map((x) => BigInt(Math.round(x * 1000)));
  const total = w.reduce((a, b) => a + b, 0n);
  if (weights.length === 0) return [];
  if (total === 0n) {
    // nothing to weigh by: split evenly (still exact)
    return splitExact(
      amount,
      weights.map(() => 1),
    );
  }
  const neg = amount < 0;
  const a = BigInt(Math.abs(amount));
  const base = w.map((x) => (a * x) / total);
  const rem = w.map((x, i) => ({ i, r: (a * x) % total }));
  let rest = Number(a - base.reduce((s, x) => s + x, 0n));
  rem.sort((p, q) => (q.r > p.r ? 1 : q.r < p.r ? -1 : p.i - q.i));
  const out = base.map(Number);
  for (let k = 0; rest > 0; k++, rest--) out[rem[k % rem.length]!.i]! += 1;
  return neg ? out.map((x) => (x === 0 ? 0 : -x)) : out;
}

/**
 * A cut sheet's cost shared among the lines whose pieces it holds, by piece area: the vinyl cost of
 * each line on this sheet. The shares add up to `costMinor` exactly.
 */
export function sheetCostShares(costMinor: number, pieces: ReadonlyArray<{ lineId: string; areaMm2: number }>): Map<string, number> {
  const area = new Map<string, number>();
  for (const p of pieces) area.set(p.lineId, (area.get(p.lineId) ?? 0) + Math.abs(p.areaMm2));
  const ids = [...area.keys()];
  const parts = splitExact(
    costMinor,
    ids.map((id) => area.get(id)!),
  );
  return new Map(ids.map((id, i) => [id, parts[i]!]));
}

// ---------------------------------------------------------------- estimates before cutting

/** The nesting's gap between pieces and margin at the roll edges (6 mm each, from memory, as in shared/engine/cut-sheets.ts). */
export const ESTIMATE_GAP_MM = 6;
export const ESTIMATE_MARGIN_MM = 6;

export type EstimatePiece = { materialId: string | null; widthMm: number; heightMm: number };
export type MaterialPrice = { rollWidthMm: number; pricePerMetreMinor: number };

/**
 * The vinyl an item will use before it is nested: each piece's box grown by the weeding gap, laid
 * on the usable roll width (roll width less both margins), gives the length of roll it takes; that
 * length × price per metre is its cost. Per material; the cost is NOT rounded here (the caller
 * rounds once per line). Pieces without a known material are skipped.
 */
export function estimateVinyl(pieces: readonly EstimatePiece[], quantity: number, materials: ReadonlyMap<string, MaterialPrice>): { byMaterial: Map<string, number>; costExact: number } {
  const byMaterial = new Map<string, number>();
  let costExact = 0;
  for (const p of pieces) {
    const m = p.materialId ? materials.get(p.materialId) : undefined;
    if (!m || !(p.widthMm > 0 && p.heightMm > 0)) continue;
    const usable = Math.max(1, m.rollWidthMm - 2 * ESTIMATE_MARGIN_MM);
    const lengthMm = (((p.widthMm + ESTIMATE_GAP_MM) * (p.heightMm + ESTIMATE_GAP_MM)) / usable) * quantity;
    byMaterial.set(p.materialId!, (byMaterial.get(p.materialId!) ?? 0) + lengthMm);
    costExact += (lengthMm / 1000) * m.pricePerMetreMinor;
  }
  return { byMaterial, costExact };
}

// ---------------------------------------------------------------- fees

export type FeeConfig = { platformFeeBps: number; paymentFeeBps: number; paymentFeeFixedMinor: number };

/** The payment provider's fee on one charge: percentage (basis points) + fixed, rounded once. */
export const paymentFee = (chargeMinor: number, cfg: Pick<FeeConfig, 'paymentFeeBps' | 'paymentFeeFixedMinor'>): number =>
  chargeMinor <= 0 ? 0 : bpsOf(chargeMinor, cfg.paymentFeeBps) + cfg.paymentFeeFixedMinor;

/** Labour, exact: minutes of work (the weeding estimate of shared/business/labour.ts) at the hourly rate. */
export const labourExact = (minutes: number, hourlyRateMinor: number): number => (minutes * hourlyRateMinor) / 60;

// ---------------------------------------------------------------- one order's lines

export type LineCostInput = {
  lineId: string;
  /** the line's price (unit × quantity) and what was refunded of it */
  totalMinor: number;
  refundedMinor: number;
  quantity: number;
  layers: number;
  blankCostMinor: number;
  /** minutes of work for all of the line's units (weedingMinutes, shared/business/labour.ts) */
  labourMinutes: number;
  /** the actual vinyl cost when every sheet holding the line is cut; otherwise null … */
  vinylCutMinor: number | null;
  /** … and the estimate (exact, not rounded) is used */
  vinylEstimateExact: number;
};

export type LineCost = {
  lineId: string;
  revenueMinor: number;
  shippingMinor: number;
  blankMinor: number;
  vinylMinor: number;
  vinylSource: 'cut' | 'estimate';
  labourMinor: number;
  platformFeeMinor: number;
  paymentFeeMinor: number;
  costMinor: number;
  marginMinor: number;
};

export type CostTotals = Omit<LineCost, 'lineId' | 'vinylSource'>;

const TOTAL_KEYS = ['revenueMinor', 'shippingMinor', 'blankMinor', 'vinylMinor', 'labourMinor', 'platformFeeMinor', 'paymentFeeMinor', 'costMinor', 'marginMinor'] as const;

export function sumCosts(lines: readonly CostTotals[]): CostTotals {
  const t = Object.fromEntries(TOTAL_KEYS.map((k) => [k, 0])) as CostTotals;
  for (const l of lines) for (const k of TOTAL_KEYS) t[k] += l[k];
  return t;
}

/**
 * Cost and margin of each line of one order. The order's shipping, platform fee and payment fee
 * are split across its lines by line price; the line's own amounts are rounded once. Margin =
 * (price − refunded + shipping share) − (blank + vinyl + labour + platform fee + payment fee).
 */
export function orderCosts(
  order: { totalMinor: number; shippingMinor: number; platformFeeMinor: number },
  lines: readonly LineCostInput[],
  cfg: Pick<FeeConfig, 'paymentFeeBps' | 'paymentFeeFixedMinor'>,
  hourlyRateMinor: number,
): { lines: LineCost[]; totals: CostTotals } {
  const weights = lines.map((l) => Math.max(0, l.totalMinor));
  const shipping = splitExact(order.shippingMinor, weights);
  const platform = splitExact(order.platformFeeMinor, weights);
  const payment = splitExact(paymentFee(order.totalMinor, cfg), weights);
  const out = lines.map((l, i): LineCost => {
    const blankMinor = l.blankCostMinor * l.quantity;
    const vinylMinor = l.vinylCutMinor ?? Math.round(l.vinylEstimateExact);
    const labourMinor = Math.round(labourExact(l.labourMinutes, hourlyRateMinor));
    const revenueMinor = l.totalMinor - l.refundedMinor;
    const costMinor = blankMinor + vinylMinor + labourMinor + platform[i]! + payment[i]!;
    return {
      lineId: l.lineId,
      revenueMinor,
      shippingMinor: shipping[i]!,
      blankMinor,
      vinylMinor,
      vinylSource: l.vinylCutMinor === null ? 'estimate' : 'cut',
      labourMinor,
      platformFeeMinor: platform[i]!,
      paymentFeeMinor: payment[i]!,
      costMinor,
      marginMinor: revenueMinor + shipping[i]! - costMinor,
    };
  });
  return { lines: out, totals: sumCosts(out) };
}

// ---------------------------------------------------------------- the listing editor's price check

export type PriceCheck = {
  priceMinor: number;
  blankMinor: number;
  vinylMinor: number;
  labourMinor: number;
  platformFeeMinor: number;
  paymentFeeMinor: number;
  costMinor: number;
  marginMinor: number;
};

/**
 * Expected cost and margin of ONE item sold alone at `priceMinor` (no shipping: shipping is
 * charged separately and paid out as it came in). The payment fee's fixed part is counted in full,
 * the worst case of a cart holding only this item.
 */
export function priceCheck(args: {
  priceMinor: number;
  layers: number;
  blankCostMinor: number;
  /** minutes of work for one item */
  labourMinutes: number;
  hourlyRateMinor: number;
  vinylEstimateExact: number;
  fees: FeeConfig;
}): PriceCheck {
  const blankMinor = args.blankCostMinor;
  const vinylMinor = Math.round(args.vinylEstimateExact);
  const labourMinor = Math.round(labourExact(args.labourMinutes, args.hourlyRateMinor));
  const platformFeeMinor = platformFee(args.priceMinor, args.fees.platformFeeBps);
  const paymentFeeMinor = paymentFee(args.priceMinor, args.fees);
  const costMinor = blankMinor + vinylMinor + labourMinor + platformFeeMinor + paymentFeeMinor;
  return { priceMinor: args.priceMinor, blankMinor, vinylMinor, labourMinor, platformFeeMinor, paymentFeeMinor, costMinor, marginMinor: args.priceMinor - costMinor };
}

/** The longest name a text field allows, made from a long name of the invented demo scenario, repeated. */
export function longestSampleName(maxLength: number): string {
  const base = 'Bartholomew';
  return base.repeat(Math.ceil(maxLength / base.length)).slice(0, Math.max(1, maxLength));
}
