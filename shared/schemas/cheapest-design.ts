/**
 * The cheapest design a shopper can make on a listing: the allowed choices that use the fewest
 * vinyl layers. Pricing reads it twice: the layers of that design are what the base price covers
 * (a layer the shopper never chose, such as a fixed layer of a required motif, is never charged as
 * an extra), and the "from" price shown on cards and the listing page is the price of that design.
 *
 * It counts layers the way `layersForChoices` (listing.ts) does: one layer per material, pieces of
 * one material share it; an outline is always cut when the listing has one; an empty text field
 * adds nothing; an optional motif may be left out. The shapes below are structural so this file
 * needs nothing from listing.ts (which imports it).
 */

type LayerSpec = { layerId: string; mode: 'fixed' | 'shopper'; materialId?: string | undefined; colourChoices?: readonly string[] | undefined };
type PersonalisationShape = {
  textFields: readonly { id: string; required: boolean; colourChoices: readonly string[] }[];
  motifChoices: readonly { motifId: string; layers: readonly LayerSpec[] }[];
  motifRequired: boolean;
  outline: { colourChoices: readonly string[] } | null;
};

export type CheapestDesign = {
  layers: number;
  motifId: string | null;
  motifColours: Record<string, string>;
  textColours: Record<string, string>;
  /** the text fields this design fills (the required ones; one optional field when nothing else is on the item) */
  filledTextFieldIds: string[];
  outlineMaterialId: string | null;
};

/** Search budget: each slot has at most 24 colours and there are at most 9 slots, so a cap keeps it bounded. */
const MAX_STEPS = 20_000;

type Slot = { key: string; options: readonly string[] };

/** Fewest distinct materials when each slot takes one of its options, starting from `used`. */
function fewestMaterials(slots: readonly Slot[], start: ReadonlySet<string>): { size: number; picks: Record<string, string> } {
  let best: { size: number; picks: Record<string, string> } | null = null;
  let steps = 0;
  const picks: Record<string, string> = {};
  const visit = (i: number, used: Set<string>) => {
    steps++;
    if (best && used.size >= best.size) return;
    if (i === slots.length) {
      best = { size: used.size, picks: { ...picks } };
      return;
    }
    const slot = slots[i]!;
    // a colour already cut costs nothing more, and no other pick can do better
    const shared = slot.options.find((o) => used.has(o));
    if (shared !== undefined) {
      picks[slot.key] = shared;
      visit(i + 1, used);
      return;
    }
    for (const o of slot.options) {
      if (best && steps > MAX_STEPS) return;
      picks[slot.key] = o;
      used.add(o);
      visit(i + 1, used);
      used.delete(o);
    }
  };
  visit(0, new Set(start));
  return best ?? { size: Number.POSITIVE_INFINITY, picks: {} };
}

export function cheapestDesign(p: PersonalisationShape): CheapestDesign {
  const motifOptions: (PersonalisationShape['motifChoices'][number] | null)[] = p.motifRequired ? [...p.motifChoices] : [null, ...p.motifChoices];
  let best: CheapestDesign | null = null;
  for (const motif of motifOptions) {
    const fixed = new Set<string>();
    const slots: Slot[] = [];
    if (p.outline) slots.push({ key: 'outline', options: p.outline.colourChoices });
    for (const l of motif?.layers ?? []) {
      if (l.mode === 'fixed' && l.materialId) fixed.add(l.materialId);
      else if (l.colourChoices?.length) slots.push({ key: `motif:${l.layerId}`, options: l.colourChoices });
    }
    let filled = p.textFields.filter((f) => f.required);
    // an item with nothing on it cannot be made: then the cheapest design fills one text field
    if (!motif && filled.length === 0) {
      if (!p.textFields[0]) continue;
      filled = [p.textFields[0]];
    }
    for (const f of filled) slots.push({ key: `text:${f.id}`, options: f.colourChoices });
    const found = fewestMaterials(slots, fixed);
    if (best && found.size >= best.layers) continue;
    const motifColours: Record<string, string> = {};
    const textColours: Record<string, string> = {};
    for (const [k, v] of Object.entries(found.picks)) {
      if (k.startsWith('motif:')) motifColours[k.slice(6)] = v;
      else if (k.startsWith('text:')) textColours[k.slice(5)] = v;
    }
    best = { layers: found.size, motifId: motif?.motifId ?? null, motifColours, textColours, filledTextFieldIds: filled.map((f) => f.id), outlineMaterialId: found.picks.outline ?? null };
  }
  return best ?? { layers: 0, motifId: null, motifColours: {}, textColours: {}, filledTextFieldIds: [], outlineMaterialId: null };
}
