// The 1:1 placement template: true scale in the PDF's own units, and tiling over pages.
// Scale facts, from outside the project: 1 in = 25.4 mm exactly (the 1959 international inch), and
// PDF user space is 1/72 in per unit by default (ISO 32000-1, 8.3.2.3), so 100 mm = 283.46 pt.
import { inflateSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { buildTemplatePdf, planTemplate, type TemplateInput, templateInputSchema } from '../../server/workers/template-pdf.ts';
import { at } from '../support/at.ts';

const PT_PER_MM = 72 / 25.4;

/** MediaBox and content stream of each page (compress: false). */
function pages(buf: Buffer): Array<{ box: number[]; content: string }> {
  const src = buf.toString('latin1');
  const objs = new Map<number, string>();
  for (const m of src.matchAll(/(\d+) 0 obj\s*([\s\S]*?)endobj/g)) objs.set(Number(m[1]), at(m, 2));
  const out: Array<{ box: number[]; content: string }> = [];
  for (const body of objs.values()) {
    if (!/\/Type \/Page\b/.test(body)) continue;
    const box = at(/\/MediaBox \[([^\]]+)\]/.exec(body)!, 1)
      .trim()
      .split(/\s+/)
      .map(Number);
    const c = objs.get(Number(at(/\/Contents (\d+) 0 R/.exec(body)!, 1))) ?? '';
    const si = c.indexOf('stream');
    let raw = c.slice(si + 6).replace(/^\r?\n/, '');
    raw = raw.slice(0, raw.lastIndexOf('endstream'));
    out.push({ box, content: /\/FlateDecode/.test(c.slice(0, si)) ? inflateSync(Buffer.from(raw, 'latin1')).toString('latin1') : raw });
  }
  return out;
}
/** Every rectangle drawn: [x, y, w, h] in PDF units. */
const rects = (content: string) => [...content.matchAll(/(-?[\d.]+) (-?[\d.]+) (-?[\d.]+) (-?[\d.]+) re/g)].map((m) => [1, 2, 3, 4].map((i) => Number(m[i])));

const pouch: TemplateInput = {
  paper: 'A4',
  orderNumber: 'NS-1041',
  title: 'Name pouch',
  text: 'Mira',
  blank: { name: 'Zip pouch', widthMm: 160, heightMm: 120, topOffsetFrom: 'top edge' },
  printArea: { xMm: 30, yMm: 20, widthMm: 100, heightMm: 60 },
  pieces: [{ d: 'M50 30H110V50H50Z', colourHex: '#2f7d6d' }],
};
const tote: TemplateInput = {
  ...pouch,
  title: 'Name tote',
  blank: { name: 'Tote bag', widthMm: 380, heightMm: 410, topOffsetFrom: 'top edge' },
  printArea: { xMm: 65, yMm: 50, widthMm: 250, heightMm: 250 },
  pieces: [{ d: 'M100 60H280V120H100Z', colourHex: '#2f7d6d' }],
};

describe('placement template PDF', () => {
  it('when built, then each page has a test bar of 100 mm = 283.46 pt and the print area is drawn at true size', async () => {
    const pdf = await buildTemplatePdf({ ...pouch, compress: false });
    const ps = pages(pdf);
    expect(ps.length).toBe(1);
    expect(
      at(ps, 0)
        .box.slice(2)
        .map((v) => Math.round(v * 100) / 100),
    ).toEqual([595.28, 841.89]); // ISO 216 A4: 210 × 297 mm
    const all = rects(at(ps, 0).content);
    // the test bar: 100 mm long, 4 pt high
    const bar = all.find((r) => r[3] === 4)!;
    expect(bar[2]).toBeCloseTo(100 * PT_PER_MM, 2);
    expect(bar[2]).toBeCloseTo(283.46, 2);
    // the print area: 100 × 60 mm
    expect(all.some((r) => Math.abs(r[2]! - 100 * PT_PER_MM) < 0.01 && Math.abs(r[3]! - 60 * PT_PER_MM) < 0.01)).toBe(true);
  });

  it('when the template is larger than a page, then it is tiled: one page per tile, each with its bar and corner marks, covering the whole print area', async () => {
    for (const paper of ['A4', 'Letter'] as const) {
      const input = { ...tote, paper };
      const plan = planTemplate(templateInputSchema.parse(input));
      // the print area plus bleed, from just above the top edge: larger than either page
      expect(plan.cols * plan.tileW).toBeGreaterThanOrEqual(plan.region.w);
      expect(plan.rows * plan.tileH).toBeGreaterThanOrEqual(plan.region.h);
      expect(plan.region.x).toBeLessThanOrEqual(65);
      expect(plan.region.x + plan.region.w).toBeGreaterThanOrEqual(65 + 250);
      expect(plan.region.y).toBeLessThanOrEqual(0);
      expect(plan.region.y + plan.region.h).toBeGreaterThanOrEqual(50 + 250);
      expect(plan.cols * plan.rows).toBeGreaterThan(1);
      const ps = pages(await buildTemplatePdf({ ...input, compress: false }));
      expect(ps.length).toBe(plan.cols * plan.rows);
      for (const p of ps) {
        expect(rects(p.content).some((r) => r[3] === 4 && Math.abs(r[2]! - 100 * PT_PER_MM) < 0.01)).toBe(true);
        // four cross marks: each two strokes of 2 × 5 mm
        const arms = [...p.content.matchAll(/(-?[\d.]+) (-?[\d.]+) m\n(-?[\d.]+) (-?[\d.]+) l/g)].filter((m) => {
          const len = Math.hypot(Number(m[3]) - Number(m[1]), Number(m[4]) - Number(m[2]));
          return Math.abs(len - 10 * PT_PER_MM) < 0.01;
        });
        expect(arms.length).toBe(8);
      }
    }
  });
});
