// Money in minor units. Digits per currency: ISO 4217 Table A.1 (USD 2, EUR 2, GBP 2, JPY 0);
// Stripe's amounts are the same smallest-unit integers (Stripe API docs, "Currencies").

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { allocate, formatMoney, minorDigits, parseMajor, platformFee, roundDiv, splitForShop } from '../../shared/money.ts';

describe('money', () => {
  it('when formatting, then digits follow ISO 4217 minor units', () => {
    expect(minorDigits('USD')).toBe(2);
    expect(minorDigits('jpy')).toBe(0);
    expect(formatMoney(1250, 'USD')).toBe('$12.50');
    expect(formatMoney(5, 'EUR')).toBe('€0.05');
    expect(formatMoney(123456789, 'GBP')).toBe('£1,234,567.89');
    expect(formatMoney(1200, 'JPY')).toBe('¥1,200');
    expect(formatMoney(-5, 'USD')).toBe('-$0.05');
    expect(() => formatMoney(1.5, 'USD')).toThrow();
    expect(() => formatMoney(100, 'XXX')).toThrow();
  });

  it('when parsing typed amounts, then they become minor units or null', () => {
    expect(parseMajor('12.5', 'USD')).toBe(1250);
    expect(parseMajor('1,200', 'JPY')).toBe(1200);
    expect(parseMajor('12.505', 'USD')).toBeNull();
    expect(parseMajor('12.5', 'JPY')).toBeNull();
    expect(parseMajor('abc', 'USD')).toBeNull();
  });

  it('when taking the 8 % fee, then it is rounded half away from zero in whole minor units', () => {
    expect(platformFee(5250, 800)).toBe(420);
    expect(platformFee(2524, 800)).toBe(202); // 201.92
    expect(platformFee(2506, 800)).toBe(200); // 200.48
    expect(platformFee(1250, 800)).toBe(100);
    expect(platformFee(6, 2500)).toBe(2); // 1.5 → 2
    expect(roundDiv(-15, 10)).toBe(-2);
  });

  it('when splitting a shop total, then transfer + fee always equals lines + shipping', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000 }), fc.integer({ min: 0, max: 100_000 }), fc.integer({ min: 0, max: 5000 }), (lines, ship, bps) => {
        const s = splitForShop(lines, ship, bps);
        return s.transferMinor + s.feeMinor === lines + ship && s.feeMinor === Math.round(((lines + ship) * bps) / 10_000);
      }),
    );
  });

  it('when allocating, then the parts add up exactly and stay proportional within one unit', () => {
    expect(allocate(100, [1, 1, 1])).toEqual([34, 33, 33]);
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1_000_000 }), fc.array(fc.integer({ min: 1, max: 1000 }), { minLength: 1, maxLength: 8 }), (amount, weights) => {
        const parts = allocate(amount, weights);
        const total = weights.reduce((a, b) => a + b, 0);
        return parts.reduce((a, b) => a + b, 0) === amount && parts.every((p, i) => Math.abs(p - (amount * weights[i]!) / total) < 1);
      }),
    );
  });
});
