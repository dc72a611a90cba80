/**
 * A shop's blanks as shoppers buy them: blank types (tee, tote, zip pouch, drawstring bag, or one the
 * seller adds), each with sizes (label, print area, top offset, price difference, garment
 * measurements for the size chart) and colours (name, hex, optional photo), and stock per size ×
 * colour. One schema per API contract, used by the seller's forms and by the routes.
 */
import { z } from 'zod';
import { type BlankKind, DEFAULT_BLANKS } from '../engine/blanks.ts';

// the engine's blank kinds (listing.ts imports this file, so the list is not taken from there)
const SHAPES = ['tote', 'kids_tee', 'adult_tee', 'pouch', 'drawstring_bag'] as const satisfies readonly BlankKind[];
const blankKindSchema = z.enum(SHAPES, { error: 'Pick a shape.' });

/** A size as the engine's listing mapping takes it: its own print area and top offset. */
export type DesignSize = { label: string; widthMm: number; heightMm: number; topOffsetMm: number };
/** The shopper's blank choice for the mapping (listingDesign): the size, the colour, and what the item is called ("Tee"). */
export type DesignBlankChoice = { noun: string; size: DesignSize | null; colour: { name: string; hex: string } | null };

export const MAX_BLANK_SIZES = 16;
export const MAX_BLANK_COLOURS = 16;
export const MAX_BLANK_TYPES = 24;
export const MAX_STOCK = 100_000;

const mm = (what: string, min: number, max: number) =>
  z
    .number({ error: `Enter the ${what} in mm.` })
    .min(min, `The ${what} is at least ${min} mm.`)
    .max(max, `The ${what} is at most ${max} mm.`);
const rowId = z.string().trim().max(64).optional();

export const blankSizeSchema = z.object({
  id: rowId,
  label: z.string({ error: 'Name the size.' }).trim().min(1, 'Name the size.').max(12, 'Use at most 12 characters.'),
  widthMm: mm('print width', 20, 600),
  heightMm: mm('print height', 20, 600),
  topOffsetMm: mm('top offset', 0, 300),
  priceDiffMinor: z
    .number({ error: 'Enter the price difference (0 for none).' })
    .int('The price difference is in whole cents.')
    .min(0, 'A size can add to the price, not take from it.')
    .max(1_000_000, 'The price difference is too large.'),
  /** garment measurements for the size chart (flat width across the chest or bag, length); optional */
  chestMm: mm('chest or width', 50, 1500).nullable().default(null),
  lengthMm: mm('length', 50, 1500).nullable().default(null),
});
export type BlankSize = z.output<typeof blankSizeSchema> & { id: string };

export const blankColourSchema = z.object({
  id: rowId,
  name: z.string({ error: 'Name the colour.' }).trim().min(1, 'Name the colour.').max(40, 'Use at most 40 characters.'),
  hex: z
    .string({ error: 'Enter a colour like #2f7d6d.' })
    .trim()
    .regex(/^#[0-9a-fA-F]{6}$/, 'Enter a colour like #2f7d6d.')
    .transform((s) => s.toLowerCase()),
  photoId: z.string().trim().max(64).nullable().default(null),
});
export type BlankColour = z.output<typeof blankColourSchema> & { id: string };

const unique = <T>(rows: T[], key: (r: T) => string, path: string, message: string, ctx: z.RefinementCtx) => {
  const seen = new Set<string>();
  rows.forEach((r, i) => {
    const k = key(r).toLowerCase();
    if (seen.has(k)) ctx.addIssue({ code: 'custom', message, path: [path, i, path === 'sizes' ? 'label' : 'name'] });
    seen.add(k);
  });
};

/** POST /api/seller/blanks and PUT /api/seller/blanks/:id: a blank type with its sizes and colours. */
export const blankTypeInputSchema = z
  .object({
    name: z.string({ error: 'Name the blank.' }).trim().min(2, 'Use at least 2 characters.').max(40, 'Use at most 40 characters.'),
    /** the drawing and placement rules it takes after */
    shape: blankKindSchema,
    sizes: z.array(blankSizeSchema).min(1, 'Add at least one size.').max(MAX_BLANK_SIZES, `At most ${MAX_BLANK_SIZES} sizes.`),
    colours: z.array(blankColourSchema).min(1, 'Add at least one colour.').max(MAX_BLANK_COLOURS, `At most ${MAX_BLANK_COLOURS} colours.`),
  })
  .superRefine((t, ctx) => {
    unique(t.sizes, (s) => s.label, 'sizes', 'Two sizes have this label.', ctx);
    unique(t.colours, (c) => c.name, 'colours', 'Two colours have this name.', ctx);
  });
export type BlankTypeInput = z.input<typeof blankTypeInputSchema>;

/** PUT /api/seller/blanks/:id/stock: counts per size × colour (rows left out keep their count). */
export const blankStockInputSchema = z.object({
  rows: z
    .array(
      z.object({
        sizeId: z.string().min(1).max(64),
        colourId: z.string().min(1).max(64),
        quantity: z.number({ error: 'Enter how many you have.' }).int('Whole items.').min(0, 'Cannot be negative.').max(MAX_STOCK, `At most ${MAX_STOCK}.`),
        lowStock: z.number({ error: 'Enter when to warn.' }).int('Whole items.').min(0, 'Cannot be negative.').max(MAX_STOCK, `At most ${MAX_STOCK}.`),
      }),
    )
    .max(MAX_BLANK_SIZES * MAX_BLANK_COLOURS),
});
export type BlankStockInput = z.input<typeof blankStockInputSchema>;
export const blankIdParams = z.object({ id: z.string().min(1).max(64) });

export type StockRow = { sizeId: string; colourId: string; quantity: number; lowStock: number; held: number };
/** A blank type as the seller's API returns it, with its stock grid. */
export type SellerBlankType = {
  id: string;
  name: string;
  shape: BlankKind;
  sizes: BlankSize[];
  colours: Array<BlankColour & { photoUrl: string | null }>;
  stock: StockRow[];
  createdAt: number;
  updatedAt: number;
};

export const stockKey = (sizeId: string, colourId: string) => `${sizeId}:${colourId}`;
export const isLowStock = (r: Pick<StockRow, 'quantity' | 'lowStock'>) => r.quantity > 0 && r.quantity <= r.lowStock;

// ---------------------------------------------------------------- a listing's offer
/** The part of a listing's content that names its blank type and the sizes and colours it offers. */
export const listingBlankOfferSchema = z
  .object({
    blankTypeId: z.string({ error: 'Pick a blank type.' }).trim().min(1, 'Pick a blank type.').max(64),
    sizeIds: z.array(z.string().min(1).max(64)).min(1, 'Offer at least one size.').max(MAX_BLANK_SIZES),
    colourIds: z.array(z.string().min(1).max(64)).min(1, 'Offer at least one colour.').max(MAX_BLANK_COLOURS),
    defaultColourId: z.string().max(64).nullable().default(null),
    /** vinyl on blank colour pairings the seller means (tone on tone): no contrast warning on this listing */
    intendedPairs: z
      .array(z.object({ materialId: z.string().min(1).max(64), colourId: z.string().min(1).max(64) }))
      .max(64, 'At most 64 intended pairings.')
      .default([]),
  })
  .refine((o) => o.defaultColourId === null || o.colourIds.includes(o.defaultColourId), { message: 'The default colour must be one of the colours offered.', path: ['defaultColourId'] });
export type ListingBlankOffer = z.output<typeof listingBlankOfferSchema>;

/** A listing's offer resolved against its shop's blank type: what the shopper picks from. */
export type ResolvedBlankOffer = {
  blankTypeId: string;
  /** the blank type's name, e.g. "Tee": the colour group is "<name> colour" */
  name: string;
  shape: BlankKind;
  sizes: BlankSize[];
  colours: Array<BlankColour & { photoUrl: string | null }>;
  defaultColourId: string;
  intendedPairs: ListingBlankOffer['intendedPairs'];
  /** size × colour pairs with none left (stockKey) */
  soldOut: string[];
};

export const offerSize = (offer: Pick<ResolvedBlankOffer, 'sizes'> | null | undefined, sizeId: string | null | undefined) => (sizeId ? offer?.sizes.find((s) => s.id === sizeId) : undefined);
export const offerColour = (offer: Pick<ResolvedBlankOffer, 'colours'> | null | undefined, colourId: string | null | undefined) =>
  colourId ? offer?.colours.find((c) => c.id === colourId) : undefined;

/**
 * The shopper's size and colour as the engine's listing mapping takes them (listingDesign's
 * `blankChoice`), or null when the listing offers none: the same for the preview and the cart.
 */
export function blankChoiceOf(
  offer: Pick<ResolvedBlankOffer, 'name' | 'sizes' | 'colours'> | null | undefined,
  choices: { sizeId?: string | null; colourId?: string | null },
): DesignBlankChoice | null {
  if (!offer) return null;
  const size = offerSize(offer, choices.sizeId);
  const colour = offerColour(offer, choices.colourId);
  return { noun: offer.name, size: size ?? null, colour: colour ? { name: colour.name, hex: colour.hex } : null };
}

/**
 * What is picked for the shopper when nothing is: the only size when there is one (a wrong size is
 * a wasted item, so among several none is), and the shop's default colour.
 */
export function blankDefaults(
  offer: Pick<ResolvedBlankOffer, 'sizes' | 'defaultColourId'> | null | undefined,
  choices: { sizeId?: string | null; colourId?: string | null },
): { sizeId: string | null; colourId: string | null } {
  return {
    sizeId: choices.sizeId ?? (offer?.sizes.length === 1 ? offer.sizes[0]!.id : null),
    colourId: choices.colourId ?? offer?.defaultColourId ?? null,
  };
}

/** "4T · Heather grey": how a line names its blank choice (cart, order, workroom, e-mails). */
export function blankChoiceLabel(blank: { sizeLabel?: string | null; colourName?: string | null }): string | null {
  const parts = [blank.sizeLabel, blank.colourName].filter((x): x is string => !!x);
  return parts.length ? parts.join(' · ') : null;
}

/** The four usual blank types a seller starts from, with the engine's default print area as one size. */
export const BLANK_PRESETS: ReadonlyArray<{ name: string; shape: BlankKind }> = [
  { name: 'Tee', shape: 'kids_tee' },
  { name: 'Tote', shape: 'tote' },
  { name: 'Zip pouch', shape: 'pouch' },
  { name: 'Drawstring bag', shape: 'drawstring_bag' },
];
export function presetInput(shape: BlankKind, name: string): BlankTypeInput {
  const b = DEFAULT_BLANKS.find((x) => x.kind === shape) ?? DEFAULT_BLANKS[0]!;
  return {
    name,
    shape,
    sizes: [{ label: 'One size', widthMm: b.printArea.widthMm, heightMm: b.printArea.heightMm, topOffsetMm: b.topOffsetMm, priceDiffMinor: 0, chestMm: null, lengthMm: null }],
    colours: [{ name: 'Natural', hex: '#efe6d4', photoId: null }],
  };
}
