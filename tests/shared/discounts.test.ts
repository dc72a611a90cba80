// A shop's code on its part of the cart. Expected amounts are worked by hand: the percentage as
// amount × rate rounded half away from zero, and the shares by the largest-remainder (Hamilton /
// Hare–Niemeyer) apportionment — floor each exact share, then give the cents left over to the
// largest fractional parts — as described in Balinski & Young, "Fair Representation" (2001), ch. 2.
import { describe, expect, it } from 'vitest';
import { applyDiscount, type DiscountRule } from '../../shared/business/discounts.ts';

const rule = (o: Partial<DiscountRule> = {}): DiscountRule => ({
  code: 'SPRING',
  kind: 'percent',
  value: 1500,
  minSpendMinor: 0,
  startsOn: null,
  endsOn: null,
  usageLimit: null,
  listingIds: null,
  active: true,
  ...o,
});
const ctx = { today: '2026-12-02', usesTaken: 0, currency: 'USD' };
const lines = [
  { id: 'a', listingId: 'tote', totalMinor: 1999 },
  { id: 'b', listingId: 'pouch', totalMinor: 3750 },
];

describe('when a 15 % code meets 19.99 + 37.50', () => {
  it('then 57.49 × 15 % = 8.6235 → 8.62 comes off, shared 3.00 and 5.62 (largest remainder)', () => {
    // exact shares 862 × 1999 / 5749 = 299.728…, 862 × 3750 / 5749 = 562.271…; floors 299 + 562 = 861,
    // the cent left goes to the larger remainder (.728…): 300 and 562
    expect(applyDiscount(rule(), lines, ctx)).toEqual({ ok: true, discountMinor: 862, perLine: { a: 300, b: 562 } });
  });
});

describe('when three equal lines share 1.00 off', () => {
  it('then the shares are 34, 33, 33 and add up to 100', () => {
    const three = ['x', 'y', 'z'].map((id) => ({ id, listingId: 'tote', totalMinor: 1000 }));
    const out = applyDiscount(rule({ kind: 'amount', value: 100 }), three, ctx);
    expect(out).toEqual({ ok: true, discountMinor: 100, perLine: { x: 34, y: 33, z: 33 } });
  });
});

describe('when a fixed amount is more than the items it covers', () => {
  it('then it takes off only what they cost', () => {
    expect(applyDiscount(rule({ kind: 'amount', value: 5000, listingIds: ['tote'] }), lines, ctx)).toEqual({ ok: true, discountMinor: 1999, perLine: { a: 1999 } });
  });
});

describe('when a code does not apply', () => {
  const why = (r: Partial<DiscountRule>, c = ctx) => {
    const out = applyDiscount(rule(r), lines, c);
    return out.ok ? null : out.reason;
  };
  it('then the shopper reads why', () => {
    expect(why({ minSpendMinor: 6000 })).toBe('The code SPRING needs $60.00 from this shop; you have $57.49. Add $2.51 more to use it.');
    expect(why({ minSpendMinor: 2500, listingIds: ['tote'] })).toBe('The code SPRING needs $25.00 of the items it covers; you have $19.99. Add $5.01 more to use it.');
    expect(why({ listingIds: ['bag'] })).toBe('The code SPRING is for other items from this shop, not the ones in your cart.');
    expect(why({ startsOn: '2026-12-03' })).toBe('The code SPRING starts on 2026-12-03.');
    expect(why({ endsOn: '2026-12-01' })).toBe('The code SPRING ended on 2026-12-01.');
    expect(why({ usageLimit: 3 }, { ...ctx, usesTaken: 3 })).toBe('The code SPRING has been used as many times as the shop allows.');
    expect(why({ active: false })).toBe('The code SPRING is paused by the shop.');
  });
  it('then the first and last days of its window still count', () => {
    expect(why({ startsOn: '2026-12-02', endsOn: '2026-12-02' })).toBe(null);
    expect(why({ usageLimit: 3 }, { ...ctx, usesTaken: 2 })).toBe(null);
  });
});
