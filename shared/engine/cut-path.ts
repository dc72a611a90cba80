// The path a cutter follows. Font outlines often overlap themselves (a letter drawn from two
// contours, joined script letters); filled on screen that is invisible, but a blade following
// every contour would cut through the middle of the letter. So a cut path is the union of the
// piece's contours under the nonzero rule, the way the preview fills them.

import { regionsToPolygons, unionRegions } from './geometry.ts';
import { flattenPath, formatPath, parsePathData, polygonsToPath } from './path.ts';

/** Cut tolerance for curves turned into chords: 0.01 mm, far below any cutter's resolution. */
const CUT_TOLERANCE_MM = 0.01;

export function cutOutline(pathData: string): string {
  const polys = flattenPath(parsePathData(pathData), CUT_TOLERANCE_MM);
  return formatPath(polygonsToPath(regionsToPolygons(unionRegions(polys, 'nonzero'))));
}

/**
 * Pieces with their path data replaced by the cut outline: what the cut-sheet SVG, the work sheet's
 * cut map and the nester all draw, so the three never disagree.
 */
export function withCutOutlines<T extends { path: string }>(pieces: readonly T[]): T[] {
  return pieces.map((p) => ({ ...p, path: cutOutline(p.path) }));
}
