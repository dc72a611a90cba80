/**
 * Money: integer minor units everywhere. Digits per currency follow ISO 4217 Table A.1 (list of the
 * maintenance agency): USD 2, EUR 2, GBP 2, JPY 0. Stripe takes the same smallest-unit integers
 * (Stripe API docs, "Currencies": JPY is zero-decimal). We format digits ourselves rather than
 * trusting CLDR through Intl for the number of decimals: CLDR's need not match ISO 4217's for every currency.
 */

export const CURRENCIES = {
  USD: { digits: 2, symbol: '$' },
  EUR: { digits: 2, symbol: '€' },
  GBP: { digits: 2, symbol: '£' },
  JPY: { digits: 0, symbol: '¥' },
} as const;
export type CurrencyCode = keyof typeof CURRENCIES;

export function isCurrency(code: string): code is CurrencyCode {
  return Object.hasOwn(CURRENCIES, code.toUpperCase());
}

/** ISO 4217 minor-unit digits; unknown codes are refused rather than guessed. */
export function minorDigits(code: string): number {
  const c = code.toUpperCase();
  if (!isCurrency(c)) throw new Error(`Unknown currency ${code}`);
  return CURRENCIES[c].digits;
}

function assertMinor(amount: number): void {
  if (!Number.isSafeInteger(amount)) throw new Error(`Money must be an integer number of minor units, got ${amount}`);
}

/**
 * "$12.50", "¥1,200", "-£0.05". Digits from ISO 4217, thousands with commas, the sign before the
 * symbol. Pure string work (no Intl) so server e-mails and the browser print the same text.
 */
export function formatMoney(amountMinor: number, code: string): string {
  assertMinor(amountMinor);
  const c = code.toUpperCase();
  const digits = minorDigits(c);
  const neg = amountMinor < 0;
  const abs = Math.abs(amountMinor);
  const scale = 10 ** digits;
  const whole = Math.floor(abs / scale);
  const frac = abs % scale;
  const wholeText = String(whole).replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  const text = digits > 0 ? `${wholeText}.${String(frac).padStart(digits, '0')}` : wholeText;
  return `${neg ? '-' : ''}${CURRENCIES[c as CurrencyCode].symbol}${text}`;
}

/** Parses "12.5" / "1,200" typed in major units into minor units; null when not a valid amount. */
export function parseMajor(text: string, code: string): number | null {
  const digits = minorDigits(code);
  const t = text.trim().replace(/,/g, '');
  const re = digits > 0 ? new RegExp(`^(\\d+)(?:\\.(\\d{1,${digits}}))?$`) : /^(\d+)$/;
  const m = re.exec(t);
  if (!m) return null;
  const frac = (m[2] ?? '').padEnd(digits, '0');
  return Number(m[1]) * 10 ** digits + (digits > 0 ? Number(frac) : 0);
}

/**
 * Round half away from zero, on integers only: `num / den` rounded. Used for the fee so that
 * no floating-point product decides a cent (1050 × 800 / 10000 = 84 exactly; 1056 → 84.48 → 84).
 */
export function roundDiv(num: number, den: number): number {
  assertMinor(num);
  assertMinor(den);
  if (den <= 0) throw new Error('denominator must be positive');
  const sign = num < 0 ? -1 : 1;
  const a = Math.abs(num);
  const q = Math.floor(a / den);
  const r = a - q * den;
  return sign * (2 * r >= den ? q + 1 : q);
}

/** Basis points in one whole: 10 000 bps = 100 %. */
export const BPS_PER_WHOLE = 10_000;

/**
 * A share of an amount given in basis points, in minor units: amount × bps / 10 000, rounded once,
 * half away from zero, on integers (roundDiv). Every percentage fee is computed here.
 */
export function bpsOf(amountMinor: number, bps: number): number {
  return roundDiv(amountMinor * bps, BPS_PER_WHOLE);
}

/**
 * The platform's fee on an amount (one shop's lines + shipping at checkout; one item's price in the
 * seller's margin check), in minor units: bpsOf(amount, feeBps) — rounded half away from zero, once.
 */
export function platformFee(amountMinor: number, feeBps: number): number {
  return bpsOf(amountMinor, feeBps);
}

export type ShopSplit = { shopTotalMinor: number; feeMinor: number; transferMinor: number };

/** One shop's part of a charge: its lines + shipping, the platform fee, and what is transferred. */
export function splitForShop(linesMinor: number, shippingMinor: number, feeBps: number): ShopSplit {
  const shopTotalMinor = linesMinor + shippingMinor;
  const feeMinor = platformFee(shopTotalMinor, feeBps);
  return { shopTotalMinor, feeMinor, transferMinor: shopTotalMinor - feeMinor };
}

/**
 * What the shop gives back of `refundedMinor` refunded on its order: its transfer's share, pro rata
 * (the platform bears refunds and returns its fee on the refunded part). Computed on the running
 * total, so the shares of several refunds always add up to the share of their sum, and a full
 * refund takes back exactly the whole transfer.
 */
export function shopShareOfRefunds(order: { totalMinor: number; platformFeeMinor: number }, refundedMinor: number): number {
  const transferMinor = order.totalMinor - order.platformFeeMinor;
  if (refundedMinor <= 0) return 0;
  if (refundedMinor >= order.totalMinor) return transferMinor;
  return roundDiv(refundedMinor * transferMinor, order.totalMinor);
}

/** The shop's payout for one order, net of what has been refunded on it: transfer − its share of refunds. */
export function payoutDue(order: { totalMinor: number; platformFeeMinor: number }, refundedMinor: number): number {
  return order.totalMinor - order.platformFeeMinor - shopShareOfRefunds(order, refundedMinor);
}

/**
 * Splits `amount` across parts in proportion to `weights`, with the remainder handed out by the
 * largest-remainder method, so the parts always add up to `amount` exactly (used to reverse a
 * transfer proportionally when one line is refunded).
 */
export function allocate(amount: number, weights: number[]): number[] {
  assertMinor(amount);
  const total = weights.reduce((a, b) => a + b, 0);
  if (total <= 0) return weights.map(() => 0);
  const raw = weights.map((w) => (amount * w) / total);
  const out = raw.map((x) => Math.floor(x));
  let rest = amount - out.reduce((a, b) => a + b, 0);
  const order = raw.map((x, i) => [x - Math.floor(x), i] as const).sort((a, b) => b[0] - a[0]);
  for (let k = 0; rest > 0; k = (k + 1) % order.length, rest--) out[order[k]![1]]! += 1;
  return out;
}
