/**
 * The engine's speed-ups must not change a single number: the fast inscribed-circle search against
 * the straightforward one it replaced, the µm rounding shortcut against writing and re-parsing, and
 * compose's weeding modes and caches against the full analysis done afresh.
 */

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { defaultBlank } from '../../../shared/engine/blanks.ts';
import { compose, type FieldDef } from '../../../shared/engine/compose.ts';
import { inscribedWidth, type Region, unionRegions } from '../../../shared/engine/geometry.ts';
import { parseMotifSvg } from '../../../shared/engine/motif.ts';
import { flattenPath, formatPath, type Polygon, parsePathData, roundPath } from '../../../shared/engine/path.ts';
import { layoutText } from '../../../shared/engine/text-layout.ts';
import { analyseWeeding } from '../../../shared/engine/weeding.ts';
import { at } from '../../support/at.ts';
import { testRegistry } from './font-fixture.ts';

const reg = testRegistry();

// The search as it was first written (quadtree pole of inaccessibility, as in Mapbox's polylabel):
// an array scanned for the most promising cell and emptied by swap-remove, every edge per distance.
function referenceInscribedWidth(polys: Polygon[], precisionMm = 0.05): number {
  let minX = Infinity,
    minY = Infinity,
    maxX = -Infinity,
    maxY = -Infinity;
  for (const p of polys)
    for (let i = 0; i < p.length; i += 2) {
      const x = p[i]!,
        y = p[i + 1]!; // i < p.length, pairs of (x, y)
      minX = Math.min(minX, x);
      maxX = Math.max(maxX, x);
      minY = Math.min(minY, y);
      maxY = Math.max(maxY, y);
    }
  if (minX === Infinity) return 0;
  const size = Math.min(maxX - minX, maxY - minY);
  if (size <= 0) return 0;
  const dist = (x: number, y: number) => {
    let inside = false,
      best = Infinity;
    for (const p of polys) {
      const n = p.length;
      for (let i = 0, j = n - 2; i < n; j = i, i += 2) {
        const ax = p[i]!,
          ay = p[i + 1]!,
          bx = p[j]!,
          by = p[j + 1]!; // i, j < n, pairs of (x, y)
        if (ay > y !== by > y && x < ((bx - ax) * (y - ay)) / (by - ay) + ax) inside = !inside;
        let dx = bx - ax,
          dy = by - ay,
          px = ax,
          py = ay;
        if (dx !== 0 || dy !== 0) {
          const t = ((x - ax) * dx + (y - ay) * dy) / (dx * dx + dy * dy);
          if (t > 1) {
            px = bx;
            py = by;
          } else if (t > 0) {
            px += dx * t;
            py += dy * t;
          }
        }
        dx = x - px;
        dy = y - py;
        best = Math.min(best, dx * dx + dy * dy);
      }
    }
    return (inside ? 1 : -1) * Math.sqrt(best);
  };
  type Cell = { x: number; y: number; h: number; d: number; max: number };
  const cell = (x: number, y: number, h: number): Cell => {
    const d = dist(x, y);
    return { x, y, h, d, max: d + h * Math.SQRT2 };
  };
  const queue: Cell[] = [];
  const h0 = size / 2;
  for (let x = minX; x < maxX; x += size) for (let y = minY; y < maxY; y += size) queue.push(cell(x + h0, y + h0, h0));
  let best = cell((minX + maxX) / 2, (minY + maxY) / 2, 0);
  for (const c of queue) if (c.d > best.d) best = c;
  let guard = 0;
  while (queue.length && guard++ < 20000) {
    let bi = 0;
    for (let i = 1; i < queue.length; i++) if (queue[i]!.max > queue[bi]!.max) bi = i; // i, bi < queue.length
    const c = queue[bi]!;
    queue[bi] = queue[queue.length - 1]!;
    queue.pop();
    if (c.d > best.d) best = c;
    if (c.max - best.d <= precisionMm / 2) continue;
    const h = c.h / 2;
    queue.push(cell(c.x - h, c.y - h, h), cell(c.x + h, c.y - h, h), cell(c.x - h, c.y + h, h), cell(c.x + h, c.y + h, h));
  }
  return Math.max(0, 2 * best.d);
}

const regionsOf = (d: string): Region[] => unionRegions(flattenPath(parsePathData(d), 0.05), 'nonzero');

describe('inscribed width (the widest stroke, for weeding)', () => {
  it('when measuring letters and outlines of real names, then the fast search returns exactly the straightforward result', () => {
    for (const [text, fontId, h] of [
      ['Bartholomew', 'dancing-script-bold', 30],
      ['Łukasz', 'baloo-bold', 40],
      ['AVATAR', 'bangers', 12],
      ['Zoë', 'bitter-bold', 60],
    ] as const) {
      const l = layoutText(reg, { text, fontId, letterHeightMm: h });
      const outline = at(
        compose(reg, {
          blank: defaultBlank('tote')!,
          fields: [{ kind: 'text', id: 'n', fontId, letterHeightMm: h, materialKind: 'smooth', colour: '#000000', outline: { offsetMm: 3, materialKind: 'smooth', colour: '#ffffff' } }],
          choices: { n: { text } },
        }).pieces,
        0,
      ).path;
      for (const d of [l.path, outline]) {
        for (const r of regionsOf(d)) {
          expect(inscribedWidth([r.outer, ...r.holes])).toBe(referenceInscribedWidth([r.outer, ...r.holes]));
          for (const hole of r.holes) expect(inscribedWidth([hole])).toBe(referenceInscribedWidth([hole]));
        }
      }
    }
  });
  it('when measuring random star polygons of many points, then the fast search returns exactly the straightforward result (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 3, max: 300 }),
        fc.double({ min: 0.5, max: 80, noNaN: true }),
        fc.double({ min: 0.05, max: 1, noNaN: true }),
        fc.integer({ min: 1, max: 1000 }),
        (n, r, dent, seed) => {
          const p: Polygon = [];
          let s = seed;
          for (let i = 0; i < n; i++) {
            s = (s * 16807) % 2147483647;
            const rr = r * (i % 2 ? dent : 1) * (0.8 + 0.2 * (s / 2147483647));
            p.push(rr * Math.cos((2 * Math.PI * i) / n), rr * Math.sin((2 * Math.PI * i) / n));
          }
          return inscribedWidth([p]) === referenceInscribedWidth([p]);
        },
      ),
      { numRuns: 150 },
    );
  });
});

describe('µm rounding', () => {
  const num = fc.double({ min: -800, max: 800, noNaN: true, noDefaultInfinity: true });
  it('when a path is rounded to the µm grid directly, then it equals writing it and parsing it back (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(num, num, fc.array(fc.tuple(fc.constantFrom('L', 'Q', 'C'), fc.array(num, { minLength: 6, maxLength: 6 })), { maxLength: 6 }), fc.boolean()), { minLength: 1, maxLength: 4 }),
        (subs) => {
          const path = subs.map(([x0, y0, segs, closed]) => ({
            x0,
            y0,
            closed,
            segs: segs.map(([t, v]) =>
              t === 'L' ? { t, x: v[0], y: v[1] } : t === 'Q' ? { t, x1: v[0], y1: v[1], x: v[2], y: v[3] } : { t, x1: v[0], y1: v[1], x2: v[2], y2: v[3], x: v[4], y: v[5] },
            ),
          }));
          expect(roundPath(path as never)).toEqual(parsePathData(formatPath(path as never)));
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe('compose weeding modes and caches', () => {
  const tote = defaultBlank('tote')!;
  const rocket = parseMotifSvg(`<svg xmlns="http://www.w3.org/2000/svg" width="60mm" height="100mm" viewBox="0 0 60 100">
    <g id="flame" fill="#e0a526"><path d="M20 70 L40 70 Q42 86 30 98 Q18 86 20 70 Z"/></g>
    <g id="hull" fill="#1f2a44"><path d="M30 2 Q46 18 44 56 L44 72 L16 72 L16 56 Q14 18 30 2 Z"/></g></svg>`);
  const fields: FieldDef[] = [
    { kind: 'motif', id: 'motif', heightMm: 60, materialKind: 'smooth', options: [{ id: 'rocket', geometry: rocket }] },
    { kind: 'text', id: 'name', fontId: 'dancing-script-bold', letterHeightMm: 30, materialKind: 'smooth', colour: '#2f7d6d', outline: { offsetMm: 2, materialKind: 'smooth', colour: '#ffffff' } },
  ];
  const input = (text: string) => ({ blank: tote, fields, choices: { motif: { motifId: 'rocket' }, name: { text } } });

  it('when composing the same design twice, then the second result equals the first and owns its objects', () => {
    const a = compose(reg, input('Wilhelmina'));
    at(a.pieces, 0).bboxMm.minX = -999;
    at(a.pieces, 0).weeding.reasons.push('changed by the caller');
    const b = compose(reg, input('Wilhelmina'));
    expect(at(b.pieces, 0).bboxMm.minX).not.toBe(-999);
    expect(at(b.pieces, 0).weeding.reasons).not.toContain('changed by the caller');
    for (const p of b.pieces) expect(p.weeding).toEqual(analyseWeeding(p.path)); // as analysing each piece afresh
  });
  it("when composing with 'fast' or 'none', then the geometry is exactly the full compose's and only the weeding differs", () => {
    const full = compose(reg, input('Bartholomew'));
    const fast = compose(reg, input('Bartholomew'), { weeding: 'fast' });
    const none = compose(reg, input('Bartholomew'), { weeding: 'none' });
    const geo = (it: typeof full | typeof none) => it.pieces.map(({ weeding: _w, ...rest }) => rest);
    expect(geo(fast)).toEqual(geo(full));
    expect(geo(none)).toEqual(geo(full));
    expect(none.weeding).toBeNull();
    expect(none.pieces.every((p) => p.weeding === null)).toBe(true);
    expect(full.weeding.analysis).toBeUndefined();
    expect(fast.weeding.analysis).toBe('fast');
    fast.pieces.forEach((p, i) => {
      const f = at(full.pieces, i).weeding;
      expect(p.weeding.thinStrokeAreaMm2).toBe(0);
      // every measured number is the full report's
      expect({ ...p.weeding, label: f.label, reasons: f.reasons, thinStrokeAreaMm2: f.thinStrokeAreaMm2, analysis: undefined }).toEqual({ ...f, analysis: undefined });
    });
  });
  it('when a piece has thin strokes, then the fast label is never harder than the full one', () => {
    const rank = { quick: 0, moderate: 1, fiddly: 2 } as const;
    for (const text of ['Bartholomew', 'Mi', 'Theodora']) {
      const full = compose(reg, input(text));
      const fast = compose(reg, input(text), { weeding: 'fast' });
      expect(rank[fast.weeding.label]).toBeLessThanOrEqual(rank[full.weeding.label]);
    }
  });
});
