/**
 * Engine benchmark (`npm run bench -- engine`): 1,000 names of 3–14 characters per font, laid out
 * by our engine (fontkit shaping + outlines as path data in mm) and shaped by harfbuzzjs (HarfBuzz,
 * the reference shaper) in the same run; median and p95 per layout, the ratio, and a cached layout.
 */
import { getFontFile, getFontRegistry } from '../server/integrations/fonts.ts';
import { layoutText } from '../shared/engine/text-layout.ts';
import { hbFont } from '../tests/shared/engine/harfbuzz-reference.ts';

const LETTERS = 'abcdefghijklmnopqrstuvwxyzäöüéèàçñøåłśźżčšž';

/** Deterministic names (a small LCG, so every run measures the same strings). */
function makeNames(n: number, seed: number): string[] {
  let s = seed >>> 0;
  const rnd = () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32);
  const out: string[] = [];
  for (let i = 0; i < n; i++) {
    const len = 3 + Math.floor(rnd() * 12);
    let name = LETTERS[Math.floor(rnd() * 26)].toUpperCase();
    for (let j = 1; j < len; j++) name += LETTERS[Math.floor(rnd() * LETTERS.length)];
    out.push(name);
  }
  return out;
}

function stats(times: number[]) {
  const t = [...times].sort((a, b) => a - b);
  const q = (p: number) => t[Math.min(t.length - 1, Math.floor(p * t.length))];
  return { median: q(0.5), p95: q(0.95) };
}

const ms = (v: number) => `${(v * 1000).toFixed(1)} µs`;

export async function run(): Promise<void> {
  const reg = getFontRegistry();
  const height = 40;
  const rows: { id: string; ours: ReturnType<typeof stats>; hb: ReturnType<typeof stats> }[] = [];
  for (const font of reg.list()) {
    const hb = hbFont(getFontFile(font.id)!.bytes);
    // Warm-up on other names: JIT and the per-size glyph outline cache, as in a running server.
    for (const n of makeNames(300, 99)) {
      layoutText(reg, { text: n, fontId: font.id, letterHeightMm: height }, { cache: false });
      hb.shape(n);
    }
    const names = makeNames(1000, 7);
    const ours: number[] = [];
    const ref: number[] = [];
    for (const n of names) {
      let t0 = performance.now();
      layoutText(reg, { text: n, fontId: font.id, letterHeightMm: height }, { cache: false });
      ours.push(performance.now() - t0);
      t0 = performance.now();
      hb.shape(n);
      ref.push(performance.now() - t0);
    }
    const row = { id: font.id, ours: stats(ours), hb: stats(ref) };
    rows.push(row);
    console.log(`${font.id.padEnd(20)} ours median ${ms(row.ours.median)} p95 ${ms(row.ours.p95)} | harfbuzz median ${ms(row.hb.median)} p95 ${ms(row.hb.p95)} | ×${(row.ours.median / row.hb.median).toFixed(2)}`);
  }
  const med = (xs: number[]) => stats(xs).median;
  const ratio = med(rows.map((r) => r.ours.median)) / med(rows.map((r) => r.hb.median));
  console.log(`ratio: ${ratio.toFixed(2)} (median of per-font medians, ours / harfbuzz; target ≤ 3)`);

  // Cached: the same request again is served from the layout cache.
  const font = reg.list()[0];
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
}
