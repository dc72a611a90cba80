import { describe, expect, it } from 'vitest';
import { DEFAULT_BLANKS, defaultBlank, usableArea } from '../../../shared/engine/blanks.ts';
import { ComposeError, compose, type FieldDef } from '../../../shared/engine/compose.ts';
import { parseMotifSvg } from '../../../shared/engine/motif.ts';
import { outlinePath } from '../../../shared/engine/outline.ts';
import { parsePathData, pathBBox } from '../../../shared/engine/path.ts';
import { layoutText } from '../../../shared/engine/text-layout.ts';
import { analyseWeeding } from '../../../shared/engine/weeding.ts';
import { testRegistry } from './font-fixture.ts';

const reg = testRegistry();
const rocket = parseMotifSvg(`<svg xmlns="http://www.w3.org/2000/svg" width="2in" height="2in" viewBox="0 0 100 100">
  <g id="flame" fill="#e0a526"><polygon points="40,80 60,80 50,100"/></g>
  <g id="body" fill="#1f2a44"><rect x="35" y="10" width="30" height="70" rx="10"/></g></svg>`);

const fields: FieldDef[] = [
  { kind: 'motif', id: 'motif', heightMm: 60, materialKind: 'smooth', options: [{ id: 'rocket', geometry: rocket, layers: { flame: { materialKind: 'glitter' } } }] },
  { kind: 'text', id: 'name', fontId: 'baloo-bold', letterHeightMm: 40, maxChars: 14, materialKind: 'smooth', colour: '#2f7d6d', outline: { offsetMm: 3, materialKind: 'smooth', colour: '#ffffff' } },
  { kind: 'colour', id: 'name-colour', target: { fieldId: 'name' }, options: ['#2f7d6d', '#e0a526'] },
];

describe('compose', () => {
  const tote = defaultBlank('tote')!;
  const item = compose(reg, { blank: tote, fields, choices: { motif: { motifId: 'rocket' }, name: { text: 'Theo' }, 'name-colour': { colour: '#e0a526' } } });

  it('when composing, then pieces come in press order bottom → top: outline, motif layers, name', () => {
    expect(item.pieces.map((p) => [p.layerId, p.role])).toEqual([
      ['name-outline', 'outline'],
      ['motif:flame', 'motif'],
      ['motif:body', 'motif'],
      ['name', 'text'],
    ]);
    expect(item.pieces[3]?.colour).toBe('#e0a526');
    expect(item.pieces[1]?.materialKind).toBe('glitter');
  });
  it('when composing on a tote, then the design is centred, starts at the top offset and stays in the upper half', () => {
    const mid = (item.bboxMm.minX + item.bboxMm.maxX) / 2;
    expect(mid).toBeCloseTo(tote.widthMm / 2, 1);
    expect(item.bboxMm.minY).toBeCloseTo(tote.topOffsetMm, 3);
    expect(item.bboxMm.maxY).toBeLessThanOrEqual(tote.heightMm / 2);
  });
  it('when a piece is mirrored for cutting, then its bbox is unchanged and its path differs', () => {
    for (const p of item.pieces) {
      const bb = pathBBox(parsePathData(p.mirroredPath));
      expect(bb.minX).toBeCloseTo(p.bboxMm.minX, 2);
      expect(bb.maxX).toBeCloseTo(p.bboxMm.maxX, 2);
      expect(p.mirroredPath).not.toBe(p.path);
    }
  });
  it('when the name is long, then it shrinks to the usable width on every default blank', () => {
    for (const blank of DEFAULT_BLANKS) {
      const it2 = compose(reg, { blank, fields: fields.slice(1, 2), choices: { name: { text: 'Bartholomew' } } });
      const w = it2.bboxMm.maxX - it2.bboxMm.minX;
      expect(w).toBeLessThanOrEqual(usableArea(blank).widthMm + 1e-6);
      expect(it2.bboxMm.maxY).toBeLessThanOrEqual(blank.maxDesignBottomMm + 1e-6);
    }
  });
  it('when a choice is missing or not offered, then compose refuses with the field id', () => {
    expect(() => compose(reg, { blank: tote, fields, choices: { motif: { motifId: 'rocket' } } })).toThrow(ComposeError);
    expect(() => compose(reg, { blank: tote, fields, choices: { motif: { motifId: 'rocket' }, name: { text: 'Mira' }, 'name-colour': { colour: '#ff00ff' } } })).toThrow(/colours offered/);
  });
});

describe('outline layer', () => {
  it('when a name is outlined by 6 mm, then the backing is one piece without holes, 6 mm larger on every side', () => {
    const l = layoutText(reg, { text: 'Mira', fontId: 'baloo-bold', letterHeightMm: 40 });
    const o = outlinePath(l.path, 6);
    expect(o.pieces).toBe(1);
    expect(analyseWeeding(o.path).counters).toBe(0);
    expect(o.bboxMm.minX).toBeCloseTo(l.bboxMm.minX - 6, 1);
    expect(o.bboxMm.maxX).toBeCloseTo(l.bboxMm.maxX + 6, 1);
    expect(o.bboxMm.minY).toBeCloseTo(l.bboxMm.minY - 6, 1);
    expect(o.areaMm2).toBeGreaterThan(0);
  });
});

describe('weeding difficulty (under 1.5 mm is hard to weed: from memory, no published source)', () => {
  it('when a bold short name is large, then it is quick with the pieces and counters counted', () => {
    const r = analyseWeeding(layoutText(reg, { text: 'Leon', fontId: 'baloo-bold', letterHeightMm: 50 }).path);
    expect(r.label).toBe('quick');
    expect(r.pieces).toBe(4); // L, e, o, n
    expect(r.counters).toBe(2); // e, o
    expect(r.narrowPieces).toBe(0);
  });
  it('when a piece is only 1 mm wide, then it is flagged narrow and the label is fiddly', () => {
    const r = analyseWeeding('M0 0H40V1H0Z M0 10H40V30H0Z');
    expect(r.pieces).toBe(2);
    expect(r.narrowPieces).toBe(1);
    expect(r.smallestPieceWidthMm!).toBeCloseTo(1, 1);
    expect(r.label).toBe('fiddly');
  });
  it('when a counter is 1 mm wide, then it is flagged as a narrow counter', () => {
    const r = analyseWeeding('M0 0H40V20H0Z M5 5V6H35V5Z');
    expect(r.counters).toBe(1);
    expect(r.narrowCounters).toBe(1);
    expect(r.label).toBe('fiddly');
  });
  it('when a long name is set small in script, then it is harder than the same name large', () => {
    const small = analyseWeeding(layoutText(reg, { text: 'Bartholomew', fontId: 'dancing-script-bold', letterHeightMm: 8 }).path);
    const large = analyseWeeding(layoutText(reg, { text: 'Bartholomew', fontId: 'dancing-script-bold', letterHeightMm: 60 }).path);
    const rank = { quick: 0, moderate: 1, fiddly: 2 } as const;
    expect(rank[small.label]).toBeGreaterThan(rank[large.label]);
    expect(small.smallestCounterWidthMm!).toBeLessThan(large.smallestCounterWidthMm!);
  });
});
