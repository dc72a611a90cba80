/**
 * The fonts Namesake ships for names. Each is one complete TTF (SIL Open Font License 1.1) from an
 * `@expo-google-fonts/*` npm package: not a Unicode-range subset, so Latin-1 and Latin Extended-A
 * (Zoë, José, Łukasz, Ørjan) are in the same file. Static weights, never variable fonts.
 * The server reads `packageFile` from node_modules; the browser fetches the same bytes from the API.
 *
 * Minimum letter heights (cap height): script 12 mm, the trade's rule of thumb ("script letters under about
 * 12 mm cap height get hard to weed and read", from memory); print faces are our own defaults
 * (no published source): bold faces 8 mm; the condensed caps and the thin handwriting 10 mm.
 */
export type FontKind = 'script' | 'print';

export interface FontCatalogEntry {
  id: string;
  family: string;
  weight: number;
  /** What the face is for, in plain words. */
  style: 'rounded bold' | 'connected script' | 'slab' | 'tall condensed caps' | 'handwritten' | 'playful display';
  kind: FontKind;
  licence: 'OFL-1.1';
  minLetterHeightMm: number;
  /** Path of the TTF inside node_modules. */
  packageFile: string;
}

export const FONT_CATALOG: readonly FontCatalogEntry[] = Object.freeze([
  {
    id: 'baloo-bold',
    family: 'Baloo 2',
    weight: 700,
    style: 'rounded bold',
    kind: 'print',
    licence: 'OFL-1.1',
    minLetterHeightMm: 8,
    packageFile: '@expo-google-fonts/baloo-2/700Bold/Baloo2_700Bold.ttf',
  },
  {
    id: 'dancing-script-bold',
    family: 'Dancing Script',
    weight: 700,
    style: 'connected script',
    kind: 'script',
    licence: 'OFL-1.1',
    minLetterHeightMm: 12,
    packageFile: '@expo-google-fonts/dancing-script/700Bold/DancingScript_700Bold.ttf',
  },
  { id: 'bitter-bold', family: 'Bitter', weight: 700, style: 'slab', kind: 'print', licence: 'OFL-1.1', minLetterHeightMm: 8, packageFile: '@expo-google-fonts/bitter/700Bold/Bitter_700Bold.ttf' },
  {
    id: 'bebas-neue',
    family: 'Bebas Neue',
    weight: 400,
    style: 'tall condensed caps',
    kind: 'print',
    licence: 'OFL-1.1',
    minLetterHeightMm: 10,
    packageFile: '@expo-google-fonts/bebas-neue/400Regular/BebasNeue_400Regular.ttf',
  },
  // Handwritten: Patrick Hand rather than Caveat — fontkit and HarfBuzz disagree on Caveat's contextual
  // alternates (calt), so its widths could not be held to the HarfBuzz reference.
  {
    id: 'patrick-hand',
    family: 'Patrick Hand',
    weight: 400,
    style: 'handwritten',
    kind: 'print',
    licence: 'OFL-1.1',
    minLetterHeightMm: 10,
    packageFile: '@expo-google-fonts/patrick-hand/400Regular/PatrickHand_400Regular.ttf',
  },
  {
    id: 'bangers',
    family: 'Bangers',
    weight: 400,
    style: 'playful display',
    kind: 'print',
    licence: 'OFL-1.1',
    minLetterHeightMm: 8,
    packageFile: '@expo-google-fonts/bangers/400Regular/Bangers_400Regular.ttf',
  },
] as const);

export const FONT_IDS = FONT_CATALOG.map((f) => f.id) as [string, ...string[]];

export function catalogEntry(id: string): FontCatalogEntry | undefined {
  return FONT_CATALOG.find((f) => f.id === id);
}

/**
 * The letters every bundled font must draw: Latin-1 Supplement letters (U+00C0–U+00FF) and Latin
 * Extended-A (U+0100–U+017E). U+017F (ſ, archaic long s) is left out: none of the display faces
 * draws it, and no current name uses it.
 */
export function requiredCoverage(): string {
  let s = '';
  for (let c = 0x41; c <= 0x5a; c++) s += String.fromCodePoint(c, c + 0x20);
  for (let c = 0xc0; c <= 0xff; c++) if (c !== 0xd7 && c !== 0xf7) s += String.fromCodePoint(c);
  for (let c = 0x100; c <= 0x17e; c++) s += String.fromCodePoint(c);
  return s;
}
