import fc from 'fast-check';
import { svgPathBbox } from 'svg-path-bbox';
import { describe, expect, it } from 'vitest';
import { formatPath, mirrorPath, mirrorPathData, parsePathData, pathArea, pathBBox } from '../../../shared/engine/path.ts';

const num = fc.double({ min: -500, max: 500, noNaN: true, noDefaultInfinity: true }).map((v) => Math.round(v * 1000) / 1000);
const seg = fc.oneof(
  fc.tuple(num, num).map(([x, y]) => `L${x} ${y}`),
  fc.tuple(num, num, num, num).map((v) => `Q${v.join(' ')}`),
  fc.tuple(num, num, num, num, num, num).map((v) => `C${v.join(' ')}`),
);
const pathArb = fc.tuple(num, num, fc.array(seg, { minLength: 1, maxLength: 8 })).map(([x, y, s]) => `M${x} ${y}${s.join('')}Z`);

describe('path geometry', () => {
  // Reference: svg-path-bbox (a general-purpose SVG path bounding-box library).
  it('when computing a bbox, then it equals svg-path-bbox for arbitrary line/quadratic/cubic paths (fast-check)', () => {
    fc.assert(
      fc.property(pathArb, (d) => {
        const ours = pathBBox(parsePathData(d));
        const [minX, minY, maxX, maxY] = svgPathBbox(d);
        const tol = 1e-6 * 1000;
        return Math.abs(ours.minX - minX) < tol && Math.abs(ours.minY - minY) < tol && Math.abs(ours.maxX - maxX) < tol && Math.abs(ours.maxY - maxY) < tol;
      }),
      { numRuns: 400 },
    );
  });
  it('when a path has arcs and relative commands, then its bbox still equals svg-path-bbox', () => {
    const d = 'm10 10 a 20 30 15 1 1 40 0 s 10 20 30 0 t 20 10 h -30 v 20 z';
    const [minX, minY, maxX, maxY] = svgPathBbox(d);
    const ours = pathBBox(parsePathData(d));
    expect(ours.minX).toBeCloseTo(minX, 1);
    expect(ours.minY).toBeCloseTo(minY, 1);
    expect(ours.maxX).toBeCloseTo(maxX, 1);
    expect(ours.maxY).toBeCloseTo(maxY, 1);
  });
  it('when a circle of r = 37 mm is written with arcs, then its area is within 0.1 % of πr²', () => {
    const r = 37;
    const d = `M${50 - r} 50A${r} ${r} 0 1 0 ${50 + r} 50A${r} ${r} 0 1 0 ${50 - r} 50Z`;
    const a = pathArea(parsePathData(d));
    expect(Math.abs(a - Math.PI * r * r) / (Math.PI * r * r)).toBeLessThan(0.001);
  });
  it('when a path is mirrored twice about any axis, then it is the original path (fast-check)', () => {
    fc.assert(
      fc.property(pathArb, num, (d, axis) => {
        const p = parsePathData(d);
        const twice = mirrorPath(mirrorPath(p, axis), axis);
        const a = formatPath(p)
          .match(/-?[\d.]+/g)!
          .map(Number);
        const b = formatPath(twice)
          .match(/-?[\d.]+/g)!
          .map(Number);
        return a.length === b.length && a.every((v, i) => Math.abs(v - b[i]!) <= 0.0011);
      }),
      { numRuns: 300 },
    );
  });
  it('when mirroring path data about its own centre, then the bbox stays put and x flips', () => {
    const d = 'M0 0L10 0L10 5Z';
    const m = mirrorPathData(d);
    expect(pathBBox(parsePathData(m))).toEqual(pathBBox(parsePathData(d)));
    expect(m).toBe('M10 0L0 0L0 5Z');
  });
});
