/**
 * A cut sheet as an SVG file for the cutter: real units (the outer width/height in mm and a viewBox
 * of the same numbers, so one user unit is one millimetre — W3C CSS Values, absolute lengths; no
 * px anywhere, so the old 90 px/in of SVG 1.1's example cannot creep in), every piece MIRRORED
 * (HTV is cut mirrored, adhesive side up — from memory; true of every HTV) and placed where the
 * nesting put it, cut paths only: stroked outlines, no fill, no text.
 * Path data is re-serialised from parsed geometry, so nothing from the input reaches the file
 * verbatim except escaped ids. Pure.
 */

import { type CutSheet, CutSheetError, type Placement } from './cut-sheets.ts';
import { type BBox, type Path, parsePathData, pathBBox, type Segment, type SubPath, transformPath } from './path.ts';

export interface CutSheetSvgPiece {
  id: string;
  path: string;
}

type Matrix = [number, number, number, number, number, number];
/** What placing a path needs from a placement. */
export type PlacedRect = Pick<Placement, 'pieceId' | 'xMm' | 'yMm' | 'widthMm' | 'heightMm' | 'rotated' | 'rotation'>;

/** The clockwise turn of a placement: its `rotation`, or a quarter turn when only `rotated` is set. */
export const turnOf = (p: Pick<Placement, 'rotated' | 'rotation'>): 0 | 90 | 180 | 270 => p.rotation ?? (p.rotated ? 90 : 0);

/**
 * The transform taking a piece's preview path (as designed, not mirrored) to its place on the sheet:
 * mirror about its own vertical centre line, turn clockwise by its rotation (0/90/180/270°), then
 * move its bbox to the placement (centred in it if the path is a little smaller than the placed rect).
 */
export function placementMatrix(placement: PlacedRect, bbox: BBox): Matrix {
  const w = bbox.maxX - bbox.minX;
  const h = bbox.maxY - bbox.minY;
  const turn = turnOf(placement);
  const quarter = turn === 90 || turn === 270;
  const placedW = quarter ? h : w;
  const placedH = quarter ? w : h;
  const X = placement.xMm + (placement.widthMm - placedW) / 2;
  const Y = placement.yMm + (placement.heightMm - placedH) / 2;
  // mirrored, at the origin: xl = maxX − x, yl = y − minY (bbox [0,w] × [0,h]); then, y down:
  if (turn === 0) return [-1, 0, 0, 1, bbox.maxX + X, Y - bbox.minY];
  // quarter turn clockwise: xr = h − yl, yr = xl (bbox [0,h] × [0,w])
  if (turn === 90) return [0, -1, -1, 0, h + bbox.minY + X, bbox.maxX + Y];
  // half turn: xr = w − xl = x − minX, yr = h − yl = maxY − y
  if (turn === 180) return [1, 0, 0, -1, X - bbox.minX, bbox.maxY + Y];
  // three quarters clockwise: xr = yl = y − minY, yr = w − xl = x − minX
  return [0, 1, 1, 0, X - bbox.minY, Y - bbox.minX];
}

/**
 * A quick reader for the path data our engine writes (M L H V C Q Z, absolute or relative): the
 * general reader (svgpath) is slower, and a batch holds thousands of glyph outlines. Anything else
 * (S, T, A, or malformed data) goes to the general reader, so the result is always the same Path.
 */
export function readPathData(d: string): Path {
  const out: Path = [];
  let cur: SubPath | null = null;
  let cx = 0,
    cy = 0,
    sx = 0,
    sy = 0;
  let i = 0;
  let cmd = 0; // char code of the current command
  const n = d.length;
  let bad = false;
  const skip = () => {
    while (i < n) {
      const c = d.charCodeAt(i);
      if (c === 32 || c === 44 || c === 10 || c === 13 || c === 9) i++;
      else break;
    }
  };
  // SVG number grammar: sign? (digits ('.' digits?)? | '.' digits) (e sign? digits)?
  const num = (): number => {
    skip();
    const s0 = i;
    let c = d.charCodeAt(i);
    if (c === 43 || c === 45) c = d.charCodeAt(++i);
    let digits = 0;
    while (c >= 48 && c <= 57) {
      digits++;
      c = d.charCodeAt(++i);
    }
    if (c === 46) {
      c = d.charCodeAt(++i);
      while (c >= 48 && c <= 57) {
        digits++;
        c = d.charCodeAt(++i);
      }
    }
    if (digits === 0) {
      bad = true;
      return 0;
    }
    if (c === 101 || c === 69) {
      const save = i;
      c = d.charCodeAt(++i);
      if (c === 43 || c === 45) c = d.charCodeAt(++i);
      let ed = 0;
      while (c >= 48 && c <= 57) {
        ed++;
        c = d.charCodeAt(++i);
      }
      if (ed === 0) i = save;
    }
    return +d.slice(s0, i);
  };
  const seg = (sg: Segment) => {
    if (!cur) {
      cur = { x0: cx, y0: cy, segs: [], closed: false };
      out.push(cur);
    }
    cur.segs.push(sg);
  };
  for (;;) {
    skip();
    if (i >= n) break;
    const c = d.charCodeAt(i);
    const isLetter = (c >= 65 && c <= 90) || (c >= 97 && c <= 122);
    if (isLetter) {
      cmd = c;
      i++;
      if (c !== 90 && c !== 122) continue;
    } else if (!cmd || cmd === 90 || cmd === 122) return parsePathData(d);
    const rel = cmd >= 97;
    const ox = rel ? cx : 0,
      oy = rel ? cy : 0;
    switch (
      cmd | 32 // lower-case
    ) {
      case 109: {
        // m
        const x = num() + ox,
          y = num() + oy;
        cur = { x0: x, y0: y, segs: [], closed: false };
        out.push(cur);
        cx = sx = x;
        cy = sy = y;
        cmd = rel ? 108 : 76; // further pairs are lines
        break;
      }
      case 108: {
        const x = num() + ox,
          y = num() + oy;
        seg({ t: 'L', x, y });
        cx = x;
        cy = y;
        break;
      }
      case 104: {
        const x = num() + ox;
        seg({ t: 'L', x, y: cy });
        cx = x;
        break;
      }
      case 118: {
        const y = num() + oy;
        seg({ t: 'L', x: cx, y });
        cy = y;
        break;
      }
      case 113: {
        const x1 = num() + ox,
          y1 = num() + oy,
          x = num() + ox,
          y = num() + oy;
        seg({ t: 'Q', x1, y1, x, y });
        cx = x;
        cy = y;
        break;
      }
      case 99: {
        const x1 = num() + ox,
          y1 = num() + oy,
          x2 = num() + ox,
          y2 = num() + oy,
          x = num() + ox,
          y = num() + oy;
        seg({ t: 'C', x1, y1, x2, y2, x, y });
        cx = x;
        cy = y;
        break;
      }
      case 122:
        if (cur) {
          (cur as SubPath).closed = true;
          cur = null;
        }
        cx = sx;
        cy = sy;
        break;
      default:
        return parsePathData(d);
    }
    if (bad) return parsePathData(d);
  }
  return out;
}

/** 1 µm precision, like path.ts's fmt, without its float → string → float round trip. */
function fmtFast(v: number): string {
  const r = Math.round(v * 1000);
  return r === 0 ? '0' : String(r / 1000);
}

/** Writes `path` transformed by `m` as path data, in one pass (no intermediate Path). */
export function formatTransformed(path: Path, m: Matrix): string {
  const [a, b, c, dd, e, f] = m;
  const parts: string[] = [];
  const X = (x: number, y: number) => fmtFast(a * x + c * y + e);
  const Y = (x: number, y: number) => fmtFast(b * x + dd * y + f);
  for (const sp of path) {
    parts.push(`M${X(sp.x0, sp.y0)} ${Y(sp.x0, sp.y0)}`);
    for (const s of sp.segs) {
      if (s.t === 'L') parts.push(`L${X(s.x, s.y)} ${Y(s.x, s.y)}`);
      else if (s.t === 'Q') parts.push(`Q${X(s.x1, s.y1)} ${Y(s.x1, s.y1)} ${X(s.x, s.y)} ${Y(s.x, s.y)}`);
      else parts.push(`C${X(s.x1, s.y1)} ${Y(s.x1, s.y1)} ${X(s.x2, s.y2)} ${Y(s.x2, s.y2)} ${X(s.x, s.y)} ${Y(s.x, s.y)}`);
    }
    if (sp.closed) parts.push('Z');
  }
  return parts.join('');
}

/** The mirrored, placed cut path of one piece, as a Path (mm on the sheet). */
export function placedCutPath(placement: PlacedRect, previewPath: string | Path): Path {
  const { path, matrix } = placedTransform(placement, previewPath);
  return transformPath(path, matrix);
}

/** The preview path (read) and the matrix that mirrors and places it; checks it fits its slot. */
export function placedTransform(placement: PlacedRect, previewPath: string | Path): { path: Path; matrix: Matrix } {
  const p = typeof previewPath === 'string' ? readPathData(previewPath) : previewPath;
  const bbox = pathBBox(p);
  const w = bbox.maxX - bbox.minX;
  const h = bbox.maxY - bbox.minY;
  const quarter = turnOf(placement) % 180 !== 0;
  const placedW = quarter ? h : w;
  const placedH = quarter ? w : h;
  // The nest kept the gap around the placed rect; a path bigger than it would break that promise.
  const TOL = 0.01;
  if (placedW > placement.widthMm + TOL || placedH > placement.heightMm + TOL) {
    throw new CutSheetError('invalid_input', `Piece ${placement.pieceId}'s outline (${w.toFixed(1)} × ${h.toFixed(1)} mm) is bigger than the size it was nested with.`);
  }
  return { path: p, matrix: placementMatrix(placement, bbox) };
}

const XML_ESC: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' };
/** Escapes text for an XML attribute or text node, and drops characters XML 1.0 forbids. */
export function escapeXml(s: string): string {
  // eslint-disable-next-line no-control-regex
  return s.replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g, '').replace(/[&<>"']/g, (c) => XML_ESC[c] ?? c);
}

const num = (v: number) => String(Math.round(v * 1000) / 1000);

/** Order groups on a sheet: weeding borders and lines (cuts), and the labels that name each group. */
export interface SheetGroupsLayer {
  groups?: ReadonlyArray<{ label: string; xMm: number; yMm: number; widthMm: number; heightMm: number }>;
  weedingLines?: ReadonlyArray<{ x1: number; y1: number; x2: number; y2: number }>;
}

/** Where a group's label sits: inside its border, in the gap strip before the pieces begin (mm). */
export const groupLabelAt = (g: { xMm: number; yMm: number }, gapMm: number) => ({ x: g.xMm + Math.min(1.5, gapMm / 4), y: g.yMm + Math.min(4.5, gapMm * 0.8), sizeMm: Math.min(4, gapMm * 0.6) });

/**
 * The SVG for one cut sheet. `pieces` holds at least every placed piece's preview path by id.
 * With order groups, each weeding border and weeding line is a cut path in the cut group; the order
 * labels are text in a group of their own (`id="order-labels"`, `data-cut="no"`, no stroke) after the
 * cut group, so a cutter that cuts stroked paths passes them over, and `labels: false` leaves them out.
 * Throws CutSheetError('invalid_input') when a placed piece has no path.
 */
export function cutSheetSvg(sheet: CutSheet & SheetGroupsLayer, pieces: readonly CutSheetSvgPiece[], opts: { labels?: boolean } = {}): string {
  const byId = new Map(pieces.map((p) => [p.id, p]));
  const W = num(sheet.rollWidthMm);
  const H = num(sheet.lengthMm);
  const out: string[] = [
    '<?xml version="1.0" encoding="UTF-8"?>',
    `<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="${W}mm" height="${H}mm" viewBox="0 0 ${W} ${H}">`,
    '<!-- Namesake cut sheet: mirrored for cutting; 1 user unit = 1 mm -->',
    '<g fill="none" stroke="#000000" stroke-width="0.5">',
  ];
  for (const pl of sheet.placements) {
    const piece = byId.get(pl.pieceId);
    if (!piece) throw new CutSheetError('invalid_input', `No outline for piece ${pl.pieceId}.`);
    const { path, matrix } = placedTransform(pl, piece.path);
    const d = formatTransformed(path, matrix);
    out.push(`<path data-piece="${escapeXml(pl.pieceId)}" data-line="${escapeXml(pl.lineId)}" d="${d}"/>`);
  }
  const groups = sheet.groups ?? [];
  const lines = sheet.weedingLines ?? [];
  if (groups.length || lines.length) out.push('<!-- weeding borders and lines: cut, so the sheet splits by order before weeding -->');
  for (const g of groups) out.push(`<path data-group="${escapeXml(g.label)}" d="M${num(g.xMm)} ${num(g.yMm)}H${num(g.xMm + g.widthMm)}V${num(g.yMm + g.heightMm)}H${num(g.xMm)}Z"/>`);
  for (const l of lines) out.push(`<path data-weeding-line="" d="M${num(l.x1)} ${num(l.y1)}L${num(l.x2)} ${num(l.y2)}"/>`);
  out.push('</g>');
  if (groups.length && opts.labels !== false) {
    out.push(
      '<!-- Order labels: NOT cut. Text only, no stroke, in their own group after the cut group; a cutter that imports text should hide or delete the group "order-labels" (or download with ?labels=0). -->',
      '<g id="order-labels" data-cut="no" fill="#b4540a" stroke="none" font-family="sans-serif" font-weight="700">',
    );
    for (const g of groups) {
      const at = groupLabelAt(g, sheet.gapMm);
      out.push(`<text x="${num(at.x)}" y="${num(at.y)}" font-size="${num(at.sizeMm)}">${escapeXml(g.label)}</text>`);
    }
    out.push('</g>');
  }
  out.push('</svg>', '');
  return out.join('\n');
}
