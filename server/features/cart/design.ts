// The shopper's choices on a live listing → the engine's composition → the snapshot a cart line
// keeps (title, personalisation in words, pieces for the preview, unit price). The mapping from the
// listing's personalisation schema to the engine's field definitions lives here; the engine itself
// stays pure (shared/engine/compose.ts).
import { compose, ComposeError, type ComposeInput, type FieldDef, type MaterialKind } from '../../../shared/engine/compose.ts';
import { defaultBlank, type Blank } from '../../../shared/engine/blanks.ts';
import type { MotifGeometry } from '../../../shared/engine/motif.ts';
import type { FontRegistry } from '../../../shared/engine/fonts.ts';
import { checkChoices, layersForChoices, priceForChoices, personalisationSchema, type Choices, type Personalisation } from '../../../shared/schemas/listing.ts';
import type { LineSnapshot } from '../../../shared/schemas/cart.ts';
import { AppError, badRequest } from '../../http/app-error.ts';

export type LiveContent = {
  title: string;
  blank: { kind: string; label: string; widthMm: number; heightMm: number; topOffsetMm: number };
  basePriceMinor: number;
  extraLayerPriceMinor: number;
  personalisation: Personalisation;
};

export type MaterialInfo = { id: string; kind: string; colourName: string; colourHex: string };
export type MotifInfo = { id: string; name: string; geometry: MotifGeometry };

const KINDS: MaterialKind[] = ['smooth', 'glitter', 'flock', 'metallic', 'patterned'];
const asKind = (k: string): MaterialKind => (KINDS.includes(k as MaterialKind) ? (k as MaterialKind) : 'smooth');

/** The live copy of a listing as stored (validated by the listing editor); re-read through the shared schema. */
export function readLiveContent(live: unknown): LiveContent | null {
  if (!live || typeof live !== 'object') return null;
  const l = live as Record<string, unknown>;
  const p = personalisationSchema.safeParse(l.personalisation);
  if (!p.success || typeof l.title !== 'string' || typeof l.basePriceMinor !== 'number') return null;
  return {
    title: l.title,
    blank: l.blank as LiveContent['blank'],
    basePriceMinor: l.basePriceMinor,
    extraLayerPriceMinor: typeof l.extraLayerPriceMinor === 'number' ? l.extraLayerPriceMinor : 0,
    personalisation: p.data,
  };
}

/** Price of one item from the live listing and the choices (never from the client). */
export const unitPrice = (content: LiveContent, choices: Choices) => priceForChoices(content, choices);

function blankFor(content: LiveContent): Blank {
  const base = defaultBlank(content.blank.kind) ?? defaultBlank('tote')!;
  return {
    ...base,
    name: content.blank.label || base.name,
    printArea: { widthMm: content.blank.widthMm, heightMm: content.blank.heightMm },
    topOffsetMm: content.blank.topOffsetMm,
    // the seller's print area decides how far down the design may go
    maxDesignBottomMm: Math.max(base.maxDesignBottomMm, content.blank.topOffsetMm + content.blank.heightMm),
  };
}

/**
 * Validates the choices against the listing (shared checkChoices), composes the item with the
 * engine and returns the line's snapshot. Bad choices → 400 with field messages in the form's keys.
 */
export function buildSnapshot(args: {
  registry: FontRegistry;
  listing: { id: string; slug: string; shopId: string; currency: string };
  content: LiveContent;
  choices: Choices;
  materials: Map<string, MaterialInfo>;
  motifs: Map<string, MotifInfo>;
}): LineSnapshot {
  const { content, choices, materials, motifs } = args;
  const p = content.personalisation;
  const errs = checkChoices(content, choices);
  if (Object.keys(errs).length > 0) throw badRequest('Some of the personalisation needs attention.', prefix(errs));

  const material = (id: string | undefined | null, key: string): MaterialInfo => {
    const m = id ? materials.get(id) : undefined;
    if (!m) throw badRequest('This colour is no longer available. Pick another.', { [`choices.${key}`]: 'This colour is no longer available. Pick another.' });
    return m;
  };

  const fields: FieldDef[] = [];
  const engineChoices: ComposeInput['choices'] = {};
  const summary: LineSnapshot['summary'] = [];
  const pieceMaterial = new Map<string, string>(); // engine layerId → material id

  const outlineMat = p.outline ? material(choices.outlineMaterialId ?? p.outline.colourChoices[0], 'outlineMaterialId') : null;

  const motifChoice = p.motifChoices.find((m) => m.motifId === choices.motifId);
  if (motifChoice) {
    const motif = motifs.get(motifChoice.motifId);
    if (!motif) throw badRequest('This motif is no longer available. Pick another.', { 'choices.motifId': 'This motif is no longer available. Pick another.' });
    const layers: Record<string, { materialKind: MaterialKind; colour: string }> = {};
    for (const l of motifChoice.layers) {
      const m = material(l.mode === 'fixed' ? l.materialId : (choices.motifColours[l.layerId] ?? l.colourChoices?.[0]), `motifColours.${l.layerId}`);
      layers[l.layerId] = { materialKind: asKind(m.kind), colour: m.colourHex };
      pieceMaterial.set(`motif:${l.layerId}`, m.id);
      if (l.mode === 'shopper') summary.push({ label: `${motifChoice.label}: ${l.layerId}`, value: m.colourName });
    }
    const printH = content.blank.heightMm;
    fields.push({ kind: 'motif', id: 'motif', heightMm: Math.min(printH * 0.55, 120), materialKind: 'smooth', options: [{ id: motif.id, geometry: motif.geometry, layers }] });
    engineChoices.motif = { motifId: motif.id };
    summary.unshift({ label: 'Motif', value: motifChoice.label });
  }

  for (const f of p.textFields) {
    const c = choices.texts[f.id];
    const text = c?.text.trim() ?? '';
    if (!text) continue;
    const m = material(choices.textColours[f.id] ?? f.colourChoices[0], `textColours.${f.id}`);
    const fontId = c?.fontId ?? f.defaultFontId;
    fields.push({
      kind: 'text',
      id: f.id,
      fontId,
      letterHeightMm: c?.letterHeightMm ?? f.defaultLetterHeightMm,
      maxLetterHeightMm: f.defaultLetterHeightMm * 2,
      maxChars: f.maxLength,
      materialKind: asKind(m.kind),
      colour: m.colourHex,
      ...(outlineMat && p.outline ? { outline: { offsetMm: p.outline.offsetMm, materialKind: asKind(outlineMat.kind), colour: outlineMat.colourHex } } : {}),
    });
    engineChoices[f.id] = { text, letterHeightMm: c?.letterHeightMm ?? f.defaultLetterHeightMm };
    pieceMaterial.set(f.id, m.id);
    if (outlineMat) pieceMaterial.set(`${f.id}-outline`, outlineMat.id);
    summary.push({ label: f.label, value: text });
    summary.push({ label: `${f.label} colour`, value: `${m.colourName} (${m.kind})` });
  }
  if (outlineMat) summary.push({ label: 'Outline colour', value: `${outlineMat.colourName} (${outlineMat.kind})` });

  if (fields.length === 0) throw badRequest('Add a name or pick a motif first.', { choices: 'Add a name or pick a motif first.' });

  let composed;
  try {
    composed = compose(args.registry, { blank: blankFor(content), fields, choices: engineChoices });
  } catch (e) {
    if (e instanceof ComposeError) throw badRequest(e.message, { [`choices.texts.${e.fieldId}.text`]: e.message });
    throw e;
  }
  const missing = composed.warnings.filter((w) => w.code === 'missing_characters');
  if (missing.length > 0) {
    const fieldsOut: Record<string, string> = {};
    for (const w of missing) fieldsOut[`choices.texts.${w.fieldId}.text`] = `This font cannot draw ${(w.characters ?? []).map((ch) => `“${ch}”`).join(', ')}. Remove ${(w.characters ?? []).length > 1 ? 'them' : 'it'} or pick another font.`;
    throw new AppError(400, 'unsupported_characters', Object.values(fieldsOut)[0]!, fieldsOut);
  }

  const bb = composed.bboxMm;
  const r2 = (n: number) => Math.round(n * 100) / 100;
  return {
    listingId: args.listing.id,
    listingTitle: content.title,
    listingSlug: args.listing.slug,
    shopId: args.listing.shopId,
    currency: args.listing.currency,
    blank: { kind: content.blank.kind, label: content.blank.label, widthMm: content.blank.widthMm, heightMm: content.blank.heightMm },
    choices,
    summary,
    geometry: {
      widthMm: r2(bb.maxX - bb.minX),
      heightMm: r2(bb.maxY - bb.minY),
      bboxMm: { minX: r2(bb.minX), minY: r2(bb.minY), maxX: r2(bb.maxX), maxY: r2(bb.maxY) },
      layerCount: layersForChoices(content, choices).length,
      pieces: composed.pieces.map((pc) => ({ d: pc.path, colourHex: pc.colour, materialId: pieceMaterial.get(pc.layerId) ?? null })),
    },
    unitPriceMinor: priceForChoices(content, choices),
  };
}

function prefix(errs: Record<string, string>): Record<string, string> {
  return Object.fromEntries(Object.entries(errs).map(([k, v]) => [`choices.${k}`, v]));
}
