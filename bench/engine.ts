/**
 * Engine benchmark (`npm run bench -- engine`): 1,000 names of 3–14 characters per font, laid out
 * by our engine (shaping via shared/engine/shaping.ts + outlines as path data in mm) and shaped by
 * harfbuzzjs (HarfBuzz, the reference shaper) in the same run, both warmed up the same way; median
 * and p95 per layout, the ratio, and a cached layout.
 * Then compose(): 200 names with a motif and an outline on a tote, p50/p95 per call, first time
 * (a name never composed before; only the motif is already known) and warm (the same design
 * composed again right after, as on a colour change or a backspace), in each weeding mode.
 */
import { getFontFile, getFontRegistry } from '../server/integrations/fonts.ts';
import { defaultBlank } from '../shared/engine/blanks.ts';
import { compose, type FieldDef, type WeedingMode } from '../shared/engine/compose.ts';
import { parseMotifSvg } from '../shared/engine/motif.ts';
import { layoutText } from '../shared/engine/text-layout.ts';
import { hbFont } from '../tests/shared/engine/harfbuzz-reference.ts';
import { at } from '../tests/support/at.ts';

const LETTERS = 'abcdefghijklmnopqrstuvwxyzäöüéèàçñøåłśźżčšž';

/** Deterministic names (a small LCG, so every run measures the same strings). */
function makeNames(n: number, seed: number): string[] {
  let s = seed >>> 0;
  const rnd = () => (s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32;
  const out: string[] = [];
  for (let i = 0; i < n; i++) {
    const len = 3 + Math.floor(rnd() * 12);
    let name = LETTERS.charAt(Math.floor(rnd() * 26)).toUpperCase();
    for (let j = 1; j < len; j++) name += LETTERS[Math.floor(rnd() * LETTERS.length)];
    out.push(name);
  }
  return out;
}

function stats(times: number[]) {
  const t = [...times].sort((a, b) => a - b);
  const q = (p: number) => t[Math.min(t.length - 1, Math.floor(p * t.length))] ?? NaN; // NaN: no samples
  return { median: q(0.5), p95: q(0.95) };
}

const ms = (v: number) => `${(v * 1000).toFixed(1)} µs`;

export async function run(): Promise<void> {
  const reg = getFontRegistry();
  const height = 40;
  const rows: { id: string; ours: ReturnType<typeof stats>; hb: ReturnType<typeof stats> }[] = [];
  for (const font of reg.list()) {
    const hb = hbFont(getFontFile(font.id)!.bytes);
    // Steady state for both sides: three passes over other names first (JIT for our code and for
    // harfbuzzjs's JS wrapper, the per-size glyph outline cache, tables fontkit decodes lazily), as
    // in a running server. Then each name is timed on both sides, taking turns at going first so
    // neither always finds the CPU caches warmed by the other.
    const warm = makeNames(300, 99);
    for (let pass = 0; pass < 3; pass++) {
      for (const n of warm) {
        layoutText(reg, { text: n, fontId: font.id, letterHeightMm: height }, { cache: false });
        hb.shape(n);
      }
    }
    const names = makeNames(1000, 7);
    const ours: number[] = [];
    const ref: number[] = [];
    const timeOurs = (n: string) => {
      const t0 = performance.now();
      layoutText(reg, { text: n, fontId: font.id, letterHeightMm: height }, { cache: false });
      ours.push(performance.now() - t0);
    };
    const timeHb = (n: string) => {
      const t0 = performance.now();
      hb.shape(n);
      ref.push(performance.now() - t0);
    };
    names.forEach((n, i) => {
      if (i % 2 === 0) {
        timeOurs(n);
        timeHb(n);
      } else {
        timeHb(n);
        timeOurs(n);
      }
    });
    const row = { id: font.id, ours: stats(ours), hb: stats(ref) };
    rows.push(row);
    console.log(
      `${font.id.padEnd(20)} ours median ${ms(row.ours.median)} p95 ${ms(row.ours.p95)} | harfbuzz median ${ms(row.hb.median)} p95 ${ms(row.hb.p95)} | ×${(row.ours.median / row.hb.median).toFixed(2)}`,
    );
  }
  const med = (xs: number[]) => stats(xs).median;
  const ratio = med(rows.map((r) => r.ours.median)) / med(rows.map((r) => r.hb.median));
  console.log(`ratio: ${ratio.toFixed(2)} (median of per-font medians, ours / harfbuzz; target ≤ 3)`);

  // Cached: the same request again is served from the layout cache.
  const font = at(reg.list(), 0);
  const names = makeNames(1000, 3);
  for (const n of names) layoutText(reg, { text: n, fontId: font.id, letterHeightMm: height });
  const cached: number[] = [];
  for (const n of names) {
    const t0 = performance.now();
    layoutText(reg, { text: n, fontId: font.id, letterHeightMm: height });
    cached.push(performance.now() - t0);
  }
  const c = stats(cached);
  console.log(`cached layout: median ${(c.median).toFixed(4)} ms p95 ${(c.p95).toFixed(4)} ms (target ≤ 0.05 ms)`);

  benchCompose();
}

// A three-layer motif (flame, hull with fins, window) as a seller would upload it.
const MOTIF = `<svg xmlns="http://www.w3.org/2000/svg" width="60mm" height="100mm" viewBox="0 0 60 100">
  <g id="flame" fill="#e0a526"><path d="M20 70 L40 70 Q42 86 30 98 Q18 86 20 70 Z"/></g>
  <g id="hull" fill="#1f2a44"><path d="M30 2 Q46 18 44 56 L44 72 L16 72 L16 56 Q14 18 30 2 Z"/><path d="M16 52 L4 72 L16 70 Z"/><path d="M44 52 L56 72 L44 70 Z"/></g>
  <g id="window" fill="#2f7d6d"><circle cx="30" cy="32" r="7"/></g></svg>`;

function benchCompose(): void {
  const reg = getFontRegistry();
  const tote = defaultBlank('tote')!;
  const geometry = parseMotifSvg(MOTIF);
  const fonts = reg.list().map((f) => f.id);
  const fieldsFor = (fontId: string): FieldDef[] => [
    { kind: 'motif', id: 'motif', heightMm: 60, materialKind: 'smooth', options: [{ id: 'rocket', geometry }] },
    { kind: 'text', id: 'name', fontId, letterHeightMm: 40, maxChars: 14, materialKind: 'smooth', colour: '#2f7d6d', outline: { offsetMm: 3, materialKind: 'smooth', colour: '#ffffff' } },
  ];
  const fieldSets = new Map(fonts.map((id) => [id, fieldsFor(id)]));
  const run = (names: string[], mode: WeedingMode) => {
    const first: number[] = [];
    const warm: number[] = [];
    names.forEach((n, i) => {
      const input = { blank: tote, fields: fieldSets.get(at(fonts, i % fonts.length))!, choices: { motif: { motifId: 'rocket' }, name: { text: n } } };
      let t0 = performance.now();
      compose(reg, input, { weeding: mode });
      first.push(performance.now() - t0);
      t0 = performance.now();
      compose(reg, input, { weeding: mode });
      warm.push(performance.now() - t0);
    });
    return { first: stats(first), warm: stats(warm) };
  };
  run(makeNames(30, 11), 'full'); // JIT warm-up on other names
  const line = (label: string, st: ReturnType<typeof stats>) => console.log(`compose ${label.padEnd(18)} p50 ${st.median.toFixed(1)} ms p95 ${st.p95.toFixed(1)} ms`);
  for (const [mode, seed] of [
    ['full', 21],
    ['fast', 22],
    ['none', 23],
  ] as const) {
    const r = run(makeNames(200, seed), mode); // every name new to the engine: nothing cached but the motif
    line(`${mode}, first time`, r.first);
    line(`${mode}, warm`, r.warm);
  }
}
