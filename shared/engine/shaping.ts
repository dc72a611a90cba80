/**
 * Speed-ups for fontkit 2.0.4's OpenType shaping (`font.layout()`), installed per font by
 * `accelerateShaping(font)` (fonts.ts does it on load). Each one keeps fontkit's algorithm and
 * only stops it from redoing or scanning work whose result is already known, so every glyph id,
 * code point and position is the one unpatched fontkit gives (tests/shared/engine/shaping.test.ts
 * compares both on random strings in every bundled font, and HarfBuzz stays the reference).
 *
 * What is patched — on this font's own layout-engine objects, never on fontkit's classes, so other
 * fontkit users (pdfkit) and fonts loaded elsewhere are untouched:
 * - `selectScript` on the GSUB/GPOS processors: a repeat call with the same arguments returns at
 *   once (fontkit otherwise rebuilds the feature table every call; the call is idempotent).
 * - The shaping plan (stages and global features): fontkit builds a fresh one per call. For the
 *   default shaper (Latin and every script without its own shaper) the plan depends only on the
 *   script, direction and requested features, so it is built once per key and reused; the per-glyph
 *   part (assigning features to glyphs) still runs every call. Other shapers (Arabic, Indic, …)
 *   keep fontkit's own setup.
 * - `lookupsForFeatures`: memoised per feature table and stage.
 * - `applyLookups`: each lookup gets a bitmap of the glyphs its subtables can start matching at
 *   (the union of their first coverage tables). A lookup with none of them in the buffer is
 *   skipped, and glyphs outside it are stepped over. fontkit's `applyLookup` returns false without
 *   side effects for such glyphs, so this only removes no-op work.
 * - `coverageIndex` and `getClassID`: a per-table array indexed by glyph id instead of a linear
 *   search, with the same first-match semantics.
 * - Glyph metrics are computed on fontkit's cached glyph before fonts.ts hands out per-use views, so
 *   a view never recomputes them (see fonts.ts).
 *
 * On top of that, `shapeText` has an exact fast path (below) for the common case — a name that
 * needs only cmap, hmtx advances and GPOS pair kerning — and hands every other string to fontkit.
 */
import type { Font as FkFont } from 'fontkit';

/* eslint-disable @typescript-eslint/no-explicit-any -- fontkit's internals are untyped */
type Any = any;

interface Coverage {
  version: number;
  glyphs?: number[];
  rangeRecords?: { start: number; end: number; startCoverageIndex: number }[];
}
interface ClassDef {
  version: number;
  startGlyph?: number;
  classValueArray?: number[];
  classRangeRecord?: { start: number; end: number; class: number }[];
}

const coverageMaps = new WeakMap<object, Int32Array>();
const classMaps = new WeakMap<object, Uint16Array | Int32Array>();

/** coverage → array glyph id → coverage index (−1 outside), first match winning as in fontkit. */
function coverageMap(cov: Coverage): Int32Array {
  let m = coverageMaps.get(cov);
  if (m) return m;
  let max = -1;
  if (cov.version === 1) for (const g of cov.glyphs!) max = Math.max(max, g);
  else if (cov.version === 2) for (const r of cov.rangeRecords!) max = Math.max(max, r.end);
  m = new Int32Array(max + 1).fill(-1);
  if (cov.version === 1) {
    const gs = cov.glyphs!;
    for (let i = gs.length - 1; i >= 0; i--) m[gs[i]!] = i; // indexOf: the first occurrence wins
  } else if (cov.version === 2) {
    const rs = cov.rangeRecords!;
    for (let k = rs.length - 1; k >= 0; k--) {
      const r = rs[k]!; // the first range containing the glyph wins
      for (let g = r.start; g <= r.end; g++) m[g] = r.startCoverageIndex + g - r.start;
    }
  }
  coverageMaps.set(cov, m);
  return m;
}

/** classDef → array glyph id → class (0 outside), first match winning as in fontkit. */
function classMap(cd: ClassDef): Uint16Array | Int32Array {
  let m = classMaps.get(cd);
  if (m) return m;
  let max = -1,
    maxClass = 0;
  if (cd.version === 1) {
    max = cd.startGlyph! + cd.classValueArray!.length - 1;
    for (const c of cd.classValueArray!) maxClass = Math.max(maxClass, c);
  } else if (cd.version === 2) {
    for (const r of cd.classRangeRecord!) {
      max = Math.max(max, r.end);
      maxClass = Math.max(maxClass, r.class);
    }
  }
  m = maxClass <= 0xffff ? new Uint16Array(Math.max(0, max + 1)) : new Int32Array(Math.max(0, max + 1));
  if (cd.version === 1) {
    const a = cd.classValueArray!;
    for (let i = 0; i < a.length; i++) if (cd.startGlyph! + i >= 0) m[cd.startGlyph! + i] = a[i]!;
  } else if (cd.version === 2) {
    const rs = cd.classRangeRecord!;
    for (let k = rs.length - 1; k >= 0; k--) {
      const r = rs[k]!;
      for (let g = Math.max(0, r.start); g <= r.end; g++) m[g] = r.class;
    }
  }
  classMaps.set(cd, m);
  return m;
}

function fastCoverageIndex(this: Any, coverage: Coverage, glyph?: number | null): number {
  if (glyph == null) glyph = this.glyphIterator.cur.id as number;
  if (coverage.version !== 1 && coverage.version !== 2) return -1;
  const m = coverageMap(coverage);
  return glyph >= 0 && glyph < m.length ? m[glyph]! : -1;
}

function fastGetClassID(glyph: number, classDef: ClassDef): number {
  if (classDef.version !== 1 && classDef.version !== 2) return 0;
  // fontkit's version-1 lookup can return a non-number for a non-integer id; ids are integers here.
  if (!Number.isInteger(glyph)) return slowGetClassID(glyph, classDef);
  const m = classMap(classDef);
  return glyph >= 0 && glyph < m.length ? m[glyph]! : 0;
}

function slowGetClassID(glyph: number, classDef: ClassDef): number {
  if (classDef.version === 1) {
    const i = glyph - classDef.startGlyph!;
    if (i >= 0 && i < classDef.classValueArray!.length) return classDef.classValueArray![i]!;
  } else if (classDef.version === 2) {
    for (const r of classDef.classRangeRecord!) if (r.start <= glyph && glyph <= r.end) return r.class;
  }
  return 0;
}

/**
 * The glyphs a subtable can start matching at: the coverage fontkit checks first for the current
 * glyph, per lookup type. `null` means "cannot tell": the lookup is never skipped.
 */
function firstCoverage(kind: 'GSUB' | 'GPOS', type: number, t: Any): Coverage | null {
  if (kind === 'GSUB' ? type === 7 : type === 9) return firstCoverage(kind, t.lookupType, t.extension);
  const ctx = kind === 'GSUB' ? [5, 6] : [7, 8];
  if (type === ctx[0]) {
    if (t.version === 1 || t.version === 2) return t.coverage ?? null;
    if (t.version === 3) return t.coverages?.length ? t.coverages[0] : null;
    return null;
  }
  if (type === ctx[1]) {
    if (t.version === 1 || t.version === 2) return t.coverage ?? null;
    if (t.version === 3) return t.inputCoverage?.length ? t.inputCoverage[0] : null;
    return null;
  }
  if (kind === 'GSUB') return type >= 1 && type <= 4 ? (t.coverage ?? null) : null;
  if (type === 1 || type === 2 || type === 3) return t.coverage ?? null;
  if (type === 4 || type === 5) return t.markCoverage ?? null;
  if (type === 6) return t.mark1Coverage ?? null;
  return null;
}

const lookupMasks = new WeakMap<object, Uint8Array | null>();

function lookupMask(kind: 'GSUB' | 'GPOS', lookup: Any): Uint8Array | null {
  if (lookupMasks.has(lookup)) return lookupMasks.get(lookup)!;
  let mask: Uint8Array | null = null;
  const maps: Int32Array[] = [];
  let ok = true;
  for (const t of lookup.subTables) {
    const cov = firstCoverage(kind, lookup.lookupType, t);
    if (!cov || (cov.version !== 1 && cov.version !== 2)) {
      ok = false;
      break;
    }
    maps.push(coverageMap(cov));
  }
  if (ok) {
    mask = new Uint8Array(maps.reduce((n, m) => Math.max(n, m.length), 0));
    for (const m of maps) for (let g = 0; g < m.length; g++) if (m[g]! >= 0) mask[g] = 1;
  }
  lookupMasks.set(lookup, mask);
  return mask;
}

function patchProcessor(proc: Any, kind: 'GSUB' | 'GPOS'): void {
  // One empty run gives us fontkit's (unexported) GlyphIterator class.
  proc.applyLookups([], [], []);
  const GlyphIterator = proc.glyphIterator.constructor;

  proc.coverageIndex = fastCoverageIndex;
  proc.getClassID = fastGetClassID;

  const selectScript = proc.selectScript;
  let lastArgs: unknown[] | null = null;
  proc.selectScript = function (script: unknown, language: unknown, direction: unknown) {
    if (lastArgs && lastArgs[0] === script && lastArgs[1] === language && lastArgs[2] === direction && typeof script === 'string') return this.scriptTag;
    const r = selectScript.call(this, script, language, direction);
    lastArgs = [script, language, direction];
    return r;
  };

  const lookupsForFeatures = proc.lookupsForFeatures;
  const memo = new WeakMap<object, Map<string, unknown>>();
  proc.lookupsForFeatures = function (userFeatures: string[] = [], exclude?: number[]) {
    if (exclude) return lookupsForFeatures.call(this, userFeatures, exclude);
    let byKey = memo.get(this.features);
    if (!byKey) {
      byKey = new Map();
      memo.set(this.features, byKey);
    }
    const key = userFeatures.join(',');
    let r = byKey.get(key);
    if (!r) {
      r = lookupsForFeatures.call(this, userFeatures);
      byKey.set(key, r);
    }
    return r;
  };

  proc.applyLookups = function (lookups: { feature: string; lookup: Any }[], glyphs: Any[], positions: unknown) {
    this.glyphs = glyphs;
    this.positions = positions;
    const it = (this.glyphIterator = new GlyphIterator(glyphs));
    for (const { feature, lookup } of lookups) {
      this.currentFeature = feature;
      const mask = lookupMask(kind, lookup);
      if (mask) {
        let hit = false;
        for (let i = 0; i < glyphs.length; i++)
          if (mask[glyphs[i].id] === 1) {
            hit = true;
            break;
          }
        if (!hit) continue; // no glyph can start a match: the lookup would change nothing
      }
      it.reset(lookup.flags);
      while (it.index < glyphs.length) {
        const cur = it.cur;
        if (!(feature in cur.features) || (mask && mask[cur.id] !== 1)) {
          it.next();
          continue;
        }
        for (const table of lookup.subTables) if (this.applyLookup(lookup.lookupType, table)) break;
        it.next();
      }
    }
  };
}

interface FontState {
  /** Default-shaper plans by `selected script|direction|requested features`. */
  plans: Map<string, { shaper: Any; plan: Any }>;
  gsub: Any;
  gpos: Any;
  /** Fast-path facts per detected script (null: that script always takes fontkit's path). */
  fast: Map<string, FastInfo | null>;
  cmap: Map<number, number>;
  advances: Map<number, number>;
  /** GDEF glyph classes (null: no GDEF class table, so the fast path is off). */
  glyphClass: Uint16Array | Int32Array | null;
}
const states = new WeakMap<object, FontState>();

/** Installs the speed-ups on one fontkit font (idempotent). */
export function accelerateShaping(font: FkFont): void {
  const f = font as Any;
  if (states.has(f)) return;
  const layoutEngine = f._layoutEngine; // fontkit caches this getter per font
  const engine = layoutEngine.engine;
  if (!engine || typeof engine.setup !== 'function' || !('GSUBProcessor' in engine)) return; // AAT fonts: untouched
  if (engine.GSUBProcessor) patchProcessor(engine.GSUBProcessor, 'GSUB');
  if (engine.GPOSProcessor) patchProcessor(engine.GPOSProcessor, 'GPOS');
  const plans = new Map<string, { shaper: Any; plan: Any }>();
  const gdefClasses = f.GDEF?.glyphClassDef;
  states.set(f, {
    plans,
    gsub: engine.GSUBProcessor,
    gpos: engine.GPOSProcessor,
    fast: new Map(),
    cmap: new Map(),
    advances: new Map(),
    glyphClass: gdefClasses && (gdefClasses.version === 1 || gdefClasses.version === 2) ? classMap(gdefClasses) : null,
  });

  const setup = engine.setup;
  let GlyphInfo: Any = null;
  engine.setup = function (glyphRun: Any) {
    const requested = JSON.stringify(glyphRun.features);
    if (GlyphInfo) {
      // The same script selection fontkit's setup makes (repeat calls are memoised above).
      let script = null;
      if (this.GPOSProcessor) script = this.GPOSProcessor.selectScript(glyphRun.script, glyphRun.language, glyphRun.direction);
      if (this.GSUBProcessor) script = this.GSUBProcessor.selectScript(glyphRun.script, glyphRun.language, glyphRun.direction);
      const hit = typeof script === 'string' ? plans.get(`${script}|${glyphRun.direction}|${requested}`) : undefined;
      if (hit) {
        // fontkit's setup with the plan taken from the cache; the per-glyph part runs as before.
        this.glyphInfos = glyphRun.glyphs.map((g: Any) => new GlyphInfo(this.font, g.id, [...g.codePoints]));
        this.shaper = hit.shaper;
        this.plan = hit.plan;
        this.plan.assignGlobalFeatures(this.glyphInfos);
        this.shaper.assignFeatures(this.plan, this.glyphInfos);
        for (const k in this.plan.allFeatures) glyphRun.features[k] = true;
        return;
      }
    }
    setup.call(this, glyphRun);
    GlyphInfo ??= this.glyphInfos[0]?.constructor ?? null;
    // Only the default shaper's plan is a pure function of script, direction and requested
    // features (its stages hold no functions and no per-run state); others are rebuilt every call.
    const script = this.plan.script;
    if (Object.getPrototypeOf(this.shaper) === Function.prototype && typeof script === 'string' && this.plan.stages.every((st: unknown) => Array.isArray(st))) {
      plans.set(`${script}|${glyphRun.direction}|${requested}`, { shaper: this.shaper, plan: this.plan });
    }
  };
}

// ---------------------------------------------------------------------------------------------
// Fast path: a string none of whose glyphs any applied GSUB lookup, or any GPOS lookup other than
// pair adjustment, could start a match at. fontkit would then change no glyph and only add pair
// adjustments (kerning) to the hmtx advances, so we do exactly that without building its objects.
// Every condition below is one fontkit's own code checks; when one fails we use fontkit.

/** A shaped run: one entry per glyph, font units. */
export interface ShapedRun {
  glyphIds: number[];
  codePoints: number[][];
  xAdvance: number[];
  xOffset: number[];
  yOffset: number[];
}

interface PairLookup {
  subTables: Any[];
}
interface FastInfo {
  first: Uint8Array;
  guards: Guard[];
  pairs: PairLookup[];
}

const DEFAULT_SCRIPTS = ['DFLT', 'dflt', 'latn'];
/** Script tag and direction fontkit detects for a lone code point (font-independent). */
const cpScripts = new Map<number, { script: string; direction: string }>();
let unknownScript: string | null = null;

function scriptOf(font: Any, cp: number): { script: string; direction: string } {
  let r = cpScripts.get(cp);
  if (!r) {
    // fontkit's detection is per code point (the first that is not Common/Inherited/Unknown), so
    // asking it about the code point alone gives exactly its per-code-point answer.
    const run = font.layout(String.fromCodePoint(cp));
    r = { script: run.script, direction: run.direction };
    cpScripts.set(cp, r);
  }
  return r;
}

function isVariationSelector(c: number): boolean {
  return (c >= 0xfe00 && c <= 0xfe0f) || (c >= 0xe0100 && c <= 0xe01ef);
}

/** fontkit's LayoutEngine#isDefaultIgnorable (Unicode DerivedCoreProperties, as HarfBuzz). */
function isDefaultIgnorable(ch: number): boolean {
  const plane = ch >> 16;
  if (plane === 0) {
    switch (ch >> 8) {
      case 0x00:
        return ch === 0x00ad;
      case 0x03:
        return ch === 0x034f;
      case 0x06:
        return ch === 0x061c;
      case 0x17:
        return ch >= 0x17b4 && ch <= 0x17b5;
      case 0x18:
        return ch >= 0x180b && ch <= 0x180e;
      case 0x20:
        return (ch >= 0x200b && ch <= 0x200f) || (ch >= 0x202a && ch <= 0x202e) || (ch >= 0x2060 && ch <= 0x206f);
      case 0xfe:
        return (ch >= 0xfe00 && ch <= 0xfe0f) || ch === 0xfeff;
      case 0xff:
        return ch >= 0xfff0 && ch <= 0xfff8;
      default:
        return false;
    }
  }
  if (plane === 1) return (ch >= 0x1bca0 && ch <= 0x1bca3) || (ch >= 0x1d173 && ch <= 0x1d17a);
  if (plane === 0x0e) return ch >= 0xe0000 && ch <= 0xe0fff;
  return false;
}

function unionMask(masks: Uint8Array[]): Uint8Array {
  const out = new Uint8Array(masks.reduce((n, m) => Math.max(n, m.length), 0));
  for (const m of masks) for (let g = 0; g < m.length; g++) if (m[g]) out[g] = 1;
  return out;
}

/** True when some glyph of the run is in the coverage. */
function anyIn(ids: number[], cov: Coverage): boolean {
  const m = coverageMap(cov);
  for (const g of ids) if (g < m.length && m[g]! >= 0) return true;
  return false;
}
const allGlyphsIn = (ids: number[], glyphs: number[]) => glyphs.every((g) => ids.includes(g));
const allClassesIn = (ids: number[], classes: number[], cd: ClassDef) => classes.every((c) => ids.some((g) => fastGetClassID(g, cd) === c));

/**
 * A necessary condition for one subtable to match anywhere in an unchanged run: fontkit's own
 * first check at some glyph, and every other glyph, class or coverage its rule compares must be
 * met by some glyph of the run. (Where they stand is not checked, so this says "may match".)
 */
function subtableMayMatch(kind: 'GSUB' | 'GPOS', type: number, t: Any, ids: number[], skipsBases: boolean): boolean {
  if (kind === 'GSUB' ? type === 7 : type === 9) return subtableMayMatch(kind, t.lookupType, t.extension, ids, skipsBases);
  const [ctx, chain] = kind === 'GSUB' ? [5, 6] : [7, 8];
  if (kind === 'GSUB' && type === 4) {
    const m = coverageMap(t.coverage);
    for (let i = 0; i < ids.length; i++) {
      const g = ids[i]!;
      const idx = g < m.length ? m[g]! : -1;
      if (idx < 0) continue;
      for (const lig of t.ligatureSets.get(idx)) {
        const comps: number[] = lig.components;
        // With no mark or ligature glyph in the run and base glyphs not skipped, fontkit compares
        // the components with the glyphs right after this one.
        if (skipsBases ? allGlyphsIn(ids, comps) : comps.every((c, k) => ids[i + 1 + k] === c)) return true;
      }
    }
    return false;
  }
  if ((type === ctx || type === chain) && t.version === 3) {
    const covs: Coverage[] = type === ctx ? t.coverages : [...t.inputCoverage, ...t.backtrackCoverage, ...t.lookaheadCoverage];
    const first = type === ctx ? t.coverages : t.inputCoverage;
    if (!first?.length) return true;
    return covs.every((c) => anyIn(ids, c));
  }
  if ((type === ctx || type === chain) && (t.version === 1 || t.version === 2)) {
    const m = coverageMap(t.coverage);
    for (const g of ids) {
      const idx = g < m.length ? m[g]! : -1;
      if (idx < 0) continue;
      if (t.version === 1) {
        const set = type === ctx ? t.ruleSets[idx] : t.chainRuleSets[idx];
        if (!set) return true; // fontkit would fail on it: let it
        for (const r of set) if (allGlyphsIn(ids, r.input) && (type === ctx || (allGlyphsIn(ids, r.backtrack) && allGlyphsIn(ids, r.lookahead)))) return true;
      } else if (type === ctx) {
        const set = t.classSet[fastGetClassID(g, t.classDef)];
        if (!set) return true;
        for (const r of set) if (allClassesIn(ids, r.classes, t.classDef)) return true;
      } else {
        const rules = t.chainClassSet[fastGetClassID(g, t.inputClassDef)];
        if (!rules) continue; // fontkit: no rules, no match
        for (const r of rules) {
          if (allClassesIn(ids, r.input, t.inputClassDef) && allClassesIn(ids, r.backtrack, t.backtrackClassDef) && allClassesIn(ids, r.lookahead, t.lookaheadClassDef)) return true;
        }
      }
    }
    return false;
  }
  const cov = firstCoverage(kind, type, t);
  return !cov || anyIn(ids, cov);
}

interface Guard {
  kind: 'GSUB' | 'GPOS';
  lookup: Any;
  first: Uint8Array;
}

function buildFastInfo(f: Any, st: FontState, script: string, direction: string): FastInfo | null | 'later' {
  if (direction !== 'ltr' || f._variationProcessor || !st.glyphClass || !st.gpos) return null;
  const procs = [st.gpos, st.gsub].filter(Boolean);
  // A script no table lists (nor a default) leaves fontkit's selection as it was: not cacheable.
  for (const p of procs) if (!p.findScript(script) && !p.findScript(DEFAULT_SCRIPTS)) return null;
  let selected: string | null = null;
  for (const p of procs) selected = p.selectScript(script, null, direction); // as fontkit's setup: GSUB's answer wins
  const hit = st.plans.get(`${selected}|${direction}|{}`);
  if (!hit) return 'later'; // not planned yet (or not the default shaper): fontkit's path plans it
  const plan = hit.plan;
  const global = plan.globalFeatures as Record<string, boolean>;
  const stages = plan.stages as string[][];
  // Kerning from a TrueType kern table (fontkit uses it when GPOS has no kern): not modelled.
  if (!st.gpos.features.kern && f.kern) return null;
  const guards: Guard[] = [];
  const pairs: PairLookup[] = [];
  for (const [kind, proc] of [
    ['GSUB', st.gsub],
    ['GPOS', st.gpos],
  ] as const) {
    if (!proc) continue;
    for (const stage of stages) {
      if (stage.length === 0) continue;
      for (const { feature, lookup } of proc.lookupsForFeatures(stage) as { feature: string; lookup: Any }[]) {
        // Only global features reach glyphs here (local ones need a fraction slash, excluded below).
        if (!global[feature]) continue;
        const mask = lookupMask(kind, lookup);
        if (!mask) return null;
        const ext = kind === 'GPOS' && lookup.lookupType === 9;
        const isPair = kind === 'GPOS' && lookup.subTables.length > 0 && lookup.subTables.every((t: Any) => (ext ? t.lookupType === 2 : lookup.lookupType === 2));
        if (!isPair) guards.push({ kind, lookup, first: mask });
        else {
          if (lookup.flags?.flags?.ignoreBaseGlyphs) return null; // would skip base glyphs: not modelled
          const subTables = lookup.subTables.map((t: Any) => (ext ? t.extension : t));
          if (!subTables.every((t: Any) => t.version === 1 || t.version === 2)) return null;
          pairs.push({ subTables });
        }
      }
    }
  }
  return { first: unionMask(guards.map((g) => g.first)), guards, pairs };
}

/** True when some GSUB lookup, or some GPOS lookup other than pair adjustment, may act on the run. */
function mayNeedFontkit(info: FastInfo, ids: number[]): boolean {
  let any = false;
  for (const g of ids)
    if (info.first[g] === 1) {
      any = true;
      break;
    }
  if (!any) return false;
  for (const { kind, lookup, first } of info.guards) {
    let hit = false;
    for (const g of ids)
      if (first[g] === 1) {
        hit = true;
        break;
      }
    if (!hit) continue;
    const skipsBases = !!lookup.flags?.flags?.ignoreBaseGlyphs;
    for (const t of lookup.subTables) if (subtableMayMatch(kind, lookup.lookupType, t, ids, skipsBases)) return true;
  }
  return false;
}

function fastShape(f: Any, st: FontState, text: string): ShapedRun | null {
  const ids: number[] = [];
  const cps: number[] = [];
  let script: string | null = null;
  const len = text.length;
  for (let i = 0; i < len; ) {
    let code = text.charCodeAt(i++);
    if (code >= 0xd800 && code <= 0xdbff && i < len) {
      const next = text.charCodeAt(i);
      if (next >= 0xdc00 && next <= 0xdfff) {
        i++;
        code = ((code & 0x3ff) << 10) + (next & 0x3ff) + 0x10000;
      }
    }
    // Variation selectors pick glyphs through cmap 14, ignorables become spaces, and a fraction
    // slash switches on local features: all left to fontkit.
    if (isVariationSelector(code) || isDefaultIgnorable(code) || code === 0x2044) return null;
    let gid = st.cmap.get(code);
    if (gid === undefined) {
      gid = f._cmapProcessor.lookup(code) as number;
      st.cmap.set(code, gid);
    }
    ids.push(gid);
    cps.push(code);
    if (script === null) {
      const s = scriptOf(f, code);
      unknownScript ??= scriptOf(f, 0x20).script;
      if (s.script !== unknownScript) script = s.script;
    }
  }
  const n = ids.length;
  const run: ShapedRun = { glyphIds: ids, codePoints: cps.map((c) => [c]), xAdvance: new Array(n), xOffset: new Array(n).fill(0), yOffset: new Array(n).fill(0) };
  if (n === 0) return run;
  script ??= unknownScript!;
  let info = st.fast.get(script);
  if (info === undefined) {
    const built = buildFastInfo(f, st, script, scriptOf(f, cps.find((c) => scriptOf(f, c).script === script) ?? 0x20).direction);
    if (built === 'later') return null; // asked again once fontkit has planned the script
    st.fast.set(script, (info = built));
  }
  if (!info) return null;
  const cls = st.glyphClass!;
  for (let i = 0; i < n; i++) {
    const g = ids[i]!;
    const k = g < cls.length ? cls[g]! : 0;
    if (k === 2 || k === 3) return null; // a ligature or mark glyph: lookup flags may skip it
  }
  if (mayNeedFontkit(info, ids)) return null;
  const adv = run.xAdvance;
  for (let i = 0; i < n; i++) {
    const g = ids[i]!;
    let a = st.advances.get(g);
    if (a === undefined) {
      a = f.getGlyph(g, [cps[i]!]).advanceWidth as number;
      st.advances.set(g, a);
    }
    adv[i] = a;
  }
  const xo = run.xOffset,
    yo = run.yOffset;
  const apply = (i: number, v: Any) => {
    if (v.xAdvance != null) adv[i] += v.xAdvance;
    if (v.yAdvance != null && v.yAdvance !== 0) return false; // vertical advance: not modelled
    if (v.xPlacement != null) xo[i] += v.xPlacement;
    if (v.yPlacement != null) yo[i] += v.yPlacement;
    return true;
  };
  // fontkit's GPOS PairPos (format 1: pair sets, format 2: class pairs) on every glyph and the one
  // after it; with no mark or ligature glyph in the run, no lookup flag skips a glyph.
  for (const { subTables } of info.pairs) {
    for (let i = 0; i + 1 < n; i++) {
      const cur = ids[i]!,
        next = ids[i + 1]!; // i + 1 < n
      for (const t of subTables) {
        const cov = coverageMap(t.coverage);
        const index = cur < cov.length ? cov[cur]! : -1;
        if (index === -1) continue;
        let v1: Any, v2: Any;
        if (t.version === 1) {
          const set = t.pairSets.get(index);
          let found = null;
          for (const pair of set)
            if (pair.secondGlyph === next) {
              found = pair;
              break;
            }
          if (!found) continue;
          v1 = found.value1;
          v2 = found.value2;
        } else {
          const row = t.classRecords.get(fastGetClassID(cur, t.classDef1));
          const pair = row?.get(fastGetClassID(next, t.classDef2));
          if (!pair) return null;
          v1 = pair.value1;
          v2 = pair.value2;
        }
        if (!v1 || !v2) return null;
        if (!apply(i, v1) || !apply(i + 1, v2)) return null;
        break;
      }
    }
  }
  return run;
}

/** The fast path alone: null when the string needs fontkit (or the font is not accelerated). */
export function shapeFast(font: FkFont, text: string): ShapedRun | null {
  const st = states.get(font);
  return st ? fastShape(font, st, text) : null;
}

/** Shapes one string: the fast path when it applies, else fontkit's `layout()` (accelerated). */
export function shapeText(font: FkFont, text: string): ShapedRun {
  return shapeFast(font, text) ?? shapeWithFontkit(font, text);
}

/** fontkit's `layout()` as a ShapedRun (the reference the fast path is tested against). */
export function shapeWithFontkit(font: FkFont, text: string): ShapedRun {
  const run = (font as Any).layout(text);
  const n = run.glyphs.length;
  const out: ShapedRun = { glyphIds: new Array(n), codePoints: new Array(n), xAdvance: new Array(n), xOffset: new Array(n), yOffset: new Array(n) };
  for (let i = 0; i < n; i++) {
    const g = run.glyphs[i],
      p = run.positions[i];
    out.glyphIds[i] = g.id;
    out.codePoints[i] = g.codePoints;
    out.xAdvance[i] = p.xAdvance;
    out.xOffset[i] = p.xOffset;
    out.yOffset[i] = p.yOffset;
  }
  return out;
}
