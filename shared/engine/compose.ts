/**
 * Composition: a listing's personalisation fields plus the shopper's choices become the pieces of
 * one item. Where each piece goes is placeDesign()'s (place.ts, the one placement, also drawn by the
 * live preview); here each placed piece becomes production geometry — its path on the blank, the
 * outline backing grown around a name, the mirrored cut path, area and weeding — listed in press
 * order, bottom → top: outline backings, motif layers, names.
 */
import type { FontRegistry } from './fonts.ts';
import { regionsArea, unionRegions } from './geometry.ts';
import { LimitError, MAX_COORDINATE_MM, MAX_TEXT_CHARS, MOTIF_MAX_LAYERS, MOTIF_MAX_PATH_CHARS } from './limits.ts';
import { type OutlineResult, outlineOfPath } from './outline.ts';
import { type BBox, flattenPath, formatPath, mirrorPath, type Path, parsePathData, pathBBox, roundPath, transformPath, unionBBox } from './path.ts';
import { type ComposeInput, type ComposeWarning, type MaterialKind, type Matrix, type PieceRole, placeDesign } from './place.ts';
import { analysePathWeeding, analyseQuickWeeding, combineWeeding, quickFromFull, type WeedingReport } from './weeding.ts';

export {
  type Choice,
  type ColourFieldDef,
  ComposeError,
  type ComposeInput,
  type ComposeWarning,
  type FieldDef,
  type MaterialKind,
  type MotifFieldDef,
  type MotifOption,
  type PieceRole,
  type PlacedPiece,
  type Placement,
  placeDesign,
  type TextFieldDef,
} from './place.ts';

/** `W` is WeedingReport unless compose() was asked for `{ weeding: 'none' }` (then null). */
export interface Piece<W extends WeedingReport | null = WeedingReport> {
  /** Unique within the item, e.g. "name", "name-outline", "motif:flame". */
  layerId: string;
  fieldId: string;
  role: PieceRole;
  materialKind: MaterialKind;
  colour: string;
  /** Placed on the blank: mm, origin top-left of the blank, y down. */
  path: string;
  /** The same piece mirrored about its own vertical centre line, as it is cut (HTV is cut mirrored). */
  mirroredPath: string;
  bboxMm: BBox;
  areaMm2: number;
  weeding: W;
}

export interface ComposedItem<W extends WeedingReport | null = WeedingReport> {
  blankId: string;
  /** Press order, bottom → top. */
  pieces: Piece<W>[];
  bboxMm: BBox;
  warnings: ComposeWarning[];
  weeding: W;
  /** Letter height actually used per text field, mm. */
  letterHeights: Record<string, number>;
}

/**
 * How much weeding analysis compose() does per piece:
 * - 'full' (the default; use it for proofs, cut sheets and orders): the complete report.
 * - 'fast' (for a live preview while the shopper types): pieces, counters, areas and the
 *   inscribed widths exactly as 'full' reports them, but no thin-stroke area (reported as 0, the
 *   report marked `analysis: 'fast'`), so its label can be milder than the full one.
 * - 'none': geometry only; every `weeding` is null.
 */
export type WeedingMode = 'full' | 'fast' | 'none';
export interface ComposeOptions {
  weeding?: WeedingMode;
}

/** A small LRU map: recently used entries stay, the oldest go first. */
class Lru<K, V> {
  private readonly m = new Map<K, V>();
  constructor(private readonly size: number) {}
  get(k: K): V | undefined {
    const v = this.m.get(k);
    if (v !== undefined) {
      this.m.delete(k);
      this.m.set(k, v);
    }
    return v;
  }
  set(k: K, v: V): V {
    this.m.set(k, v);
    if (this.m.size > this.size) this.m.delete(this.m.keys().next().value as K);
    return v;
  }
}

/**
 * Everything about a piece that depends only on its placed path data, computed once per distinct
 * path: a motif placed where it was on the last keystroke, an outline or name seen before, is
 * served from here. Each value is exactly what computing it afresh gives (same function, same input).
 */
interface PieceGeometry {
  parsed: Path;
  bboxMm: BBox;
  mirroredPath: string;
  area?: number;
  full?: WeedingReport;
  fast?: WeedingReport;
}
const geometryCache = new Lru<string, PieceGeometry>(96);
const outlineCache = new Lru<string, OutlineResult>(48);
const placedCache = new Lru<string, string>(96);
const layoutCache = new Lru<string, Path>(32);

/** A text layout's path data, parsed once per distinct layout. */
const parsedLayout = (d: string): Path => layoutCache.get(d) ?? layoutCache.set(d, parsePathData(d));

function geometryOf(d: string, parsed?: Path): PieceGeometry {
  let g = geometryCache.get(d);
  if (!g) {
    const p = parsed ?? parsePathData(d);
    const bb = pathBBox(p);
    g = geometryCache.set(d, { parsed: p, bboxMm: bb, mirroredPath: formatPath(mirrorPath(p, (bb.minX + bb.maxX) / 2)) });
  }
  return g;
}

function weedingOf(g: PieceGeometry, mode: WeedingMode): WeedingReport | null {
  if (mode === 'none') return null;
  if (mode === 'fast') return (g.fast ??= g.full ? quickFromFull(g.full) : analyseQuickWeeding(g.parsed));
  return (g.full ??= analysePathWeeding(g.parsed));
}

const copyReport = (w: WeedingReport | null): WeedingReport | null => (w ? { ...w, reasons: [...w.reasons] } : null);

function piece(
  layerId: string,
  fieldId: string,
  role: PieceRole,
  materialKind: MaterialKind,
  colour: string,
  d: string,
  mode: WeedingMode,
  areaMm2?: number,
  parsed?: Path,
): Piece<WeedingReport | null> {
  const g = geometryOf(d, parsed);
  const area = areaMm2 ?? (g.area ??= regionsArea(unionRegions(flattenPath(g.parsed, 0.01), 'nonzero')));
  return {
    layerId,
    fieldId,
    role,
    materialKind,
    colour,
    path: d,
    mirroredPath: g.mirroredPath,
    bboxMm: { ...g.bboxMm },
    areaMm2: area,
    weeding: copyReport(weedingOf(g, mode)),
  };
}

/** Path data moved by a matrix, written on the 1 µm grid (as formatPath writes it), and the path it parses to. */
function moveParsed(p: Path, m: Matrix): { d: string; parsed: Path } {
  const moved = transformPath(p, m);
  return { d: formatPath(moved), parsed: roundPath(moved) };
}

/** A motif layer's path data placed by a matrix; the same placement is served from a cache. */
function placeMotifLayer(path: string, m: Matrix): string {
  const key = `${m.join(',')}|${path}`;
  return placedCache.get(key) ?? placedCache.set(key, formatPath(transformPath(parsePathData(path), m)));
}

function outlineCached(d: string, parsed: Path, offsetMm: number): OutlineResult {
  const key = `${offsetMm}|${d}`;
  return outlineCache.get(key) ?? outlineCache.set(key, outlineOfPath(parsed, offsetMm));
}

/**
 * The bounds of limits.ts on what compose() is handed (the routes check them first; this is the
 * engine's own check): texts, motif layers and their path data, the blank's size.
 */
function checkComposeInput(input: ComposeInput): void {
  const { blank } = input;
  for (const v of [blank.widthMm, blank.heightMm, blank.topOffsetMm]) {
    if (!(Math.abs(v) <= MAX_COORDINATE_MM)) throw new LimitError('MAX_COORDINATE_MM', `The blank's size is outside the ${MAX_COORDINATE_MM} mm limit.`);
  }
  for (const f of input.fields) {
    if (f.kind === 'text') {
      const c = input.choices[f.id];
      if (c && 'text' in c && (typeof c.text !== 'string' || c.text.length > MAX_TEXT_CHARS * 2 || [...c.text].length > MAX_TEXT_CHARS)) {
        throw new LimitError('MAX_TEXT_CHARS', `The text is longer than the ${MAX_TEXT_CHARS}-character limit.`);
      }
    } else if (f.kind === 'motif') {
      for (const o of f.options) {
        if (o.geometry.layers.length > MOTIF_MAX_LAYERS) throw new LimitError('MOTIF_MAX_LAYERS', `A motif has more than ${MOTIF_MAX_LAYERS} layers.`);
        for (const l of o.geometry.layers) {
          if (l.path.length > MOTIF_MAX_PATH_CHARS) throw new LimitError('MOTIF_MAX_PATH_CHARS', `A motif layer's outline is longer than ${MOTIF_MAX_PATH_CHARS.toLocaleString('en')} characters.`);
          const b = l.bboxMm;
          if (![b.minX, b.minY, b.maxX, b.maxY].every((v) => Math.abs(v) <= MAX_COORDINATE_MM))
            throw new LimitError('MAX_COORDINATE_MM', `A motif layer lies outside the ${MAX_COORDINATE_MM} mm limit.`);
        }
      }
    }
  }
}

export function compose(registry: FontRegistry, input: ComposeInput, options?: { weeding?: 'full' | 'fast' }): ComposedItem;
export function compose(registry: FontRegistry, input: ComposeInput, options: { weeding: 'none' }): ComposedItem<null>;
export function compose(registry: FontRegistry, input: ComposeInput, options?: ComposeOptions): ComposedItem<WeedingReport | null>;
export function compose(registry: FontRegistry, input: ComposeInput, options: ComposeOptions = {}): ComposedItem<WeedingReport | null> {
  const mode: WeedingMode = options.weeding ?? 'full';
  if (mode !== 'full' && mode !== 'fast' && mode !== 'none') throw new RangeError(`Unknown weeding mode "${String(mode)}".`);
  checkComposeInput(input);
  const placement = placeDesign(registry, input);
  const outlines: Piece<WeedingReport | null>[] = [];
  const pieces: Piece<WeedingReport | null>[] = [];
  for (const p of placement.pieces) {
    if (p.role === 'motif') {
      pieces.push(piece(p.layerId, p.fieldId, 'motif', p.materialKind, p.colour, placeMotifLayer(p.d, p.matrix), mode, p.areaMm2));
      continue;
    }
    const { d, parsed } = moveParsed(parsedLayout(p.d), p.matrix);
    if (p.outline) {
      const o = outlineCached(d, parsed, p.outline.offsetMm);
      outlines.push(piece(`${p.fieldId}-outline`, p.fieldId, 'outline', p.outline.materialKind, p.outline.colour, o.path, mode, o.areaMm2));
    }
    pieces.push(piece(p.layerId, p.fieldId, 'text', p.materialKind, p.colour, d, mode, undefined, parsed));
  }
  // press order, bottom → top: outline backings under everything, then placement's order
  pieces.unshift(...outlines);
  let bbox: BBox | null = null;
  for (const p of pieces) bbox = unionBBox(bbox, p.bboxMm);
  return {
    blankId: input.blank.id,
    pieces,
    bboxMm: bbox ?? { minX: 0, minY: 0, maxX: 0, maxY: 0 },
    warnings: placement.warnings,
    weeding: mode === 'none' ? null : combineWeeding(pieces.map((p) => p.weeding as WeedingReport)),
    letterHeights: placement.letterHeights,
  };
}
