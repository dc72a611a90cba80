/**
 * A listing's personalisation schema plus the shopper's choices → the engine's compose() input.
 * One mapping for both sides: the personaliser's live preview (src/features/personaliser) and the
 * cart's snapshot (server/features/cart/design.ts, buildSnapshot), so the preview draws exactly
 * what the cart stores (tests/client/design-parity.test.ts). Pure: no I/O, mm inside.
 *
 * Looking up materials and motifs is the caller's: the server's lookups throw with field messages
 * when a colour or motif is gone; the client's return undefined and the piece is left out.
 */

import { materialLabel } from '../material-label.ts';
// type-only: shared/schemas imports the engine at run time, not the other way round
import type { DesignBlankChoice, DesignSize } from '../schemas/blanks.ts';
import type { Choices, ListingContent } from '../schemas/listing.ts';
import { type Blank, defaultBlank } from './blanks.ts';
import type { ComposeInput, FieldDef, MaterialKind } from './compose.ts';
import { FONT_CATALOG } from './font-catalog.ts';
import type { StoredMotifGeometry } from './motif.ts';
import { MATERIAL_KINDS } from './press-defaults.ts';

/** A blank's kind and the print area on it (a listing's blank; a line snapshot's with its top offset). */
export type DesignBlank = { kind: string; label: string; widthMm: number; heightMm: number; topOffsetMm: number };
/** The parts of a listing's content the design is made from. */
export type DesignContent = Pick<ListingContent, 'blank' | 'personalisation'>;
export type DesignMaterial = { id: string; kind: string; colourName: string; colourHex: string };
export type DesignMotif = { id: string; geometry: StoredMotifGeometry };

export type DesignLookups = {
  /** `key` names the choice (e.g. `textColours.name`) so a throwing lookup can point at the field. */
  material(id: string | null | undefined, key: string): DesignMaterial | undefined;
  motif(id: string): DesignMotif | undefined;
};

export type ListingDesign = {
  /** null when there is nothing to draw yet (no text typed, no motif) */
  input: ComposeInput | null;
  /** the personalisation in words, in the order the cart line shows it */
  summary: Array<{ label: string; value: string }>;
  /** engine layerId → material id */
  pieceMaterial: Map<string, string>;
};

export const asMaterialKind = (k: string): MaterialKind => ((MATERIAL_KINDS as readonly string[]).includes(k) ? (k as MaterialKind) : 'smooth');

export type { DesignBlankChoice, DesignSize };

/**
 * The blank as the engine sees it: the kind's drawn size with the listing's own print area, or the
 * chosen size's print area and top offset when the listing offers sizes.
 */
export function blankFor(content: { blank: DesignBlank }, size?: DesignSize | null): Blank {
  const base = defaultBlank(content.blank.kind) ?? defaultBlank('tote')!;
  const area = size ?? content.blank;
  return {
    ...base,
    name: content.blank.label || base.name,
    printArea: { widthMm: area.widthMm, heightMm: area.heightMm },
    topOffsetMm: area.topOffsetMm,
    // the seller's print area decides how far down the design may go
    maxDesignBottomMm: Math.max(base.maxDesignBottomMm, area.topOffsetMm + area.heightMm),
  };
}

export function listingDesign(content: DesignContent, choices: Choices, lookups: DesignLookups, blankChoice?: DesignBlankChoice | null): ListingDesign {
  const p = content.personalisation;
  const fields: FieldDef[] = [];
  const engineChoices: ComposeInput['choices'] = {};
  const summary: ListingDesign['summary'] = [];
  const pieceMaterial = new Map<string, string>();

  const outlineMat = p.outline ? lookups.material(choices.outlineMaterialId ?? p.outline.colourChoices[0], 'outlineMaterialId') : undefined;

  const motifChoice = p.motifChoices.find((m) => m.motifId === choices.motifId);
  const motif = motifChoice ? lookups.motif(motifChoice.motifId) : undefined;
  if (motifChoice && motif) {
    const layers: Record<string, { materialKind: MaterialKind; colour: string }> = {};
    for (const l of motifChoice.layers) {
      const m = lookups.material(l.mode === 'fixed' ? l.materialId : (choices.motifColours[l.layerId] ?? l.colourChoices?.[0]), `motifColours.${l.layerId}`);
      if (!m) continue;
      layers[l.layerId] = { materialKind: asMaterialKind(m.kind), colour: m.colourHex };
      pieceMaterial.set(`motif:${l.layerId}`, m.id);
      if (l.mode === 'shopper') summary.push({ label: `${motifChoice.label}: ${l.layerId}`, value: m.colourName });
    }
    fields.push({
      kind: 'motif',
      id: 'motif',
      heightMm: Math.min((blankChoice?.size ?? content.blank).heightMm * 0.55, 120),
      materialKind: 'smooth',
      options: [{ id: motif.id, geometry: motif.geometry, layers }],
    });
    engineChoices.motif = { motifId: motif.id };
    summary.unshift({ label: 'Motif', value: motifChoice.label });
  }

  for (const f of p.textFields) {
    const c = choices.texts[f.id];
    const text = c?.text.trim() ?? '';
    if (!text) continue;
    const m = lookups.material(choices.textColours[f.id] ?? f.colourChoices[0], `textColours.${f.id}`);
    if (!m) continue;
    const letterHeightMm = c?.letterHeightMm ?? f.defaultLetterHeightMm;
    fields.push({
      kind: 'text',
      id: f.id,
      fontId: c?.fontId ?? f.defaultFontId,
      letterHeightMm,
      maxLetterHeightMm: f.defaultLetterHeightMm * 2,
      maxChars: f.maxLength,
      ...(f.minLetterHeightMm ? { minLetterHeightMm: f.minLetterHeightMm } : {}),
      materialKind: asMaterialKind(m.kind),
      colour: m.colourHex,
      ...(outlineMat && p.outline ? { outline: { offsetMm: p.outline.offsetMm, materialKind: asMaterialKind(outlineMat.kind), colour: outlineMat.colourHex } } : {}),
    });
    engineChoices[f.id] = { text, letterHeightMm };
    pieceMaterial.set(f.id, m.id);
    if (outlineMat) pieceMaterial.set(`${f.id}-outline`, outlineMat.id);
    summary.push({ label: f.label, value: text });
    const font = FONT_CATALOG.find((x) => x.id === (c?.fontId ?? f.defaultFontId));
    if (font) summary.push({ label: `${f.label} font`, value: font.family });
    summary.push({ label: `${f.label} colour`, value: materialLabel(m) });
  }
  if (outlineMat) summary.push({ label: 'Outline colour', value: materialLabel(outlineMat) });
  // the blank's size and colour lead the summary: cart, order, proof and e-mails show them first
  if (blankChoice?.colour) summary.unshift({ label: `${blankChoice.noun} colour`, value: blankChoice.colour.name });
  if (blankChoice?.size) summary.unshift({ label: 'Size', value: blankChoice.size.label });

  return { input: fields.length === 0 ? null : { blank: blankFor(content, blankChoice?.size), fields, choices: engineChoices }, summary, pieceMaterial };
}
