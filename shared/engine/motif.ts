/**
 * Motif SVG intake: a seller's layered SVG becomes plain, normalised geometry in mm — layers of
 * path data with bbox and area — and nothing else. Only geometry survives: script, foreignObject,
 * event attributes, external references, images, text, styles… are dropped (and reported);
 * a DOCTYPE or ENTITY declaration refuses the file outright (OWASP ASVS 1.5.1, 1.3.4), as do
 * files over the size, element, depth, path-command or coordinate caps of limits.ts (ASVS 5.2.1).
 * Coordinates are checked after every transform, so `scale(1e12)` is refused like a point at 1e12.
 * Serve motifs only through `renderMotifSvg`,
 * which writes back just the path elements we generate.
 *
 * Units: W3C CSS Values and Units, absolute lengths — 1in = 96px = 25.4mm. A bare number is px.
 */

import { XMLParser, XMLValidator } from 'fast-xml-parser';
import svgpath from 'svgpath';
import { cssLengthToMm, MM_PER_CSS_PX } from '../units.ts';
import { type FillRule, regionsArea, regionsToPolygons, unionRegions } from './geometry.ts';
import { LimitError, MOTIF_MAX_BYTES, MOTIF_MAX_DEPTH, MOTIF_MAX_ELEMENTS, MOTIF_MAX_LAYERS, MOTIF_MAX_PATH_CHARS, MOTIF_MAX_PATH_COMMANDS, MOTIF_MAX_SIDE_MM } from './limits.ts';
import { type BBox, checkPathBounds, flattenPath, formatPath, fromSvgPath, type Path, type Polygon, parsePathData, pathBBox, polygonsToPath } from './path.ts';

/** The motif caps of limits.ts, by short name (a test may pass lower ones to parseMotifSvg). */
export const MOTIF_LIMITS = Object.freeze({
  maxBytes: MOTIF_MAX_BYTES,
  maxElements: MOTIF_MAX_ELEMENTS,
  maxDepth: MOTIF_MAX_DEPTH,
  maxLayers: MOTIF_MAX_LAYERS,
  maxPathCommands: MOTIF_MAX_PATH_COMMANDS,
});

export type MotifErrorCode =
  | 'too_large'
  | 'too_many_elements'
  | 'too_deep'
  | 'doctype_refused'
  | 'malformed'
  | 'not_svg'
  | 'bad_size'
  | 'no_geometry'
  | 'too_many_layers'
  | 'too_many_commands'
  | 'out_of_range'
  | 'too_complex';

/** Codes for a file refused because it crosses one of the limits (not because it is broken). */
export const MOTIF_LIMIT_CODES: ReadonlySet<MotifErrorCode> = new Set(['too_large', 'too_many_elements', 'too_deep', 'too_many_layers', 'too_many_commands', 'out_of_range', 'too_complex']);

export class MotifError extends Error {
  constructor(
    public readonly code: MotifErrorCode,
    message: string,
  ) {
    super(message);
    this.name = 'MotifError';
  }
}

export interface MotifLayer {
  /** Layer id: the group's data-layer or id, or `fill-rrggbb` for ungrouped shapes. */
  id: string;
  /** The layer's fill colour as #rrggbb, or null when it is not a plain colour. */
  colour: string | null;
  /** Filled outline in mm (nonzero fill; overlapping shapes already united), y down. */
  path: string;
  bboxMm: BBox;
  areaMm2: number;
}

export interface MotifGeometry {
  widthMm: number;
  heightMm: number;
  /** Bottom → top (document order: later layers paint over earlier ones). */
  layers: MotifLayer[];
  /** What was removed, for the seller's report. Never stored as content. */
  dropped: { what: string; reason: string; count: number }[];
}

/** A motif's geometry as stored with a shop's motifs and composed: without the report of what was dropped. */
export type StoredMotifGeometry = Omit<MotifGeometry, 'dropped'>;

const SHAPES = new Set(['rect', 'circle', 'ellipse', 'line', 'polyline', 'polygon', 'path']);
const SILENT = new Set(['title', 'desc', 'metadata']);
const REASONS: Record<string, string> = {
  script: 'scripts are never kept',
  foreignObject: 'embedded documents are never kept',
  image: 'images are not cut geometry',
  use: 'references to other content are not followed',
  a: 'links are not kept',
  text: 'text in a motif is not cut geometry; use a name field',
  style: 'style sheets are not kept; fills are read from attributes',
  defs: 'definitions (gradients, symbols) are not cut geometry',
  symbol: 'symbols are not cut geometry',
  svg: 'nested documents are not kept',
  iframe: 'embedded documents are never kept',
};

const TOLERANCE_MM = 0.01;

type XNode = Record<string, unknown>;
interface Ctx {
  transform: string;
  fill: string | null;
  fillRule: FillRule;
  layer: string | null;
  layerColour: string | null;
  depth: number;
}
interface LayerAcc {
  id: string;
  colour: string | null;
  polys: Polygon[];
  rule: FillRule[];
  lines: Path[];
}

const NAMED: Record<string, string> = {
  black: '#000000',
  white: '#ffffff',
  red: '#ff0000',
  green: '#008000',
  blue: '#0000ff',
  yellow: '#ffff00',
  orange: '#ffa500',
  purple: '#800080',
  pink: '#ffc0cb',
  brown: '#a52a2a',
  grey: '#808080',
  gray: '#808080',
  navy: '#000080',
  teal: '#008080',
  gold: '#ffd700',
  silver: '#c0c0c0',
  lime: '#00ff00',
  maroon: '#800000',
};

/** A CSS colour → #rrggbb, or null for anything that is not a plain colour (url(), currentColor…). */
export function normaliseColour(v: string | null | undefined): string | null {
  if (!v) return null;
  const s = v.trim().toLowerCase();
  if (/^#[0-9a-f]{6}$/.test(s)) return s;
  if (/^#[0-9a-f]{3}$/.test(s)) return `#${s[1]}${s[1]}${s[2]}${s[2]}${s[3]}${s[3]}`;
  const m = /^rgb\(\s*(\d{1,3})\s*,\s*(\d{1,3})\s*,\s*(\d{1,3})\s*\)$/.exec(s);
  if (m) return `#${[m[1], m[2], m[3]].map((x) => Math.min(255, Number(x)).toString(16).padStart(2, '0')).join('')}`;
  return NAMED[s] ?? null;
}

const SAFE_ID = /^[A-Za-z][A-Za-z0-9_-]{0,63}$/;
function safeId(raw: string | undefined, fallback: string): string {
  if (!raw) return fallback;
  const t = raw
    .trim()
    .replace(/[^A-Za-z0-9_-]+/g, '-')
    .replace(/^[^A-Za-z]+/, '')
    .slice(0, 64);
  return SAFE_ID.test(t) ? t : fallback;
}

function styleProp(style: string | undefined, prop: string): string | undefined {
  if (!style) return undefined;
  for (const decl of style.split(';')) {
    const i = decl.indexOf(':');
    if (i > 0 && decl.slice(0, i).trim().toLowerCase() === prop) return decl.slice(i + 1).trim();
  }
  return undefined;
}

/** A length attribute in user units (px): bare numbers, or absolute CSS units converted to px. */
function num(v: unknown, dflt = 0): number {
  if (v === undefined || v === null || v === '') return dflt;
  const s = String(v).trim();
  const n = Number(s);
  if (Number.isFinite(n)) return n;
  const mm = cssLengthToMm(s);
  return mm === null ? NaN : mm / MM_PER_CSS_PX;
}

function shapeToD(tag: string, a: Record<string, string>): string | null {
  const f = (n: number) => String(n);
  switch (tag) {
    case 'rect': {
      const x = num(a.x),
        y = num(a.y),
        w = num(a.width),
        h = num(a.height);
      if (!(w > 0 && h > 0)) return null;
      let rx = a.rx !== undefined ? num(a.rx) : NaN,
        ry = a.ry !== undefined ? num(a.ry) : NaN;
      if (Number.isNaN(rx)) rx = Number.isNaN(ry) ? 0 : ry;
      if (Number.isNaN(ry)) ry = rx;
      rx = Math.min(Math.max(0, rx), w / 2);
      ry = Math.min(Math.max(0, ry), h / 2);
      if (rx === 0 || ry === 0) return `M${f(x)} ${f(y)}H${f(x + w)}V${f(y + h)}H${f(x)}Z`;
      return `M${f(x + rx)} ${f(y)}H${f(x + w - rx)}A${f(rx)} ${f(ry)} 0 0 1 ${f(x + w)} ${f(y + ry)}V${f(y + h - ry)}A${f(rx)} ${f(ry)} 0 0 1 ${f(x + w - rx)} ${f(y + h)}H${f(x + rx)}A${f(rx)} ${f(ry)} 0 0 1 ${f(x)} ${f(y + h - ry)}V${f(y + ry)}A${f(rx)} ${f(ry)} 0 0 1 ${f(x + rx)} ${f(y)}Z`;
    }
    case 'circle':
    case 'ellipse': {
      const cx = num(a.cx),
        cy = num(a.cy);
      const rx = tag === 'circle' ? num(a.r) : num(a.rx),
        ry = tag === 'circle' ? num(a.r) : num(a.ry);
      if (!(rx > 0 && ry > 0)) return null;
      return `M${f(cx - rx)} ${f(cy)}A${f(rx)} ${f(ry)} 0 1 0 ${f(cx + rx)} ${f(cy)}A${f(rx)} ${f(ry)} 0 1 0 ${f(cx - rx)} ${f(cy)}Z`;
    }
    case 'line': {
      const x1 = num(a.x1),
        y1 = num(a.y1),
        x2 = num(a.x2),
        y2 = num(a.y2);
      if ([x1, y1, x2, y2].some((n) => !Number.isFinite(n))) return null;
      return `M${f(x1)} ${f(y1)}L${f(x2)} ${f(y2)}`;
    }
    case 'polyline':
    case 'polygon': {
      const pts = (a.points ?? '')
        .trim()
        .split(/[\s,]+/)
        .filter(Boolean)
        .map(Number);
      if (pts.length < 4 || pts.some((n) => !Number.isFinite(n))) return null;
      let d = `M${f(pts[0]!)} ${f(pts[1]!)}`; // at least four numbers, checked above
      for (let i = 2; i + 1 < pts.length; i += 2) d += `L${f(pts[i]!)} ${f(pts[i + 1]!)}`;
      return tag === 'polygon' ? `${d}Z` : d;
    }
    case 'path': {
      const d = a.d ?? '';
      return /^[\sMmZzLlHhVvCcSsQqTtAa0-9eE.,+-]*$/.test(d) && /[Mm]/.test(d) ? d : null;
    }
  }
  return null;
}

function tagOf(node: XNode): string | null {
  for (const k of Object.keys(node)) if (k !== ':@') return k;
  return null;
}

function attrsOf(node: XNode): Record<string, string> {
  const raw = (node[':@'] ?? {}) as Record<string, unknown>;
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(raw)) out[k.startsWith('@_') ? k.slice(2) : k] = String(v);
  return out;
}

/**
 * Deepest element nesting, found by a linear scan of the tags (comments, CDATA and processing
 * instructions skipped) before the XML parser builds anything: a file nested thousands deep is
 * refused without recursing into it.
 */
function nestingDepth(svg: string, stopAbove: number): number {
  const text = svg.replace(/<!--[\s\S]*?-->|<!\[CDATA\[[\s\S]*?\]\]>|<\?[\s\S]*?\?>/g, '');
  let depth = 0,
    max = 0;
  for (const m of text.matchAll(/<(\/?)[A-Za-z][^>]*?(\/?)>/g)) {
    if (m[1]) depth--;
    else if (!m[2]) {
      depth++;
      if (depth > max) max = depth;
      if (max > stopAbove) return max;
    }
  }
  return max;
}

/** Parses and sanitises a motif SVG. Throws MotifError when the file is refused. */
export function parseMotifSvg(svg: string, limits: Partial<typeof MOTIF_LIMITS> = {}): MotifGeometry {
  try {
    return parseMotif(svg, { ...MOTIF_LIMITS, ...limits });
  } catch (e) {
    // a bound crossed deep in the geometry (flattening) is a refusal like any other
    if (e instanceof LimitError) throw new MotifError(e.limit === 'MAX_COORDINATE_MM' ? 'out_of_range' : 'too_complex', `The motif is refused: ${e.message}`);
    throw e;
  }
}

/**
 * The checks that need no parsing — byte size, DOCTYPE/ENTITY, element count, nesting depth — in
 * one linear pass over the text. The server runs them on the request thread before it hands the
 * file to a worker; parseMotifSvg runs them again first.
 */
export function checkMotifBounds(svg: string, limits: Partial<typeof MOTIF_LIMITS> = {}): void {
  const lim = { ...MOTIF_LIMITS, ...limits };
  if (typeof svg !== 'string') throw new MotifError('malformed', 'The motif must be SVG text.');
  if (new TextEncoder().encode(svg).byteLength > lim.maxBytes) throw new MotifError('too_large', `The motif file is larger than ${Math.round(lim.maxBytes / 1024)} KB.`);
  // Entities and DOCTYPEs are refused before any parsing (no entity expansion, no external DTDs).
  if (/<!DOCTYPE|<!ENTITY|<!ELEMENT|<!ATTLIST/i.test(svg)) throw new MotifError('doctype_refused', 'The motif has a DOCTYPE or ENTITY declaration; save it as plain SVG without one.');
  const tagCount = (svg.match(/<[A-Za-z]/g) ?? []).length;
  if (tagCount > lim.maxElements) throw new MotifError('too_many_elements', `The motif has more than ${lim.maxElements} elements.`);
  // the root <svg> is depth 1 and its children depth 2; maxDepth counts the groups around an element
  if (nestingDepth(svg, lim.maxDepth + 2) > lim.maxDepth + 2) throw new MotifError('too_deep', `The motif nests groups more than ${lim.maxDepth} deep.`);
}

function parseMotif(svg: string, lim: typeof MOTIF_LIMITS): MotifGeometry {
  checkMotifBounds(svg, lim);
  const valid = XMLValidator.validate(svg, { allowBooleanAttributes: true });
  if (valid !== true) throw new MotifError('malformed', `The motif is not well-formed SVG (line ${valid.err.line}: ${valid.err.msg}).`);

  const parser = new XMLParser({
    preserveOrder: true,
    ignoreAttributes: false,
    allowBooleanAttributes: true,
    processEntities: false,
    htmlEntities: false,
    parseTagValue: false,
    parseAttributeValue: false,
    ignoreDeclaration: true,
    ignorePiTags: true,
    trimValues: true,
  });
  const doc = parser.parse(svg) as XNode[];
  const rootNode = doc.find((n) => tagOf(n) !== null && tagOf(n) !== '#text');
  if (!rootNode || tagOf(rootNode) !== 'svg') throw new MotifError('not_svg', 'The file is not an SVG image (no <svg> root).');
  const rootAttrs = attrsOf(rootNode);

  // ---- viewport: width/height (absolute CSS units, bare = px) and viewBox ----
  const vb = (rootAttrs.viewBox ?? '')
    .trim()
    .split(/[\s,]+/)
    .filter(Boolean)
    .map(Number);
  const [vbX = NaN, vbY = NaN, vbW = NaN, vbH = NaN] = vb;
  const hasVb = vb.length === 4 && vb.every(Number.isFinite) && vbW > 0 && vbH > 0;
  let wMm = cssLengthToMm(rootAttrs.width);
  let hMm = cssLengthToMm(rootAttrs.height);
  if (hasVb) {
    if (wMm === null && hMm === null) {
      wMm = vbW * MM_PER_CSS_PX;
      hMm = vbH * MM_PER_CSS_PX;
    } else if (wMm === null) wMm = (hMm! * vbW) / vbH;
    else if (hMm === null) hMm = (wMm * vbH) / vbW;
  }
  if (wMm === null || hMm === null || !(wMm > 0 && hMm > 0)) {
    throw new MotifError('bad_size', 'The motif needs a viewBox or an absolute width and height (mm, cm, in, pt or px).');
  }
  if (wMm > MOTIF_MAX_SIDE_MM || hMm > MOTIF_MAX_SIDE_MM) {
    throw new MotifError('bad_size', `The motif's canvas is larger than the ${MOTIF_MAX_SIDE_MM} mm limit on each side.`);
  }
  // user units → mm (preserveAspectRatio: xMidYMid meet by default, or none)
  let sx: number,
    sy: number,
    tx = 0,
    ty = 0;
  if (hasVb) {
    sx = wMm / vbW;
    sy = hMm / vbH;
    if ((rootAttrs.preserveAspectRatio ?? '').trim() !== 'none') {
      const s = Math.min(sx, sy);
      tx = (wMm - vbW * s) / 2;
      ty = (hMm - vbH * s) / 2;
      sx = sy = s;
    }
    tx -= vbX * sx;
    ty -= vbY * sy;
  } else {
    sx = sy = MM_PER_CSS_PX;
  }

  const dropped = new Map<string, { what: string; reason: string; count: number }>();
  const drop = (what: string, reason: string) => {
    const d = dropped.get(what);
    if (d) d.count++;
    else dropped.set(what, { what, reason, count: 1 });
  };
  const layers = new Map<string, LayerAcc>();
  let elements = 0;
  let commands = 0;

  const walk = (children: XNode[], ctx: Ctx) => {
    for (const node of children) {
      const tag = tagOf(node);
      if (!tag || tag === '#text' || tag === '#comment') continue;
      elements++;
      if (elements > lim.maxElements) throw new MotifError('too_many_elements', `The motif has more than ${lim.maxElements} elements.`);
      if (ctx.depth > lim.maxDepth) throw new MotifError('too_deep', `The motif nests groups more than ${lim.maxDepth} deep.`);
      const a = attrsOf(node);
      for (const [k, v] of Object.entries(a)) {
        if (/^on/i.test(k)) drop(`${k} attribute`, 'event handlers are never kept');
        else if (/(^|:)href$/i.test(k)) drop(`${k} attribute`, /^\s*(#)/.test(v) ? 'references are not followed' : 'external references are never followed');
      }
      if (SILENT.has(tag)) continue;
      if (tag !== 'g' && !SHAPES.has(tag)) {
        drop(`<${tag}>`, REASONS[tag] ?? 'not cut geometry');
        continue;
      }
      if (a.display?.trim() === 'none' || a.visibility?.trim() === 'hidden' || styleProp(a.style, 'display') === 'none') continue;
      const fillRaw = styleProp(a.style, 'fill') ?? a.fill;
      const ruleRaw = styleProp(a['style'], 'fill-rule') ?? a['fill-rule'];
      const t = a.transform && /^[\s\w(),.+-]*$/.test(a.transform) ? a.transform : '';
      if (a.transform && !t) drop('transform attribute', 'could not be read');
      const next: Ctx = {
        transform: t ? `${ctx.transform} ${t}` : ctx.transform,
        fill: fillRaw !== undefined ? fillRaw : ctx.fill,
        fillRule: ruleRaw === 'evenodd' ? 'evenodd' : ruleRaw === 'nonzero' ? 'nonzero' : ctx.fillRule,
        layer: ctx.layer,
        layerColour: ctx.layerColour,
        depth: ctx.depth + 1,
      };
      if (tag === 'g') {
        if (!ctx.layer && (a['data-layer'] || a.id)) {
          next.layer = safeId(a['data-layer'] || a.id, `layer-${layers.size + 1}`);
          next.layerColour = normaliseColour(fillRaw);
        }
        walk((node.g ?? []) as XNode[], next);
        continue;
      }
      const d = shapeToD(tag, a);
      if (d === null) {
        drop(`<${tag}>`, 'no usable geometry');
        continue;
      }
      const fill = next.fill ?? 'black'; // SVG's initial fill is black
      const isLine = tag === 'line';
      if (fill.trim() === 'none' && !isLine) {
        drop(`<${tag}> without fill`, 'outlines drawn only with a stroke are not cut; give the shape a fill');
        continue;
      }
      const colour = normaliseColour(fill);
      const key = next.layer ?? `fill-${(colour ?? 'other').replace('#', '')}`;
      let acc = layers.get(key);
      if (!acc) {
        if (layers.size >= lim.maxLayers) throw new MotifError('too_many_layers', `The motif has more than ${lim.maxLayers} layers (colours).`);
        acc = { id: key, colour: next.layer ? (next.layerColour ?? colour) : colour, polys: [], rule: [], lines: [] };
        layers.set(key, acc);
      }
      let sp = svgpath(d);
      // counted before any transform or flattening work: the file's segments, implicit repeats expanded
      commands += (sp as unknown as { segments: unknown[] }).segments.length;
      if (commands > lim.maxPathCommands) throw new MotifError('too_many_commands', `The motif has more than ${lim.maxPathCommands.toLocaleString('en')} path commands.`);
      if (next.transform.trim()) sp = sp.transform(next.transform.trim());
      sp = sp.scale(sx, sy).translate(tx, ty);
      const path = fromSvgPath(sp);
      // every point where it lands in mm, after the element's and its groups' transforms
      checkPathBounds(path, 'A point of the motif');
      if (isLine) acc.lines.push(path);
      else {
        // Each shape fills by its own rule; uniting it first makes the layer a plain nonzero fill.
        const shapePolys = regionsToPolygons(unionRegions(flattenPath(path, TOLERANCE_MM), next.fillRule));
        acc.polys.push(...shapePolys);
      }
    }
  };
  walk((rootNode.svg ?? []) as XNode[], { transform: '', fill: null, fillRule: 'nonzero', layer: null, layerColour: null, depth: 0 });

  const out: MotifLayer[] = [];
  for (const acc of layers.values()) {
    const regions = unionRegions(acc.polys, 'nonzero');
    const p: Path = [...polygonsToPath(regionsToPolygons(regions)), ...acc.lines.flat()];
    if (p.length === 0) continue;
    const d = formatPath(p);
    // what compose() will be handed later: refused now rather than stored and unusable
    if (d.length > MOTIF_MAX_PATH_CHARS)
      throw new MotifError(
        'too_complex',
        `The motif's layer "${acc.id}" is too detailed: its outline is longer than the ${MOTIF_MAX_PATH_CHARS.toLocaleString('en')}-character limit. Simplify the artwork.`,
      );
    out.push({ id: acc.id, colour: acc.colour, path: d, bboxMm: pathBBox(p), areaMm2: regionsArea(regions) });
  }
  if (out.length === 0) throw new MotifError('no_geometry', 'The motif has no filled shapes to cut.');
  return { widthMm: wMm, heightMm: hMm, layers: out, dropped: [...dropped.values()] };
}

const PATH_DATA = /^[MLHVCSQTAZmlhvcsqtaz0-9eE.,+\- ]*$/;
const esc = (s: string) => s.replace(/[^A-Za-z0-9_-]/g, '');

/**
 * Writes normalised motif geometry back as a clean SVG: one <g> per layer holding one <path> we
 * generated. Nothing from the seller's file reaches this output except numbers, safe ids and
 * #rrggbb colours, and even a tampered stored object cannot inject markup.
 */
export function renderMotifSvg(m: MotifGeometry): string {
  const n = (v: number) => (Number.isFinite(v) ? String(Math.round(v * 1000) / 1000) : '0');
  let out = `<svg xmlns="http://www.w3.org/2000/svg" width="${n(m.widthMm)}mm" height="${n(m.heightMm)}mm" viewBox="0 0 ${n(m.widthMm)} ${n(m.heightMm)}">`;
  for (const layer of m.layers) {
    const id = esc(layer.id) || 'layer';
    const colour = layer.colour && /^#[0-9a-f]{6}$/.test(layer.colour) ? layer.colour : '#000000';
    const d = PATH_DATA.test(layer.path) ? layer.path : formatPath(parsePathData(''));
    out += `<g id="${id}" data-layer="${id}"><path fill="${colour}" d="${d}"/></g>`;
  }
  return `${out}</svg>`;
}
