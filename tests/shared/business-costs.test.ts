// Cost of goods, margin and the ledger helpers (shared/business). Exactness is checked by sums;
// the largest-remainder method is the Hamilton apportionment method (any text on apportionment).

import fc from 'fast-check';
import Papa from 'papaparse';
import { describe, expect, test } from 'vitest';
import { estimateVinyl, longestSampleName, orderCosts, paymentFee, priceCheck, sheetCostShares, splitExact } from '../../shared/business/costs.ts';
import { balanceByMonth, type LedgerEntry, ledgerCsv, minorToDecimal, signForShop } from '../../shared/business/ledger.ts';
import { ordersByListing, salesByWeek, vinylByMaterialMonth, weekStart } from '../../shared/business/reports.ts';
import { splitForShop } from '../../shared/money.ts';

describe('splitting a sheet cost by piece area', () => {
  test('when three orders share a cut sheet, then their vinyl costs add up to the sheet cost to the cent', () => {
    // a 0.93 m sheet at 13.30/m → 1237 cents; three names of nearly equal area
    const shares = sheetCostShares(1237, [
      { lineId: 'mira', areaMm2: 2410.5 },
      { lineId: 'theo', areaMm2: 1800.25 },
      { lineId: 'mira', areaMm2: 300 },
      { lineId: 'anouk', areaMm2: 2710.75 },
    ]);
    const parts = [...shares.values()];
    expect(parts.reduce((a, b) => a + b, 0)).toBe(1237);
    // shares follow the area: anouk (2710.75) < mira (2710.5 + 300) … and each within a cent of its exact share
    const total = 2410.5 + 300 + 1800.25 + 2710.75;
    expect(Math.abs(shares.get('mira')! - (1237 * 2710.5) / total)).toBeLessThan(1);
    expect(Math.abs(shares.get('theo')! - (1237 * 1800.25) / total)).toBeLessThan(1);
    expect(Math.abs(shares.get('anouk')! - (1237 * 2710.75) / total)).toBeLessThan(1);
  });

  test('when equal areas do not divide the cost, then the leftover cents go one each to the earliest parts', () => {
    expect(splitExact(100, [1, 1, 1])).toEqual([34, 33, 33]);
    expect(splitExact(2, [1, 1, 1])).toEqual([1, 1, 0]);
    expect(splitExact(-100, [1, 1, 1])).toEqual([-34, -33, -33]);
    expect(splitExact(5, [0, 0])).toEqual([3, 2]);
  });

  test('when any cost is split by any areas, then the parts always sum exactly and never differ from the exact share by a cent or more', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 5_000_000 }), fc.array(fc.double({ min: 0.001, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 30 }), (amount, weights) => {
        const parts = splitExact(amount, weights);
        expect(parts.reduce((a, b) => a + b, 0)).toBe(amount);
        const scaled = weights.map((w) => Math.round(w * 1000));
        const total = scaled.reduce((a, b) => a + b, 0);
        parts.forEach((p, i) => expect(Math.abs(p - (amount * scaled[i]!) / total)).toBeLessThan(1 + 1e-9));
      }),
    );
  });
});

describe('cost and margin of an order', () => {
  const fees = { paymentFeeBps: 290, paymentFeeFixedMinor: 30 };

  test('when the payment fee is 2.9 % + 30, then a 25.00 charge costs 1.03 (72.5 → 73, half away from zero)', () => {
    expect(paymentFee(2500, fees)).toBe(73 + 30);
    expect(paymentFee(0, fees)).toBe(0);
  });

  test('when an order has two lines, then every amount is whole minor units and the order totals are the sums of the lines', () => {
    const order = { totalMinor: 2400 + 1350 + 450, shippingMinor: 450, platformFeeMinor: 336 };
    const r = orderCosts(
      order,
      [
        { lineId: 'a', totalMinor: 2400, refundedMinor: 0, quantity: 1, layers: 2, blankCostMinor: 480, labourMinutes: 14, vinylCutMinor: 412, vinylEstimateExact: 0 },
        { lineId: 'b', totalMinor: 1350, refundedMinor: 0, quantity: 1, layers: 1, blankCostMinor: 300, labourMinutes: 7, vinylCutMinor: null, vinylEstimateExact: 87.6 },
      ],
      fees,
      1800,
    );
    const [a, b] = r.lines;
    // labour: 14 min at 18.00/h = 4.20; 7 min = 2.10
    expect(a!.labourMinor).toBe(420);
    expect(b!.labourMinor).toBe(210);
    expect(b!.vinylMinor).toBe(88);
    expect(b!.vinylSource).toBe('estimate');
    expect(a!.vinylSource).toBe('cut');
    // order-level amounts split exactly: shipping, the platform fee, the payment fee of the charge
    expect(a!.shippingMinor + b!.shippingMinor).toBe(450);
    expect(a!.platformFeeMinor + b!.platformFeeMinor).toBe(336);
    expect(a!.paymentFeeMinor + b!.paymentFeeMinor).toBe(paymentFee(order.totalMinor, fees));
    for (const l of r.lines) {
      expect(l.costMinor).toBe(l.blankMinor + l.vinylMinor + l.labourMinor + l.platformFeeMinor + l.paymentFeeMinor);
      expect(l.marginMinor).toBe(l.revenueMinor + l.shippingMinor - l.costMinor);
    }
    expect(r.totals.marginMinor).toBe(a!.marginMinor + b!.marginMinor);
    expect(r.totals.revenueMinor + r.totals.shippingMinor).toBe(order.totalMinor);
  });

  test('when a line was refunded, then its revenue drops by the refund', () => {
    const r = orderCosts(
      { totalMinor: 2000, shippingMinor: 0, platformFeeMinor: 160 },
      [{ lineId: 'a', totalMinor: 2000, refundedMinor: 2000, quantity: 1, layers: 1, blankCostMinor: 400, labourMinutes: 0, vinylCutMinor: 0, vinylEstimateExact: 0 }],
      fees,
      0,
    );
    expect(r.lines[0]!.revenueMinor).toBe(0);
    expect(r.lines[0]!.marginMinor).toBeLessThan(0);
  });
});

describe('estimates and the price check', () => {
  test('when a 100 × 40 mm piece goes on a 305 mm roll, then it takes (106 × 46) / 293 mm of roll', () => {
    const e = estimateVinyl([{ materialId: 'm', widthMm: 100, heightMm: 40 }], 2, new Map([['m', { rollWidthMm: 305, pricePerMetreMinor: 1000 }]]));
    const length = ((106 * 46) / 293) * 2;
    expect(e.byMaterial.get('m')).toBeCloseTo(length, 9);
    expect(e.costExact).toBeCloseTo((length / 1000) * 1000, 9);
  });

  test('when the price is below cost, then the margin is negative by exactly the difference', () => {
    const p = priceCheck({
      priceMinor: 800,
      layers: 2,
      blankCostMinor: 600,
      labourMinutes: 12,
      hourlyRateMinor: 2000,
      vinylEstimateExact: 49.5,
      fees: { platformFeeBps: 800, paymentFeeBps: 290, paymentFeeFixedMinor: 30 },
    });
    // 600 + 50 (49.5 rounds up) + 400 labour + 64 fee + (23.2 → 23) + 30
    expect(p.costMinor).toBe(600 + 50 + 400 + 64 + 53);
    expect(p.marginMinor).toBe(800 - p.costMinor);
  });

  test('when a price ends on half a cent of fee, then the margin check takes the fee checkout takes (half rounds up, once)', () => {
    // 2506 × 8 % = 200.48 → 200; 6 × 25 % = 1.5 → 2; 1056 × 8 % = 84.48 → 84 (integer rounding, not a float product)
    for (const [priceMinor, platformFeeBps, fee] of [
      [2506, 800, 200],
      [6, 2500, 2],
      [1056, 800, 84],
      [2524, 800, 202],
    ] as const) {
      const p = priceCheck({
        priceMinor,
        layers: 1,
        blankCostMinor: 0,
        labourMinutes: 0,
        hourlyRateMinor: 0,
        vinylEstimateExact: 0,
        fees: { platformFeeBps, paymentFeeBps: 0, paymentFeeFixedMinor: 0 },
      });
      expect(p.platformFeeMinor).toBe(fee);
      expect(p.platformFeeMinor).toBe(splitForShop(priceMinor, 0, platformFeeBps).feeMinor);
    }
  });

  test('when the longest name is made, then it has exactly the allowed length', () => {
    expect([...longestSampleName(12)].length).toBe(12);
    expect(longestSampleName(5)).toBe('Barth');
  });
});

describe('ledger', () => {
  const e = (day: string, kind: LedgerEntry['kind'], amountMinor: number, memo: string | null = null): LedgerEntry => ({
    id: `${day}-${kind}`,
    at: Date.parse(`${day}T10:00:00Z`),
    day,
    kind,
    orderId: null,
    orderNumber: 'NS-1001',
    amountMinor,
    currency: 'USD',
    memo,
    ...signForShop(kind, amountMinor),
  });

  test('when a month has a charge, its fee and its transfer, then earned − paid out is 0; a refund with a smaller reversal leaves a balance', () => {
    const months = balanceByMonth([
      e('2026-11-20', 'charge', 2850),
      e('2026-11-20', 'platform_fee', 228),
      e('2026-11-20', 'transfer', 2622),
      e('2026-12-02', 'refund', -1000),
      e('2026-12-02', 'refund_reversal', -920),
    ]);
    expect(months.map((m) => m.month)).toEqual(['2026-11', '2026-12']);
    expect(months[0]).toMatchObject({ chargesMinor: 2850, feesMinor: -228, earnedMinor: 2622, paidOutMinor: 2622, netMinor: 0, balanceMinor: 0 });
    expect(months[1]).toMatchObject({ refundsMinor: -1000, earnedMinor: -1000, paidOutMinor: -920, netMinor: -80, balanceMinor: -80 });
  });

  test('when exported, then the CSV parses back with the same amounts and a formula-like memo is defused', () => {
    const csv = ledgerCsv([e('2026-11-20', 'charge', 2850, '=HYPERLINK("x")'), e('2026-11-20', 'platform_fee', 228, 'fee, 800 bps')], 2);
    const rows = Papa.parse<string[]>(csv.trim()).data;
    expect(rows[0]).toEqual(['date', 'kind', 'order', 'amount', 'earned', 'paid_out', 'currency', 'memo']);
    expect(rows[1]).toEqual(['2026-11-20', 'charge', 'NS-1001', '28.50', '28.50', '0.00', 'USD', `'=HYPERLINK("x")`]);
    expect(rows[2]![4]).toBe('-2.28');
    expect(rows[2]![7]).toBe('fee, 800 bps');
    expect(minorToDecimal(-5, 2)).toBe('-0.05');
    expect(minorToDecimal(1200, 0)).toBe('1200');
  });
});

describe('chart data', () => {
  test('when sales fall in two ISO weeks, then they are grouped by Monday', () => {
    expect(weekStart('2026-12-06')).toBe('2026-11-30'); // a Sunday belongs to the week that began on Monday 30 Nov
    const w = salesByWeek([
      { day: '2026-12-01', salesMinor: 1000, marginMinor: 300, quantity: 1 },
      { day: '2026-12-06', salesMinor: 500, marginMinor: 100, quantity: 2 },
      { day: '2026-12-07', salesMinor: 700, marginMinor: -50, quantity: 1 },
    ]);
    expect(w).toEqual([
      { week: '2026-11-30', salesMinor: 1500, marginMinor: 400, items: 3 },
      { week: '2026-12-07', salesMinor: 700, marginMinor: -50, items: 1 },
    ]);
  });

  test('when sheets are cut, then vinyl is summed per material per month, and orders are counted once per listing', () => {
    expect(
      vinylByMaterialMonth([
        { month: '2026-12', materialId: 'g', material: 'Gold glitter', consumedMm: 300.2 },
        { month: '2026-12', materialId: 'g', material: 'Gold glitter', consumedMm: 125 },
        { month: '2026-11', materialId: 's', material: 'Navy smooth', consumedMm: 80 },
      ]),
    ).toEqual([
      { month: '2026-11', materialId: 's', material: 'Navy smooth', usedMm: 80 },
      { month: '2026-12', materialId: 'g', material: 'Gold glitter', usedMm: 425.2 },
    ]);
    const l = ordersByListing([
      { listingId: 'tote', title: 'Tote', orderId: 'o1', quantity: 1, salesMinor: 100 },
      { listingId: 'tote', title: 'Tote', orderId: 'o1', quantity: 2, salesMinor: 200 },
      { listingId: 'tote', title: 'Tote', orderId: 'o2', quantity: 1, salesMinor: 100 },
      { listingId: 'bag', title: 'Bag', orderId: 'o2', quantity: 1, salesMinor: 50 },
    ]);
    expect(l[0]).toEqual({ listingId: 'tote', title: 'Tote', orders: 2, items: 4, salesMinor: 400 });
    expect(l[1]!.orders).toBe(1);
  });
});
