// The shopper's choices on a live listing → the engine's composition → the snapshot a cart line
// keeps (title, personalisation in words, pieces for the preview, unit price). The mapping from the
// listing's personalisation schema to the engine's field definitions is shared with the personaliser
// (shared/engine/listing-design.ts); here the server adds validation, pricing and the snapshot.
import { type ComposedItem, ComposeError, type ComposeInput, compose } from '../../../shared/engine/compose.ts';
import type { FontRegistry } from '../../../shared/engine/fonts.ts';
import { type DesignMaterial, type DesignMotif, listingDesign } from '../../../shared/engine/listing-design.ts';
import { blankChoiceOf, offerColour, offerSize, type ResolvedBlankOffer } from '../../../shared/schemas/blanks.ts';
import type { LineSnapshot } from '../../../shared/schemas/cart.ts';
import { type Choices, checkChoices, type ListingContent, layersForChoices, materialIdsOf, type Personalisation, personalisationSchema, priceForChoices } from '../../../shared/schemas/listing.ts';
import { formatSmallLength } from '../../../shared/units.ts';
import { AppError, badRequest } from '../../http/app-error.ts';
import type { WorkPool } from '../../workers/pool.ts';

export type MaterialInfo = DesignMaterial;
export type MotifInfo = DesignMotif & { name: string };

/**
 * The copy of a listing a shopper buys from, as stored (written through the editor's schema), or
 * null when there is none or it is malformed; its personalisation is read through the shared schema
 * again so older rows get today's defaults.
 */
export function readLiveContent(live: ListingContent | null | undefined): ListingContent | null {
  if (!live || typeof live.title !== 'string' || typeof live.basePriceMinor !== 'number') return null;
  const p = personalisationSchema.safeParse(live.personalisation);
  return p.success ? { ...live, personalisation: p.data } : null;
}

/**
 * The materials and motifs buildSnapshot looks up, keyed by id, from a shop's rows: only materials
 * the listing's personalisation refers to (materialIdsOf), so any other id is "no longer available".
 */
export function snapshotLookups(p: Personalisation, materialRows: readonly MaterialInfo[], motifRows: readonly MotifInfo[]): { materials: Map<string, MaterialInfo>; motifs: Map<string, MotifInfo> } {
  const ids = new Set(materialIdsOf(p));
  return {
    materials: new Map(materialRows.filter((m) => ids.has(m.id)).map((m) => [m.id, m])),
    motifs: new Map(motifRows.map((m) => [m.id, { id: m.id, name: m.name, geometry: m.geometry }])),
  };
}

/** Price of one item from the live listing and the choices (never from the client). */
export const unitPrice = (content: ListingContent, choices: Choices, offer?: ResolvedBlankOffer | null) => priceForChoices(content, choices, offer);

type SnapshotArgs = {
  registry: FontRegistry;
  listing: { id: string; slug: string; shopId: string; currency: string };
  content: Pick<ListingContent, 'title' | 'blank' | 'basePriceMinor' | 'extraLayerPriceMinor' | 'personalisation'>;
  choices: Choices;
  materials: Map<string, MaterialInfo>;
  motifs: Map<string, MotifInfo>;
  /** the listing's sizes and colours resolved from the shop's blank type (blanks feature), or none */
  offer?: ResolvedBlankOffer | null;
};

/**
 * Validates the choices against the listing (shared checkChoices), composes the item with the
 * engine and returns the line's snapshot. Bad choices → 400 with field messages in the form's keys.
 * Composes in this thread (seeding, price checks); the cart uses buildSnapshotOffThread.
 */
export function buildSnapshot(args: SnapshotArgs): LineSnapshot {
  const design = prepare(args);
  return finish(
    args,
    design,
    composeHere(() => compose(args.registry, design.input)),
  );
}

/** buildSnapshot with the composition done in the worker pool (plain data in, plain data out). */
export async function buildSnapshotOffThread(args: Omit<SnapshotArgs, 'registry'> & { pool: WorkPool }): Promise<LineSnapshot> {
  const design = prepare(args);
  let composed: ComposedItem;
  try {
    composed = await args.pool.run({ kind: 'compose', input: design.input });
  } catch (e) {
    throw composeRefusal(e);
  }
  return finish(args, design, composed);
}

function prepare(args: Omit<SnapshotArgs, 'registry'>) {
  const { content, choices, materials, motifs, offer } = args;
  const errs = checkChoices(content, choices, offer);
  if (Object.keys(errs).length > 0) throw badRequest('Some of the personalisation needs attention.', prefix(errs));

  const design = listingDesign(
    content,
    choices,
    {
      material(id, key) {
        const m = id ? materials.get(id) : undefined;
        if (!m) throw badRequest('This colour is no longer available. Pick another.', { [`choices.${key}`]: 'This colour is no longer available. Pick another.' });
        return m;
      },
      motif(id) {
        const m = motifs.get(id);
        if (!m) throw badRequest('This motif is no longer available. Pick another.', { 'choices.motifId': 'This motif is no longer available. Pick another.' });
        return m;
      },
    },
    blankChoiceOf(offer, choices),
  );
  const { summary, pieceMaterial } = design;
  if (!design.input) throw badRequest('Add a name or pick a motif first.', { choices: 'Add a name or pick a motif first.' });
  return { summary, pieceMaterial, input: design.input as ComposeInput };
}

const composeRefusal = (e: unknown): unknown => (e instanceof ComposeError ? badRequest(e.message, { [`choices.texts.${e.fieldId}.text`]: e.message }) : e);

function composeHere(fn: () => ComposedItem): ComposedItem {
  try {
    return fn();
  } catch (e) {
    throw composeRefusal(e);
  }
}

function finish(args: Omit<SnapshotArgs, 'registry'>, design: ReturnType<typeof prepare>, composed: ComposedItem): LineSnapshot {
  const { content, choices } = args;
  const { summary, pieceMaterial } = design;
  const missing = composed.warnings.filter((w) => w.code === 'missing_characters');
  if (missing.length > 0) {
    const fieldsOut: Record<string, string> = {};
    for (const w of missing) fieldsOut[`choices.texts.${w.fieldId}.text`] = w.message;
    throw new AppError(400, 'unsupported_characters', Object.values(fieldsOut)[0]!, fieldsOut);
  }

  const bb = composed.bboxMm;
  const r2 = (n: number) => Math.round(n * 100) / 100;
  const shown = withLetterHeights(summary, content.personalisation.textFields, composed.letterHeights);
  return {
    listingId: args.listing.id,
    listingTitle: content.title,
    listingSlug: args.listing.slug,
    shopId: args.listing.shopId,
    currency: args.listing.currency,
    blank: snapshotBlank(content, args.offer, choices),
    choices,
    summary: shown,
    geometry: {
      widthMm: r2(bb.maxX - bb.minX),
      heightMm: r2(bb.maxY - bb.minY),
      bboxMm: { minX: r2(bb.minX), minY: r2(bb.minY), maxX: r2(bb.maxX), maxY: r2(bb.maxY) },
      layerCount: layersForChoices(content, choices).length,
      pieces: composed.pieces.map((pc) => ({ d: pc.path, colourHex: pc.colour, materialId: pieceMaterial.get(pc.layerId) ?? null })),
    },
    unitPriceMinor: priceForChoices(content, choices, args.offer),
  };
}

function snapshotBlank(content: SnapshotArgs['content'], offer: ResolvedBlankOffer | null | undefined, choices: Choices): LineSnapshot['blank'] {
  const b = content.blank;
  const size = offerSize(offer, choices.sizeId);
  const colour = offerColour(offer, choices.colourId);
  return {
    kind: b.kind,
    label: b.label,
    widthMm: size?.widthMm ?? b.widthMm,
    heightMm: size?.heightMm ?? b.heightMm,
    ...(offer && size ? { blankTypeId: offer.blankTypeId, sizeId: size.id, sizeLabel: size.label } : {}),
    ...(colour ? { colourId: colour.id, colourName: colour.name, colourHex: colour.hex } : {}),
  };
}

/** The letter height each name is really cut at (after fitting), shown after its font, for the shopper and the shop. */
function withLetterHeights(summary: LineSnapshot['summary'], fields: readonly { id: string; label: string }[], heights: Record<string, number>): LineSnapshot['summary'] {
  const out: LineSnapshot['summary'] = [];
  for (const row of summary) {
    out.push(row);
    const f = fields.find((x) => row.label === `${x.label} font`);
    const h = f ? heights[f.id] : undefined;
    if (f && h !== undefined) out.push({ label: `${f.label} letter height`, value: formatSmallLength(h) });
  }
  return out;
}

function prefix(errs: Record<string, string>): Record<string, string> {
  return Object.fromEntries(Object.entries(errs).map(([k, v]) => [`choices.${k}`, v]));
}
