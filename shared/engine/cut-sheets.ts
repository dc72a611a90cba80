/**
 * Cut sheets: nest one material's pieces onto its roll with a weeding gap between pieces and a
 * margin at the roll edges (6 mm / ¼ in each, from memory), rotation allowed.
 *
 * The rectangle packing is maxrects-packer's MaxRects bin. The gap is honoured by padding every
 * rectangle by `gap` on its right and bottom and giving the bin `usable + gap` of width: a padded
 * rect that ends at the bin's right edge leaves exactly `gap` of padding outside the usable width,
 * so a piece never comes closer than `gap` to another piece and never crosses the margins.
 * Pure: plain data in, plain data out; mm, y down (x across the roll, y along it).
 */
// The package's main entry is UMD; its ESM build ships no .d.mts (declared in maxrects-packer.d.ts
// beside this file), so its types come from the main entry's declarations (checked with 2.7.4).

import type { IOption, MaxRectsPacker as MaxRectsPackerClass } from 'maxrects-packer';
import * as maxrectsEsm from 'maxrects-packer/dist/maxrects-packer.mjs';

const { MaxRectsPacker } = maxrectsEsm as { MaxRectsPacker: typeof MaxRectsPackerClass };
/** maxrects-packer's PACKING_LOGIC values (dist/types.d.ts). */
const PACKING_LOGIC = { MAX_AREA: 0, MAX_EDGE: 1 } as const;
type Logic = NonNullable<IOption['logic']>;

import { z } from 'zod';
import { LimitError, MAX_NEST_PIECES, MOTIF_MAX_PATH_CHARS } from './limits.ts';

export const DEFAULT_GAP_MM = 6; // weeding gap 6 mm (¼ in), from memory
export const DEFAULT_MARGIN_MM = 6; // margin at the roll edge 6 mm, from memory

export const nestPieceSchema = z.object({
  id: z.string().min(1).max(128),
  lineId: z.string().min(1).max(128),
  orderNumber: z.string().max(64).optional(),
  /** what keeps pieces together in an order group (the order number without a unit suffix) */
  group: z.string().max(64).optional(),
  layerId: z.string().min(1).max(128),
  widthMm: z.number().positive().finite(),
  heightMm: z.number().positive().finite(),
  areaMm2: z.number().nonnegative().finite(),
  /** SVG path data, mm, y down, as previewed (not mirrored); carried through for the SVG. */
  path: z.string().max(MOTIF_MAX_PATH_CHARS),
});
export type NestPiece = z.infer<typeof nestPieceSchema>;

export const nestInputSchema = z
  .object({
    rollWidthMm: z.number().positive().finite().max(5000),
    gapMm: z.number().nonnegative().finite().max(100).default(DEFAULT_GAP_MM),
    marginMm: z.number().nonnegative().finite().max(200).default(DEFAULT_MARGIN_MM),
    /** Cut from fixed-length sheets (e.g. 305 × 305 mm) instead of one long roll. */
    maxLengthMm: z.number().positive().finite().optional(),
    pieces: z.array(nestPieceSchema),
  })
  .refine((v) => v.rollWidthMm > 2 * v.marginMm, { message: 'The roll is narrower than its two margins.', path: ['rollWidthMm'] });
export type NestInput = z.input<typeof nestInputSchema>;

export interface Placement {
  pieceId: string;
  lineId: string;
  orderNumber?: string;
  layerId: string;
  /** Top-left corner of the placed piece on the sheet, mm from the roll's left edge and the sheet's start. */
  xMm: number;
  yMm: number;
  /** Size as placed (already swapped when rotated). */
  widthMm: number;
  heightMm: number;
  /** Turned a quarter turn (90° or 270°): width and height are swapped. */
  rotated: boolean;
  /** The turn clockwise, degrees; absent = 90 when `rotated`, else 0 (the box packer's placements). */
  rotation?: Rotation;
}

export type Rotation = 0 | 90 | 180 | 270;

export interface CutSheet {
  rollWidthMm: number;
  gapMm: number;
  marginMm: number;
  /** Length of roll used: the end of the last piece plus the trailing margin. */
  lengthMm: number;
  /** Pieces' area ÷ (roll width × length). */
  utilisation: number;
  piecesAreaMm2: number;
  placements: Placement[];
}

/** A thrown error with a stable code, for the service to turn into `{ error: { code, message, fields? } }`. */
export class CutSheetError extends Error {
  constructor(
    public readonly code: 'piece_too_wide' | 'piece_too_long' | 'invalid_input',
    message: string,
    public readonly fields?: Record<string, string>,
  ) {
    super(message);
    this.name = 'CutSheetError';
  }
}

interface Attempt {
  logic: Logic;
  order: (a: Item, b: Item) => number;
}
interface Item {
  piece: NestPiece;
  w: number;
  h: number;
}

// MaxRects is greedy, and which greedy choice wins depends on the mix of sizes: try a few orders
// and scores and keep the shortest. Each run costs ~50 ms for 300 pieces (the free-rectangle list
// grows with the pieces), so big sheets try only the one that won most often in bench/cutsheets.ts.
const byLongSide = (a: Item, b: Item) => Math.max(b.w, b.h) - Math.max(a.w, a.h) || b.w * b.h - a.w * a.h;
const byWidth = (a: Item, b: Item) => b.w - a.w || b.h - a.h;
const byShortSide = (a: Item, b: Item) => Math.min(b.w, b.h) - Math.min(a.w, a.h) || Math.max(b.w, b.h) - Math.max(a.w, a.h);
const ATTEMPTS: Attempt[] = [
  { logic: PACKING_LOGIC.MAX_EDGE as Logic, order: byLongSide }, // best or near-best in the bench's mixes
  { logic: PACKING_LOGIC.MAX_EDGE as Logic, order: byWidth },
  { logic: PACKING_LOGIC.MAX_AREA as Logic, order: byShortSide },
  { logic: PACKING_LOGIC.MAX_AREA as Logic, order: byWidth },
];
const FEW_PIECES = 150;

interface PackedRect {
  x: number;
  y: number;
  rot: boolean;
  data: Item;
}

function packOnce(items: Item[], binW: number, binH: number, gap: number, attempt: Attempt): PackedRect[][] {
  const packer = new MaxRectsPacker<any>(binW, binH, 0, {
    smart: false, // a fixed-width strip; we measure the used length ourselves
    pot: false,
    square: false,
    allowRotation: true,
    border: 0,
    logic: attempt.logic,
  });
  // add() one by one in our order: addArray would re-sort by its own rule.
  for (const it of [...items].sort(attempt.order)) packer.add(it.w + gap, it.h + gap, it);
  return packer.bins.map((bin) => (bin.rects as any[]).map((r: any) => ({ x: r.x, y: r.y, rot: !!r.rot, data: r.data as Item })));
}

function toSheet(rects: PackedRect[], rollWidthMm: number, gap: number, margin: number): CutSheet {
  let end = 0;
  let area = 0;
  const placements: Placement[] = rects.map((r) => {
    const { piece, w, h } = r.data;
    // maxrects-packer reports a rotated rect with its original size: swap it ourselves.
    const pw = r.rot ? h : w;
    const ph = r.rot ? w : h;
    const p: Placement = {
      pieceId: piece.id,
      lineId: piece.lineId,
      ...(piece.orderNumber !== undefined ? { orderNumber: piece.orderNumber } : {}),
      layerId: piece.layerId,
      xMm: margin + r.x,
      yMm: margin + r.y,
      widthMm: pw,
      heightMm: ph,
      rotated: r.rot,
    };
    end = Math.max(end, p.yMm + ph);
    area += piece.areaMm2;
    return p;
  });
  placements.sort((a, b) => a.yMm - b.yMm || a.xMm - b.xMm);
  const lengthMm = placements.length ? end + margin : 0;
  return {
    rollWidthMm,
    gapMm: gap,
    marginMm: margin,
    lengthMm,
    utilisation: lengthMm > 0 ? area / (rollWidthMm * lengthMm) : 0,
    piecesAreaMm2: area,
    placements,
  };
}

/**
 * Nests ONE material's pieces (the caller groups by material kind + colour, see groupByMaterial).
 * One long roll gives one sheet; with `maxLengthMm` the pieces spread over as many sheets as needed.
 * Throws CutSheetError('piece_too_wide') when a piece fits the usable width in neither orientation.
 */
export function nestCutSheets(input: NestInput): CutSheet[] {
  // the bound first, before zod reads every piece
  if (Array.isArray(input?.pieces) && input.pieces.length > MAX_NEST_PIECES) {
    throw new LimitError(
      'MAX_NEST_PIECES',
      `There are ${input.pieces.length.toLocaleString('en')} pieces to nest; the limit is ${MAX_NEST_PIECES.toLocaleString('en')} at once. Build cut sheets for fewer lines.`,
    );
  }
  const parsed = nestInputSchema.safeParse(input);
  if (!parsed.success) {
    const fields: Record<string, string> = {};
    for (const i of parsed.error.issues) fields[i.path.map(String).join('.') || '_'] ??= i.message;
    throw new CutSheetError('invalid_input', 'The pieces to nest are not valid.', fields);
  }
  const { rollWidthMm, gapMm: gap, marginMm: margin, maxLengthMm, pieces } = parsed.data;
  const usableW = rollWidthMm - 2 * margin;
  const usableL = maxLengthMm !== undefined ? maxLengthMm - 2 * margin : Infinity;
  if (pieces.length === 0) return [];

  const EPS = 1e-9;
  const items: Item[] = pieces.map((piece) => ({ piece, w: piece.widthMm, h: piece.heightMm }));
  for (const it of items) {
    const fitsUpright = it.w <= usableW + EPS;
    const fitsTurned = it.h <= usableW + EPS;
    if (!fitsUpright && !fitsTurned) {
      throw new CutSheetError('piece_too_wide', `Piece ${it.piece.id} (${round1(it.w)} × ${round1(it.h)} mm) is wider than the roll's usable width of ${round1(usableW)} mm in both orientations.`, {
        [`pieces.${it.piece.id}`]: 'wider than the roll',
      });
    }
    const fitsSomeWay = (fitsUpright && it.h <= usableL + EPS) || (fitsTurned && it.w <= usableL + EPS);
    if (!fitsSomeWay) {
      throw new CutSheetError('piece_too_long', `Piece ${it.piece.id} (${round1(it.w)} × ${round1(it.h)} mm) does not fit a ${round1(maxLengthMm!)} mm sheet.`, {
        [`pieces.${it.piece.id}`]: 'longer than the sheet',
      });
    }
  }

  const binW = usableW + gap;
  // A long roll: a strip tall enough for every piece stacked end to end, so one bin holds all.
  const binH = Number.isFinite(usableL) ? usableL + gap : items.reduce((s, it) => s + Math.max(it.w, it.h) + gap, 0) + gap;

  let best: CutSheet[] | null = null;
  let bestLen = Infinity;
  for (const attempt of items.length <= FEW_PIECES ? ATTEMPTS : ATTEMPTS.slice(0, 1)) {
    const bins = packOnce(items, binW, binH, gap, attempt);
    const sheets = bins.map((rects) => toSheet(rects, rollWidthMm, gap, margin));
    const placed = sheets.reduce((s, sh) => s + sh.placements.length, 0);
    if (placed !== items.length) continue; // should not happen after the checks above
    // Fewer sheets first, then the shorter total, then the shorter last sheet.
    const len = sheets.length * 1e9 + sheets.reduce((s, sh) => s + sh.lengthMm, 0);
    if (len < bestLen) {
      best = sheets;
      bestLen = len;
    }
  }
  if (!best) throw new CutSheetError('invalid_input', 'The pieces could not be nested.');
  return best;
}

const round1 = (v: number) => Math.round(v * 10) / 10;

export interface MaterialKey {
  materialKind: string;
  colour: string;
}

/** Groups pieces by material (kind + colour), in first-seen order. */
export function groupByMaterial<T extends MaterialKey>(pieces: readonly T[]): Array<{ materialKind: string; colour: string; key: string; pieces: T[] }> {
  const groups = new Map<string, { materialKind: string; colour: string; key: string; pieces: T[] }>();
  for (const p of pieces) {
    const key = materialKey(p);
    let g = groups.get(key);
    if (!g) {
      g = { materialKind: p.materialKind, colour: p.colour, key, pieces: [] };
      groups.set(key, g);
    }
    g.pieces.push(p);
  }
  return [...groups.values()];
}

/** "glitter|gold": colours compare case-insensitively and trimmed, so "Gold " and "gold" share a sheet. */
export function materialKey(m: MaterialKey): string {
  return `${m.materialKind}|${m.colour.trim().toLowerCase()}`;
}
