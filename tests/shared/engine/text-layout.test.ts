import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { FONT_CATALOG, requiredCoverage } from '../../../shared/engine/font-catalog.ts';
import { createFontRegistry } from '../../../shared/engine/fonts.ts';
import { parsePathData, pathBBox } from '../../../shared/engine/path.ts';
import { layoutText } from '../../../shared/engine/text-layout.ts';
import { fontBytes, testRegistry } from './font-fixture.ts';
import { hbAdvanceMm, hbFont } from './harfbuzz-reference.ts';

const reg = testRegistry();

describe('bundled fonts', () => {
  it('when listing the catalogue, then there are six OFL fonts covering every needed style', () => {
    expect(FONT_CATALOG).toHaveLength(6);
    expect(new Set(FONT_CATALOG.map((f) => f.style)).size).toBe(6);
    expect(FONT_CATALOG.every((f) => f.licence === 'OFL-1.1')).toBe(true);
  });
  it.each(FONT_CATALOG.map((f) => f.id))('when checking %s, then its cmap covers Latin-1 letters and Latin Extended-A', (id) => {
    const f = reg.require(id);
    const missing = [...requiredCoverage()].filter((c) => !f.hasChar(c.codePointAt(0)!));
    expect(missing).toEqual([]);
    const l = layoutText(reg, { text: 'Zoë José Łukasz Ørjan', fontId: id, letterHeightMm: 30 });
    expect(l.missing).toEqual([]);
  });
  it('when measuring letter height, then the top of "H" sits exactly the requested height above the baseline', () => {
    for (const f of FONT_CATALOG) {
      const l = layoutText(reg, { text: 'H', fontId: f.id, letterHeightMm: 40 });
      // y = 0 is the cap line, y = baselineMm the baseline (some display faces dip the H a hair below it)
      expect(l.bboxMm.minY).toBeCloseTo(0, 6);
      expect(l.baselineMm).toBe(40);
    }
  });
});

// Reference: HarfBuzz via harfbuzzjs (the HarfBuzz project's own npm package).
describe('advances against HarfBuzz', () => {
  const strings = ['AV', 'To', 'Ty', 'Zoë', 'José', 'Łukasz', 'AVATAR', 'Bartholomew'];
  const fonts = ['baloo-bold', 'dancing-script-bold', 'bitter-bold', 'bebas-neue', 'patrick-hand', 'bangers'];
  for (const id of fonts) {
    it(`when laying out kerned and accented names in ${id}, then widths match HarfBuzz within 0.01 mm`, () => {
      const hb = hbFont(fontBytes(id));
      const f = reg.require(id);
      for (const t of strings) {
        const ours = layoutText(reg, { text: t, fontId: id, letterHeightMm: 50 });
        expect(Math.abs(ours.advanceMm - hbAdvanceMm(hb, t, 50, f.capHeightUnits))).toBeLessThan(0.01);
        expect(ours.glyphs.map((g) => g.glyphId)).toEqual(hb.shape(t).glyphIds);
      }
    });
  }
  it('when a font kerns AV, then the laid-out width is less than the sum of the single letters (kerning applied)', () => {
    const av = layoutText(reg, { text: 'AV', fontId: 'bitter-bold', letterHeightMm: 50 }).advanceMm;
    const a = layoutText(reg, { text: 'A', fontId: 'bitter-bold', letterHeightMm: 50 }).advanceMm;
    const v = layoutText(reg, { text: 'V', fontId: 'bitter-bold', letterHeightMm: 50 }).advanceMm;
    expect(av).toBeLessThan(a + v - 0.5);
  });
  it('when laying out random names not in any fixed list, then every font agrees with HarfBuzz (fast-check)', () => {
    const hbs = new Map(fonts.map((id) => [id, hbFont(fontBytes(id))]));
    const letters = [...'abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZäöüéèçñøåłśźżčšžŁØ -'];
    fc.assert(
      fc.property(fc.constantFrom(...fonts), fc.array(fc.constantFrom(...letters), { minLength: 1, maxLength: 14 }), fc.double({ min: 5, max: 300, noNaN: true }), (id, chars, h) => {
        const t = chars.join('');
        const ours = layoutText(reg, { text: t, fontId: id, letterHeightMm: h }, { cache: false });
        return Math.abs(ours.advanceMm - hbAdvanceMm(hbs.get(id)!, t, h, reg.require(id).capHeightUnits)) < 0.01;
      }),
      { numRuns: 300 },
    );
  });
});

describe('layout output', () => {
  it('when the font lacks a character, then it is reported and not drawn', () => {
    const l = layoutText(reg, { text: 'Mira 美咲', fontId: 'bangers', letterHeightMm: 20 });
    expect(l.missing).toEqual(['美', '咲']);
    const mira = layoutText(reg, { text: 'Mira', fontId: 'bangers', letterHeightMm: 20 });
    expect(l.bboxMm.maxX).toBeCloseTo(mira.bboxMm.maxX, 6);
  });
  it('when text is decomposed (e + combining diaeresis), then it is normalised to NFC first', () => {
    const l = layoutText(reg, { text: 'Zoe\u0308', fontId: 'baloo-bold', letterHeightMm: 20 });
    expect(l.text).toBe('Zoë');
    expect(l.glyphs).toHaveLength(3);
  });
  it('when the same input is laid out twice, then the second is served from cache in ≤ 0.05 ms', () => {
    const input = { text: 'Anouk', fontId: 'dancing-script-bold', letterHeightMm: 33 };
    const first = layoutText(reg, input);
    const t0 = performance.now();
    for (let i = 0; i < 1000; i++) layoutText(reg, input);
    const per = (performance.now() - t0) / 1000;
    expect(layoutText(reg, input)).toBe(first);
    expect(per).toBeLessThan(0.05);
  });
  it('when the registry is built again from the same bytes (as the browser does), then the path data is identical', () => {
    const other = createFontRegistry(FONT_CATALOG.map((f) => ({ ...f, bytes: fontBytes(f.id) })));
    for (const f of FONT_CATALOG) {
      const a = layoutText(reg, { text: 'Priya Łukasz', fontId: f.id, letterHeightMm: 41.3 });
      const b = layoutText(other, { text: 'Priya Łukasz', fontId: f.id, letterHeightMm: 41.3 });
      expect(b.path).toBe(a.path);
    }
  });
  it('when the path is parsed again, then its bbox equals the reported tight bbox within 1 µm', () => {
    const l = layoutText(reg, { text: 'Theo', fontId: 'dancing-script-bold', letterHeightMm: 30 });
    const bb = pathBBox(parsePathData(l.path));
    expect(Math.abs(bb.minX - l.bboxMm.minX)).toBeLessThan(0.002);
    expect(Math.abs(bb.maxX - l.bboxMm.maxX)).toBeLessThan(0.002);
    expect(Math.abs(bb.maxY - l.bboxMm.maxY)).toBeLessThan(0.002);
  });
  it('when tracking is added, then the advance grows by tracking × (glyphs − 1)', () => {
    const a = layoutText(reg, { text: 'Kai', fontId: 'bitter-bold', letterHeightMm: 30 });
    const b = layoutText(reg, { text: 'Kai', fontId: 'bitter-bold', letterHeightMm: 30, trackingMm: 2 });
    expect(b.advanceMm - a.advanceMm).toBeCloseTo(4, 9);
  });
});

describe('characters per glyph', () => {
  it('when "e" was first met inside a decomposed "ë", then a later "e" still reports its own character', () => {
    const reg2 = createFontRegistry(FONT_CATALOG.map((f) => ({ ...f, bytes: fontBytes(f.id) })));
    for (const f of FONT_CATALOG) {
      layoutText(reg2, { text: 'Zoë', fontId: f.id, letterHeightMm: 20 });
      expect(
        layoutText(reg2, { text: 'Wilhelmina', fontId: f.id, letterHeightMm: 20 })
          .glyphs.map((g) => g.char)
          .join(''),
      ).toBe('Wilhelmina');
      expect(
        layoutText(reg2, { text: 'Zoë', fontId: f.id, letterHeightMm: 21 })
          .glyphs.map((g) => g.char)
          .join(''),
      ).toBe('Zoë');
    }
  });
});
