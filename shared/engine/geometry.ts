/**
 * Polygon union and offset with Clipper (Angus Johnson's polygon clipping library, `clipper-lib`).
 * Clipper works on integers: we scale mm by 10 000 (0.1 µm grid), far below cutting precision.
 */
import ClipperLib from 'clipper-lib';
import type { Polygon } from './path.ts';

const SCALE = 10_000;
export type FillRule = 'nonzero' | 'evenodd';

/** One filled region: an outer contour and its holes (the counters of a letter). */
export interface Region {
  outer: Polygon;
  holes: Polygon[];
}

function toInt(polys: Polygon[]): ClipperLib.Paths {
  return polys.map((p) => {
    const out: ClipperLib.Path = [];
    for (let i = 0; i < p.length; i += 2) out.push({ X: Math.round(p[i]! * SCALE), Y: Math.round(p[i + 1]! * SCALE) });
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
    const first = out[0];
    return first && first.length >= 3 ? fromInt(first) : null;
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

/**
 * The outer contours of polygons grown by `deltaMm` (round joins), holes filled: one Clipper offset
 * straight from the raw contours (overlapping ones merge), keeping only the top-level outers, so
 * the result is disjoint simple polygons.
 */
export function grownOuterContours(polys: Polygon[], deltaMm: number, arcToleranceMm = 0.01, join: 'round' | 'miter' = 'round'): Polygon[] {
  if (polys.length === 0) return [];
  const co = new ClipperLib.ClipperOffset(2, arcToleranceMm * SCALE);
  co.AddPaths(toInt(polys), join === 'round' ? ClipperLib.JoinType.jtRound : ClipperLib.JoinType.jtMiter, ClipperLib.EndType.etClosedPolygon);
  const tree = new ClipperLib.PolyTree();
  co.Execute(tree, deltaMm * SCALE);
  return tree.Childs().map((n) => fromInt(n.Contour()));
}

export function polygonAreaAbs(p: Polygon): number {
  let a = 0;
  for (let i = 0; i < p.length; i += 2) {
    const j = (i + 2) % p.length;
    const xi = p[i]!,
      yi = p[i + 1]!,
      xj = p[j]!,
      yj = p[j + 1]!; // i, j < p.length, pairs of (x, y)
    a += xi * yj - xj * yi;
  }
  return Math.abs(a / 2);
}

export function regionArea(r: Region): number {
  return polygonAreaAbs(r.outer) - r.holes.reduce((s, h) => s + polygonAreaAbs(h), 0);
}

export const regionsArea = (rs: Region[]): number => rs.reduce((s, r) => s + regionArea(r), 0);

/** Squared distance from (x, y) to the segment a–b (to the nearer end beyond either end). */
function segmentDist2(ax: number, ay: number, bx: number, by: number, x: number, y: number): number {
  let dx = bx - ax,
    dy = by - ay;
  let px = ax,
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
  return dx * dx + dy * dy;
}

/** Signed distance from (x, y) to the boundary of polygons (even-odd inside test): > 0 inside. */
function signedDistance(x: number, y: number, polys: Polygon[]): number {
  let inside = false;
  let best = Infinity;
  for (const p of polys) {
    const n = p.length;
    for (let i = 0, j = n - 2; i < n; j = i, i += 2) {
      const ax = p[i]!,
        ay = p[i + 1]!,
        bx = p[j]!,
        by = p[j + 1]!; // i, j < n, pairs of (x, y)
      if (ay > y !== by > y && x < ((bx - ax) * (y - ay)) / (by - ay) + ax) inside = !inside;
      const d = segmentDist2(ax, ay, bx, by, x, y);
      if (d < best) best = d;
    }
  }
  return (inside ? 1 : -1) * Math.sqrt(best);
}

/** Polygon edges as a flat table [ax, ay, bx, by, …] in the order signedDistance walks them. */
function edgeTable(polys: Polygon[]): Float64Array {
  let n = 0;
  for (const p of polys) n += p.length >> 1;
  const e = new Float64Array(n * 4);
  let k = 0;
  for (const p of polys) {
    const m = p.length;
    for (let i = 0, j = m - 2; i < m; j = i, i += 2) {
      e[k++] = p[i]!;
      e[k++] = p[i + 1]!;
      e[k++] = p[j]!;
      e[k++] = p[j + 1]!;
    }
  }
  return e;
}

/** Squared distance from (x, y) to edge k — signedDistance's arithmetic exactly (the same function). */
function edgeDist2(e: Float64Array, k: number, x: number, y: number): number {
  return segmentDist2(e[k]!, e[k + 1]!, e[k + 2]!, e[k + 3]!, x, y); // k is an edge's first slot of four
}

/** The crossing test of signedDistance's even-odd rule for edge k and the ray from (x, y) to the right. */
function edgeCrosses(e: Float64Array, k: number, x: number, y: number): boolean {
  const ax = e[k]!,
    ay = e[k + 1]!,
    bx = e[k + 2]!,
    by = e[k + 3]!; // k is an edge's first slot of four
  return ay > y !== by > y && x < ((bx - ax) * (y - ay)) / (by - ay) + ax;
}

/**
 * Edges bucketed on a uniform grid (each edge in every cell its bbox touches) and by grid row, so a
 * signed distance needs only the edges near the point and the edges of its row. It returns exactly
 * what the plain all-edges loop returns: the nearest edge is searched in rings of cells until no
 * unvisited edge can be nearer (a bound with a margin far above rounding), the inside test counts
 * every edge whose y-range contains the point's y (all of them are in its row), and min and parity
 * do not depend on the order edges are visited in.
 */
interface EdgeIndex {
  e: Float64Array;
  n: number;
  x0: number;
  y0: number;
  cw: number;
  ch: number;
  gx: number;
  gy: number;
  cellStart: Int32Array;
  cellEdges: Int32Array;
  rowStart: Int32Array;
  rowEdges: Int32Array;
  stamp: Int32Array;
  query: number;
}

const INDEX_MIN_EDGES = 64;

function buildEdgeIndex(e: Float64Array, minX: number, minY: number, maxX: number, maxY: number): EdgeIndex {
  const n = e.length >> 2;
  const W = maxX - minX,
    H = maxY - minY;
  const side = Math.sqrt((W * H) / Math.max(1, n / 2)) || Math.max(W, H);
  const gx = Math.max(1, Math.min(256, Math.ceil(W / side))),
    gy = Math.max(1, Math.min(256, Math.ceil(H / side)));
  const cw = W / gx || 1,
    ch = H / gy || 1;
  const cx = (v: number) => {
    const i = Math.floor((v - minX) / cw);
    return i < 0 ? 0 : i >= gx ? gx - 1 : i;
  };
  const cy = (v: number) => {
    const j = Math.floor((v - minY) / ch);
    return j < 0 ? 0 : j >= gy ? gy - 1 : j;
  };
  const cellCount = new Int32Array(gx * gy + 1),
    rowCount = new Int32Array(gy + 1);
  const range = new Int32Array(n * 4);
  for (let q = 0; q < n; q++) {
    const k = q * 4;
    const ax = e[k]!,
      ay = e[k + 1]!,
      bx = e[k + 2]!,
      by = e[k + 3]!; // q < n = e.length / 4
    const i0 = cx(Math.min(ax, bx)),
      i1 = cx(Math.max(ax, bx));
    const j0 = cy(Math.min(ay, by)),
      j1 = cy(Math.max(ay, by));
    range[k] = i0;
    range[k + 1] = i1;
    range[k + 2] = j0;
    range[k + 3] = j1;
    // cx/cy clamp to [0, gx) and [0, gy): the counters have gx·gy + 1 and gy + 1 slots
    for (let j = j0; j <= j1; j++) {
      rowCount[j + 1]!++;
      for (let i = i0; i <= i1; i++) cellCount[j * gx + i + 1]!++;
    }
  }
  for (let c = 0; c < gx * gy; c++) cellCount[c + 1]! += cellCount[c]!;
  for (let r = 0; r < gy; r++) rowCount[r + 1]! += rowCount[r]!;
  const cellStart = cellCount.slice(),
    rowStart = rowCount.slice();
  const cellEdges = new Int32Array(cellCount[gx * gy]!),
    rowEdges = new Int32Array(rowCount[gy]!);
  const cfill = cellStart.slice(0, gx * gy),
    rfill = rowStart.slice(0, gy);
  for (let q = 0; q < n; q++) {
    const k = q * 4;
    const i0 = range[k]!,
      i1 = range[k + 1]!,
      j0 = range[k + 2]!,
      j1 = range[k + 3]!; // written in the loop above
    for (let j = j0; j <= j1; j++) {
      rowEdges[rfill[j]!++] = k;
      for (let i = i0; i <= i1; i++) cellEdges[cfill[j * gx + i]!++] = k;
    }
  }
  return { e, n, x0: minX, y0: minY, cw, ch, gx, gy, cellStart, cellEdges, rowStart, rowEdges, stamp: new Int32Array(n), query: 0 };
}

function signedDistanceIndexed(x: number, y: number, ix: EdgeIndex): number {
  const { e, gx, gy, cellStart, cellEdges, stamp } = ix;
  let qi = Math.floor((x - ix.x0) / ix.cw),
    qj = Math.floor((y - ix.y0) / ix.ch);
  qi = qi < 0 ? 0 : qi >= gx ? gx - 1 : qi;
  qj = qj < 0 ? 0 : qj >= gy ? gy - 1 : qj;
  let inside = false;
  // qj is clamped to [0, gy) and rowStart has gy + 1 slots; r stays inside the row's slice of rowEdges
  for (let r = ix.rowStart[qj]!, end = ix.rowStart[qj + 1]!; r < end; r++) if (edgeCrosses(e, ix.rowEdges[r]!, x, y)) inside = !inside;
  const q = ++ix.query;
  const step = Math.min(ix.cw, ix.ch);
  const rings = Math.max(qi, gx - 1 - qi, qj, gy - 1 - qj);
  let best = Infinity;
  for (let k = 0; k <= rings; k++) {
    // Every edge outside rings 0..k-1 is more than (k-1)·step away (the point is inside or beyond its clamped cell).
    if (k >= 2) {
      const bound = (k - 1) * step - 1e-7;
      if (bound > 0 && bound * bound > best) break;
    }
    const j0 = Math.max(0, qj - k),
      j1 = Math.min(gy - 1, qj + k),
      i0 = Math.max(0, qi - k),
      i1 = Math.min(gx - 1, qi + k);
    for (let j = j0; j <= j1; j++) {
      const onEdgeRow = j === qj - k || j === qj + k;
      for (let i = i0; i <= i1; i++) {
        if (!onEdgeRow && i !== qi - k && i !== qi + k) continue; // only the ring's own cells
        const c = j * gx + i;
        // c < gx·gy and cellStart has gx·gy + 1 slots; t stays inside the cell's slice of cellEdges
        for (let t = cellStart[c]!, end = cellStart[c + 1]!; t < end; t++) {
          const ek = cellEdges[t]!;
          const id = ek >> 2;
          if (stamp[id] === q) continue;
          stamp[id] = q;
          const d = edgeDist2(e, ek, x, y);
          if (d < best) best = d;
        }
      }
    }
  }
  return (inside ? 1 : -1) * Math.sqrt(best);
}

/** signedDistance over an edge table: the same arithmetic, edge by edge. */
function signedDistanceEdges(x: number, y: number, e: Float64Array): number {
  let inside = false;
  let best = Infinity;
  for (let k = 0; k < e.length; k += 4) {
    if (edgeCrosses(e, k, x, y)) inside = !inside;
    const d = edgeDist2(e, k, x, y);
    if (d < best) best = d;
  }
  return (inside ? 1 : -1) * Math.sqrt(best);
}

interface Cell {
  x: number;
  y: number;
  h: number;
  d: number;
  max: number;
  pos: number;
  hi: number;
}

/**
 * The cell queue of the inscribed-circle search. It hands out cells in exactly the order a plain
 * array scanned for the first cell with the largest `max` and emptied by swap-remove would (the
 * straightforward form of the search): the order is (max descending, array position ascending),
 * kept in a binary heap, with each cell's array position tracked as swap-remove moves cells.
 * O(log n) per step instead of O(n), same cells, same result.
 */
class CellQueue {
  private readonly arr: Cell[] = [];
  private readonly heap: Cell[] = [];
  get length(): number {
    return this.arr.length;
  }
  private before(a: Cell, b: Cell): boolean {
    return a.max > b.max || (a.max === b.max && a.pos < b.pos);
  }
  // up/down are called with an index of a cell in the heap, and only visit parents/children below heap.length
  private up(i: number): void {
    const h = this.heap,
      c = h[i]!;
    while (i > 0) {
      const pi = (i - 1) >> 1,
        p = h[pi]!;
      if (!this.before(c, p)) break;
      h[i] = p;
      p.hi = i;
      i = pi;
    }
    h[i] = c;
    c.hi = i;
  }
  private down(i: number): void {
    const h = this.heap,
      n = h.length,
      c = h[i]!;
    for (;;) {
      let k = 2 * i + 1;
      if (k >= n) break;
      if (k + 1 < n && this.before(h[k + 1]!, h[k]!)) k++;
      const child = h[k]!;
      if (!this.before(child, c)) break;
      h[i] = child;
      child.hi = i;
      i = k;
    }
    h[i] = c;
    c.hi = i;
  }
  push(c: Cell): void {
    c.pos = this.arr.length;
    this.arr.push(c);
    c.hi = this.heap.length;
    this.heap.push(c);
    this.up(c.hi);
  }
  /** Removes and returns the most promising cell. */
  pop(): Cell {
    const h = this.heap,
      top = h[0];
    if (!top) throw new Error('CellQueue.pop() on an empty queue');
    const tail = h.pop()!;
    if (tail !== top) {
      h[0] = tail;
      tail.hi = 0;
      this.down(0);
    }
    const arr = this.arr,
      last = arr.pop()!;
    if (last !== top) {
      // swap-remove: the array's last cell takes the popped cell's slot (a lower position ranks earlier among ties)
      arr[top.pos] = last;
      last.pos = top.pos;
      this.up(last.hi);
    }
    return top;
  }
  cells(): readonly Cell[] {
    return this.arr;
  }
}

/**
 * The widest stroke a shape holds: the diameter of its largest inscribed circle, found with the
 * quadtree "pole of inaccessibility" search (as in Mapbox's polylabel) to `precisionMm`.
 */
export function inscribedWidth(polys: Polygon[], precisionMm = 0.05): number {
  let minX = Infinity,
    minY = Infinity,
    maxX = -Infinity,
    maxY = -Infinity;
  for (const p of polys)
    for (let i = 0; i < p.length; i += 2) {
      const x = p[i]!,
        y = p[i + 1]!; // i < p.length, pairs of (x, y)
      if (x < minX) minX = x;
      if (x > maxX) maxX = x;
      if (y < minY) minY = y;
      if (y > maxY) maxY = y;
    }
  if (minX === Infinity) return 0;
  const size = Math.min(maxX - minX, maxY - minY);
  if (size <= 0) return 0;
  const edges = edgeTable(polys);
  const index = edges.length >> 2 >= INDEX_MIN_EDGES ? buildEdgeIndex(edges, minX, minY, maxX, maxY) : null;
  const cell = (x: number, y: number, h: number): Cell => {
    const d = index ? signedDistanceIndexed(x, y, index) : signedDistanceEdges(x, y, edges);
    return { x, y, h, d, max: d + h * Math.SQRT2, pos: 0, hi: 0 };
  };
  const queue = new CellQueue();
  const h0 = size / 2;
  for (let x = minX; x < maxX; x += size) for (let y = minY; y < maxY; y += size) queue.push(cell(x + h0, y + h0, h0));
  let best = cell((minX + maxX) / 2, (minY + maxY) / 2, 0);
  for (const c of queue.cells()) if (c.d > best.d) best = c;
  let guard = 0;
  while (queue.length && guard++ < 20000) {
    const c = queue.pop(); // the most promising cell
    if (c.d > best.d) best = c;
    if (c.max - best.d <= precisionMm / 2) continue;
    const h = c.h / 2;
    queue.push(cell(c.x - h, c.y - h, h));
    queue.push(cell(c.x + h, c.y - h, h));
    queue.push(cell(c.x - h, c.y + h, h));
    queue.push(cell(c.x + h, c.y + h, h));
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

/**
 * Area (mm²) where two shapes overlap: each a list of polygons filled under `rule` (nonzero by
 * default, as cut pieces are), intersected with Clipper. 0 when they only touch.
 */
export function intersectionArea(a: Polygon[], b: Polygon[], rule: FillRule = 'nonzero'): number {
  if (a.length === 0 || b.length === 0) return 0;
  const c = new ClipperLib.Clipper();
  c.AddPaths(toInt(a), ClipperLib.PolyType.ptSubject, true);
  c.AddPaths(toInt(b), ClipperLib.PolyType.ptClip, true);
  const tree = new ClipperLib.PolyTree();
  c.Execute(ClipperLib.ClipType.ctIntersection, tree, fill(rule), fill(rule));
  return regionsArea(treeToRegions(tree, []));
}
