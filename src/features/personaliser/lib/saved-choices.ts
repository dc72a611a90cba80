/**
 * What the shopper typed and picked, kept per listing in localStorage so a reload (or a failed
 * add-to-cart) loses nothing. Read back through the shared choices schema and the listing's own
 * options: a font or colour the listing no longer offers falls back to its default.
 */
import { blankDefaults, type ResolvedBlankOffer } from '../../../../shared/schemas/blanks.ts';
import { type Choices, choicesSchema, defaultColour, type Personalisation } from '../../../../shared/schemas/listing.ts';

type Offer = Pick<ResolvedBlankOffer, 'sizes' | 'colours' | 'defaultColourId'> | null | undefined;

const key = (listingId: string) => `namesake.personalise.${listingId}`;

/** The listing's defaults; no size is picked for the shopper (a wrong size is a wasted item), the colour is the shop's default. */
export function defaultChoices(p: Personalisation, offer?: Offer): Choices {
  return {
    texts: Object.fromEntries(p.textFields.map((f) => [f.id, { text: '', fontId: f.defaultFontId, letterHeightMm: f.defaultLetterHeightMm }])),
    textColours: Object.fromEntries(p.textFields.map((f) => [f.id, defaultColour(f.colourChoices)])),
    motifId: p.motifChoices[0]?.motifId ?? null,
    motifColours: Object.fromEntries(
      p.motifChoices.flatMap((m) =>
        (m.motifId === p.motifChoices[0]?.motifId ? m.layers : []).filter((l) => l.mode === 'shopper' && l.colourChoices?.length).map((l) => [l.layerId, defaultColour(l.colourChoices!)]),
      ),
    ),
    outlineMaterialId: p.outline ? defaultColour(p.outline.colourChoices) : null,
    ...blankDefaults(offer, {}),
  };
}

/** Keeps only what the listing still offers, filling the rest from the defaults. */
export function reconcile(p: Personalisation, saved: Choices, offer?: Offer): Choices {
  const d = defaultChoices(p, offer);
  const texts: Choices['texts'] = {};
  for (const f of p.textFields) {
    const s = saved.texts[f.id];
    texts[f.id] = {
      text: typeof s?.text === 'string' ? s.text.slice(0, f.maxLength * 2) : '',
      fontId: s && f.fontIds.includes(s.fontId) ? s.fontId : f.defaultFontId,
      letterHeightMm: s && s.letterHeightMm > 0 && s.letterHeightMm <= f.defaultLetterHeightMm * 2 ? s.letterHeightMm : f.defaultLetterHeightMm,
    };
  }
  const textColours: Choices['textColours'] = {};
  for (const f of p.textFields) {
    const s = saved.textColours[f.id];
    textColours[f.id] = s !== undefined && f.colourChoices.includes(s) ? s : defaultColour(f.colourChoices);
  }
  const motif = p.motifChoices.find((m) => m.motifId === saved.motifId);
  const motifId = motif ? motif.motifId : saved.motifId === null && !p.motifRequired ? null : d.motifId;
  const layers = p.motifChoices.find((m) => m.motifId === motifId)?.layers ?? [];
  const motifColours: Choices['motifColours'] = {};
  for (const l of layers) {
    if (l.mode !== 'shopper' || !l.colourChoices?.length) continue;
    const s = saved.motifColours[l.layerId];
    motifColours[l.layerId] = s && l.colourChoices.includes(s) ? s : defaultColour(l.colourChoices);
  }
  const outlineMaterialId = p.outline
    ? saved.outlineMaterialId && p.outline.colourChoices.includes(saved.outlineMaterialId)
      ? saved.outlineMaterialId
      : defaultColour(p.outline.colourChoices)
    : null;
  const sizeId = saved.sizeId && offer?.sizes.some((s) => s.id === saved.sizeId) ? saved.sizeId : d.sizeId;
  const colourId = saved.colourId && offer?.colours.some((c) => c.id === saved.colourId) ? saved.colourId : d.colourId;
  return { texts, textColours, motifId, motifColours, outlineMaterialId, sizeId, colourId };
}

export function loadChoices(listingId: string, p: Personalisation, offer?: Offer): Choices {
  try {
    const raw = localStorage.getItem(key(listingId));
    if (raw) {
      const parsed = choicesSchema.safeParse(JSON.parse(raw));
      if (parsed.success) return reconcile(p, parsed.data, offer);
    }
  } catch {
    // storage blocked or corrupt: start fresh
  }
  return defaultChoices(p, offer);
}

export function saveChoices(listingId: string, choices: Choices): void {
  try {
    localStorage.setItem(key(listingId), JSON.stringify(choices));
  } catch {
    // private mode / quota: the page still works, it just won't remember
  }
}

export function forgetChoices(listingId: string): void {
  try {
    localStorage.removeItem(key(listingId));
  } catch {
    /* ignore */
  }
}
