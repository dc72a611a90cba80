/**
 * A shop's offers to shoppers: discount codes, "order by" dates per occasion, the shipping estimate
 * behind needed-by dates; and the shopper's per-shop choices in the cart (a code, a needed-by date).
 * One schema per contract, used by the form and by the route.
 */
import { z } from 'zod';
import { isValidDay } from '../business/working-days.ts';

const day = z.string({ error: 'Enter a date.' }).refine(isValidDay, 'Use a real date, written yyyy-mm-dd.');
/** '' from an empty date input means "no date" */
const optionalDay = z.union([z.literal(''), day, z.null()]).transform((v) => (v ? v : null));

export const DISCOUNT_KINDS = ['percent', 'amount'] as const;
export type DiscountKind = (typeof DISCOUNT_KINDS)[number];
export const DISCOUNT_KIND_LABELS: Record<DiscountKind, string> = { percent: 'Percentage off', amount: 'Amount off' };

export const MAX_PERCENT_OFF = 90;
export const CODE_RE = /^[A-Z0-9-]{3,20}$/;
export const MAX_CODE_LISTINGS = 50;

/** A code as the shopper types it: trimmed and upper-cased before anything else. */
export const codeText = z.string({ error: 'Enter a code.' }).trim().toUpperCase().regex(CODE_RE, 'Codes are 3–20 letters, digits or dashes.');

/** POST /api/seller/discounts and PUT /api/seller/discounts/:id — the seller's form. */
export const discountCodeSchema = z
  .object({
    code: codeText,
    kind: z.enum(DISCOUNT_KINDS, { error: 'Pick percentage or amount.' }),
    /** whole percent, for kind percent */
    percentOff: z.number({ error: 'Enter the percentage.' }).int('Whole percent.').min(1, 'At least 1 %.').max(MAX_PERCENT_OFF, `At most ${MAX_PERCENT_OFF} %.`).nullable().default(null),
    /** minor units, for kind amount */
    amountOffMinor: z.number({ error: 'Enter the amount.' }).int('Whole cents.').min(1, 'At least 1 cent.').max(10_000_000, 'That is too much.').nullable().default(null),
    minSpendMinor: z.number({ error: 'Enter the minimum spend (0 for none).' }).int('Whole cents.').min(0, 'Cannot be negative.').max(10_000_000, 'That is too much.').default(0),
    startsOn: optionalDay.default(null),
    endsOn: optionalDay.default(null),
    usageLimit: z.number({ error: 'Enter a number of uses.' }).int('Whole uses.').min(1, 'At least 1 use.').max(100_000, 'At most 100,000 uses.').nullable().default(null),
    /** empty: the whole shop */
    listingIds: z.array(z.string().min(1).max(64)).max(MAX_CODE_LISTINGS, `At most ${MAX_CODE_LISTINGS} listings.`).default([]),
    active: z.boolean().default(true),
  })
  .superRefine((v, ctx) => {
    if (v.kind === 'percent' && v.percentOff === null) ctx.addIssue({ code: 'custom', path: ['percentOff'], message: 'Enter the percentage.' });
    if (v.kind === 'amount' && v.amountOffMinor === null) ctx.addIssue({ code: 'custom', path: ['amountOffMinor'], message: 'Enter the amount.' });
    if (v.startsOn && v.endsOn && v.endsOn < v.startsOn) ctx.addIssue({ code: 'custom', path: ['endsOn'], message: 'The last day comes before the first.' });
  });
export type DiscountCodeInput = z.input<typeof discountCodeSchema>;
export type DiscountCodeValues = z.output<typeof discountCodeSchema>;

export const discountIdParams = z.object({ id: z.string().min(1).max(64) });

/** GET /api/seller/discounts: the shop's codes with what each gave away on paid orders. */
export type DiscountCodeView = {
  id: string;
  code: string;
  kind: DiscountKind;
  percentOff: number | null;
  amountOffMinor: number | null;
  minSpendMinor: number;
  startsOn: string | null;
  endsOn: string | null;
  usageLimit: number | null;
  listingIds: string[];
  active: boolean;
  /** checkouts paid with it, and those holding it on an open payment page */
  usedCount: number;
  reservedCount: number;
  /** what it took off paid orders (before refunds) */
  givenAwayMinor: number;
};
export type DiscountsView = { currency: string; codes: DiscountCodeView[]; givenAwayMinor: number; ordersWithCode: number };

/** POST /api/offers/cart/:shopId/code */
export const applyCodeSchema = z.object({ code: z.string({ error: 'Enter a code.' }).trim().min(1, 'Enter a code.').max(40, 'Codes are at most 20 characters.') });
/** PUT /api/offers/cart/:shopId/needed-by */
export const neededBySchema = z.object({ neededBy: optionalDay });
export const cartShopParams = z.object({ shopId: z.string().min(1).max(64) });

/** The code on one shop's part of the cart, after line pricing. */
export type CartDiscount = { code: string; codeId: string | null; applied: boolean; discountMinor: number; message: string };
/** The shopper's needed-by date for one shop's parcel and whether the shop can make it. */
export type CartDelivery = { neededBy: string | null; shipBy: string; arrival: string; canMake: boolean | null };

/** "Order by" dates: POST /api/seller/order-by-dates. */
export const orderByDateSchema = z.object({
  occasion: z.string({ error: 'Name the occasion.' }).trim().min(2, 'Use at least 2 characters.').max(60, 'Use at most 60 characters.'),
  orderBy: day,
});
export type OrderByDateInput = z.input<typeof orderByDateSchema>;
export type OrderByDate = { id: string; occasion: string; orderBy: string };

/** PUT /api/seller/shipping-days: the shop's own estimate of time in the post. */
export const shippingDaysSchema = z.object({
  shippingDays: z.number({ error: 'Enter the days in the post.' }).int('Whole days.').min(0, 'Cannot be negative.').max(30, 'At most 30 working days.'),
});
export type ShippingDaysInput = z.input<typeof shippingDaysSchema>;

/** GET /api/offers/listings/:slug/delivery[?neededBy=]: what the listing page says about dates. */
export const deliveryQuery = z.object({ neededBy: optionalDay.optional() });
export type ListingDelivery = {
  processingDays: number;
  shippingDays: number;
  /** ordered today */
  shipBy: string;
  arrival: string;
  /** the needed-by check (shared/business/needed-by.ts neededByVerdict) */
  verdict: { neededBy: string; shipBy: string; arrival: string; latestShip: string; canMake: boolean } | null;
  /** the shop's order-by dates still to come, soonest first */
  orderBy: OrderByDate[];
};
