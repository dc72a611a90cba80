/**
 * Nesting by real outlines: each piece's cut outline (the union of its contours, as the blade
 * follows it) is grown by half the weeding gap with Clipper's polygon offset; two pieces whose grown
 * outlines do not overlap are at least the gap apart. Pieces turn 0/90/180/270°, so small ones sit in
 * the hollows of names and motifs.
 *
 * How: a bottom-left fill over rasters. The sheet is a grid of square cells (`cellMm`); a piece's
 * raster is every cell whose centre lies inside its grown outline grown again by half a cell's
 * diagonal (plus the flattening and arc tolerances). Any point of the grown outline lies in some
 * cell, and that cell's centre is within half a diagonal of it, so the raster covers the grown
 * outline: pieces with disjoint rasters have disjoint grown outlines, whatever the cell size.
 * Pieces are placed largest first, each where its far edge along the roll is nearest the start
 * (then leftmost), trying the four turns. Placement offsets are whole cells, so rasters line up.
 * Margins are checked on the outline's exact bbox, not the raster.
 *
 * The box packer (cut-sheets.ts) stays the floor: `nestPieces` runs both and keeps the outline nest
 * only when it is no longer (and uses no more sheets). A time budget stops the outline nest and
 * falls back to the box packer's sheets.
 * Pure: plain data in, plain data out; mm, y down.
 */

import { placementMatrix, readPathData } from './cut-sheet-svg.ts';
import { type CutSheet, CutSheetError, type NestInput, type NestPiece, nestCutSheets, nestInputSchema, type Placement, type Rotation } from './cut-sheets.ts';
import { grownOuterContours } from './geometry.ts';
import { LimitError, MAX_NEST_PIECES } from './limits.ts';
import { flattenPath, type Polygon, pathBBox } from './path.ts';

export interface OutlineNestOptions {
  /** Raster cell, mm: smaller packs a little tighter and runs slower. */
  cellMm?: number;
  /** Stop the outline nest after this long and keep the box packer's sheets. */
  budgetMs?: number;
  /** A clock, for the budget (performance.now by default). */
  now?: () => number;
  /** How far back from the sheet's far end a piece looks for a hollow, mm (Infinity: the whole sheet). */
  lookbackMm?: number;
}

export const DEFAULT_CELL_MM = 1;
export const DEFAULT_BUDGET_MS = 1500;
/** Hollows further back than this from the far end are nearly always too small for what is left. */
export const DEFAULT_LOOKBACK_MM = Infinity;
/**
 * Mitred joins: a mitre (squared off at twice the distance) always covers the round join, so the
 * grown outline still holds the true one, and Clipper makes no arc points — about a third faster
 * on glyph outlines, for the same roll length on the bench.
 */
const JOIN = 'miter';
const FLATTEN_TOL_MM = 0.05;
const ARC_TOL_MM = 0.05;

/** One turn of one piece, rasterised: per row of cells, its occupied spans. */
interface Shape {
  rotation: Rotation;
  /** placed bbox, mm */
  w: number;
  h: number;
  /** first raster row, in cells relative to the placement's cell (negative: the grown part) */
  row0: number;
  /** spans[k] = [a0, a1, a0, a1, …], columns relative to the placement's cell, a1 exclusive */
  spans: Int32Array[];
  /** widest single span per row, for a quick test against the sheet's longest free run */
  widest: Int32Array;
  /** the raster's centre along the roll, mm from the placement's top */
  cy: number;
  /** the widest row (index into spans) and its width */
  kw: number;
  wmax: number;
}

interface Item {
  piece: NestPiece;
  shapes: Shape[];
  grownArea: number;
}

/**
 * The piece's cut outline grown by `growMm`, counters filled (a cell in a counter is never offered:
 * a counter of a name is narrower than any piece grown by the gap), as polygons in the placed frame
 * of each turn.
 */
function rasterise(piece: NestPiece, halfGap: number, cell: number, turns: readonly Rotation[] = [0, 90, 180, 270]): Item {
  const path = readPathData(piece.path);
  const bbox = pathBBox(path);
  const grow = halfGap + (cell * Math.SQRT2) / 2 + FLATTEN_TOL_MM + ARC_TOL_MM + 1e-3;
  const grown = grownOuterContours(flattenPath(path, FLATTEN_TOL_MM), grow, ARC_TOL_MM, JOIN);
  const shapes: Shape[] = [];
  let area = 0;
  for (const rotation of turns) {
    const turned = rotation === 90 || rotation === 270;
    const w = turned ? piece.heightMm : piece.widthMm;
    const h = turned ? piece.widthMm : piece.heightMm;
    const m = placementMatrix({ pieceId: piece.id, xMm: 0, yMm: 0, widthMm: w, heightMm: h, rotated: turned, rotation }, bbox);
    const polys: Polygon[] = grown.map((p) => {
      const out: Polygon = new Array(p.length);
      for (let i = 0; i < p.length; i += 2) {
        const x = p[i]!,
          y = p[i + 1]!;
        out[i] = m[0] * x + m[2] * y + m[4];
        out[i + 1] = m[1] * x + m[3] * y + m[5];
      }
      return out;
    });
    const s = scanline(polys, cell);
    let cells = 0,
      mom = 0;
    s.spans.forEach((sp, k) => {
      for (let q = 0; q < sp.length; q += 2) {
        const n = sp[q + 1]! - sp[q]!;
        cells += n;
        mom += n * (k + s.row0 + 0.5) * cell;
      }
    });
    let kw = 0;
    s.widest.forEach((v, k) => {
      if (v > s.widest[kw]!) kw = k;
    });
    shapes.push({ rotation, w, h, ...s, cy: cells ? mom / cells : h / 2, kw, wmax: s.widest[kw] ?? 0 });
    if (rotation === turns[0]) for (const sp of s.spans) for (let k = 0; k < sp.length; k += 2) area += (sp[k + 1]! - sp[k]!) * cell * cell;
  }
  return { piece, shapes, grownArea: area };
}

/** Cells whose centre ((a + ½)·cell, (b + ½)·cell) lies inside the polygons (even-odd: they are disjoint). */
function scanline(polys: Polygon[], cell: number): { row0: number; spans: Int32Array[]; widest: Int32Array } {
  let minY = Infinity,
    maxY = -Infinity;
  for (const p of polys)
    for (let i = 1; i < p.length; i += 2) {
      const y = p[i]!;
      if (y < minY) minY = y;
      if (y > maxY) maxY = y;
    }
  const b0 = Math.ceil(minY / cell - 0.5);
  const b1 = Math.floor(maxY / cell - 0.5);
  const rows: number[][] = [];
  for (let b = b0; b <= b1; b++) rows.push([]);
  for (const p of polys) {
    const n = p.length;
    for (let i = 0; i < n; i += 2) {
      const x1 = p[i]!,
        y1 = p[i + 1]!;
      const j = (i + 2) % n;
      const x2 = p[j]!,
        y2 = p[j + 1]!;
      if (y1 === y2) continue;
      const lo = Math.min(y1, y2),
        hi = Math.max(y1, y2);
      // rows whose centre line y_c satisfies lo <= y_c < hi (half-open: a vertex counts once)
      const first = Math.ceil(lo / cell - 0.5);
      for (let b = first; (b + 0.5) * cell < hi; b++) {
        const yc = (b + 0.5) * cell;
        if (yc < lo) continue;
        rows[b - b0]!.push(x1 + ((yc - y1) * (x2 - x1)) / (y2 - y1));
      }
    }
  }
  const spans: Int32Array[] = [];
  const widest = new Int32Array(rows.length);
  rows.forEach((xs, k) => {
    xs.sort((a, b) => a - b);
    const out: number[] = [];
    for (let i = 0; i + 1 < xs.length; i += 2) {
      const a0 = Math.ceil(xs[i]! / cell - 0.5);
      const a1 = Math.floor(xs[i + 1]! / cell - 0.5) + 1;
      if (a1 <= a0) continue;
      if (out.length && out[out.length - 1]! >= a0) out[out.length - 1] = Math.max(out[out.length - 1]!, a1);
      else out.push(a0, a1);
    }
    spans.push(Int32Array.from(out));
    let wmax = 0;
    for (let i = 0; i < out.length; i += 2) wmax = Math.max(wmax, out[i + 1]! - out[i]!);
    widest[k] = wmax;
  });
  return { row0: b0, spans, widest };
}

const ctz = (v: number) => 31 - Math.clz32(v & -v);

/** The sheet's occupied cells, a bit per cell, rows growing along the roll as needed. */
class Grid {
  readonly wpr: number;
  bits: Uint32Array;
  /** longest free run per row (cells); rows never touched are all free */
  run: Int32Array;
  /** rows below this one have no free run as wide as any piece's widest row */
  floor = 0;
  constructor(
    readonly cols: number,
    /** row index of world row 0 (room for the grown part above the first piece) */
    readonly off: number,
  ) {
    this.wpr = (cols + 31) >>> 5;
    this.bits = new Uint32Array(this.wpr * 1024);
    this.run = new Int32Array(1024).fill(cols);
  }
  ensure(rows: number) {
    if (rows <= this.run.length) return;
    let cap = this.run.length;
    while (cap < rows) cap *= 2;
    const bits = new Uint32Array(this.wpr * cap);
    bits.set(this.bits);
    const run = new Int32Array(cap).fill(this.cols);
    run.set(this.run);
    this.bits = bits;
    this.run = run;
  }
  /** First set cell in [from, to) of row r, or -1. */
  firstSet(r: number, from: number, to: number): number {
    if (r >= this.run.length) return -1;
    const base = r * this.wpr;
    let w = from >>> 5;
    const last = (to - 1) >>> 5;
    let v = this.bits[base + w]! & (~0 << (from & 31));
    for (;;) {
      if (w === last) v &= 0xffffffff >>> (31 - ((to - 1) & 31));
      if (v) return (w << 5) + ctz(v);
      if (w === last) return -1;
      w++;
      v = this.bits[base + w]!;
    }
  }
  /** First clear cell at or after `from` in row r (cols when none). */
  firstClear(r: number, from: number): number {
    const base = r * this.wpr;
    let w = from >>> 5;
    let v = ~this.bits[base + w]! & (~0 << (from & 31));
    for (;;) {
      if (v) return Math.min(this.cols, (w << 5) + ctz(v));
      w++;
      if (w >= this.wpr) return this.cols;
      v = ~this.bits[base + w]!;
    }
  }
  fill(r: number, from: number, to: number) {
    const base = r * this.wpr;
    for (let c = from; c < to; ) {
      const w = c >>> 5;
      const end = Math.min(to, (w + 1) << 5);
      const n = end - c;
      const mask = n === 32 ? 0xffffffff : ((1 << n) - 1) << (c & 31);
      this.bits[base + w]! |= mask;
      c = end;
    }
  }
  measure(r: number) {
    let best = 0;
    let c = 0;
    while (c < this.cols) {
      const free = this.firstClear(r, c);
      if (free >= this.cols) break;
      const next = this.firstSet(r, free, this.cols);
      const end = next < 0 ? this.cols : next;
      best = Math.max(best, end - free);
      c = end;
    }
    this.run[r] = best;
  }
}

interface Spot {
  i: number;
  j: number;
  shape: Shape;
}

/** Lowest-far-edge, then leftmost spot for one turn of a piece, or null. */
function findSpot(g: Grid, s: Shape, iMin: number, iMax: number, jMin: number, jMax: number, cell: number, bestFar: number): Spot | null {
  const n = s.spans.length;
  // the widest row needs a free run at least as wide: skip the rows that have none
  let r = g.floor;
  while (r < g.run.length && g.run[r]! < s.wmax) r++;
  // a sheet row that was too full last time is tried first (it usually still is, one row higher up
  // the shape): most rejections then cost one comparison
  let failRow = -1;
  for (let j = Math.max(jMin, r - s.row0 - s.kw - g.off); j <= jMax; j++) {
    if (score(j, s, cell) >= bestFar) return null;
    const r0 = j + s.row0 + g.off;
    g.ensure(r0 + n + 1);
    if (g.run[r0 + s.kw]! < s.wmax) continue;
    const kf = failRow - r0;
    if (kf >= 0 && kf < n && g.run[failRow]! < s.widest[kf]!) continue;
    let ok = true;
    for (let k = 0; k < n; k++) {
      if (g.run[r0 + k]! < s.widest[k]!) {
        ok = false;
        failRow = r0 + k;
        break;
      }
    }
    if (!ok) continue;
    let i = iMin;
    let k0 = 0; // the row that collided last: checked first at the next i
    scan: while (i <= iMax) {
      for (let q0 = 0; q0 < n; q0++) {
        const k = (k0 + q0) % n;
        const sp = s.spans[k]!;
        for (let q = 0; q < sp.length; q += 2) {
          const a0 = sp[q]! + i + g.off;
          const hit = g.firstSet(r0 + k, a0, sp[q + 1]! + i + g.off);
          if (hit >= 0) {
            i = Math.max(i + 1, g.firstClear(r0 + k, hit) - sp[q]! - g.off);
            k0 = k;
            continue scan;
          }
        }
      }
      return { i, j, shape: s };
    }
  }
  return null;
}

function place(g: Grid, spot: Spot) {
  const { shape: s, i, j } = spot;
  const r0 = j + s.row0 + g.off;
  g.ensure(r0 + s.spans.length + 1);
  s.spans.forEach((sp, k) => {
    for (let q = 0; q < sp.length; q += 2) g.fill(r0 + k, sp[q]! + i + g.off, sp[q + 1]! + i + g.off);
    g.measure(r0 + k);
  });
}

class OutOfTime extends Error {}
/**
 * Where a spot ranks: the raster's centre along the roll (lowest first). Against "lowest top" or
 * "lowest far edge" this tucks pieces into hollows a little more often (bench/cutsheets.ts).
 */
const score = (j: number, s: Shape, cell: number) => j * cell + s.cy;

/** Nests pieces by outline onto one roll (or fixed sheets); throws OutOfTime past the budget. */
function outlineNest(
  items: Item[],
  rollWidthMm: number,
  gap: number,
  margin: number,
  maxLengthMm: number | undefined,
  cell: number,
  deadline: number,
  now: () => number,
  lookbackMm = DEFAULT_LOOKBACK_MM,
): CutSheet[] {
  const reach = Math.ceil((gap / 2 + cell * 2 + FLATTEN_TOL_MM + ARC_TOL_MM) / cell) + 2;
  const cols = Math.ceil(rollWidthMm / cell) + 2 * reach;
  // largest grown area first (tried against longest side, shortest side and box area: best or tied)
  const order = [...items].sort((a, b) => b.grownArea - a.grownArea);
  const minWide = Math.min(...items.flatMap((it) => it.shapes.map((s) => s.wmax)));
  const sheets: Array<{ grid: Grid; placements: Placement[]; end: number; area: number }> = [];
  const EPS = 1e-9;
  const jMin = Math.ceil(margin / cell - EPS);
  const iMin = Math.ceil(margin / cell - EPS);
  let left = order;
  while (left.length) {
    const grid = new Grid(cols, reach);
    const sheet = { grid, placements: [] as Placement[], end: 0, area: 0 };
    const rest: Item[] = [];
    for (const it of left) {
      if (now() > deadline) throw new OutOfTime();
      while (grid.floor < grid.run.length && grid.run[grid.floor]! < minWide) grid.floor++;
      let best: Spot | null = null;
      let bestFar = Infinity;
      for (const s of it.shapes) {
        const iMax = Math.floor((rollWidthMm - margin - s.w) / cell + EPS);
        if (iMax < iMin) continue;
        const jMax = maxLengthMm !== undefined ? Math.floor((maxLengthMm - margin - s.h) / cell + EPS) : Number.MAX_SAFE_INTEGER;
        const from = Math.max(jMin, Math.floor((sheet.end - lookbackMm) / cell));
        const spot = findSpot(grid, s, iMin, iMax, from, jMax, cell, bestFar);
        const sc = spot ? score(spot.j, s, cell) : Infinity;
        if (spot && sc < bestFar) {
          best = spot;
          bestFar = sc;
        }
      }
      if (!best) {
        rest.push(it);
        continue;
      }
      place(grid, best);
      const p = it.piece;
      const turned = best.shape.rotation === 90 || best.shape.rotation === 270;
      sheet.placements.push({
        pieceId: p.id,
        lineId: p.lineId,
        ...(p.orderNumber !== undefined ? { orderNumber: p.orderNumber } : {}),
        layerId: p.layerId,
        xMm: best.i * cell,
        yMm: best.j * cell,
        widthMm: best.shape.w,
        heightMm: best.shape.h,
        rotated: turned,
        rotation: best.shape.rotation,
      });
      sheet.end = Math.max(sheet.end, best.j * cell + best.shape.h);
      sheet.area += p.areaMm2;
    }
    if (!sheet.placements.length) throw new CutSheetError('piece_too_long', 'A piece does not fit a sheet.');
    sheets.push(sheet);
    left = rest;
  }
  return sheets.map((s) => {
    s.placements.sort((a, b) => a.yMm - b.yMm || a.xMm - b.xMm);
    const lengthMm = s.end + margin;
    return { rollWidthMm, gapMm: gap, marginMm: margin, lengthMm, utilisation: s.area / (rollWidthMm * lengthMm), piecesAreaMm2: s.area, placements: s.placements };
  });
}

const total = (sheets: CutSheet[]) => sheets.length * 1e9 + sheets.reduce((s, sh) => s + sh.lengthMm, 0);

/**
 * Nests one material's pieces by their outlines, with the box packer as fallback and floor: the
 * result is never longer (and never more sheets) than nestCutSheets' for the same input. Throws as
 * nestCutSheets does for pieces that fit nowhere.
 */
export function nestPieces(input: NestInput, opts: OutlineNestOptions = {}): CutSheet[] {
  if (Array.isArray(input?.pieces) && input.pieces.length > MAX_NEST_PIECES) {
    throw new LimitError('MAX_NEST_PIECES', `There are ${input.pieces.length.toLocaleString('en')} pieces to nest; the limit is ${MAX_NEST_PIECES.toLocaleString('en')} at once.`);
  }
  // the box packer validates the input and refuses pieces that fit nowhere
  const boxed = nestCutSheets(input);
  if (boxed.length === 0) return boxed;
  const { rollWidthMm, gapMm, marginMm, maxLengthMm, pieces } = nestInputSchema.parse(input);
  const now = opts.now ?? (() => performance.now());
  const cell = opts.cellMm ?? DEFAULT_CELL_MM;
  if (!(cell >= 0.1 && cell <= 10)) throw new RangeError('The raster cell must be between 0.1 and 10 mm.');
  const deadline = now() + (opts.budgetMs ?? DEFAULT_BUDGET_MS);
  try {
    const items = pieces.map((p) => rasterise(p, gapMm / 2, cell));
    const nested = outlineNest(items, rollWidthMm, gapMm, marginMm, maxLengthMm, cell, deadline, now, opts.lookbackMm);
    return total(nested) <= total(boxed) ? nested : boxed;
  } catch (e) {
    if (e instanceof OutOfTime) return boxed;
    throw e;
  }
}

// ---------------------------------------------------------------- order groups

/** An order's pieces kept together on a sheet, inside a weeding border (a cut rectangle). */
export interface SheetGroup {
  /** what the group is labelled with: the order number */
  label: string;
  /** the weeding border, mm on the sheet */
  xMm: number;
  yMm: number;
  widthMm: number;
  heightMm: number;
}
/** A straight weeding line between groups (a cut), mm on the sheet. */
export interface WeedingLine {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}
export type GroupedSheet = CutSheet & { groups: SheetGroup[]; weedingLines: WeedingLine[] };

export interface GroupOptions extends OutlineNestOptions {
  /** Lay the groups out in rows with straight weeding lines between them, so the sheet splits by order. */
  weedingLines?: boolean;
}

const rectPath = (w: number, h: number) => `M0 0H${w}V${h}H0Z`;

/**
 * "Keep each order together": each order's pieces (by `group`, else order number, else line) are
 * nested as one cluster; a weeding border is cut `gap` outside the cluster's pieces; the borders are
 * then nested on the roll like pieces, `gap` apart and inside the margins. With `weedingLines`, the
 * borders sit in rows instead, and a straight cut runs between rows and between groups in a row.
 */
export function nestOrderGroups(input: NestInput, opts: GroupOptions = {}): GroupedSheet[] {
  const { rollWidthMm, gapMm, marginMm, maxLengthMm, pieces } = nestInputSchema.parse(input);
  if (pieces.length === 0) return [];
  const usable = rollWidthMm - 2 * marginMm;
  const byGroup = new Map<string, NestPiece[]>();
  for (const p of pieces) {
    const key = p.group ?? p.orderNumber ?? p.lineId;
    let g = byGroup.get(key);
    if (!g) byGroup.set(key, (g = []));
    g.push(p);
  }
  // a group's cluster is nested on a strip no wider than the roll leaves inside two border gaps
  const inner = usable - 2 * gapMm;
  const clusters: Array<{ label: string; sheet: CutSheet; w: number; h: number }> = [];
  for (const [label, ps] of byGroup) {
    const narrowest = Math.max(...ps.map((p) => Math.min(p.widthMm, p.heightMm)));
    if (narrowest > inner + 1e-9)
      throw new CutSheetError('piece_too_wide', `Order ${label}: a piece is too wide to keep inside a weeding border on this roll. Choose "tightest" for this batch.`, {
        grouping: 'too wide for a weeding border',
      });
    // try the full width and a squarer strip; keep the smaller cluster
    const area = ps.reduce((s, p) => s + (p.widthMm + gapMm) * (p.heightMm + gapMm), 0);
    const widths = [...new Set([inner, Math.min(inner, Math.max(narrowest + 1e-6, Math.sqrt(area) * 1.2))])];
    let best: { sheet: CutSheet; w: number; h: number } | null = null;
    for (const w of widths) {
      const [sheet] = nestPieces({ rollWidthMm: w, gapMm, marginMm: 0, pieces: ps }, opts);
      if (!sheet) continue;
      const cw = Math.max(...sheet.placements.map((p) => p.xMm + p.widthMm));
      const ch = Math.max(...sheet.placements.map((p) => p.yMm + p.heightMm));
      if (!best || cw * ch < best.w * best.h) best = { sheet, w: cw, h: ch };
    }
    clusters.push({ label, ...best! });
  }
  // the borders: `gap` outside each cluster
  const borders = clusters.map((c, k) => ({ c, w: c.w + 2 * gapMm, h: c.h + 2 * gapMm, id: `group-${k}` }));
  const placedBorders: Array<Array<{ k: number; x: number; y: number }>> = [];
  const lines: WeedingLine[][] = [];
  // the borders nest upright (a cluster is never turned as a whole), by the same raster fill
  let upright: CutSheet[] | null = null;
  if (!opts.weedingLines) {
    const now = opts.now ?? (() => performance.now());
    const cell = opts.cellMm ?? DEFAULT_CELL_MM;
    const items = borders.map((b) => rasterise({ id: b.id, lineId: b.id, layerId: 'border', widthMm: b.w, heightMm: b.h, areaMm2: b.w * b.h, path: rectPath(b.w, b.h) }, gapMm / 2, cell, [0]));
    try {
      upright = outlineNest(items, rollWidthMm, gapMm, marginMm, maxLengthMm, cell, now() + (opts.budgetMs ?? DEFAULT_BUDGET_MS), now);
    } catch (e) {
      if (!(e instanceof OutOfTime)) throw e;
    }
  }
  if (!upright) {
    // rows, tallest first; a new sheet when a fixed-length sheet is full
    const order = borders.map((b, k) => ({ b, k })).sort((a, b) => b.b.h - a.b.h);
    let sheet: Array<{ k: number; x: number; y: number }> = [];
    let sheetLines: WeedingLine[] = [];
    let x = marginMm,
      y = marginMm,
      rowH = 0;
    const lineX0 = marginMm - gapMm / 2,
      lineX1 = rollWidthMm - marginMm + gapMm / 2;
    for (const { b, k } of order) {
      if (x > marginMm && x + b.w > rollWidthMm - marginMm + 1e-9) {
        // close the row: a line across the roll, half a gap after it
        y += rowH + gapMm;
        sheetLines.push({ x1: lineX0, y1: y - gapMm / 2, x2: lineX1, y2: y - gapMm / 2 });
        x = marginMm;
        rowH = 0;
      }
      if (maxLengthMm !== undefined && y + b.h > maxLengthMm - marginMm + 1e-9 && sheet.length) {
        sheetLines.pop();
        placedBorders.push(sheet);
        lines.push(sheetLines);
        sheet = [];
        sheetLines = [];
        x = marginMm;
        y = marginMm;
        rowH = 0;
      }
      if (x > marginMm) sheetLines.push({ x1: x - gapMm / 2, y1: y - gapMm / 2, x2: x - gapMm / 2, y2: y + Math.max(rowH, b.h) + gapMm / 2 });
      sheet.push({ k, x, y });
      x += b.w + gapMm;
      rowH = Math.max(rowH, b.h);
    }
    placedBorders.push(sheet);
    // a row's vertical lines end with the row: trim them to its height
    lines.push(sheetLines);
    // rows were only a fallback when no lines were asked for
    if (!opts.weedingLines) for (const l of lines) l.length = 0;
  } else {
    for (const sh of upright) {
      placedBorders.push(sh.placements.map((pl) => ({ k: Number(pl.pieceId.slice('group-'.length)), x: pl.xMm, y: pl.yMm })));
      lines.push([]);
    }
  }
  return placedBorders.map((bs, s) => {
    const placements: Placement[] = [];
    const groups: SheetGroup[] = [];
    let end = 0,
      area = 0;
    for (const { k, x, y } of bs) {
      const b = borders[k]!;
      const bw = b.w,
        bh = b.h;
      groups.push({ label: b.c.label, xMm: x, yMm: y, widthMm: bw, heightMm: bh });
      end = Math.max(end, y + bh);
      for (const pl of b.c.sheet.placements) {
        area += pieces.find((p) => p.id === pl.pieceId)?.areaMm2 ?? 0;
        placements.push({ ...pl, xMm: pl.xMm + x + gapMm, yMm: pl.yMm + y + gapMm });
      }
    }
    placements.sort((a, b) => a.yMm - b.yMm || a.xMm - b.xMm);
    const lengthMm = end + marginMm;
    return {
      rollWidthMm,
      gapMm,
      marginMm,
      lengthMm,
      utilisation: area / (rollWidthMm * lengthMm),
      piecesAreaMm2: area,
      placements,
      groups,
      weedingLines: (lines[s] ?? []).filter((l) => l.y1 < end + gapMm),
    };
  });
}
