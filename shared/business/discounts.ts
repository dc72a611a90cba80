/**
 * A shop's discount code applied to its part of a cart: whether it applies (and in our words why
 * not), what it takes off, and each line's share. Pure; money in integer minor units.
 *
 * - percent: bpsOf(eligible subtotal, bps), rounded once, half away from zero (shared/money.ts);
 * - amount: the fixed amount, never more than the eligible subtotal;
 * - the discount is shared over the eligible lines in proportion to their totals by the
 *   largest-remainder method (allocate), so the line shares always add up to it exactly. Each line's
 *   paid total is its price less its share: that is what a refund of the line gives back, what the
 *   platform fee is taken on and what the shop's margin counts as revenue.
 * Shipping is never discounted.
 */
import { allocate, bpsOf, formatMoney } from '../money.ts';

export type DiscountRule = {
  code: string;
  kind: 'percent' | 'amount';
  /** percent: basis points (1500 = 15 %); amount: minor units */
  value: number;
  minSpendMinor: number;
  startsOn: string | null;
  endsOn: string | null;
  usageLimit: number | null;
  /** null: every listing of the shop */
  listingIds: readonly string[] | null;
  active: boolean;
};

export type DiscountLine = { id: string; listingId: string; totalMinor: number };

export type DiscountOutcome = { ok: true; discountMinor: number; perLine: Record<string, number> } | { ok: false; reason: string };

export function applyDiscount(rule: DiscountRule, lines: readonly DiscountLine[], ctx: { today: string; usesTaken: number; currency: string }): DiscountOutcome {
  const { code } = rule;
  const money = (m: number) => formatMoney(m, ctx.currency);
  if (!rule.active) return { ok: false, reason: `The code ${code} is paused by the shop.` };
  if (rule.startsOn && ctx.today < rule.startsOn) return { ok: false, reason: `The code ${code} starts on ${rule.startsOn}.` };
  if (rule.endsOn && ctx.today > rule.endsOn) return { ok: false, reason: `The code ${code} ended on ${rule.endsOn}.` };
  if (rule.usageLimit !== null && ctx.usesTaken >= rule.usageLimit) return { ok: false, reason: `The code ${code} has been used as many times as the shop allows.` };
  const eligible = rule.listingIds ? lines.filter((l) => rule.listingIds!.includes(l.listingId)) : [...lines];
  if (eligible.length === 0) return { ok: false, reason: `The code ${code} is for other items from this shop, not the ones in your cart.` };
  const spend = eligible.reduce((a, l) => a + l.totalMinor, 0);
  if (spend < rule.minSpendMinor) {
    const what = rule.listingIds ? 'of the items it covers' : 'from this shop';
    return { ok: false, reason: `The code ${code} needs ${money(rule.minSpendMinor)} ${what}; you have ${money(spend)}. Add ${money(rule.minSpendMinor - spend)} more to use it.` };
  }
  const off = rule.kind === 'percent' ? bpsOf(spend, rule.value) : Math.min(rule.value, spend);
  const shares = allocate(
    off,
    eligible.map((l) => l.totalMinor),
  );
  const perLine: Record<string, number> = {};
  eligible.forEach((l, i) => {
    perLine[l.id] = shares[i]!;
  });
  return { ok: true, discountMinor: off, perLine };
}
