/**
 * shaping.ts must not change a single glyph or unit: its fast path and its speed-ups of fontkit are
 * checked against fontkit 2.0.4 as published (the same bytes loaded with `accelerate: false`), on
 * random strings in every bundled font — Latin names, ligature pairs, combining marks, fraction
 * slashes, ignorables, variation selectors and other scripts, so both paths and the switches
 * between scripts are exercised — and the fast path against HarfBuzz (harfbuzzjs), the reference.
 */

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { FONT_CATALOG } from '../../../shared/engine/font-catalog.ts';
import { type LoadedFont, loadFont } from '../../../shared/engine/fonts.ts';
import { shapeFast, shapeText, shapeWithFontkit } from '../../../shared/engine/shaping.ts';
import { fontBytes } from './font-fixture.ts';
import { hbFont } from './harfbuzz-reference.ts';

const fonts = FONT_CATALOG.map((e) => {
  const src = { ...e, bytes: fontBytes(e.id) };
  return { id: e.id, fast: loadFont(src), plain: loadFont(src, { accelerate: false }), hb: hbFont(src.bytes) };
});

const NAME_LETTERS = [...'abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZäöüéèàçñøåłśźżčšžŁØÆæœßı'];
// Pieces that make fontkit do more than kern: ligatures, contextual forms, marks, fractions,
// ignorables, variation selectors, other scripts (and their shapers), astral characters.
const TRICKY = [
  'ff',
  'fi',
  'fl',
  'ffi',
  'ffl',
  'ft',
  'ij',
  'll',
  'tt',
  'Th',
  'Q',
  'fj',
  '1\u20442',
  '\u2044',
  '\u0300',
  '\u0301',
  '\u0308',
  '\u0327',
  '\u030c',
  '\u00ad',
  '\u200d',
  '\u200c',
  '\ufe0f',
  '\u200b',
  ' ',
  '-',
  "'",
  '’',
  '.',
  '&',
  '0',
  '7',
  'αβγ',
  'Жя',
  'مرحبا',
  'שלום',
  'नमस्ते',
  '美咲',
  '😀',
  '\ud800',
];
const nameArb = fc.array(fc.constantFrom(...NAME_LETTERS), { minLength: 1, maxLength: 14 }).map((a) => a.join(''));
const mixedArb = fc
  .array(fc.oneof({ weight: 3, arbitrary: fc.constantFrom(...NAME_LETTERS) }, { weight: 1, arbitrary: fc.constantFrom(...TRICKY) }), { minLength: 0, maxLength: 16 })
  .map((a) => a.join(''));

/** The result or the error, so that "fontkit throws" is compared too (it does on a few odd strings). */
function outcome(fn: () => unknown): unknown {
  try {
    return fn();
  } catch (err) {
    return { throws: String(err) };
  }
}

const byId = (id: string) => fonts.find((f) => f.id === id)!;
const fontArb = fc.constantFrom(...fonts.map((f) => f.id));

describe('shaping against fontkit as published', () => {
  it('when shaping random mixed strings in every font, then glyphs, code points and positions equal unpatched fontkit (fast-check)', () => {
    fc.assert(
      fc.property(fontArb, mixedArb, (id, t) => {
        const f = byId(id);
        expect(outcome(() => shapeText(f.fast.font, t))).toEqual(outcome(() => shapeWithFontkit(f.plain.font, t)));
      }),
      { numRuns: 3000 },
    );
  });

  it('when shaping random names, then the fast path is taken for most and equals unpatched fontkit exactly (fast-check)', () => {
    let fast = 0,
      runs = 0;
    fc.assert(
      fc.property(fontArb, nameArb, (id, t) => {
        const f = byId(id);
        const r = shapeFast(f.fast.font, t);
        runs++;
        if (r) {
          fast++;
          expect(r).toEqual(shapeWithFontkit(f.plain.font, t));
        }
        expect(shapeText(f.fast.font, t)).toEqual(shapeWithFontkit(f.plain.font, t));
      }),
      { numRuns: 3000 },
    );
    expect(fast / runs).toBeGreaterThan(0.5); // otherwise the test above would prove nothing about it
  });

  it('when a name needs a ligature or a combining mark, then the fast path declines and fontkit shapes it', () => {
    // Patrick Hand's "liga" joins f+l, Baloo's joins f+i; a combining mark needs GPOS mark positioning.
    for (const [id, t] of [
      ['patrick-hand', 'Raffl'],
      ['baloo-bold', 'Fifi'],
      ['bitter-bold', 'Zoe\u0308'],
    ] as const) {
      const f = byId(id);
      const ref = shapeWithFontkit(f.plain.font, t);
      expect(shapeFast(f.fast.font, t)).toBeNull();
      expect(shapeText(f.fast.font, t)).toEqual(ref);
      // something beyond kerning really happened: glyphs joined, or a mark placed off its pen position
      const joined = ref.glyphIds.length < [...t].length;
      const placed = ref.xOffset.some((x) => x !== 0) || ref.yOffset.some((y) => y !== 0);
      expect(joined || placed).toBe(true);
    }
  });

  it('when layout is asked for other features, directions or scripts in turn, then the cached plans give unpatched fontkit\u2019s runs', () => {
    const cases: [string, string[] | undefined, string | undefined][] = [
      ['Office 1/2', undefined, undefined],
      ['Office 1/2', ['smcp'], undefined],
      ['Office', ['liga'], undefined],
      ['Ωmega', undefined, undefined],
      ['Office', undefined, 'grek'],
      ['مرحبا', undefined, undefined],
      ['Office 1/2', undefined, undefined],
    ];
    const run = (f: LoadedFont, [t, feats, script]: (typeof cases)[number]) => {
      const r = (f.font as unknown as { layout(t: string, f?: string[], s?: string): { glyphs: { id: number }[]; positions: object[]; features: object; script: string } }).layout(t, feats, script);
      return { ids: r.glyphs.map((g) => g.id), positions: r.positions.map((p) => ({ ...p })), features: r.features, script: r.script };
    };
    for (const f of fonts) for (let round = 0; round < 2; round++) for (const c of cases) expect(run(f.fast, c)).toEqual(run(f.plain, c));
  });
});

// Reference: HarfBuzz via harfbuzzjs (the HarfBuzz project's own npm package).
describe('fast path against HarfBuzz', () => {
  it('when the fast path shapes a random name, then its glyph ids and advances are HarfBuzz\u2019s (fast-check)', () => {
    fc.assert(
      fc.property(fontArb, nameArb, (id, t) => {
        const f = byId(id);
        const r = shapeFast(f.fast.font, t);
        if (!r) return;
        const ref = f.hb.shape(t);
        expect(r.glyphIds).toEqual(ref.glyphIds);
        expect(r.xAdvance).toEqual(ref.xAdvances);
      }),
      { numRuns: 2000 },
    );
  });
});
