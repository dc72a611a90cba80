// The card and address fields of the hosted payment page: what each test card does, and the checks
// on what was typed. Every message says what to type.
import { z } from 'zod';
import type { CardField, ShippingField } from './html.ts';
import type { PendingCard } from './store.ts';
import type { ShippingDetails } from './types.ts';

// Test cards (Stripe API docs, "Testing").
export type CardBehaviour = 'succeed' | 'generic_decline' | 'insufficient_funds' | 'authenticate';
const TEST_CARDS: Record<string, CardBehaviour> = {
  '4242424242424242': 'succeed',
  '4000000000000002': 'generic_decline',
  '4000000000009995': 'insufficient_funds',
  '4000002760003184': 'authenticate',
};

/** What a card number does on the test page; undefined for any other (valid) number. */
export const cardBehaviour = (number: string): CardBehaviour | undefined => TEST_CARDS[number];

/** The Luhn check digit test (ISO/IEC 7812-1). */
function luhn(num: string): boolean {
  let sum = 0;
  let dbl = false;
  for (let i = num.length - 1; i >= 0; i--) {
    let d = num.charCodeAt(i) - 48;
    if (dbl) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
    dbl = !dbl;
  }
  return sum % 10 === 0;
}

function brandOf(num: string): string {
  if (num.startsWith('4')) return 'visa';
  if (/^5[1-5]|^2[2-7]/.test(num)) return 'mastercard';
  if (/^3[47]/.test(num)) return 'amex';
  return 'unknown';
}

const cardFormSchema = z.object({
  card_number: z.string().max(40).default(''),
  card_expiry: z.string().max(20).default(''),
  card_cvc: z.string().max(10).default(''),
});
type CardForm = z.output<typeof cardFormSchema>;

export interface CardCheck {
  values: CardForm;
  errors: Partial<Record<CardField, string>>;
  /** The digits only. */
  number: string;
  card: PendingCard;
}

/** Checks the card fields against `today` (for the expiry); `errors` is empty when they are fine. */
export function checkCard(raw: Record<string, unknown>, today: Date): CardCheck {
  const f = cardFormSchema.safeParse(raw);
  const values = f.success ? f.data : { card_number: '', card_expiry: '', card_cvc: '' };
  const errors: Partial<Record<CardField, string>> = {};
  const number = values.card_number.replace(/[\s-]/g, '');
  if (!/^\d{12,19}$/.test(number)) errors.card_number = 'Enter the card number: 16 digits, spaces allowed.';
  else if (!luhn(number)) errors.card_number = "That card number isn't valid. Check the digits and try again.";
  // "12/34", "12 / 34", "12/2034", or the digits alone ("1234", "122034"): month, then year
  const exp = /^\s*(\d{1,2})\s*\/\s*(\d{2}|\d{4})\s*$/.exec(values.card_expiry) ?? /^\s*(\d{2})(\d{2}|\d{4})\s*$/.exec(values.card_expiry);
  let expMonth = 0;
  let expYear = 0;
  if (exp) {
    const yy = exp[2] ?? '';
    expMonth = Number(exp[1]);
    expYear = yy.length === 2 ? 2000 + Number(yy) : Number(yy);
  }
  if (!exp || expMonth < 1 || expMonth > 12) errors.card_expiry = 'Enter the expiry date as MM/YY, for example 12/34.';
  else if (expYear * 12 + expMonth < today.getUTCFullYear() * 12 + today.getUTCMonth() + 1) errors.card_expiry = 'This card has expired. Enter a month and year that have not passed.';
  if (!/^\d{3,4}$/.test(values.card_cvc.trim())) errors.card_cvc = 'Enter the 3 or 4 digits of the security code.';
  return { values, errors, number, card: { last4: number.slice(-4), exp_month: expMonth, exp_year: expYear, brand: brandOf(number) } };
}

const shippingFormSchema = z.object({
  ship_name: z.string().max(200).default(''),
  ship_line1: z.string().max(200).default(''),
  ship_line2: z.string().max(200).default(''),
  ship_city: z.string().max(200).default(''),
  ship_postal_code: z.string().max(40).default(''),
  ship_state: z.string().max(200).default(''),
  ship_country: z.string().max(10).default(''),
});
type ShippingForm = Record<ShippingField, string>;

export interface ShippingCheck {
  values: ShippingForm;
  errors: Partial<Record<ShippingField, string>>;
  /** The address, tidied, when there are no errors. */
  details: ShippingDetails | null;
}

/** Checks the address typed on the payment page against the session's `allowed_countries`. */
export function checkShipping(raw: Record<string, unknown>, allowed: string[]): ShippingCheck {
  const r = shippingFormSchema.safeParse(raw);
  const values: ShippingForm = r.success ? r.data : { ship_name: '', ship_line1: '', ship_line2: '', ship_city: '', ship_postal_code: '', ship_state: '', ship_country: '' };
  const t = (v: string) => v.trim().replace(/\s+/g, ' ');
  const errors: Partial<Record<ShippingField, string>> = {};
  if (!t(values.ship_name)) errors.ship_name = 'Enter the name of the person the parcel is for.';
  if (!t(values.ship_line1)) errors.ship_line1 = 'Enter the first line of the address, for example the house number and street.';
  if (!t(values.ship_city)) errors.ship_city = 'Enter the town or city.';
  if (!t(values.ship_postal_code)) errors.ship_postal_code = 'Enter the postal code.';
  else if (!/^[A-Za-z0-9][A-Za-z0-9 -]{1,11}$/.test(t(values.ship_postal_code))) errors.ship_postal_code = 'Enter the postal code using letters, digits, spaces or hyphens.';
  const country = t(values.ship_country).toUpperCase();
  if (!country) errors.ship_country = 'Choose the country the parcel goes to.';
  else if (!allowed.includes(country)) errors.ship_country = 'We can only send parcels to the countries in the list. Choose one of them.';
  if (Object.keys(errors).length > 0) return { values, errors, details: null };
  return {
    values,
    errors,
    details: {
      name: t(values.ship_name),
      address: {
        line1: t(values.ship_line1),
        line2: t(values.ship_line2) || null,
        city: t(values.ship_city),
        postal_code: t(values.ship_postal_code).toUpperCase(),
        state: t(values.ship_state) || null,
        country,
      },
    },
  };
}
