/**
 * The shopper's choices on one listing and everything that follows from them without the font
 * engine: the compose() input, the blank, the price and layer count, the motif picker's options.
 * Choices are read back from and kept in localStorage (saved-choices.ts), written just after the
 * frame so the write never sits between a keystroke and its paint.
 */
import { useEffect, useMemo, useState } from 'react';
import { contrastWarnings } from '../../../../shared/engine/contrast.ts';
import type { StoredMotifGeometry } from '../../../../shared/engine/motif.ts';
import { offerColour, offerSize } from '../../../../shared/schemas/blanks.ts';
import type { ListingPage, PublicMaterial } from '../../../../shared/schemas/catalog.ts';
import { type Choices, defaultColour, layersForChoices, priceForChoices, type TextField } from '../../../../shared/schemas/listing.ts';
import { blankFor, designInput } from '../lib/design.ts';
import { loadChoices, saveChoices } from '../lib/saved-choices.ts';

export type ChoicesUpdate = (c: Choices) => Choices;
export type TextChoice = Choices['texts'][string];
export type MotifOption = { motifId: string; label: string; geometry: StoredMotifGeometry | null; colours: Record<string, string | undefined> };

/** A text field's current choice, or its defaults before the shopper has touched it. */
export const textChoice = (choices: Choices, f: TextField): TextChoice => choices.texts[f.id] ?? { text: '', fontId: f.defaultFontId, letterHeightMm: f.defaultLetterHeightMm };

/** Changes part of one text field's choice (text, font or letter height). */
export const withText =
  (f: TextField, patch: Partial<TextChoice>): ChoicesUpdate =>
  (s) => ({
    ...s,
    texts: { ...s.texts, [f.id]: { ...textChoice(s, f), ...patch } },
  });

export function useDesignState(listing: ListingPage) {
  const p = listing.content.personalisation;
  const offer = listing.blankOffer ?? null;
  const [choices, setChoices] = useState<Choices>(() => loadChoices(listing.id, p, offer));

  useEffect(() => {
    const t = setTimeout(() => saveChoices(listing.id, choices), 0);
    return () => clearTimeout(t);
  }, [listing.id, choices]);

  const input = useMemo(() => designInput(listing, choices), [listing, choices]);
  const fontIds = useMemo(() => [...new Set(p.textFields.flatMap((f) => f.fontIds))], [p.textFields]);
  const size = offerSize(offer, choices.sizeId) ?? null;
  const colour = offerColour(offer, choices.colourId) ?? null;
  // the chosen size's print area and top offset (the listing's own until a size is picked)
  const blank = useMemo(() => blankFor(listing.content, size), [listing.content, size]);
  const materials = useMemo(() => new Map(listing.materials.map((m) => [m.id, m])), [listing.materials]);
  const materialsOf = (ids: readonly string[] | undefined): PublicMaterial[] => (ids ?? []).flatMap((id) => materials.get(id) ?? []);

  /** Picks a motif; the layers' colours carry over where the new motif offers them, else its first. */
  const withMotif =
    (motifId: string | null): ChoicesUpdate =>
    (s) => {
      const layers = p.motifChoices.find((m) => m.motifId === motifId)?.layers ?? [];
      const motifColours: Choices['motifColours'] = {};
      for (const l of layers) {
        if (l.mode !== 'shopper' || !l.colourChoices?.length) continue;
        const saved = s.motifColours[l.layerId];
        motifColours[l.layerId] = saved && l.colourChoices.includes(saved) ? saved : defaultColour(l.colourChoices);
      }
      return { ...s, motifId, motifColours };
    };

  /** The motifs offered, each drawn in the colours its layers would get. */
  const motifOptions: MotifOption[] = p.motifChoices.map((m) => ({
    motifId: m.motifId,
    label: m.label,
    geometry: listing.motifs.find((x) => x.id === m.motifId)?.geometry ?? null,
    colours: Object.fromEntries(
      m.layers.map((l) => [
        l.layerId,
        materials.get(l.mode === 'fixed' ? (l.materialId ?? '') : ((m.motifId === choices.motifId ? choices.motifColours[l.layerId] : undefined) ?? l.colourChoices?.[0] ?? ''))?.colourHex,
      ]),
    ),
  }));

  return {
    personalisation: p,
    choices,
    setChoices,
    input,
    /** every font the listing allows (what the preview loads) */
    fontIds,
    blank,
    materialsOf,
    motifOptions,
    motifChoice: p.motifChoices.find((m) => m.motifId === choices.motifId),
    price: priceForChoices(listing.content, choices, offer),
    /** every vinyl colour of the design that will hardly show on the chosen blank colour (WCAG 2.2 contrast below 3:1) */
    contrast:
      offer && colour
        ? contrastWarnings(
            layersForChoices(listing.content, choices).flatMap((id) => materials.get(id) ?? []),
            { id: colour.id, name: colour.name, hex: colour.hex, noun: offer.name.toLowerCase() },
            offer.intendedPairs,
          )
        : [],
    /** the listing's sizes and colours (null: one plain blank), and the shopper's pick of each */
    offer,
    size,
    colour,
    layerCount: layersForChoices(listing.content, choices).length,
    /** the names typed, for labels and messages */
    texts: p.textFields
      .map((f) => choices.texts[f.id]?.text.trim())
      .filter(Boolean)
      .join(', '),
    withMotif,
  };
}
