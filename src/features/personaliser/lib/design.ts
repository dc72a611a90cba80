/**
 * A listing's personalisation schema plus the shopper's choices → the engine's compose() input.
 * This is the same mapping the server applies when a line is added to the cart
 * (server/features/cart/design.ts, buildSnapshot); tests/client/design-parity.test.ts holds the
 * two to the same pieces. (It belongs in shared/ once the cart's owner can move theirs there.)
 */
import type { ComposeInput, FieldDef, MaterialKind } from '../../../../shared/engine/compose.ts';
import { defaultBlank, type Blank } from '../../../../shared/engine/blanks.ts';
import type { MotifGeometry } from '../../../../shared/engine/motif.ts';
import type { ListingPage, PublicMaterial } from '../../../../shared/schemas/catalog.ts';
import type { Choices } from '../../../../shared/schemas/listing.ts';

const KINDS: MaterialKind[] = ['smooth', 'glitter', 'flock', 'metallic', 'patterned'];
const asKind = (k: string): MaterialKind => (KINDS.includes(k as MaterialKind) ? (k as MaterialKind) : 'smooth');

export type DesignListing = Pick<ListingPage, 'content' | 'materials' | 'motifs'>;

/** The blank as the engine sees it: the kind's drawn size with the listing's own print area. */
export function blankFor(content: DesignListing['content']): Blank {
  const base = defaultBlank(content.blank.kind) ?? defaultBlank('tote')!;
  return {
    ...base,
    name: content.blank.label || base.name,
    printArea: { widthMm: content.blank.widthMm, heightMm: content.blank.heightMm },
    topOffsetMm: content.blank.topOffsetMm,
    maxDesignBottomMm: Math.max(base.maxDesignBottomMm, content.blank.topOffsetMm + content.blank.heightMm),
  };
}

/** The material a choice resolves to (the field's first colour when none is picked yet). */
export function materialFor(listing: DesignListing, id: string | null | undefined): PublicMaterial | undefined {
  return id ? listing.materials.find((m) => m.id === id) : undefined;
}

/**
 * compose() input for the choices, or null when there is nothing to draw yet (no text typed,
 * no motif). Unknown colours or motifs are skipped rather than thrown: the server has the last word.
 */
export function designInput(listing: DesignListing, choices: Choices): ComposeInput | null {
  const p = listing.content.personalisation;
  const fields: FieldDef[] = [];
  const engineChoices: ComposeInput['choices'] = {};
  const outlineMat = p.outline ? materialFor(listing, choices.outlineMaterialId ?? p.outline.colourChoices[0]) : undefined;

  const motifChoice = p.motifChoices.find((m) => m.motifId === choices.motifId);
  const motif = motifChoice ? listing.motifs.find((m) => m.id === motifChoice.motifId) : undefined;
  if (motifChoice && motif) {
    const layers: Record<string, { materialKind: MaterialKind; colour: string }> = {};
    for (const l of motifChoice.layers) {
      const m = materialFor(listing, l.mode === 'fixed' ? l.materialId : (choices.motifColours[l.layerId] ?? l.colourChoices?.[0]));
      if (m) layers[l.layerId] = { materialKind: asKind(m.kind), colour: m.colourHex };
    }
    fields.push({
      kind: 'motif', id: 'motif', heightMm: Math.min(listing.content.blank.heightMm * 0.55, 120), materialKind: 'smooth',
      options: [{ id: motif.id, geometry: motif.geometry as MotifGeometry, layers }],
    });
    engineChoices.motif = { motifId: motif.id };
  }

  for (const f of p.textFields) {
    const c = choices.texts[f.id];
    const text = c?.text.trim() ?? '';
    if (!text) continue;
    const m = materialFor(listing, choices.textColours[f.id] ?? f.colourChoices[0]);
    if (!m) continue;
    const letterHeightMm = c?.letterHeightMm ?? f.defaultLetterHeightMm;
    fields.push({
      kind: 'text', id: f.id, fontId: c?.fontId ?? f.defaultFontId, letterHeightMm, maxLetterHeightMm: f.defaultLetterHeightMm * 2, maxChars: f.maxLength,
      materialKind: asKind(m.kind), colour: m.colourHex,
      ...(outlineMat && p.outline ? { outline: { offsetMm: p.outline.offsetMm, materialKind: asKind(outlineMat.kind), colour: outlineMat.colourHex } } : {}),
    });
    engineChoices[f.id] = { text, letterHeightMm };
  }
  if (fields.length === 0) return null;
  return { blank: blankFor(listing.content), fields, choices: engineChoices };
}
