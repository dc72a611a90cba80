/**
 * Listings: the editor's input (what a seller saves), the shopper's choices on a listing, the pure
 * price of a set of choices, and the listing states. Used by the server routes and the client forms.
 */
import { z } from 'zod';
import { DEFAULT_BLANKS, type BlankKind as EngineBlankKind } from '../engine/blanks.ts';
import { FONT_IDS } from '../engine/font-catalog.ts';
import { listingBlankOfferSchema, offerColour, offerSize, type ResolvedBlankOffer, stockKey } from './blanks.ts';
import { cheapestDesign } from './cheapest-design.ts';
import { pageQuery } from './pagination.ts';

// ---------------------------------------------------------------- occasions (shoppers browse by these)
export const OCCASIONS = ['autumn-harvest', 'winter-lights', 'spring-picnic', 'back-to-school', 'birthday'] as const;
export const occasionSchema = z.enum(OCCASIONS, { error: 'Pick one of the occasions.' });
export type Occasion = z.infer<typeof occasionSchema>;
export const OCCASION_LABELS: Record<Occasion, string> = {
  'autumn-harvest': 'Autumn harvest',
  'winter-lights': 'Winter lights',
  'spring-picnic': 'Spring picnic',
  'back-to-school': 'Back to school',
  birthday: 'Birthday',
};

// ---------------------------------------------------------------- blanks (from the engine's defaults)
export const BLANK_KINDS = ['tote', 'kids_tee', 'adult_tee', 'pouch', 'drawstring_bag'] as const satisfies readonly EngineBlankKind[];
export const blankKindSchema = z.enum(BLANK_KINDS, { error: 'Pick a blank.' });
export type BlankKind = z.infer<typeof blankKindSchema>;

/** Print area and top offset per blank, from shared/engine/blanks.ts (sizes from memory); seller-editable. */
export const BLANK_DEFAULTS: Record<BlankKind, { label: string; widthMm: number; heightMm: number; topOffsetMm: number }> = Object.fromEntries(
  BLANK_KINDS.map((k) => {
    const b = DEFAULT_BLANKS.find((x) => x.kind === k)!;
    return [k, { label: b.name, widthMm: b.printArea.widthMm, heightMm: b.printArea.heightMm, topOffsetMm: b.topOffsetMm }];
  }),
) as Record<BlankKind, { label: string; widthMm: number; heightMm: number; topOffsetMm: number }>;

const id = (what: string) =>
  z
    .string({ error: `Pick a ${what}.` })
    .trim()
    .min(1, `Pick a ${what}.`)
    .max(64, `That ${what} id is too long.`);
const fieldKey = z
  .string({ error: 'Give it a short id.' })
  .trim()
  .regex(/^[a-z0-9][a-z0-9_-]{0,31}$/, 'Use 1–32 lower-case letters, digits, - or _.');
const label = z.string({ error: 'Enter a label.' }).trim().min(1, 'Enter a label.').max(60, 'Use at most 60 characters.');
const minor = (what: string) =>
  z
    .number({ error: `Enter the ${what}.` })
    .int(`The ${what} is in whole cents.`)
    .min(0, `The ${what} cannot be negative.`)
    .max(10_000_000, `The ${what} is too large.`);
const mm = (what: string, min: number, max: number) =>
  z
    .number({ error: `Enter the ${what} in mm.` })
    .min(min, `The ${what} is at least ${min} mm.`)
    .max(max, `The ${what} is at most ${max} mm.`);

export const blankSchema = z
  .object({
    kind: blankKindSchema,
    label: z.string().trim().max(60, 'Use at most 60 characters.').optional(),
    widthMm: mm('print width', 20, 600).optional(),
    heightMm: mm('print height', 20, 600).optional(),
    topOffsetMm: mm('top offset', 0, 300).optional(),
  })
  .transform((b) => {
    const d = BLANK_DEFAULTS[b.kind];
    return {
      kind: b.kind,
      label: b.label || d.label,
      widthMm: b.widthMm ?? d.widthMm,
      heightMm: b.heightMm ?? d.heightMm,
      topOffsetMm: b.topOffsetMm ?? d.topOffsetMm,
    };
  });
export type Blank = z.output<typeof blankSchema>;

// ---------------------------------------------------------------- personalisation schema
const colourChoices = z.array(id('material')).max(24, 'At most 24 colours.');

/**
 * The colour a shopper starts with: the first one offered. Every list of colours a shopper picks
 * from (a text field's, an outline's, a shopper layer's) has at least one, checked by this schema.
 */
export function defaultColour(choices: readonly string[]): string {
  const first = choices[0];
  if (first === undefined) throw new Error('A colour choice list is empty: the listing schema requires at least one colour.');
  return first;
}

export const textFieldSchema = z
  .object({
    id: fieldKey,
    label,
    maxLength: z.number({ error: 'Enter a maximum length.' }).int().min(1, 'At least 1 character.').max(40, 'At most 40 characters.').default(12),
    fontIds: z
      .array(z.enum(FONT_IDS, { error: 'Pick a font from the list.' }))
      .min(1, 'Allow at least one font.')
      .max(FONT_IDS.length),
    defaultFontId: z.enum(FONT_IDS, { error: 'Pick a font from the list.' }).optional(),
    defaultLetterHeightMm: mm('letter height', 5, 200).default(50),
    /** the smallest letter height this item should have (larger than the font's own minimum); optional */
    minLetterHeightMm: mm('smallest letter height', 5, 100).optional(),
    required: z.boolean().default(true),
    colourChoices: colourChoices.min(1, 'Offer at least one colour.'),
  })
  // fontIds has at least one entry here: zod runs a transform only on input that passed min(1) above
  .transform((f) => ({ ...f, defaultFontId: f.defaultFontId ?? f.fontIds[0]! }))
  .refine((f) => f.fontIds.includes(f.defaultFontId), { message: 'The default font must be one of the allowed fonts.', path: ['defaultFontId'] });
export type TextField = z.output<typeof textFieldSchema>;

export const motifLayerChoiceSchema = z
  .object({
    layerId: z.string().trim().min(1).max(64),
    /** fixed: always `materialId`; shopper: the shopper picks one of `colourChoices` */
    mode: z.enum(['fixed', 'shopper']),
    materialId: id('material').optional(),
    colourChoices: colourChoices.optional(),
  })
  .superRefine((l, ctx) => {
    if (l.mode === 'fixed' && !l.materialId) ctx.addIssue({ code: 'custom', message: 'Pick the material for this layer.', path: ['materialId'] });
    if (l.mode === 'shopper' && !(l.colourChoices && l.colourChoices.length > 0)) ctx.addIssue({ code: 'custom', message: 'Offer at least one colour for this layer.', path: ['colourChoices'] });
  });
export type MotifLayerChoice = z.output<typeof motifLayerChoiceSchema>;

export const motifChoiceSchema = z.object({
  motifId: id('motif'),
  label,
  layers: z.array(motifLayerChoiceSchema).min(1, 'Map at least one layer.').max(4, 'At most 4 layers on one item.'),
});
export type MotifChoice = z.output<typeof motifChoiceSchema>;

export const outlineSchema = z.object({
  offsetMm: mm('outline offset', 1, 15).default(3),
  colourChoices: colourChoices.min(1, 'Offer at least one outline colour.'),
});

export const personalisationSchema = z
  .object({
    textFields: z.array(textFieldSchema).max(4, 'At most 4 text fields.').default([]),
    motifChoices: z.array(motifChoiceSchema).max(12, 'At most 12 motifs.').default([]),
    motifRequired: z.boolean().default(false),
    outline: outlineSchema.nullable().default(null),
  })
  .superRefine((p, ctx) => {
    const seen = new Set<string>();
    p.textFields.forEach((f, i) => {
      if (seen.has(f.id)) ctx.addIssue({ code: 'custom', message: 'Two text fields have this id.', path: ['textFields', i, 'id'] });
      seen.add(f.id);
    });
    const motifs = new Set<string>();
    p.motifChoices.forEach((m, i) => {
      if (motifs.has(m.motifId)) ctx.addIssue({ code: 'custom', message: 'This motif is offered twice.', path: ['motifChoices', i, 'motifId'] });
      motifs.add(m.motifId);
    });
    if (p.motifRequired && p.motifChoices.length === 0) ctx.addIssue({ code: 'custom', message: 'Offer a motif, or make the motif optional.', path: ['motifRequired'] });
    if (p.textFields.length === 0 && p.motifChoices.length === 0) ctx.addIssue({ code: 'custom', message: 'Add a text field or a motif for the shopper to personalise.', path: ['textFields'] });
  });
export type Personalisation = z.output<typeof personalisationSchema>;

// ---------------------------------------------------------------- the editor's input
export const DESCRIPTION_FORMATS = ['plain', 'markdown'] as const;

export const listingInputSchema = z.object({
  title: z.string({ error: 'Enter a title.' }).trim().min(3, 'Use at least 3 characters.').max(100, 'Use at most 100 characters.'),
  description: z.string().trim().max(5000, 'Use at most 5,000 characters.').default(''),
  /** plain: shown as text with line breaks; markdown: rendered with HTML disabled (raw HTML comes out as text) */
  descriptionFormat: z.enum(DESCRIPTION_FORMATS).default('plain'),
  blank: blankSchema,
  basePriceMinor: minor('base price').min(100, 'The base price is at least 1.00.'),
  extraLayerPriceMinor: minor('price per extra layer').default(0),
  occasions: z
    .array(occasionSchema)
    .max(OCCASIONS.length)
    .default([])
    .transform((o) => [...new Set(o)]),
  photoIds: z.array(id('photo')).max(8, 'At most 8 photos.').default([]),
  hasSmallDecorations: z.boolean().default(false),
  personalisation: personalisationSchema,
  /** the shop's blank type and the sizes and colours this listing offers (null: the plain blank above) */
  blankOffer: listingBlankOfferSchema.nullable().default(null),
  /** workroom costing (the seller's own figures; never shown to shoppers) */
  blankCostMinor: minor('blank cost').default(0),
  minutesPerLayer: z.number().min(0).max(240).default(0),
});
/** what the form holds (defaults optional) */
export type ListingInput = z.input<typeof listingInputSchema>;
/**
 * A listing's content: what the editor's schema outputs, what the server stores (the draft and the
 * approved live copy, both JSON columns typed with it), and what the engine's mapping reads.
 */
export type ListingContent = z.output<typeof listingInputSchema>;

export const LISTING_STATES = ['draft', 'in_review', 'live', 'rejected', 'paused'] as const;
export const listingStateSchema = z.enum(LISTING_STATES);
export type ListingState = z.infer<typeof listingStateSchema>;

// ---------------------------------------------------------------- the shopper's choices
export const choicesSchema = z.object({
  texts: z
    .record(
      z.string().max(32),
      z.object({
        text: z.string().max(200, 'That text is too long.'),
        fontId: z.string().max(64),
        letterHeightMm: z.number().min(1).max(300),
      }),
    )
    .default({}),
  textColours: z.record(z.string().max(32), z.string().max(64)).default({}),
  motifId: z.string().max(64).nullable().default(null),
  motifColours: z.record(z.string().max(64), z.string().max(64)).default({}),
  outlineMaterialId: z.string().max(64).nullable().default(null),
  /** the blank's size and colour (listings with a blank offer) */
  sizeId: z.string().max(64).nullable().default(null),
  colourId: z.string().max(64).nullable().default(null),
});
export type ChoicesInput = z.input<typeof choicesSchema>;
export type Choices = z.output<typeof choicesSchema>;

/** The parts of a listing's content that pricing and checking need. */
export type PricedContent = Pick<ListingContent, 'basePriceMinor' | 'extraLayerPriceMinor' | 'personalisation'>;

/**
 * The layers (one vinyl material each, cut and pressed as one) that a set of choices uses, bottom
 * to top: outline, motif layers, then text. A text field left empty adds no layer; a field without
 * a chosen colour uses its first colour. Pieces of the same material share one layer: they are cut
 * from the same sheet and pressed together (DEVELOPERS.md, "Cutting and nesting").
 */
export function layersForChoices(content: PricedContent, choices: Choices): string[] {
  const p = content.personalisation;
  const used: string[] = [];
  const add = (m: string | undefined | null) => {
    if (m && !used.includes(m)) used.push(m);
  };
  if (p.outline) add(choices.outlineMaterialId ?? p.outline.colourChoices[0]);
  const motif = p.motifChoices.find((m) => m.motifId === choices.motifId);
  if (motif) for (const l of motif.layers) add(l.mode === 'fixed' ? l.materialId : (choices.motifColours[l.layerId] ?? l.colourChoices?.[0]));
  for (const f of p.textFields) {
    const t = choices.texts[f.id]?.text.trim() ?? '';
    if (t) add(choices.textColours[f.id] ?? f.colourChoices[0]);
  }
  return used;
}

/**
 * The layers the base price covers: those of the cheapest design a shopper can make on this listing
 * (cheapest-design.ts). A layer the shopper never chose (a fixed layer of a required motif, say) is
 * part of every design, so it is never charged as an extra.
 */
export function includedLayers(content: PricedContent): number {
  return Math.max(1, cheapestDesign(content.personalisation).layers);
}

/**
 * Price in minor units: base price plus the extra-layer price for every layer past the included ones,
 * plus the chosen size's price difference (when the listing offers sizes: `offer`, resolved from the
 * shop's blank type by the server, or as the listing page carries it).
 */
export function priceForChoices(content: PricedContent, choices: Choices, offer?: Pick<ResolvedBlankOffer, 'sizes'> | null): number {
  const layers = layersForChoices(content, choices).length;
  const sizeDiff = offerSize(offer, choices.sizeId)?.priceDiffMinor ?? 0;
  return content.basePriceMinor + content.extraLayerPriceMinor * Math.max(0, layers - includedLayers(content)) + sizeDiff;
}

/** The choices of the cheapest design a shopper can make (required texts filled with a one-letter name). */
export function cheapestChoices(content: PricedContent): Choices {
  const d = cheapestDesign(content.personalisation);
  const texts: Choices['texts'] = {};
  for (const f of content.personalisation.textFields) if (d.filledTextFieldIds.includes(f.id)) texts[f.id] = { text: 'A', fontId: f.defaultFontId, letterHeightMm: f.defaultLetterHeightMm };
  return { texts, textColours: d.textColours, motifId: d.motifId, motifColours: d.motifColours, outlineMaterialId: d.outlineMaterialId, sizeId: null, colourId: null };
}

/** The "from" price: what the cheapest design a shopper can make costs. */
export function fromPriceMinor(content: PricedContent): number {
  return priceForChoices(content, cheapestChoices(content));
}

/**
 * Checks choices against the listing's personalisation schema: required fields, lengths, allowed
 * fonts, colours and motifs. Returns field messages keyed like the form (`texts.name.text`);
 * empty when all is well. Glyph coverage and minimum letter height are the engine's checks.
 */
export function checkChoices(content: PricedContent, choices: Choices, offer?: ResolvedBlankOffer | null): Record<string, string> {
  const p = content.personalisation;
  const errs: Record<string, string> = {};
  if (offer) {
    const size = offerSize(offer, choices.sizeId);
    const colour = offerColour(offer, choices.colourId);
    if (!size) errs.sizeId = choices.sizeId ? 'Pick one of the sizes offered.' : 'Pick a size.';
    if (!colour) errs.colourId = choices.colourId ? 'Pick one of the colours offered.' : `Pick a ${offer.name.toLowerCase()} colour.`;
    if (size && colour && offer.soldOut.includes(stockKey(size.id, colour.id))) errs.sizeId = `Size ${size.label} in ${colour.name.toLowerCase()} is sold out. Pick another size or colour.`;
  }
  const fieldIds = new Set(p.textFields.map((f) => f.id));
  for (const k of Object.keys(choices.texts)) if (!fieldIds.has(k)) errs[`texts.${k}`] = 'This listing has no such text field.';
  for (const f of p.textFields) {
    const c = choices.texts[f.id];
    const text = c?.text.trim() ?? '';
    if (!text) {
      if (f.required) errs[`texts.${f.id}.text`] = `Enter the ${f.label.toLowerCase()}.`;
      continue;
    }
    if ([...text].length > f.maxLength) errs[`texts.${f.id}.text`] = `Use at most ${f.maxLength} characters.`;
    if (c && !f.fontIds.includes(c.fontId)) errs[`texts.${f.id}.fontId`] = 'Pick one of the fonts this listing offers.';
    const colour = choices.textColours[f.id];
    if (colour !== undefined && !f.colourChoices.includes(colour)) errs[`textColours.${f.id}`] = 'Pick one of the colours offered.';
  }
  const motif = p.motifChoices.find((m) => m.motifId === choices.motifId);
  if (choices.motifId !== null && !motif) errs.motifId = 'Pick one of the motifs offered.';
  if (choices.motifId === null && p.motifRequired) errs.motifId = 'Pick a motif.';
  if (motif)
    for (const [layerId, materialId] of Object.entries(choices.motifColours)) {
      const l = motif.layers.find((x) => x.layerId === layerId);
      if (!l || l.mode !== 'shopper' || !l.colourChoices?.includes(materialId)) errs[`motifColours.${layerId}`] = 'Pick one of the colours offered for this layer.';
    }
  if (choices.outlineMaterialId !== null && !p.outline?.colourChoices.includes(choices.outlineMaterialId)) errs.outlineMaterialId = 'Pick one of the outline colours offered.';
  return errs;
}

// ---------------------------------------------------------------- seller-side views
export const listingIdParams = z.object({ id: z.string().min(1).max(64) });
/** GET /api/seller/listings: the shop's listings, last changed first, a page at a time */
export const SELLER_LISTINGS_PAGE_SIZE = 25;
export const sellerListingsQuerySchema = pageQuery(SELLER_LISTINGS_PAGE_SIZE).extend({ state: listingStateSchema.optional() });
export type SellerListingsQuery = z.output<typeof sellerListingsQuerySchema>;

/** A listing as the seller's API returns it. */
export type SellerListing = {
  id: string;
  slug: string;
  state: ListingState;
  pendingReview: boolean;
  rejectionReason: string | null;
  /** goes up by one on every save of the working copy; moderation decides on one revision */
  revision: number;
  draft: ListingContent;
  live: ListingContent | null;
  currency: string;
  publishedAt: number | null;
  createdAt: number;
  updatedAt: number;
};

/** The catalogue's denormalised columns for a live copy (filters and sort read these, not the JSON). */
export function liveColumns(content: Pick<ListingContent, 'title' | 'occasions'> & PricedContent & { blank: { kind: string } }) {
  return {
    liveTitle: content.title,
    livePriceMinor: fromPriceMinor(content),
    liveBlankKind: content.blank.kind,
    liveOccasions: `,${content.occasions.join(',')},`,
  };
}

/** Every material id a listing's personalisation refers to (for ownership checks and the listing page). */
export function materialIdsOf(p: Personalisation): string[] {
  const ids = new Set<string>();
  for (const f of p.textFields) f.colourChoices.forEach((m) => ids.add(m));
  for (const m of p.motifChoices)
    for (const l of m.layers) {
      if (l.materialId) ids.add(l.materialId);
      l.colourChoices?.forEach((c) => ids.add(c));
    }
  p.outline?.colourChoices.forEach((m) => ids.add(m));
  return [...ids];
}
