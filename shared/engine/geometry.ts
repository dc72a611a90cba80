/**
 * Polygon union and offset with Clipper (Angus Johnson's polygon clipping library, `clipper-lib`).
 * Clipper works on integers: we scale mm by 10 000 (0.1 µm grid), far below cutting precision.
 */
import ClipperLib from 'clipper-lib';
import type { Polygon } from './path.ts';

const SCALE = 10_000;
export type FillRule = 'nonzero' | 'evenodd';

/** One filled region: an outer contour and its holes (the counters of a letter). */
export interface Region { outer: Polygon; holes: Polygon[] }

function toInt(polys: Polygon[]): ClipperLib.Paths {
  return polys.map((p) => {
    const out: ClipperLib.Path = [];
    for (let i = 0; i < p.length; i += 2) out.push({ X: Math.round(p[i] * SCALE), Y: Math.round(p[i + 1] * SCALE) });
    return out;
  });
}

function fromInt(path: ClipperLib.Path): Polygon {
  const out: Polygon = [];
  for (const pt of path) out.push(pt.X / SCALE, pt.Y / SCALE);
  return out;
}

const fill = (r: FillRule) => (r === 'evenodd' ? ClipperLib.PolyFillType.pftEvenOdd : ClipperLib.PolyFillType.pftNonZero);

function treeToRegions(tree: ClipperLib.PolyNode, out: Region[]): Region[] {
  for (const outer of tree.Childs()) {
    const region: Region = { outer: fromInt(outer.Contour()), holes: [] };
    out.push(region);
    for (const hole of outer.Childs()) {
      region.holes.push(fromInt(hole.Contour()));
      treeToRegions(hole, out); // islands inside a counter are regions of their own
    }
  }
  return out;
}

/** Union of polygons under a fill rule → disjoint regions with their holes. */
export function unionRegions(polys: Polygon[], rule: FillRule = 'nonzero'): Region[] {
  if (polys.length === 0) return [];
  const c = new ClipperLib.Clipper();
  c.AddPaths(toInt(polys), ClipperLib.PolyType.ptSubject, true);
  const tree = new ClipperLib.PolyTree();
  c.Execute(ClipperLib.ClipType.ctUnion, tree, fill(rule), fill(rule));
  return treeToRegions(tree, []);
}

/** Drops points closer than `distanceMm` to their neighbours or to a straight line through them. */
export function simplifyRegions(regions: Region[], distanceMm: number): Region[] {
  const clean = (p: Polygon) => {
    const out = ClipperLib.Clipper.CleanPolygons(toInt([p]), distanceMm * SCALE);
    return out.length && out[0].length >= 3 ? fromInt(out[0]) : null;
  };
  const res: Region[] = [];
  for (const r of regions) {
    const outer = clean(r.outer);
    if (!outer) continue;
    res.push({ outer, holes: r.holes.map(clean).filter((h): h is Polygon => h !== null) });
  }
  return res;
}

/** Regions → flat polygon list with outers and holes oppositely wound (fills right under nonzero). */
export function regionsToPolygons(regions: Region[]): Polygon[] {
  const out: Polygon[] = [];
  for (const r of regions) out.push(r.outer, ...r.holes);
  return out;
}

/** Grows (delta > 0) or shrinks (delta < 0) polygons by delta mm with round joins. */
export function offsetPolygons(polys: Polygon[], deltaMm: number, arcToleranceMm = 0.01, join: 'round' | 'miter' = 'round'): Region[] {
  if (polys.length === 0) return [];
  const co = new ClipperLib.ClipperOffset(2, arcToleranceMm * SCALE);
  co.AddPaths(toInt(polys), join === 'round' ? ClipperLib.JoinType.jtRound : ClipperLib.JoinType.jtMiter, ClipperLib.EndType.etClosedPolygon);
  const tree = new ClipperLib.PolyTree();
  co.Execute(tree, deltaMm * SCALE);
  return treeToRegions(tree, []);
}

export function polygonAreaAbs(p: Polygon): number {
  let a = 0;
  for (let i = 0; i < p.length; i += 2) {
    const j = (i + 2) % p.length;
    a += p[i] * p[j + 1] - p[j] * p[i + 1];
  }
  return Math.abs(a / 2);
}

export function regionArea(r: Region): number {
  return polygonAreaAbs(r.outer) - r.holes.reduce((s, h) => s + polygonAreaAbs(h), 0);
}

export const regionsArea = (rs: Region[]): number => rs.reduce((s, r) => s + regionArea(r), 0);

/** Signed distance from (x, y) to the boundary of polygons (even-odd inside test): > 0 inside. */
function signedDistance(x: number, y: number, polys: Polygon[]): number {
  let inside = false;
  let best = Infinity;
  for (const p of polys) {
    const n = p.length;
    for (let i = 0, j = n - 2; i < n; j = i, i += 2) {
      const ax = p[i], ay = p[i + 1], bx = p[j], by = p[j + 1];
      if (ay > y !== by > y && x < ((bx - ax) * (y - ay)) / (by - ay) + ax) inside = !inside;
      // distance to segment a–b
      let dx = bx - ax, dy = by - ay;
      let px = ax, py = ay;
      if (dx !== 0 || dy !== 0) {
        const t = ((x - ax) * dx + (y - ay) * dy) / (dx * dx + dy * dy);
        if (t > 1) { px = bx; py = by; } else if (t > 0) { px += dx * t; py += dy * t; }
      }
      dx = x - px; dy = y - py;
      const d = dx * dx + dy * dy;
      if (d < best) best = d;
    }
  }
  return (inside ? 1 : -1) * Math.sqrt(best);
}

/**
 * The widest stroke a shape holds: the diameter of its largest inscribed circle, found with the
 * quadtree "pole of inaccessibility" search (as in Mapbox's polylabel) to `precisionMm`.
 */
export function inscribedWidth(polys: Polygon[], precisionMm = 0.05): number {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const p of polys) for (let i = 0; i < p.length; i += 2) {
    if (p[i] < minX) minX = p[i]; if (p[i] > maxX) maxX = p[i];
    if (p[i + 1] < minY) minY = p[i + 1]; if (p[i + 1] > maxY) maxY = p[i + 1];
  }
  if (minX === Infinity) return 0;
  const size = Math.min(maxX - minX, maxY - minY);
  if (size <= 0) return 0;
  interface Cell { x: number; y: number; h: number; d: number; max: number }
  const cell = (x: number, y: number, h: number): Cell => {
    const d = signedDistance(x, y, polys);
    return { x, y, h, d, max: d + h * Math.SQRT2 };
  };
  const queue: Cell[] = [];
  const push = (c: Cell) => { queue.push(c); };
  const h0 = size / 2;
  for (let x = minX; x < maxX; x += size) for (let y = minY; y < maxY; y += size) push(cell(x + h0, y + h0, h0));
  let best = cell((minX + maxX) / 2, (minY + maxY) / 2, 0);
  for (const c of queue) if (c.d > best.d) best = c;
  let guard = 0;
  while (queue.length && guard++ < 20000) {
    // take the most promising cell
    let bi = 0;
    for (let i = 1; i < queue.length; i++) if (queue[i].max > queue[bi].max) bi = i;
    const c = queue[bi];
    queue[bi] = queue[queue.length - 1];
    queue.pop();
    if (c.d > best.d) best = c;
    if (c.max - best.d <= precisionMm / 2) continue;
    const h = c.h / 2;
    push(cell(c.x - h, c.y - h, h)); push(cell(c.x + h, c.y - h, h));
    push(cell(c.x - h, c.y + h, h)); push(cell(c.x + h, c.y + h, h));
  }
  return Math.max(0, 2 * best.d);
}

/** True when an inward offset of width/2 erases the shape entirely: it is narrower than `widthMm` everywhere. */
export function isNarrowerThan(polys: Polygon[], widthMm: number): boolean {
  return regionsArea(offsetPolygons(polys, -widthMm / 2, 0.1, 'miter')) <= 1e-6;
}

/** Area of the parts thinner than widthMm: shape minus its morphological opening. */
export function thinArea(polys: Polygon[], widthMm: number): number {
  const total = regionsArea(unionRegions(polys));
  const opened = offsetPolygons(regionsToPolygons(offsetPolygons(polys, -widthMm / 2, 0.1, 'miter')), widthMm / 2, 0.1);
  return Math.max(0, total - regionsArea(opened));
}
