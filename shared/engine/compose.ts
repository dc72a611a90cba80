/**
 * Composition: a listing's personalisation fields plus the shopper's choices become the pieces of
 * one item, placed on the blank (centred horizontally, starting `topOffsetMm` down, kept inside the
 * usable print area) and listed in press order, bottom → top: outline backings, motif layers, names.
 */
import type { FontRegistry } from './fonts.ts';
import { usableArea, type Blank } from './blanks.ts';
import { fitText, type TextWarning } from './fit.ts';
import { LayoutError } from './text-layout.ts';
import type { MotifGeometry } from './motif.ts';
import { outlineOfPath, type OutlineResult } from './outline.ts';
import { formatPath, mirrorPath, parsePathData, pathBBox, roundPath, transformPath, unionBBox, flattenPath, type BBox, type Path } from './path.ts';
import type { TextLayout } from './text-layout.ts';
import { regionsArea, unionRegions } from './geometry.ts';
import { LimitError, MAX_COORDINATE_MM, MAX_TEXT_CHARS, MOTIF_MAX_LAYERS, MOTIF_MAX_PATH_CHARS } from './limits.ts';
import { analysePathWeeding, analyseQuickWeeding, combineWeeding, quickFromFull, type WeedingReport } from './weeding.ts';

export type MaterialKind = 'smooth' | 'glitter' | 'flock' | 'metallic' | 'patterned';
export type PieceRole = 'text' | 'outline' | 'motif';

export interface TextFieldDef {
  kind: 'text';
  id: string;
  fontId: string;
  /** Default cap height; the shopper may choose smaller or up to maxLetterHeightMm. */
  letterHeightMm: number;
  maxLetterHeightMm?: number;
  minLetterHeightMm?: number;
  maxChars?: number;
  trackingMm?: number;
  materialKind: MaterialKind;
  colour: string;
  /** Outline backing grown around the name. */
  outline?: { offsetMm: number; materialKind: MaterialKind; colour: string };
}

export interface MotifOption {
  id: string;
  geometry: MotifGeometry;
  /** Material and colour per motif layer id; layers not listed use the field default and their own colour. */
  layers?: Record<string, { materialKind?: MaterialKind; colour?: string }>;
}

export interface MotifFieldDef {
  kind: 'motif';
  id: string;
  /** Height of the motif's ink on the item, mm (scaled down if it does not fit). */
  heightMm: number;
  materialKind: MaterialKind;
  options: MotifOption[];
}

export interface ColourFieldDef {
  kind: 'colour';
  id: string;
  /** What the colour paints: a text field, its outline (layerId 'outline'), or a motif layer. */
  target: { fieldId: string; layerId?: string };
  options: string[];
}

export type FieldDef = TextFieldDef | MotifFieldDef | ColourFieldDef;

export type Choice = { text: string; letterHeightMm?: number } | { motifId: string } | { colour: string };

export interface ComposeInput {
  blank: Blank;
  fields: FieldDef[];
  choices: Record<string, Choice | undefined>;
  /** Vertical gap between stacked fields, mm (default 8). */
  gapMm?: number;
}

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

export interface ComposeWarning extends TextWarning { fieldId: string }

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

export class ComposeError extends Error {
  constructor(public readonly fieldId: string, message: string) {
    super(message);
    this.name = 'ComposeError';
  }
}

interface Block {
  fieldId: string;
  w: number;
  h: number;
  /** Pieces for a block whose ink's top-left lands at (x, y). */
  place(x: number, y: number): Piece<WeedingReport | null>[];
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
export interface ComposeOptions { weeding?: WeedingMode }

/** A small LRU map: recently used entries stay, the oldest go first. */
class Lru<K, V> {
  private readonly m = new Map<K, V>();
  constructor(private readonly size: number) {}
  get(k: K): V | undefined {
    const v = this.m.get(k);
    if (v !== undefined) { this.m.delete(k); this.m.set(k, v); }
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
interface PieceGeometry { parsed: Path; bboxMm: BBox; mirroredPath: string; area?: number; full?: WeedingReport; fast?: WeedingReport }
const geometryCache = new Lru<string, PieceGeometry>(96);
const outlineCache = new Lru<string, OutlineResult>(48);
const placedCache = new Lru<string, string>(96);
const layoutPaths = new WeakMap<TextLayout, Path>();

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

function piece(layerId: string, fieldId: string, role: PieceRole, materialKind: MaterialKind, colour: string, d: string, mode: WeedingMode, areaMm2?: number, parsed?: Path): Piece<WeedingReport | null> {
  const g = geometryOf(d, parsed);
  const area = areaMm2 ?? (g.area ??= regionsArea(unionRegions(flattenPath(g.parsed, 0.01), 'nonzero')));
  return {
    layerId, fieldId, role, materialKind, colour,
    path: d,
    mirroredPath: g.mirroredPath,
    bboxMm: { ...g.bboxMm },
    areaMm2: area,
    weeding: copyReport(weedingOf(g, mode)),
  };
}

type Matrix = [number, number, number, number, number, number];

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
          if (![b.minX, b.minY, b.maxX, b.maxY].every((v) => Math.abs(v) <= MAX_COORDINATE_MM)) throw new LimitError('MAX_COORDINATE_MM', `A motif layer lies outside the ${MAX_COORDINATE_MM} mm limit.`);
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
  const { blank, fields, choices } = input;
  const gap = input.gapMm ?? 8;
  const area = usableArea(blank);
  const colours = new Map<string, string>(); // "field" or "field:layer" → colour
  for (const f of fields) {
    if (f.kind !== 'colour') continue;
    const c = choices[f.id];
    if (!c) continue;
    if (!('colour' in c) || !f.options.includes(c.colour)) throw new ComposeError(f.id, 'Choose one of the colours offered.');
    colours.set(f.target.layerId ? `${f.target.fieldId}:${f.target.layerId}` : f.target.fieldId, c.colour);
  }
  const warnings: ComposeWarning[] = [];
  const letterHeights: Record<string, number> = {};
  const layoutFields = fields.filter((f): f is TextFieldDef | MotifFieldDef => f.kind !== 'colour');
  const stackGaps = Math.max(0, layoutFields.length - 1) * gap;

  const buildBlocks = (k: number): Block[] => {
    warnings.length = 0;
    return layoutFields.map((f): Block => {
      if (f.kind === 'text') {
        const c = choices[f.id];
        if (!c || !('text' in c) || c.text.trim() === '') throw new ComposeError(f.id, 'Enter the text for this item.');
        const chosen = Math.min(c.letterHeightMm ?? f.letterHeightMm, f.maxLetterHeightMm ?? Infinity, f.letterHeightMm * 4);
        const grow = f.outline ? 2 * f.outline.offsetMm : 0;
        let fitted: ReturnType<typeof fitText>;
        try {
          fitted = fitText(
            registry,
            { text: c.text, fontId: f.fontId, letterHeightMm: Math.max(0.5, Math.floor(chosen * k * 1000) / 1000), trackingMm: f.trackingMm },
            { maxWidthMm: area.widthMm - grow, maxHeightMm: Math.max(1, area.heightMm - stackGaps - grow), minLetterHeightMm: f.minLetterHeightMm, maxChars: f.maxChars },
          );
        } catch (e) {
          if (e instanceof LayoutError) throw new ComposeError(f.id, e.message);
          throw e;
        }
        for (const w of fitted.warnings) warnings.push({ ...w, fieldId: f.id });
        letterHeights[f.id] = fitted.letterHeightMm;
        const L = fitted.layout;
        const pad = f.outline ? f.outline.offsetMm : 0;
        return {
          fieldId: f.id,
          w: L.widthMm + grow,
          h: L.heightMm + grow,
          place(x, y) {
            let lp = layoutPaths.get(L);
            if (!lp) { lp = parsePathData(L.path); if (Object.isFrozen(L)) layoutPaths.set(L, lp); }
            const { d, parsed } = moveParsed(lp, [1, 0, 0, 1, x + pad - L.bboxMm.minX, y + pad - L.bboxMm.minY]);
            const out: Piece<WeedingReport | null>[] = [];
            if (f.outline) {
              const o = outlineCached(d, parsed, f.outline.offsetMm);
              out.push(piece(`${f.id}-outline`, f.id, 'outline', f.outline.materialKind, colours.get(`${f.id}:outline`) ?? f.outline.colour, o.path, mode, o.areaMm2));
            }
            out.push(piece(f.id, f.id, 'text', f.materialKind, colours.get(f.id) ?? f.colour, d, mode, undefined, parsed));
            return out;
          },
        };
      }
      const c = choices[f.id];
      const opt = c && 'motifId' in c ? f.options.find((o) => o.id === c.motifId) : f.options.length === 1 ? f.options[0] : undefined;
      if (!opt) throw new ComposeError(f.id, 'Choose one of the motifs offered.');
      let ink: BBox | null = null;
      for (const l of opt.geometry.layers) ink = unionBBox(ink, l.bboxMm);
      const bb = ink!;
      const iw = bb.maxX - bb.minX, ih = bb.maxY - bb.minY;
      const m = Math.min(f.heightMm / ih, area.widthMm / iw, (area.heightMm - stackGaps) / ih) * k;
      return {
        fieldId: f.id,
        w: iw * m,
        h: ih * m,
        place(x, y) {
          return opt.geometry.layers.map((l) => {
            const spec = opt.layers?.[l.id];
            const d = placeMotifLayer(l.path, [m, 0, 0, m, x - bb.minX * m, y - bb.minY * m]);
            return piece(`${f.id}:${l.id}`, f.id, 'motif', spec?.materialKind ?? f.materialKind, colours.get(`${f.id}:${l.id}`) ?? spec?.colour ?? l.colour ?? '#000000', d, mode, l.areaMm2 * m * m);
          });
        },
      };
    });
  };

  let blocks = buildBlocks(1);
  const total = () => blocks.reduce((s, b) => s + b.h, 0) + stackGaps;
  for (let i = 0; i < 5 && total() > area.heightMm + 1e-9; i++) {
    const inkH = blocks.reduce((s, b) => s + b.h, 0);
    const k = Math.max(0.01, (area.heightMm - stackGaps) / inkH) * (i === 0 ? 1 : 0.99 ** i);
    blocks = buildBlocks(k);
  }

  const placed: Piece<WeedingReport | null>[] = [];
  let y = blank.topOffsetMm;
  for (const b of blocks) {
    placed.push(...b.place((blank.widthMm - b.w) / 2, y));
    y += b.h + gap;
  }
  const rank: Record<PieceRole, number> = { outline: 0, motif: 1, text: 2 };
  const pieces = placed.map((p, i) => ({ p, i })).sort((a, b) => rank[a.p.role] - rank[b.p.role] || a.i - b.i).map((x) => x.p);
  let bbox: BBox | null = null;
  for (const p of pieces) bbox = unionBBox(bbox, p.bboxMm);
  return {
    blankId: blank.id,
    pieces,
    bboxMm: bbox ?? { minX: 0, minY: 0, maxX: 0, maxY: 0 },
    warnings: [...warnings],
    weeding: mode === 'none' ? null : combineWeeding(pieces.map((p) => p.weeding as WeedingReport)),
    letterHeights,
  };
}
