/** Cart: inputs (add a line, change a quantity) and the cart as the API returns it. */
import { z } from 'zod';
import { choicesSchema } from './listing.ts';
import type { CartDelivery, CartDiscount } from './offers.ts';

export const MAX_LINE_QUANTITY = 20;

const quantity = z.number({ error: 'Enter a quantity.' }).int('Use a whole number.').min(1, 'At least 1.').max(MAX_LINE_QUANTITY, `At most ${MAX_LINE_QUANTITY} of one item.`);

/**
 * POST /api/cart/lines. Deliberately no price field: unknown keys (a posted `unitPriceMinor`) are
 * stripped by zod and the server prices the line from the live listing.
 */
export const addCartLineSchema = z.object({
  listingId: z.string({ error: 'Pick a listing.' }).trim().min(1, 'Pick a listing.').max(64),
  quantity: quantity.default(1),
  choices: choicesSchema,
});
export type AddCartLineInput = z.input<typeof addCartLineSchema>;

export const updateCartLineSchema = z.object({ quantity });
export type UpdateCartLineInput = z.infer<typeof updateCartLineSchema>;

export const cartLineParams = z.object({ lineId: z.string().min(1).max(64) });

/** One cut piece of the design, for the small preview: path data in mm on the design's own box. */
export type SnapshotPiece = { d: string; colourHex: string; materialId: string | null };

/** What a cart line (and later an order line) keeps, frozen when the line is added. */
export type LineSnapshot = {
  listingId: string;
  listingTitle: string;
  listingSlug: string;
  shopId: string;
  currency: string;
  /** the print area used; with a blank offer also the chosen size and colour (blankChoiceLabel reads them) */
  blank: { kind: string; label: string; widthMm: number; heightMm: number; blankTypeId?: string; sizeId?: string; sizeLabel?: string; colourId?: string; colourName?: string; colourHex?: string };
  choices: z.output<typeof choicesSchema>;
  /** human-readable personalisation, e.g. [{ label: 'Name', value: 'Mira' }, { label: 'Name colour', value: 'Glitter gold' }] */
  summary: Array<{ label: string; value: string }>;
  geometry: {
    widthMm: number;
    heightMm: number;
    /** the design's box on the blank (mm, origin top-left of the blank): the preview's viewBox */
    bboxMm: { minX: number; minY: number; maxX: number; maxY: number };
    layerCount: number;
    pieces: SnapshotPiece[];
  };
  unitPriceMinor: number;
};

export type CartLine = {
  id: string;
  listingId: string;
  quantity: number;
  unitPriceMinor: number;
  lineTotalMinor: number;
  snapshot: LineSnapshot;
  /** false when the listing went off sale after the line was added: it cannot be bought now */
  available: boolean;
  /** this line's share of its shop's discount code (lineTotalMinor is before it) */
  discountMinor?: number;
};

export type CartShop = {
  shopId: string;
  shopName: string;
  shopSlug: string;
  currency: string;
  lines: CartLine[];
  subtotalMinor: number;
  shippingMinor: number;
  totalMinor: number;
  /** the shop's code, after line pricing (totalMinor is after it): server/features/offers */
  discount?: CartDiscount | null;
  discountMinor?: number;
  /** the shopper's needed-by date for this shop's parcel */
  delivery?: CartDelivery | null;
};

export type Cart = {
  /** null until the first line is added */
  id: string | null;
  version: number;
  currency: string | null;
  shops: CartShop[];
  itemCount: number;
  subtotalMinor: number;
  shippingMinor: number;
  /** what every shop's code took off (totalMinor is after it) */
  discountMinor?: number;
  totalMinor: number;
};
