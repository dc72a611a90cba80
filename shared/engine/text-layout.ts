/**
 * Text layout: a name in a font at a letter height → glyph outlines as SVG path data in mm.
 * Shaping (kerning, ligatures, contextual forms as the font defines them) is fontkit's `layout()`,
 * through shaping.ts (which takes an exact shortcut for strings that need only kerning).
 * Coordinates: x = 0 at the pen start, y = 0 on the cap line, y down; the baseline is at
 * y = letterHeightMm. Letter height is the cap height, measured from the "H" glyph (see fonts.ts).
 */
import type { FontRegistry, LoadedFont } from './fonts.ts';
import { LimitError, MAX_LETTER_HEIGHT_MM, MAX_TEXT_CHARS } from './limits.ts';
import { type BBox, bboxGrower, cubicExtrema, EMPTY_BBOX, quadExtrema } from './path.ts';
import { shapeText } from './shaping.ts';

export interface LayoutTextInput {
  text: string;
  fontId: string;
  /** Cap height in mm. */
  letterHeightMm: number;
  /** Extra space after every glyph but the last, in mm (may be negative). */
  trackingMm?: number;
}

export interface LaidOutGlyph {
  /** The character(s) this glyph draws (more than one for a ligature). */
  char: string;
  glyphId: number;
  /** Pen position where this glyph starts, mm. */
  xMm: number;
  advanceMm: number;
}

export interface TextLayout {
  /** The text after NFC normalisation. */
  text: string;
  fontId: string;
  letterHeightMm: number;
  trackingMm: number;
  /** mm per font unit. */
  scale: number;
  /** Sum of advances (plus tracking), mm. */
  advanceMm: number;
  /** Tight width and height of the ink, mm. */
  widthMm: number;
  heightMm: number;
  bboxMm: BBox;
  baselineMm: number;
  /** All outlines as one path (nonzero fill, y down, mm, points on a 1 µm grid; relative commands within a glyph). */
  path: string;
  glyphs: LaidOutGlyph[];
  /** Characters the font has no glyph for, each once, in order of appearance. */
  missing: string[];
}

// Glyph outline cache per font, in font units. Ops: 0 M x y, 1 L x y, 2 Q x1 y1 x y, 3 C x1 y1 x2 y2 x y, 4 Z.
interface GlyphData {
  ops: number[];
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
  empty: boolean;
}

/** fontkit's path commands, each with exactly its own number of coordinates. */
type GlyphCommand =
  | { command: 'moveTo' | 'lineTo'; args: [number, number] }
  | { command: 'quadraticCurveTo'; args: [number, number, number, number] }
  | { command: 'bezierCurveTo'; args: [number, number, number, number, number, number] }
  | { command: 'closePath'; args: [] };

interface FontCaches {
  glyphs: Map<number, GlyphData>;
  outlines: Map<number, Map<number, GlyphOutline>>;
  layouts: Map<string, TextLayout>;
}
const caches = new WeakMap<LoadedFont, FontCaches>();
const LAYOUT_CACHE_SIZE = 2000;

function cachesFor(f: LoadedFont): FontCaches {
  let c = caches.get(f);
  if (!c) {
    c = { glyphs: new Map(), outlines: new Map(), layouts: new Map() };
    caches.set(f, c);
  }
  return c;
}

function glyphData(f: LoadedFont, c: FontCaches, id: number): GlyphData {
  let g = c.glyphs.get(id);
  if (g) return g;
  const glyph = f.font.getGlyph(id) as unknown as { id: number; path: { commands: GlyphCommand[] } };
  const ops: number[] = [];
  const { ax, ay, box } = bboxGrower();
  let px = 0,
    py = 0;
  // .notdef (glyph 0) is drawn as nothing: a missing character is reported, not cut as a box.
  const commands = glyph.id === 0 ? [] : glyph.path.commands;
  for (const cmd of commands) {
    const { command, args: a } = cmd;
    switch (command) {
      case 'moveTo':
        ops.push(0, a[0], a[1]);
        ax(a[0]);
        ay(a[1]);
        px = a[0];
        py = a[1];
        break;
      case 'lineTo':
        ops.push(1, a[0], a[1]);
        ax(a[0]);
        ay(a[1]);
        px = a[0];
        py = a[1];
        break;
      case 'quadraticCurveTo':
        ops.push(2, a[0], a[1], a[2], a[3]);
        quadExtrema(px, a[0], a[2], ax);
        quadExtrema(py, a[1], a[3], ay);
        ax(a[2]);
        ay(a[3]);
        px = a[2];
        py = a[3];
        break;
      case 'bezierCurveTo':
        ops.push(3, a[0], a[1], a[2], a[3], a[4], a[5]);
        cubicExtrema(px, a[0], a[2], a[4], ax);
        cubicExtrema(py, a[1], a[3], a[5], ay);
        ax(a[4]);
        ay(a[5]);
        px = a[4];
        py = a[5];
        break;
      case 'closePath':
        ops.push(4);
        break;
    }
  }
  const b = box();
  g = b ? { ops, ...b, empty: false } : { ops, ...EMPTY_BBOX, empty: true };
  c.glyphs.set(id, g);
  return g;
}

interface GlyphOutline {
  x0: number;
  y0: number;
  rest: string;
}

/**
 * A glyph's outline at one scale: its first point in µm from the glyph origin and the rest as
 * relative path commands whose deltas are differences of µm-rounded points, so no rounding drifts.
 */
function glyphOutline(c: FontCaches, gd: GlyphData, id: number, s: number, cap: number): GlyphOutline {
  let byScale = c.outlines.get(s);
  if (!byScale) {
    byScale = new Map();
    c.outlines.set(s, byScale);
    if (c.outlines.size > 32) c.outlines.delete(c.outlines.keys().next().value as number);
  }
  let go = byScale.get(id);
  if (go) return go;
  const ops = gd.ops;
  // X(i)/Y(i) read the coordinate at ops[i]: every op code is followed by its full set of coordinates.
  const X = (i: number) => Math.round(ops[i]! * s * 1000);
  const Y = (i: number) => Math.round((cap - ops[i]!) * s * 1000);
  const r = (v: number) => String(v / 1000);
  let x0 = 0,
    y0 = 0,
    cx = 0,
    cy = 0,
    sx = 0,
    sy = 0,
    rest = '',
    first = true;
  for (let k = 0; k < ops.length; ) {
    const op = ops[k];
    if (op === 0 || op === 1) {
      const x = X(k + 1),
        y = Y(k + 2);
      if (first) {
        x0 = x;
        y0 = y;
        first = false;
      } else rest += `${op === 0 ? 'm' : 'l'}${r(x - cx)} ${r(y - cy)}`;
      cx = x;
      cy = y;
      if (op === 0) {
        sx = x;
        sy = y;
      }
      k += 3;
    } else if (op === 2) {
      const x1 = X(k + 1),
        y1 = Y(k + 2),
        x = X(k + 3),
        y = Y(k + 4);
      rest += `q${r(x1 - cx)} ${r(y1 - cy)} ${r(x - cx)} ${r(y - cy)}`;
      cx = x;
      cy = y;
      k += 5;
    } else if (op === 3) {
      const x1 = X(k + 1),
        y1 = Y(k + 2),
        x2 = X(k + 3),
        y2 = Y(k + 4),
        x = X(k + 5),
        y = Y(k + 6);
      rest += `c${r(x1 - cx)} ${r(y1 - cy)} ${r(x2 - cx)} ${r(y2 - cy)} ${r(x - cx)} ${r(y - cy)}`;
      cx = x;
      cy = y;
      k += 7;
    } else {
      rest += 'z';
      cx = sx;
      cy = sy; // after closepath the current point is the subpath's start
      k += 1;
    }
  }
  go = { x0, y0, rest };
  byScale.set(id, go);
  return go;
}

/** Lays out text in one line. Repeated calls with the same input are served from a cache (same object). */
/** The font engine could not shape the text at all (not the same as missing characters). */
export class LayoutError extends Error {
  readonly code = 'unshapeable_text';
  constructor(message: string) {
    super(message);
    this.name = 'LayoutError';
  }
}

export function layoutText(registry: FontRegistry, input: LayoutTextInput, opts: { cache?: boolean } = {}): TextLayout {
  const f = registry.require(input.fontId);
  return layoutWithFont(f, input, opts);
}

export function layoutWithFont(f: LoadedFont, input: LayoutTextInput, opts: { cache?: boolean } = {}): TextLayout {
  const text = input.text.normalize('NFC');
  const tracking = input.trackingMm ?? 0;
  const h = input.letterHeightMm;
  if (!(h > 0) || !Number.isFinite(h)) throw new RangeError('letterHeightMm must be a positive number.');
  if (h > MAX_LETTER_HEIGHT_MM) throw new LimitError('MAX_LETTER_HEIGHT_MM', `The letter height is over the ${MAX_LETTER_HEIGHT_MM} mm limit.`);
  if (!Number.isFinite(tracking)) throw new RangeError('trackingMm must be a finite number.');
  // length in code points, counted without building an array for a huge string
  if (text.length > MAX_TEXT_CHARS * 2 || [...text].length > MAX_TEXT_CHARS) throw new LimitError('MAX_TEXT_CHARS', `The text is longer than the ${MAX_TEXT_CHARS}-character limit.`);
  const c = cachesFor(f);
  const key = `${h}|${tracking}|${text}`;
  const useCache = opts.cache !== false;
  if (useCache) {
    const hit = c.layouts.get(key);
    if (hit) {
      c.layouts.delete(key); // LRU: move to the newest end
      c.layouts.set(key, hit);
      return hit;
    }
  }

  const s = h / f.capHeightUnits;
  const cap = f.capHeightUnits;
  const trackUnits = tracking / s;
  let run: ReturnType<typeof shapeText>;
  try {
    run = shapeText(f.font, text);
  } catch {
    // fontkit throws on a few odd mixes (e.g. a fraction slash beside CJK, emoji after a combining mark)
    throw new LayoutError('This font cannot set that mix of characters. Try removing symbols or emoji.');
  }
  const glyphs: LaidOutGlyph[] = [];
  let d = '';
  let pen = 0;
  let minX = Infinity,
    minY = Infinity,
    maxX = -Infinity,
    maxY = -Infinity;
  const n = run.glyphIds.length;
  for (let i = 0; i < n; i++) {
    // the run's arrays are parallel, all n long
    const id = run.glyphIds[i]!;
    const gd = glyphData(f, c, id);
    const ox = pen + run.xOffset[i]!;
    const oy = run.yOffset[i]!;
    if (!gd.empty) {
      const go = glyphOutline(c, gd, id, s, cap);
      // Glyph origin on the 1 µm grid; the outline after the first point is relative, so its string
      // is reused for every occurrence of the glyph at this size.
      const OX = Math.round(ox * s * 1000),
        OY = Math.round(-oy * s * 1000);
      d += `M${(OX + go.x0) / 1000} ${(OY + go.y0) / 1000}${go.rest}`;
      const gx0 = (gd.minX + ox) * s,
        gx1 = (gd.maxX + ox) * s;
      const gy0 = (cap - gd.maxY - oy) * s,
        gy1 = (cap - gd.minY - oy) * s;
      if (gx0 < minX) minX = gx0;
      if (gx1 > maxX) maxX = gx1;
      if (gy0 < minY) minY = gy0;
      if (gy1 > maxY) maxY = gy1;
    }
    const adv = run.xAdvance[i]! + (i < n - 1 ? trackUnits : 0);
    const cps = run.codePoints[i]!;
    glyphs.push({ char: cps.length === 1 ? String.fromCodePoint(cps[0]!) : String.fromCodePoint(...cps), glyphId: id, xMm: pen * s, advanceMm: adv * s });
    pen += adv;
  }

  const missing: string[] = [];
  for (const ch of text) {
    const cp = ch.codePointAt(0)!;
    if (!f.hasChar(cp) && !missing.includes(ch)) missing.push(ch);
  }

  const bboxMm: BBox = minX === Infinity ? { minX: 0, minY: 0, maxX: 0, maxY: 0 } : { minX, minY, maxX, maxY };
  const result: TextLayout = {
    text,
    fontId: f.id,
    letterHeightMm: h,
    trackingMm: tracking,
    scale: s,
    advanceMm: pen * s,
    widthMm: bboxMm.maxX - bboxMm.minX,
    heightMm: bboxMm.maxY - bboxMm.minY,
    bboxMm,
    baselineMm: h,
    path: d,
    glyphs,
    missing,
  };
  if (useCache) {
    Object.freeze(result);
    Object.freeze(glyphs);
    Object.freeze(missing);
    Object.freeze(bboxMm);
    c.layouts.set(key, result);
    if (c.layouts.size > LAYOUT_CACHE_SIZE) c.layouts.delete(c.layouts.keys().next().value as string);
  }
  return result;
}
