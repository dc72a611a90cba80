/**
 * Default blanks: the undecorated items with their print area and where the design starts.
 * Sizes are from memory (DEVELOPERS.md, "Blanks and print areas"; a seller may correct them). Coordinates: mm, origin at the
 * top-left of the blank laid flat, y down. The print area is centred horizontally; its top is
 * `topOffsetMm` below the top edge (tote, bag, pouch) or the collar (tees).
 */
export type BlankKind = 'tote' | 'kids_tee' | 'adult_tee' | 'pouch' | 'drawstring_bag';

export interface Blank {
  id: string;
  kind: BlankKind;
  name: string;
  widthMm: number;
  heightMm: number;
  printArea: { widthMm: number; heightMm: number };
  /** Distance from the top edge / collar to the top of the design. */
  topOffsetMm: number;
  topOffsetFrom: 'top edge' | 'collar';
  /** The design must end above this line (distance from the top); e.g. a tote's upper half. */
  maxDesignBottomMm: number;
  source: string;
}

export const DEFAULT_BLANKS: readonly Blank[] = Object.freeze([
  {
    id: 'tote',
    kind: 'tote',
    name: 'Tote bag',
    widthMm: 380,
    heightMm: 410,
    printArea: { widthMm: 250, heightMm: 250 },
    topOffsetMm: 50,
    topOffsetFrom: 'top edge',
    // A tote rests on its bottom: keep the design off the lower part, in the upper half (common practice).
    maxDesignBottomMm: 205,
    source: 'about 38 × 41 cm, print area up to 25 × 25 cm (from memory); upper half (common practice); 5 cm top offset is our default',
  },
  {
    id: 'kids_tee',
    kind: 'kids_tee',
    name: "Kids' tee",
    widthMm: 400,
    heightMm: 500,
    printArea: { widthMm: 200, heightMm: 200 },
    topOffsetMm: 50,
    topOffsetFrom: 'collar',
    maxDesignBottomMm: 250,
    source: 'print area up to 20 × 20 cm; top about 5 cm below the collar (from memory); garment size is our default',
  },
  {
    id: 'adult_tee',
    kind: 'adult_tee',
    name: 'Adult tee',
    widthMm: 520,
    heightMm: 720,
    printArea: { widthMm: 280, heightMm: 300 },
    topOffsetMm: 75,
    topOffsetFrom: 'collar',
    maxDesignBottomMm: 375,
    source: 'print area up to 28 × 30 cm; top about 7.5 cm below the collar (from memory); garment size is our default',
  },
  {
    id: 'pouch',
    kind: 'pouch',
    name: 'Zip pouch',
    widthMm: 230,
    heightMm: 160,
    printArea: { widthMm: 180, heightMm: 100 },
    topOffsetMm: 30,
    topOffsetFrom: 'top edge',
    maxDesignBottomMm: 130,
    source: 'print area about 18 × 10 cm (from memory); pouch size and offset are our defaults',
  },
  {
    id: 'drawstring_bag',
    kind: 'drawstring_bag',
    name: 'Drawstring bag',
    widthMm: 340,
    heightMm: 420,
    printArea: { widthMm: 230, heightMm: 230 },
    topOffsetMm: 70,
    topOffsetFrom: 'top edge',
    // Like a tote it rests on its bottom: keep to the upper part; 7 cm clears the drawstring channel.
    maxDesignBottomMm: 300,
    source: 'our defaults (no published source); placement follows the tote rule (common practice)',
  },
] satisfies Blank[]);

export function defaultBlank(id: string): Blank | undefined {
  return DEFAULT_BLANKS.find((b) => b.id === id);
}

/** The space a design may use on a blank: the print area, cut short where the blank says so. */
export function usableArea(blank: Blank): { widthMm: number; heightMm: number } {
  return {
    widthMm: blank.printArea.widthMm,
    heightMm: Math.max(0, Math.min(blank.printArea.heightMm, blank.maxDesignBottomMm - blank.topOffsetMm)),
  };
}
