/**
 * Path geometry in millimetres (y down). A path is a list of subpaths made of absolute line,
 * quadratic and cubic segments — the only kinds fonts and normalised SVG produce (arcs are turned
 * into cubics by svgpath's `unarc`). Pure functions, no I/O.
 */
import svgpath from 'svgpath';
import { checkCoordinate, LimitError, MAX_COORDINATE_MM, MAX_FLATTENED_POINTS, MAX_SEGMENTS_PER_CURVE } from './limits.ts';

export type Segment = { t: 'L'; x: number; y: number } | { t: 'Q'; x1: number; y1: number; x: number; y: number } | { t: 'C'; x1: number; y1: number; x2: number; y2: number; x: number; y: number };
export interface SubPath {
  x0: number;
  y0: number;
  segs: Segment[];
  closed: boolean;
}
export type Path = SubPath[];
export interface BBox {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}
/** A closed polygon as a flat [x0, y0, x1, y1, …] array, in mm. */
export type Polygon = number[];

export const EMPTY_BBOX: BBox = Object.freeze({ minX: 0, minY: 0, maxX: 0, maxY: 0 });

/** Path coordinates are written with 3 decimals (1 µm): exact enough to cut, identical in every JS engine. */
export function fmt(v: number): string {
  const r = Math.round(v * 1000) / 1000;
  return r === 0 ? '0' : String(r);
}

/** Parses any SVG path data (relative, shorthand, arcs…) into absolute L/Q/C subpaths. */
export function parsePathData(d: string): Path {
  return fromSvgPath(svgpath(d));
}

/** Reads an svgpath object (after its queued transforms) into our Path form. */
export function fromSvgPath(sp: ReturnType<typeof svgpath>): Path {
  const out: Path = [];
  let cur: SubPath | null = null;
  let cx = 0;
  let cy = 0;
  let sx = 0;
  let sy = 0;
  sp.unarc()
    .unshort()
    .abs()
    .iterate((s) => {
      const c = s[0];
      switch (c) {
        case 'M':
          cur = { x0: s[1], y0: s[2], segs: [], closed: false };
          out.push(cur);
          cx = sx = s[1];
          cy = sy = s[2];
          return;
        case 'Z':
        case 'z':
          if (cur) {
            cur.closed = true;
            cx = sx;
            cy = sy;
            cur = null;
          }
          return;
      }
      if (!cur) {
        // Drawing after Z without M starts at the last subpath's start point (SVG rule).
        cur = { x0: cx, y0: cy, segs: [], closed: false };
        out.push(cur);
      }
      const segs = (cur as SubPath).segs;
      switch (c) {
        case 'L':
          segs.push({ t: 'L', x: s[1], y: s[2] });
          cx = s[1];
          cy = s[2];
          break;
        case 'H':
          segs.push({ t: 'L', x: s[1], y: cy });
          cx = s[1];
          break;
        case 'V':
          segs.push({ t: 'L', x: cx, y: s[1] });
          cy = s[1];
          break;
        case 'Q':
          segs.push({ t: 'Q', x1: s[1], y1: s[2], x: s[3], y: s[4] });
          cx = s[3];
          cy = s[4];
          break;
        case 'C':
          segs.push({ t: 'C', x1: s[1], y1: s[2], x2: s[3], y2: s[4], x: s[5], y: s[6] });
          cx = s[5];
          cy = s[6];
          break;
        default:
          break; // after abs/unshort/unarc nothing else remains
      }
    });
  return out;
}

/** Writes a Path as compact SVG path data with 1 µm precision. */
export function formatPath(path: Path): string {
  let d = '';
  for (const sp of path) {
    d += `M${fmt(sp.x0)} ${fmt(sp.y0)}`;
    for (const s of sp.segs) {
      if (s.t === 'L') d += `L${fmt(s.x)} ${fmt(s.y)}`;
      else if (s.t === 'Q') d += `Q${fmt(s.x1)} ${fmt(s.y1)} ${fmt(s.x)} ${fmt(s.y)}`;
      else d += `C${fmt(s.x1)} ${fmt(s.y1)} ${fmt(s.x2)} ${fmt(s.y2)} ${fmt(s.x)} ${fmt(s.y)}`;
    }
    if (sp.closed) d += 'Z';
  }
  return d;
}

const r3 = (v: number) => {
  const r = Math.round(v * 1000) / 1000;
  return r === 0 ? 0 : r;
};

/**
 * The path `parsePathData(formatPath(path))` gives — every coordinate on the 1 µm grid, as written —
 * without writing and parsing the string.
 */
export function roundPath(path: Path): Path {
  return path.map((sp) => ({
    x0: r3(sp.x0),
    y0: r3(sp.y0),
    segs: sp.segs.map((s): Segment => {
      if (s.t === 'L') return { t: 'L', x: r3(s.x), y: r3(s.y) };
      if (s.t === 'Q') return { t: 'Q', x1: r3(s.x1), y1: r3(s.y1), x: r3(s.x), y: r3(s.y) };
      return { t: 'C', x1: r3(s.x1), y1: r3(s.y1), x2: r3(s.x2), y2: r3(s.y2), x: r3(s.x), y: r3(s.y) };
    }),
    closed: sp.closed,
  }));
}

/** Applies x' = a·x + c·y + e, y' = b·x + d·y + f (the SVG matrix order). */
export function transformPath(path: Path, m: readonly [number, number, number, number, number, number]): Path {
  const [a, b, c, d, e, f] = m;
  const X = (x: number, y: number) => a * x + c * y + e;
  const Y = (x: number, y: number) => b * x + d * y + f;
  return path.map((sp) => ({
    x0: X(sp.x0, sp.y0),
    y0: Y(sp.x0, sp.y0),
    closed: sp.closed,
    segs: sp.segs.map((s): Segment => {
      if (s.t === 'L') return { t: 'L', x: X(s.x, s.y), y: Y(s.x, s.y) };
      if (s.t === 'Q') return { t: 'Q', x1: X(s.x1, s.y1), y1: Y(s.x1, s.y1), x: X(s.x, s.y), y: Y(s.x, s.y) };
      return { t: 'C', x1: X(s.x1, s.y1), y1: Y(s.x1, s.y1), x2: X(s.x2, s.y2), y2: Y(s.x2, s.y2), x: X(s.x, s.y), y: Y(s.x, s.y) };
    }),
  }));
}

export const translatePath = (path: Path, dx: number, dy: number): Path => transformPath(path, [1, 0, 0, 1, dx, dy]);
export const scalePath = (path: Path, s: number): Path => transformPath(path, [s, 0, 0, s, 0, 0]);

/** Mirror about the vertical line x = axisX (HTV is cut mirrored). Mirroring twice is the identity. */
export const mirrorPath = (path: Path, axisX: number): Path => transformPath(path, [-1, 0, 0, 1, 2 * axisX, 0]);

/** Mirrors path data about its own bbox's vertical centre line, so the piece stays where it is. */
export function mirrorPathData(d: string, axisX?: number): string {
  const p = parsePathData(d);
  const ax = axisX ?? ((b) => (b.minX + b.maxX) / 2)(pathBBox(p));
  return formatPath(mirrorPath(p, ax));
}

// ---- exact bounding box: endpoints plus the curve's extrema (roots of the derivative) ----

/** Passes `acc` the value of a quadratic Bézier (one coordinate) at each turning point strictly inside the curve. */
export function quadExtrema(p0: number, p1: number, p2: number, acc: (v: number) => void): void {
  const den = p0 - 2 * p1 + p2;
  if (den !== 0) {
    const t = (p0 - p1) / den;
    if (t > 0 && t < 1) acc((1 - t) * (1 - t) * p0 + 2 * (1 - t) * t * p1 + t * t * p2);
  }
}

function cubicAt(p0: number, p1: number, p2: number, p3: number, t: number): number {
  const u = 1 - t;
  return u * u * u * p0 + 3 * u * u * t * p1 + 3 * u * t * t * p2 + t * t * t * p3;
}

/** Passes `acc` the value of a cubic Bézier (one coordinate) at each turning point strictly inside the curve. */
export function cubicExtrema(p0: number, p1: number, p2: number, p3: number, acc: (v: number) => void): void {
  // B'(t)/3 = a t² + b t + c
  const a = -p0 + 3 * p1 - 3 * p2 + p3;
  const b = 2 * (p0 - 2 * p1 + p2);
  const c = p1 - p0;
  if (Math.abs(a) < 1e-12) {
    if (Math.abs(b) > 1e-12) {
      const t = -c / b;
      if (t > 0 && t < 1) acc(cubicAt(p0, p1, p2, p3, t));
    }
    return;
  }
  const disc = b * b - 4 * a * c;
  if (disc < 0) return;
  const sq = Math.sqrt(disc);
  for (const t of [(-b + sq) / (2 * a), (-b - sq) / (2 * a)]) if (t > 0 && t < 1) acc(cubicAt(p0, p1, p2, p3, t));
}

/** The tight bounding box of a path (curve extrema, not control points). Empty path → zero box. */
/**
 * A box grown one coordinate at a time (x and y are fed separately, as the extrema helpers above
 * report them): `box()` is the box so far, or null while nothing has been added.
 */
export function bboxGrower() {
  let minX = Infinity,
    minY = Infinity,
    maxX = -Infinity,
    maxY = -Infinity;
  return {
    ax: (v: number) => {
      if (v < minX) minX = v;
      if (v > maxX) maxX = v;
    },
    ay: (v: number) => {
      if (v < minY) minY = v;
      if (v > maxY) maxY = v;
    },
    box: (): BBox | null => (minX === Infinity ? null : { minX, minY, maxX, maxY }),
  };
}

export function pathBBox(path: Path): BBox {
  const { ax, ay, box } = bboxGrower();
  for (const sp of path) {
    let px = sp.x0,
      py = sp.y0;
    ax(px);
    ay(py);
    for (const s of sp.segs) {
      if (s.t === 'Q') {
        quadExtrema(px, s.x1, s.x, ax);
        quadExtrema(py, s.y1, s.y, ay);
      } else if (s.t === 'C') {
        cubicExtrema(px, s.x1, s.x2, s.x, ax);
        cubicExtrema(py, s.y1, s.y2, s.y, ay);
      }
      ax(s.x);
      ay(s.y);
      px = s.x;
      py = s.y;
    }
  }
  return box() ?? { ...EMPTY_BBOX };
}

export function unionBBox(a: BBox | null, b: BBox): BBox {
  if (!a) return { ...b };
  return { minX: Math.min(a.minX, b.minX), minY: Math.min(a.minY, b.minY), maxX: Math.max(a.maxX, b.maxX), maxY: Math.max(a.maxY, b.maxY) };
}

// ---- exact signed area by Green's theorem: A = ½∮(x dy − y dx) ----
// The integrand is a polynomial of degree ≤ 5 on a cubic, so 3-point Gauss–Legendre is exact.
const GAUSS_LEGENDRE_3 = [
  { t: 0.5 - Math.sqrt(15) / 10, w: 5 / 18 },
  { t: 0.5, w: 8 / 18 },
  { t: 0.5 + Math.sqrt(15) / 10, w: 5 / 18 },
] as const;

function segArea(px: number, py: number, s: Segment): number {
  if (s.t === 'L') return (px * s.y - s.x * py) / 2;
  let sum = 0;
  for (const { t, w } of GAUSS_LEGENDRE_3) {
    const u = 1 - t;
    let x: number, y: number, dx: number, dy: number;
    if (s.t === 'Q') {
      x = u * u * px + 2 * u * t * s.x1 + t * t * s.x;
      y = u * u * py + 2 * u * t * s.y1 + t * t * s.y;
      dx = 2 * u * (s.x1 - px) + 2 * t * (s.x - s.x1);
      dy = 2 * u * (s.y1 - py) + 2 * t * (s.y - s.y1);
    } else {
      x = cubicAt(px, s.x1, s.x2, s.x, t);
      y = cubicAt(py, s.y1, s.y2, s.y, t);
      dx = 3 * u * u * (s.x1 - px) + 6 * u * t * (s.x2 - s.x1) + 3 * t * t * (s.x - s.x2);
      dy = 3 * u * u * (s.y1 - py) + 6 * u * t * (s.y2 - s.y1) + 3 * t * t * (s.y - s.y2);
    }
    sum += w * (x * dy - y * dx);
  }
  return sum / 2;
}

/** Signed area of each subpath (closed implicitly, as fill does). Positive = clockwise on screen (y down). */
export function subpathAreas(path: Path): number[] {
  return path.map((sp) => {
    let a = 0,
      px = sp.x0,
      py = sp.y0;
    for (const s of sp.segs) {
      a += segArea(px, py, s);
      px = s.x;
      py = s.y;
    }
    a += (px * sp.y0 - sp.x0 * py) / 2; // closing line
    return a;
  });
}

/** Exact filled area of a path whose holes wind opposite to their outlines (fonts, clipper output). */
export function pathArea(path: Path): number {
  return Math.abs(subpathAreas(path).reduce((s, a) => s + a, 0));
}

// ---- flattening (Wang's formula for the number of chords per curve) ----

/** Every coordinate of a path is finite and within ±MAX_COORDINATE_MM; throws LimitError otherwise. */
export function checkPathBounds(path: Path, what = 'A point of the path'): void {
  const M = MAX_COORDINATE_MM;
  const bad = (v: number) => !(v <= M && v >= -M); // NaN fails too
  for (const sp of path) {
    if (bad(sp.x0)) checkCoordinate(sp.x0, what);
    if (bad(sp.y0)) checkCoordinate(sp.y0, what);
    for (const s of sp.segs) {
      if (bad(s.x)) checkCoordinate(s.x, what);
      if (bad(s.y)) checkCoordinate(s.y, what);
      if (s.t !== 'L') {
        if (bad(s.x1)) checkCoordinate(s.x1, what);
        if (bad(s.y1)) checkCoordinate(s.y1, what);
        if (s.t === 'C') {
          if (bad(s.x2)) checkCoordinate(s.x2, what);
          if (bad(s.y2)) checkCoordinate(s.y2, what);
        }
      }
    }
  }
}

/** Number of segments in a path (each line or curve). */
export const segmentCount = (path: Path): number => path.reduce((n, sp) => n + sp.segs.length, 0);

/**
 * Flattens each subpath into a closed polygon; `tolMm` is the largest distance from the true curve.
 * Bounded (shared/engine/limits.ts): every coordinate within ±MAX_COORDINATE_MM, at most
 * MAX_SEGMENTS_PER_CURVE chords per curve and MAX_FLATTENED_POINTS points in all, else LimitError.
 */
export function flattenPath(path: Path, tolMm = 0.01): Polygon[] {
  checkPathBounds(path);
  if (!(tolMm > 0)) throw new RangeError('The flattening tolerance must be positive.');
  const chords = (k: number, m: number) => Math.min(MAX_SEGMENTS_PER_CURVE, Math.max(1, Math.ceil(Math.sqrt((k * m) / tolMm))));
  const polys: Polygon[] = [];
  let budget = MAX_FLATTENED_POINTS;
  const spend = (n: number) => {
    budget -= n;
    if (budget < 0) throw new LimitError('MAX_FLATTENED_POINTS', `The shape is too detailed: flattening it takes more than ${MAX_FLATTENED_POINTS.toLocaleString('en')} points.`);
  };
  for (const sp of path) {
    const pts: number[] = [sp.x0, sp.y0];
    let px = sp.x0,
      py = sp.y0;
    spend(1);
    for (const s of sp.segs) {
      if (s.t === 'L') {
        spend(1);
        pts.push(s.x, s.y);
      } else if (s.t === 'Q') {
        const m = Math.hypot(px - 2 * s.x1 + s.x, py - 2 * s.y1 + s.y);
        const n = chords(0.25, m);
        spend(n);
        for (let i = 1; i <= n; i++) {
          const t = i / n,
            u = 1 - t;
          pts.push(u * u * px + 2 * u * t * s.x1 + t * t * s.x, u * u * py + 2 * u * t * s.y1 + t * t * s.y);
        }
      } else {
        const m = Math.max(Math.hypot(px - 2 * s.x1 + s.x2, py - 2 * s.y1 + s.y2), Math.hypot(s.x1 - 2 * s.x2 + s.x, s.y1 - 2 * s.y2 + s.y));
        const n = chords(0.75, m);
        spend(n);
        for (let i = 1; i <= n; i++) {
          const t = i / n;
          pts.push(cubicAt(px, s.x1, s.x2, s.x, t), cubicAt(py, s.y1, s.y2, s.y, t));
        }
      }
      px = s.x;
      py = s.y;
    }
    if (pts.length >= 6) polys.push(pts);
  }
  return polys;
}

/** Polygons → path data (straight segments, closed). */
export function polygonsToPath(polys: Polygon[]): Path {
  return polys
    .filter((p) => p.length >= 6)
    .map((p) => {
      const segs: Segment[] = [];
      // at least three (x, y) pairs, by the filter above
      for (let i = 2; i < p.length; i += 2) segs.push({ t: 'L', x: p[i]!, y: p[i + 1]! });
      return { x0: p[0]!, y0: p[1]!, segs, closed: true };
    });
}

/** Signed shoelace area of a flat polygon. */
export function polygonArea(p: Polygon): number {
  let a = 0;
  const n = p.length;
  for (let i = 0; i < n; i += 2) {
    const j = (i + 2) % n;
    const xi = p[i]!,
      yi = p[i + 1]!,
      xj = p[j]!,
      yj = p[j + 1]!; // i, j < n, pairs of (x, y)
    a += xi * yj - xj * yi;
  }
  return a / 2;
}
