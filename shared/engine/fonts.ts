/**
 * Font registry: fonts are loaded from bytes (Uint8Array) that the caller supplies — the server
 * reads the TTF from disk, the browser fetches the same file — so both sides parse identical data
 * with fontkit and produce identical outlines. No I/O here.
 */
import * as fontkit from 'fontkit';
import type { FontKind } from './font-catalog.ts';
import { accelerateShaping } from './shaping.ts';

export interface FontSource {
  id: string;
  family: string;
  kind: FontKind;
  licence: string;
  minLetterHeightMm: number;
  bytes: Uint8Array;
}

/** fontkit's font object, narrowed to what we use (its typings are for Node Buffers). */
export type FkFont = fontkit.Font;
export type FkGlyph = fontkit.Glyph;

export interface LoadedFont {
  id: string;
  family: string;
  kind: FontKind;
  licence: string;
  minLetterHeightMm: number;
  unitsPerEm: number;
  /**
   * Cap height in font units, measured as the top of the "H" glyph's outline bbox — not the
   * OS/2 capHeight field, which is up to 2.6 % lower in our fonts (Bangers). Letter height means this height.
   */
  capHeightUnits: number;
  /** Every character the cmap maps, sorted by code point (controls left out). */
  characters: string;
  hasChar(cp: number): boolean;
  font: FkFont;
  /** Byte length of the font file (for integrity checks between client and server). */
  byteLength: number;
}

export interface FontRegistry {
  get(id: string): LoadedFont | undefined;
  require(id: string): LoadedFont;
  list(): LoadedFont[];
}

/** Parses one font's bytes. Throws when the bytes are not a single TrueType/OpenType font or lack "H". */
export function loadFont(src: FontSource, opts: { accelerate?: boolean } = {}): LoadedFont {
  // fontkit reads through a DataView, so a plain Uint8Array works in Node and the browser alike.
  const parsed = fontkit.create(src.bytes as unknown as Buffer);
  if (!('layout' in parsed) || !('unitsPerEm' in parsed)) throw new Error(`Font ${src.id}: not a single font file.`);
  const font = parsed as FkFont;
  // fontkit caches one Glyph object per id with the code points of its first use, so after an "ë"
  // is decomposed into "e" + mark, every later "e" would report "ë". Hand out a thin view per use
  // that carries this use's code points and shares everything else (outline, metrics) with the cache.
  const fk = font as unknown as { getGlyph(id: number, cps?: number[]): { codePoints: number[] } | null };
  const getGlyph = fk.getGlyph.bind(font);
  fk.getGlyph = (id: number, cps: number[] = []) => {
    const g = getGlyph(id, cps);
    if (!g || g.codePoints === cps || sameCodePoints(g.codePoints, cps)) return g;
    // Metrics go on the cached glyph first, so views read them from it instead of each computing
    // their own (fontkit memoises them on `this`, which for a view would be the view).
    void (g as unknown as { advanceWidth: number }).advanceWidth;
    return Object.create(g, { codePoints: { value: cps, enumerable: true } });
  };
  // Exact speed-ups of fontkit's shaping (shaping.ts); `accelerate: false` only for tests that
  // compare against fontkit as published.
  if (opts.accelerate !== false) accelerateShaping(font);
  const h = font.glyphForCodePoint(0x48);
  if (!h || h.id === 0) throw new Error(`Font ${src.id}: it has no "H" to measure the letter height.`);
  const capHeightUnits = h.bbox.maxY; // H sits on the baseline: its top is the cap height
  const cps = [...font.characterSet].filter((c) => c >= 0x20 && !(c >= 0x7f && c <= 0x9f) && c <= 0x10ffff).sort((a, b) => a - b);
  const set = new Set(cps);
  return {
    id: src.id,
    family: src.family,
    kind: src.kind,
    licence: src.licence,
    minLetterHeightMm: src.minLetterHeightMm,
    unitsPerEm: font.unitsPerEm,
    capHeightUnits,
    characters: String.fromCodePoint(...cps),
    hasChar: (cp) => set.has(cp),
    font,
    byteLength: src.bytes.byteLength,
  };
}

function sameCodePoints(a: number[], b: number[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/** What describes a font apart from its bytes (a catalogue entry or the API's font info carries it). */
export type FontMeta = Pick<FontSource, 'id' | 'family' | 'kind' | 'licence' | 'minLetterHeightMm'>;

/** A font's source from its description and its bytes (other fields of `meta` are left out). */
export const fontSource = (meta: FontMeta, bytes: Uint8Array): FontSource => ({
  id: meta.id,
  family: meta.family,
  kind: meta.kind,
  licence: meta.licence,
  minLetterHeightMm: meta.minLetterHeightMm,
  bytes,
});

/**
 * The registry over fonts already parsed — the one builder the server, the browser and the compose
 * worker use. It reads `fonts` live, so a font added to the map later is found.
 */
export function fontRegistry(fonts: ReadonlyMap<string, LoadedFont>): FontRegistry {
  return {
    get: (id) => fonts.get(id),
    require(id) {
      const f = fonts.get(id);
      if (!f) throw new Error(`Unknown font "${id}".`);
      return f;
    },
    list: () => [...fonts.values()],
  };
}

/** Parses every source and returns their registry. */
export function createFontRegistry(sources: readonly FontSource[]): FontRegistry {
  return fontRegistry(new Map(sources.map((s) => [s.id, loadFont(s)])));
}
