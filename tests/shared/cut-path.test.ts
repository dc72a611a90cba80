import { describe, expect, it } from 'vitest';
import { getFontRegistry } from '../../server/integrations/fonts.ts';
import { cutOutline } from '../../shared/engine/cut-path.ts';
import { parsePathData, pathArea, pathBBox } from '../../shared/engine/path.ts';
import { layoutText } from '../../shared/engine/text-layout.ts';

const subpaths = (d: string) => (d.match(/M/g) ?? []).length;

describe('cut outline', () => {
  it('when two squares overlap, then the cut path is one contour around both, with the union area', () => {
    const d = 'M0 0L10 0L10 10L0 10Z M5 5L15 5L15 15L5 15Z';
    const cut = cutOutline(d);
    expect(subpaths(cut)).toBe(1);
    // 100 + 100 − 25 overlap
    expect(Math.abs(pathArea(parsePathData(cut)))).toBeCloseTo(175, 6);
  });

  it('when a letter has a counter, then the hole stays a hole (area of "O" ring kept)', () => {
    const d = 'M0 0L20 0L20 20L0 20Z M5 5L5 15L15 15L15 5Z';
    const cut = cutOutline(d);
    expect(subpaths(cut)).toBe(2);
    expect(Math.abs(pathArea(parsePathData(cut)))).toBeCloseTo(400 - 100, 6);
  });

  it('when a real script name is cut, then no contour lies inside another filled one and the box is unchanged', () => {
    const reg = getFontRegistry();
    const l = layoutText(reg, { text: 'Mira', fontId: 'dancing-script-bold', letterHeightMm: 40 });
    const cut = cutOutline(l.path);
    const a = pathBBox(parsePathData(l.path));
    const b = pathBBox(parsePathData(cut));
    for (const k of ['minX', 'minY', 'maxX', 'maxY'] as const) expect(b[k]).toBeCloseTo(a[k], 1);
    // joined script letters overlap: the union has fewer contours than the glyphs drew
    expect(subpaths(cut)).toBeLessThan(subpaths(l.path));
    // and cutting the union again changes nothing (it has no overlaps left)
    expect(subpaths(cutOutline(cut))).toBe(subpaths(cut));
  });
});
