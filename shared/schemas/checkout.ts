/** Checkout: the session the client is sent to, and the status the return page polls. */
import { z } from 'zod';
import type { LineSnapshot } from './cart.ts';

export const checkoutStatusParams = z.object({
  sessionId: z
    .string()
    .min(8)
    .max(255)
    .regex(/^[A-Za-z0-9_]+$/, 'That is not a payment session id.'),
});

/** POST /api/checkout → where to send the shopper */
export type CheckoutStarted = { checkoutId: string; sessionId: string; url: string };

export const CHECKOUT_STATES = ['open', 'paid', 'expired', 'cancelled'] as const;
export type CheckoutState = (typeof CHECKOUT_STATES)[number];

/** GET /api/checkout/:sessionId/status and GET /api/checkout/latest */
export type CheckoutStatus = {
  checkoutId: string;
  sessionId: string | null;
  state: CheckoutState;
  /** open: the shopper may still pay on the payment page */
  payUrl: string | null;
  /** our words for the last decline, if the last attempt failed */
  problem: string | null;
  /** the provider has the money (orders follow as soon as its notice reaches us) */
  paymentReceived: boolean;
  totalMinor: number;
  currency: string;
  orders: Array<{ id: string; number: string; shopName: string; totalMinor: number }>;
};

/**
 * Countries we ask the payment page to accept for the parcel's address (ISO 3166-1 alpha-2):
 * the US, Canada, the UK, Ireland, Australia, New Zealand and the other EU member states.
 */
export const SHIPPING_COUNTRIES = [
  'US',
  'CA',
  'GB',
  'IE',
  'AU',
  'NZ',
  'AT',
  'BE',
  'BG',
  'HR',
  'CY',
  'CZ',
  'DK',
  'EE',
  'FI',
  'FR',
  'DE',
  'GR',
  'HU',
  'IT',
  'LV',
  'LT',
  'LU',
  'MT',
  'NL',
  'PL',
  'PT',
  'RO',
  'SK',
  'SI',
  'ES',
  'SE',
] as const;

const shipText = (max: number) => z.string().trim().min(1).max(max);

/** orders.ship_to: where the shop posts the parcel, as the payment page collected it. */
export const shipToSchema = z.object({
  name: shipText(200),
  line1: shipText(200),
  line2: shipText(200).nullable(),
  city: shipText(200),
  postalCode: shipText(40),
  state: shipText(200).nullable(),
  country: z.string().regex(/^[A-Z]{2}$/),
});
export type ShipTo = z.infer<typeof shipToSchema>;

/** Reads a stored ship_to value; anything malformed counts as "no address". */
export function parseShipTo(raw: unknown): ShipTo | null {
  const r = shipToSchema.safeParse(raw);
  return r.success ? r.data : null;
}

function countryName(code: string): string {
  try {
    return new Intl.DisplayNames(['en'], { type: 'region' }).of(code) ?? code;
  } catch {
    return code;
  }
}

/** The address as the lines written on a parcel: name, street, town, region with postal code, country. */
export function shipToLines(a: ShipTo): string[] {
  return [a.name, a.line1, a.line2, a.city, [a.state, a.postalCode].filter(Boolean).join(' '), countryName(a.country)].filter((l): l is string => !!l);
}

/** The cart frozen at checkout; orders are made from exactly this, never from the live cart. */
export type PricedCheckout = {
  currency: string;
  totalMinor: number;
  shops: Array<{
    shopId: string;
    shopName: string;
    shippingMinor: number;
    subtotalMinor: number;
    totalMinor: number;
    /** the shop's code (totalMinor and each line's totalMinor are after it; subtotalMinor before) */
    discount?: { codeId: string; code: string; discountMinor: number } | null;
    neededBy?: string | null;
    lines: Array<{ cartLineId: string; listingId: string; title: string; quantity: number; unitPriceMinor: number; totalMinor: number; discountMinor?: number; snapshot: LineSnapshot }>;
  }>;
};
