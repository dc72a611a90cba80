// The outline nester's promises, checked from outside it: gaps measured with Clipper's own offset
// and intersection (clipper-lib called directly here, not through the engine's geometry helpers).
import ClipperLib from 'clipper-lib';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { placedCutPath } from '../../shared/engine/cut-sheet-svg.ts';
import { type CutSheet, type NestPiece, nestCutSheets } from '../../shared/engine/cut-sheets.ts';
import { nestOrderGroups, nestPieces } from '../../shared/engine/outline-nest.ts';
import { flattenPath, formatPath, parsePathData, pathArea, pathBBox, polygonsToPath, subpathAreas } from '../../shared/engine/path.ts';
import { at } from '../support/at.ts';

const S = 10_000; // Clipper works on integers: 0.1 µm
const toInt = (poly: number[]) => {
  const out: ClipperLib.Path = [];
  for (let i = 0; i < poly.length; i += 2) out.push({ X: Math.round(poly[i]! * S), Y: Math.round(poly[i + 1]! * S) });
  return out;
};

/** Polygons grown by `d` mm with Clipper's round offset (arc chords lie inside the true arc). */
function grow(polys: number[][], d: number): ClipperLib.Paths {
  const co = new ClipperLib.ClipperOffset(2, 0.002 * S);
  co.AddPaths(polys.map(toInt), ClipperLib.JoinType.jtRound, ClipperLib.EndType.etClosedPolygon);
  const out: ClipperLib.Paths = [];
  co.Execute(out, d * S);
  return out;
}

/** Area (mm²) where two grown shapes overlap. */
function overlap(a: ClipperLib.Paths, b: ClipperLib.Paths): number {
  const c = new ClipperLib.Clipper();
  c.AddPaths(a, ClipperLib.PolyType.ptSubject, true);
  c.AddPaths(b, ClipperLib.PolyType.ptClip, true);
  const out: ClipperLib.Paths = [];
  c.Execute(ClipperLib.ClipType.ctIntersection, out, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
  return out.reduce((s, p) => s + Math.abs(ClipperLib.Clipper.Area(p)), 0) / (S * S);
}

/** A star-ish polygon: `n` points at random radii around a centre, as path data with its bbox at 0,0. */
const shapeArb = fc
  .record({
    n: fc.integer({ min: 3, max: 9 }),
    radii: fc.array(fc.double({ min: 0.25, max: 1, noNaN: true }), { minLength: 9, maxLength: 9 }),
    w: fc.double({ min: 4, max: 90, noNaN: true }),
    h: fc.double({ min: 4, max: 90, noNaN: true }),
  })
  .map(({ n, radii, w, h }) => {
    const pts: number[] = [];
    for (let k = 0; k < n; k++) {
      const a = (2 * Math.PI * k) / n;
      pts.push((radii[k]! * Math.cos(a) * w) / 2, (radii[k]! * Math.sin(a) * h) / 2);
    }
    const p = polygonsToPath([pts]);
    const bb = pathBBox(p);
    const d = formatPath(polygonsToPath([pts.map((v, i) => (i % 2 ? v - bb.minY : v - bb.minX))]));
    return d;
  });

function asPieces(paths: string[]): NestPiece[] {
  return paths.flatMap((d, i) => {
    const p = parsePathData(d);
    const bb = pathBBox(p);
    const w = bb.maxX - bb.minX,
      h = bb.maxY - bb.minY;
    if (!(w > 0.01 && h > 0.01)) return [];
    return [{ id: `p${i}`, lineId: `l${i % 3}`, layerId: 'name', widthMm: w + 0.002, heightMm: h + 0.002, areaMm2: Math.abs(pathArea(p)), path: d }];
  });
}

const totalLength = (sheets: CutSheet[]) => sheets.reduce((s, sh) => s + sh.lengthMm, 0);

describe('nestPieces (outlines)', () => {
  it('when random shapes are nested, then every outline is inside the margins, outlines stay ≥ the gap apart, and the roll is never longer than the box packer’s (property)', () => {
    fc.assert(
      fc.property(
        fc.array(shapeArb, { minLength: 1, maxLength: 14 }),
        fc.integer({ min: 0, max: 10 }),
        fc.integer({ min: 0, max: 12 }),
        fc.integer({ min: 120, max: 400 }),
        (paths, gapMm, marginMm, rollWidthMm) => {
          const pieces = asPieces(paths);
          const input = { rollWidthMm, gapMm, marginMm, pieces };
          const sheets = nestPieces(input);
          const boxed = nestCutSheets(input);
          // the floor: never more sheets, never longer
          expect(sheets.length).toBeLessThanOrEqual(boxed.length);
          expect(totalLength(sheets)).toBeLessThanOrEqual(totalLength(boxed) + 1e-9);
          for (const sheet of sheets) {
            const placed = sheet.placements.map((pl) => {
              const piece = pieces.find((p) => p.id === pl.pieceId)!;
              return flattenPath(placedCutPath(pl, piece.path), 0.001);
            });
            for (const polys of placed) {
              const bb = pathBBox(polygonsToPath(polys));
              expect(bb.minX).toBeGreaterThanOrEqual(marginMm - 1e-6);
              expect(bb.minY).toBeGreaterThanOrEqual(marginMm - 1e-6);
              expect(bb.maxX).toBeLessThanOrEqual(rollWidthMm - marginMm + 1e-6);
              expect(bb.maxY).toBeLessThanOrEqual(sheet.lengthMm - marginMm + 1e-6);
            }
            // grown by a hair under half the gap, no two outlines may touch: their distance is ≥ the gap
            // (with gap 0 the shapes shrink by the hair: no overlap beyond 0.04 mm)
            const grown = placed.map((polys) => grow(polys, gapMm / 2 - 0.02));
            for (let i = 0; i < grown.length; i++) for (let j = i + 1; j < grown.length; j++) expect(overlap(grown[i]!, grown[j]!)).toBe(0);
          }
          // every piece once
          expect(sheets.flatMap((s) => s.placements.map((p) => p.pieceId)).sort()).toEqual(pieces.map((p) => p.id).sort());
        },
      ),
      { numRuns: 30 },
    );
  });

  it('when small squares fit inside a U, then the outline nest puts them in its hollow and uses less roll than the box packer', () => {
    // U: 100 × 100 mm, walls 20 mm, hollow 60 × 80 mm; squares 30 mm. Roll 130 mm: usable 118 mm.
    const u = 'M0 0H20V80H80V0H100V100H0Z';
    const sq = 'M0 0H30V30H0Z';
    const pieces = asPieces([u, sq, sq]);
    const input = { rollWidthMm: 130, gapMm: 6, marginMm: 6, pieces };
    const boxed = totalLength(nestCutSheets(input));
    const nested = totalLength(nestPieces(input));
    // any box packing: no room beside the U (118 − 100 − 6 = 12 mm < 30), so the squares go after it:
    // at least 6 + 100 + 6 + 30 + 6 = 148 mm
    expect(boxed).toBeGreaterThanOrEqual(148 - 1e-6);
    // outline: both squares inside the hollow (48 × 74 mm of room with the gaps), so only the U's length
    expect(nested).toBeCloseTo(112, 1);
  });

  it('when a piece is placed at each turn, then its cut outline is mirrored (winding reversed) and exactly fills its slot', () => {
    const d = 'M0 0H40V10H10V25H0Z'; // an asymmetric "Γ"
    const prev = parsePathData(d);
    for (const rotation of [0, 90, 180, 270] as const) {
      const turned = rotation % 180 !== 0;
      const pl = { pieceId: 'x', xMm: 7, yMm: 11, widthMm: turned ? 25 : 40, heightMm: turned ? 40 : 25, rotated: turned, rotation };
      const cut = placedCutPath(pl, prev);
      const bb = pathBBox(cut);
      expect([bb.minX, bb.minY, bb.maxX, bb.maxY].map((v) => Math.round(v * 1e6) / 1e6)).toEqual([7, 11, 7 + pl.widthMm, 11 + pl.heightMm]);
      // a mirror then a turn: determinant −1, so the signed area flips, whatever the turn
      expect(at(subpathAreas(cut), 0)).toBeCloseTo(-at(subpathAreas(prev), 0), 9);
    }
  });
});

describe('nestOrderGroups', () => {
  const orders = (paths: string[][]) => paths.flatMap((ps, o) => asPieces(ps).map((p, i) => ({ ...p, id: `o${o}-${i}`, orderNumber: `NS-${1040 + o}`, group: `NS-${1040 + o}` })));

  it('when orders are kept together, then each order sits inside its own weeding border, ≥ the gap from it, borders apart by the gap and inside the margins (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.array(shapeArb, { minLength: 1, maxLength: 4 }), { minLength: 1, maxLength: 5 }), fc.boolean(), (paths, weedingLines) => {
        const pieces = orders(paths);
        const gapMm = 6,
          marginMm = 6,
          rollWidthMm = 305;
        const sheets = nestOrderGroups({ rollWidthMm, gapMm, marginMm, pieces }, { weedingLines });
        for (const sheet of sheets) {
          for (const g of sheet.groups) {
            expect(g.xMm).toBeGreaterThanOrEqual(marginMm - 1e-6);
            expect(g.xMm + g.widthMm).toBeLessThanOrEqual(rollWidthMm - marginMm + 1e-6);
            expect(g.yMm + g.heightMm).toBeLessThanOrEqual(sheet.lengthMm - marginMm + 1e-6);
            for (const pl of sheet.placements.filter((p) => p.orderNumber === g.label)) {
              // the piece's box lies inside the border, at least the gap from it
              expect(pl.xMm).toBeGreaterThanOrEqual(g.xMm + gapMm - 1e-6);
              expect(pl.yMm).toBeGreaterThanOrEqual(g.yMm + gapMm - 1e-6);
              expect(pl.xMm + pl.widthMm).toBeLessThanOrEqual(g.xMm + g.widthMm - gapMm + 1e-6);
              expect(pl.yMm + pl.heightMm).toBeLessThanOrEqual(g.yMm + g.heightMm - gapMm + 1e-6);
            }
          }
          // borders (cuts) at least the gap apart
          for (let i = 0; i < sheet.groups.length; i++)
            for (let j = i + 1; j < sheet.groups.length; j++) {
              const a = sheet.groups[i]!,
                b = sheet.groups[j]!;
              const dx = Math.max(b.xMm - (a.xMm + a.widthMm), a.xMm - (b.xMm + b.widthMm));
              const dy = Math.max(b.yMm - (a.yMm + a.heightMm), a.yMm - (b.yMm + b.heightMm));
              expect(Math.max(dx, dy)).toBeGreaterThanOrEqual(gapMm - 1e-6);
            }
          // a weeding line never crosses a border
          for (const l of sheet.weedingLines)
            for (const g of sheet.groups) {
              const crossesX = l.x1 === l.x2 && l.x1 > g.xMm && l.x1 < g.xMm + g.widthMm && Math.max(l.y1, l.y2) > g.yMm && Math.min(l.y1, l.y2) < g.yMm + g.heightMm;
              const crossesY = l.y1 === l.y2 && l.y1 > g.yMm && l.y1 < g.yMm + g.heightMm && Math.max(l.x1, l.x2) > g.xMm && Math.min(l.x1, l.x2) < g.xMm + g.widthMm;
              expect(crossesX || crossesY).toBe(false);
            }
          if (!weedingLines) expect(sheet.weedingLines).toEqual([]);
        }
        expect(sheets.flatMap((s) => s.groups.map((g) => g.label)).sort()).toEqual([...new Set(pieces.map((p) => p.group))].sort());
        expect(sheets.flatMap((s) => s.placements).length).toBe(pieces.length);
      }),
      { numRuns: 20 },
    );
  });
});
