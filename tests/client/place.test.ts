// The live preview (src/features/personaliser/lib/place.ts, a thin caller of the engine's one
// placement) and compose() must put every piece in the same place: the preview's path data drawn
// through its matrix is compose()'s path, to the character; bad input fails the same way in both.
import fs from 'node:fs';
import { describe, expect, it } from 'vitest';
import { getFontRegistry } from '../../server/integrations/fonts.ts';
import { defaultBlank } from '../../shared/engine/blanks.ts';
import { ComposeError, type ComposeInput, compose, type FieldDef } from '../../shared/engine/compose.ts';
import { parseMotifSvg } from '../../shared/engine/motif.ts';
import { formatPath, parsePathData, transformPath } from '../../shared/engine/path.ts';
import { placeDesign } from '../../src/features/personaliser/lib/place.ts';
import { at } from '../support/at.ts';

const reg = getFontRegistry();
const fox = parseMotifSvg(fs.readFileSync('server/db/demo-motifs/fox-with-acorn.svg', 'utf8'));
const motif = (heightMm: number): FieldDef => ({ kind: 'motif', id: 'motif', heightMm, materialKind: 'smooth', options: [{ id: 'fox', geometry: fox, layers: { body: { colour: '#e0a526' } } }] });
const name = (id: string, fontId: string, letterHeightMm: number, extra: Partial<Extract<FieldDef, { kind: 'text' }>> = {}): FieldDef => ({
  kind: 'text',
  id,
  fontId,
  letterHeightMm,
  maxLetterHeightMm: letterHeightMm * 2,
  maxChars: 14,
  materialKind: 'smooth',
  colour: '#2f7d6d',
  ...extra,
});

const cases: Array<[string, ComposeInput]> = [
  ['a name alone on a tote', { blank: defaultBlank('tote')!, fields: [name('name', 'baloo-bold', 50)], choices: { name: { text: 'Mira' } } }],
  [
    'motif above a name',
    { blank: defaultBlank('tote')!, fields: [motif(110), name('name', 'dancing-script-bold', 45)], choices: { motif: { motifId: 'fox' }, name: { text: 'Zoë', letterHeightMm: 60 } } },
  ],
  ['a long name that must shrink', { blank: defaultBlank('kids_tee')!, fields: [name('name', 'bitter-bold', 60)], choices: { name: { text: 'Bartholomew' } } }],
  [
    'two names and a motif that overflow a pouch',
    {
      blank: defaultBlank('pouch')!,
      fields: [motif(90), name('first', 'bebas-neue', 40), name('second', 'patrick-hand', 30), { kind: 'colour', id: 'c', target: { fieldId: 'first' }, options: ['#1f2a44', '#e0a526'] }],
      choices: { motif: { motifId: 'fox' }, first: { text: 'Anouk' }, second: { text: 'and Kai' }, c: { colour: '#e0a526' } },
    },
  ],
  [
    'a name with an outline backing',
    {
      blank: defaultBlank('drawstring_bag')!,
      fields: [name('name', 'bangers', 50, { outline: { offsetMm: 3, materialKind: 'smooth', colour: '#ffffff' } })],
      choices: { name: { text: 'Leon' } },
    },
  ],
];

describe('the preview places every piece where compose() does', () => {
  for (const [label, input] of cases) {
    it(`when placing ${label}, then each piece's transformed path is compose()'s path`, () => {
      const item = compose(reg, input);
      const placed = placeDesign(reg, input);
      const composed = item.pieces.filter((p) => p.role !== 'outline');
      expect(placed.pieces.map((p) => p.layerId)).toEqual(composed.map((p) => p.layerId));
      placed.pieces.forEach((p, i) => {
        const c = at(composed, i);
        expect(formatPath(transformPath(parsePathData(p.d), p.matrix)), p.layerId).toBe(c.path);
        expect(p.colour).toBe(c.colour);
        expect(p.bboxMm.minX).toBeCloseTo(c.bboxMm.minX, 2);
        expect(p.bboxMm.maxY).toBeCloseTo(c.bboxMm.maxY, 2);
      });
      expect(placed.letterHeights).toEqual(item.letterHeights);
      expect(placed.warnings).toEqual(item.warnings);
      // with an outline, the item's box is the outline's (grown by the offset; rounding of curves aside)
      for (const k of ['minX', 'minY', 'maxX', 'maxY'] as const) expect(Math.abs(placed.bboxMm[k] - item.bboxMm[k])).toBeLessThan(0.6);
    });
  }

  const badInputs: Array<[string, ComposeInput, string]> = [
    ['an empty name', { blank: defaultBlank('tote')!, fields: [name('name', 'baloo-bold', 50)], choices: { name: { text: '  ' } } }, 'name'],
    ['a motif not offered', { blank: defaultBlank('tote')!, fields: [motif(100)], choices: { motif: { motifId: 'owl' } } }, 'motif'],
    [
      'a colour not offered',
      {
        blank: defaultBlank('tote')!,
        fields: [name('name', 'baloo-bold', 50), { kind: 'colour', id: 'c', target: { fieldId: 'name' }, options: ['#1f2a44'] }],
        choices: { name: { text: 'Mira' }, c: { colour: '#ff0000' } },
      },
      'c',
    ],
  ];
  for (const [label, input, fieldId] of badInputs) {
    it(`when given ${label}, then the preview and compose() refuse it with the same field and message`, () => {
      const err = (fn: () => unknown) => {
        try {
          fn();
        } catch (e) {
          return e;
        }
        return null;
      };
      const a = err(() => placeDesign(reg, input));
      const b = err(() => compose(reg, input));
      expect(a).toBeInstanceOf(ComposeError);
      expect(b).toBeInstanceOf(ComposeError);
      expect([(a as ComposeError).fieldId, (a as ComposeError).message]).toEqual([fieldId, (b as ComposeError).message]);
    });
  }
});
