/**
 * Weeding difficulty: how fiddly a piece is to weed. Strokes or pieces narrower than about
 * 1.5 mm (1/16 in) are hard to weed (from memory); few, large pieces are quick, many small pieces and
 * tiny counters are slow (common practice). The label thresholds below are our own (no published source).
 */

import { inscribedWidth, polygonAreaAbs, type Region, regionArea, simplifyRegions, thinArea, unionRegions } from './geometry.ts';
import { flattenPath, type Path, parsePathData } from './path.ts';

export const NARROW_MM = 1.5;

export type WeedingLabel = 'quick' | 'moderate' | 'fiddly';

export interface WeedingReport {
  label: WeedingLabel;
  /** Separate pieces of vinyl that stay on the carrier. */
  pieces: number;
  /** Inner counters (holes inside pieces) that must be picked out. */
  counters: number;
  smallestPieceAreaMm2: number | null;
  /** Widest stroke of the thinnest piece (diameter of its largest inscribed circle), mm. */
  smallestPieceWidthMm: number | null;
  smallestCounterAreaMm2: number | null;
  smallestCounterWidthMm: number | null;
  /** Pieces and counters narrower than 1.5 mm everywhere. */
  narrowPieces: number;
  narrowCounters: number;
  /** Area of strokes thinner than 1.5 mm inside otherwise wider pieces, mm². */
  thinStrokeAreaMm2: number;
  totalAreaMm2: number;
  /** The reasons behind the label, in words. */
  reasons: string[];
  /**
   * 'fast' when the report was made without the thin-stroke analysis (compose's typing mode):
   * thinStrokeAreaMm2 is then 0 and the label may be milder than the full report's. Absent for a full report.
   */
  analysis?: 'fast';
}

const minOrNull = (xs: number[]) => (xs.length ? Math.min(...xs) : null);

export function analyseRegions(regions: Region[], opts: { thinStrokes?: boolean } = {}): WeedingReport {
  const withThin = opts.thinStrokes !== false;
  const pieceAreas = regions.map(regionArea);
  const pieceWidths = regions.map((r) => inscribedWidth([r.outer, ...r.holes]));
  const holes = regions.flatMap((r) => r.holes);
  const counterAreas = holes.map(polygonAreaAbs);
  const counterWidths = holes.map((h) => inscribedWidth([h]));
  const narrowPieces = pieceWidths.filter((w) => w < NARROW_MM).length;
  const narrowCounters = counterWidths.filter((w) => w < NARROW_MM).length;
  const thin = withThin ? regions.reduce((s, r, i) => s + (pieceWidths[i]! < NARROW_MM ? 0 : thinArea([r.outer, ...r.holes], NARROW_MM)), 0) : 0;
  const report = label({
    pieces: regions.length,
    counters: holes.length,
    smallestPieceAreaMm2: minOrNull(pieceAreas),
    smallestPieceWidthMm: minOrNull(pieceWidths),
    smallestCounterAreaMm2: minOrNull(counterAreas),
    smallestCounterWidthMm: minOrNull(counterWidths),
    narrowPieces,
    narrowCounters,
    thinStrokeAreaMm2: thin,
    totalAreaMm2: pieceAreas.reduce((a, b) => a + b, 0),
  });
  return withThin ? report : { ...report, analysis: 'fast' };
}

function label(r: Omit<WeedingReport, 'label' | 'reasons'>): WeedingReport {
  const reasons: string[] = [];
  let level = 0;
  const bump = (l: number, why: string) => {
    level = Math.max(level, l);
    reasons.push(why);
  };
  if (r.narrowPieces > 0) bump(2, `${r.narrowPieces} piece(s) narrower than ${NARROW_MM} mm`);
  if (r.narrowCounters > 0) bump(2, `${r.narrowCounters} counter(s) narrower than ${NARROW_MM} mm`);
  if (r.thinStrokeAreaMm2 > Math.max(2, 0.03 * r.totalAreaMm2)) bump(1, `strokes thinner than ${NARROW_MM} mm (${r.thinStrokeAreaMm2.toFixed(1)} mm²)`);
  if (r.pieces > 30) bump(2, `${r.pieces} separate pieces`);
  else if (r.pieces > 12) bump(1, `${r.pieces} separate pieces`);
  if (r.counters > 20) bump(2, `${r.counters} counters to pick out`);
  else if (r.counters > 6) bump(1, `${r.counters} counters to pick out`);
  if (r.smallestPieceAreaMm2 !== null && r.smallestPieceAreaMm2 < 10) bump(1, `smallest piece ${r.smallestPieceAreaMm2.toFixed(1)} mm²`);
  if (r.smallestCounterWidthMm !== null && r.smallestCounterWidthMm < 3 && r.narrowCounters === 0) bump(1, `smallest counter ${r.smallestCounterWidthMm.toFixed(1)} mm wide`);
  const lbl: WeedingLabel = level === 2 ? 'fiddly' : level === 1 ? 'moderate' : 'quick';
  if (reasons.length === 0) reasons.push(`${r.pieces} piece(s), ${r.counters} counter(s), nothing under ${NARROW_MM} mm`);
  return { label: lbl, ...r, reasons };
}

/** Weeding report for one piece's path data (nonzero fill). */
export function analyseWeeding(pathData: string): WeedingReport {
  return analysePathWeeding(parsePathData(pathData));
}

/** analyseWeeding for path data already parsed (`parsePathData`): the same report, without parsing again. */
export function analysePathWeeding(path: Path): WeedingReport {
  return analyseRegions(pieceRegions(path));
}

const pieceRegions = (path: Path) => simplifyRegions(unionRegions(flattenPath(path, 0.05), 'nonzero'), 0.03);

/** The 'fast' report: everything the full one has but the thin-stroke area (see WeedingReport.analysis). */
export function analyseQuickWeeding(path: Path): WeedingReport {
  return analyseRegions(pieceRegions(path), { thinStrokes: false });
}

/** The 'fast' report derived from a full one (the same numbers, without the thin-stroke area). */
export function quickFromFull(r: WeedingReport): WeedingReport {
  const { label: _l, reasons: _r, analysis: _a, ...rest } = r;
  return { ...label({ ...rest, thinStrokeAreaMm2: 0 }), analysis: 'fast' };
}

/** Combines piece reports into the item's: totals, smallest of each, the hardest label. */
export function combineWeeding(reports: WeedingReport[]): WeedingReport {
  const vals = (f: (r: WeedingReport) => number | null) => reports.map(f).filter((v): v is number => v !== null);
  const combined = label({
    pieces: reports.reduce((s, r) => s + r.pieces, 0),
    counters: reports.reduce((s, r) => s + r.counters, 0),
    smallestPieceAreaMm2: minOrNull(vals((r) => r.smallestPieceAreaMm2)),
    smallestPieceWidthMm: minOrNull(vals((r) => r.smallestPieceWidthMm)),
    smallestCounterAreaMm2: minOrNull(vals((r) => r.smallestCounterAreaMm2)),
    smallestCounterWidthMm: minOrNull(vals((r) => r.smallestCounterWidthMm)),
    narrowPieces: reports.reduce((s, r) => s + r.narrowPieces, 0),
    narrowCounters: reports.reduce((s, r) => s + r.narrowCounters, 0),
    thinStrokeAreaMm2: reports.reduce((s, r) => s + r.thinStrokeAreaMm2, 0),
    totalAreaMm2: reports.reduce((s, r) => s + r.totalAreaMm2, 0),
  });
  return reports.some((r) => r.analysis === 'fast') ? { ...combined, analysis: 'fast' } : combined;
}
