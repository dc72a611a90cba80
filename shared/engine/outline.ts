/**
 * The outline layer (a listing option): a name's shape grown by N mm with round corners, holes and
 * counters filled, as one backing piece — polygon offset and union by Clipper.
 */

import { offsetPolygons, regionsArea, unionRegions } from './geometry.ts';
import { type BBox, flattenPath, formatPath, type Path, parsePathData, pathBBox, polygonsToPath } from './path.ts';

export interface OutlineResult {
  path: string;
  bboxMm: BBox;
  areaMm2: number;
  pieces: number;
}

export function outlinePath(pathData: string, offsetMm: number, toleranceMm = 0.02): OutlineResult {
  if (!(offsetMm > 0) || offsetMm > 50) throw new RangeError('The outline offset must be between 0 and 50 mm.');
  return outlineOfPath(parsePathData(pathData), offsetMm, toleranceMm);
}

/** outlinePath for path data already parsed (`parsePathData`). */
export function outlineOfPath(path: Path, offsetMm: number, toleranceMm = 0.02): OutlineResult {
  if (!(offsetMm > 0) || offsetMm > 50) throw new RangeError('The outline offset must be between 0 and 50 mm.');
  const united = unionRegions(flattenPath(path, toleranceMm), 'nonzero');
  const grown = offsetPolygons(
    united.map((r) => r.outer),
    offsetMm,
    toleranceMm,
  );
  // Holes filled: keep only outer contours, then unite again (offset outers may touch).
  const filled = unionRegions(
    grown.map((r) => r.outer),
    'nonzero',
  ).map((r) => ({ outer: r.outer, holes: [] }));
  const p = polygonsToPath(filled.map((r) => r.outer));
  return { path: formatPath(p), bboxMm: pathBBox(p), areaMm2: regionsArea(filled), pieces: filled.length };
}
