/**
 * The order layers are pressed in, from the design's geometry. Two layers only need an order when
 * their vinyl overlaps: the lower one is pressed (tacked) before the upper one goes on. Layers that
 * don't overlap go down together in one step, which saves a press per layer (makers do the same by
 * hand). The design's own stacking (its layers bottom → top) says which of two overlapping layers
 * is under; a top-only material (glitter, flock … — `topOnly` in the press tables) may have no
 * overlapping layer above it, and when the design puts one there no order can fix it: the
 * conflict is reported so the seller hears why before anything is cut. Pure.
 */
import { intersectionArea } from './geometry.ts';
import { flattenPath, type Polygon, parsePathData, pathBBox } from './path.ts';

/** Overlap smaller than this (mm²) is a shared edge or flattening noise, not vinyl on vinyl. */
export const MIN_OVERLAP_MM2 = 1;
/** Flattening tolerance for the overlap test: far below any overlap that matters. */
const FLATTEN_MM = 0.1;

/** Pairs of layer ids whose shapes overlap by more than MIN_OVERLAP_MM2, each pair in the order given. */
export function layerOverlaps(layers: ReadonlyArray<{ layerId: string; paths: readonly string[] }>, minAreaMm2 = MIN_OVERLAP_MM2): Array<[string, string]> {
  const shapes = layers.map((l) => {
    const parsed = l.paths.map(parsePathData);
    const polys: Polygon[] = parsed.flatMap((p) => flattenPath(p, FLATTEN_MM));
    const boxes = parsed.map(pathBBox);
    const box = boxes.length
      ? { minX: Math.min(...boxes.map((b) => b.minX)), minY: Math.min(...boxes.map((b) => b.minY)), maxX: Math.max(...boxes.map((b) => b.maxX)), maxY: Math.max(...boxes.map((b) => b.maxY)) }
      : null;
    return { id: l.layerId, polys, box };
  });
  const out: Array<[string, string]> = [];
  for (let i = 0; i < shapes.length; i++) {
    for (let j = i + 1; j < shapes.length; j++) {
      const a = shapes[i]!;
      const b = shapes[j]!;
      if (!a.box || !b.box || a.box.maxX <= b.box.minX || b.box.maxX <= a.box.minX || a.box.maxY <= b.box.minY || b.box.maxY <= a.box.minY) continue;
      if (intersectionArea(a.polys, b.polys) > minAreaMm2) out.push([a.id, b.id]);
    }
  }
  return out;
}

export interface OrderLayer {
  layerId: string;
  topOnly: boolean;
}

export interface PressOrder {
  /** Press steps bottom → top; each holds layers that don't overlap one another, placed and pressed together. */
  groups: string[][];
  /** Top-only layers the design covers with another overlapping layer: no valid order exists for them. */
  conflicts: Array<{ layerId: string; coveredBy: string[] }>;
}

/**
 * Groups layers (given bottom → top) into press steps. A layer's step comes after the step of
 * every overlapping layer below it (longest chain of overlaps); a layer nothing overlaps from
 * above waits for the last step, so it is pressed once, in the final press, rather than tacked and
 * pressed again. `overlaps` null means the geometry is unknown: every pair is taken to overlap,
 * which gives one layer per step in the design's order.
 */
export function pressOrder(layers: readonly OrderLayer[], overlaps: ReadonlyArray<readonly [string, string]> | null): PressOrder {
  const idx = new Map(layers.map((l, i) => [l.layerId, i]));
  const below: number[][] = layers.map(() => []);
  const above: number[][] = layers.map(() => []);
  const link = (i: number, j: number) => {
    const [lo, hi] = i < j ? [i, j] : [j, i];
    if (lo === hi || below[hi]!.includes(lo)) return;
    below[hi]!.push(lo);
    above[lo]!.push(hi);
  };
  if (overlaps === null) for (let i = 0; i < layers.length; i++) for (let j = i + 1; j < layers.length; j++) link(i, j);
  else
    for (const [a, b] of overlaps) {
      const i = idx.get(a);
      const j = idx.get(b);
      if (i !== undefined && j !== undefined) link(i, j);
    }
  // longest chain of overlaps under each layer (layers come bottom → top, so one pass suffices)
  const level: number[] = [];
  layers.forEach((_, i) => {
    level[i] = below[i]!.reduce((m, k) => Math.max(m, level[k]! + 1), 0);
  });
  const last = Math.max(0, ...level);
  const step = level.map((lv, i) => (above[i]!.length === 0 ? last : lv));
  const groups: string[][] = Array.from({ length: last + 1 }, () => []);
  layers.forEach((l, i) => groups[step[i]!]!.push(l.layerId));
  const conflicts = layers.flatMap((l, i) => (l.topOnly && above[i]!.length ? [{ layerId: l.layerId, coveredBy: above[i]!.map((k) => layers[k]!.layerId) }] : []));
  return { groups: groups.filter((g) => g.length > 0), conflicts };
}
