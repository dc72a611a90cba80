import { inflateSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { buildWorksheetPdf, mapPageCount, type WorksheetInput, worksheetPageCount } from '../../server/workers/worksheet-pdf.ts';
import { type NestPiece, nestCutSheets } from '../../shared/engine/cut-sheets.ts';
import { pressCard } from '../../shared/engine/press-card.ts';
import { at } from '../support/at.ts';

// ---- a small PDF reader: objects, page boxes, and text decoded through each font's ToUnicode map ----

interface Parsed {
  pages: number[][];
  text: string;
  fontNames: string[];
}

function parsePdf(buf: Buffer): Parsed {
  const src = buf.toString('latin1');
  const objs = new Map<number, { dict: string; stream?: string }>();
  for (const m of src.matchAll(/(\d+) 0 obj\s*([\s\S]*?)endobj/g)) {
    const body = at(m, 2);
    const si = body.indexOf('stream');
    if (si < 0) {
      objs.set(Number(m[1]), { dict: body });
      continue;
    }
    const dict = body.slice(0, si);
    let raw = body.slice(si + 6).replace(/^\r?\n/, '');
    raw = raw.slice(0, raw.lastIndexOf('endstream')).replace(/\r?\n$/, '');
    const bytes = Buffer.from(raw, 'latin1');
    const stream = /\/FlateDecode/.test(dict) ? inflateSync(bytes).toString('latin1') : raw;
    objs.set(Number(m[1]), { dict, stream });
  }
  const pages: number[][] = [];
  const contents: Array<{ stream: string; fonts: Record<string, number> }> = [];
  for (const o of objs.values()) {
    if (!/\/Type \/Page\b/.test(o.dict)) continue;
    pages.push(
      at(/\/MediaBox \[([^\]]+)\]/.exec(o.dict)!, 1)
        .trim()
        .split(/\s+/)
        .map(Number),
    );
    const c = /\/Contents (\d+) 0 R/.exec(o.dict);
    const resRef = /\/Resources (\d+) 0 R/.exec(o.dict);
    const res = resRef ? objs.get(Number(resRef[1]))!.dict : o.dict;
    const fonts: Record<string, number> = {};
    const fontDict = /\/Font\s*<<([\s\S]*?)>>/.exec(res);
    if (fontDict) for (const f of at(fontDict, 1).matchAll(/\/(\w+) (\d+) 0 R/g)) fonts[at(f, 1)] = Number(f[2]);
    if (c) contents.push({ stream: objs.get(Number(c[1]))!.stream ?? '', fonts });
  }
  const cmaps = new Map<number, Map<number, string>>();
  const fontNames: string[] = [];
  const cmapFor = (fontObj: number) => {
    if (cmaps.has(fontObj)) return cmaps.get(fontObj)!;
    const map = new Map<number, string>();
    const dict = objs.get(fontObj)!.dict;
    const base = /\/BaseFont \/(\S+)/.exec(dict);
    if (base) fontNames.push(at(base, 1));
    const tu = /\/ToUnicode (\d+) 0 R/.exec(dict);
    const utf16 = (hex: string) => {
      const h = hex.replace(/\s+/g, '');
      let s = '';
      for (let i = 0; i < h.length; i += 4) s += String.fromCharCode(parseInt(h.slice(i, i + 4), 16));
      return s;
    };
    if (tu) {
      const cm = objs.get(Number(tu[1]))!.stream!;
      for (const r of cm.matchAll(/<([0-9a-f]+)>\s*<([0-9a-f]+)>\s*\[([^\]]*)\]/gi)) {
        const start = parseInt(at(r, 1), 16);
        [...at(r, 3).matchAll(/<([0-9a-f\s]+)>/gi)].forEach((d, i) => map.set(start + i, utf16(at(d, 1))));
      }
      for (const block of cm.matchAll(/beginbfchar([\s\S]*?)endbfchar/g)) {
        for (const r of at(block, 1).matchAll(/<([0-9a-f]+)>\s*<([0-9a-f\s]+)>/gi)) map.set(parseInt(at(r, 1), 16), utf16(at(r, 2)));
      }
    }
    cmaps.set(fontObj, map);
    return map;
  };
  let text = '';
  for (const { stream, fonts } of contents) {
    let map = new Map<number, string>();
    for (const op of stream.matchAll(/\/(\w+) [\d.]+ Tf|\[((?:<[0-9a-f]*>|[^\]])*)\] TJ|<([0-9a-f]*)> Tj/gi)) {
      if (op[1]) {
        const fontObj = fonts[op[1]];
        map = fontObj ? cmapFor(fontObj) : new Map();
        continue;
      }
      const hexes = op[2] !== undefined ? [...op[2].matchAll(/<([0-9a-f]*)>/gi)].map((h) => at(h, 1)) : [op[3] ?? ''];
      for (const h of hexes) for (let i = 0; i < h.length; i += 4) text += map.get(parseInt(h.slice(i, i + 4), 16)) ?? '\uFFFD';
      text += '\n';
    }
  }
  return { pages, text, fontNames };
}

// ---- a batch ----

const rect = (w: number, h: number) => `M0 0H${w}V${h}H0Z`;
const pieces: NestPiece[] = [
  { id: 'p1', lineId: 'l1', orderNumber: 'NS-1041', layerId: 'name', widthMm: 120, heightMm: 40, areaMm2: 2000, path: rect(120, 40) },
  { id: 'p2', lineId: 'l2', orderNumber: 'NS-1042', layerId: 'name', widthMm: 90, heightMm: 35, areaMm2: 1500, path: rect(90, 35) },
];
const glitter: NestPiece[] = [{ id: 'g1', lineId: 'l1', orderNumber: 'NS-1041', layerId: 'acorn', widthMm: 40, heightMm: 45, areaMm2: 900, path: rect(40, 45) }];

function batch(paper: 'A4' | 'Letter', extra: Partial<WorksheetInput> = {}): WorksheetInput {
  const smooth = nestCutSheets({ rollWidthMm: 305, pieces })[0];
  const gl = nestCutSheets({ rollWidthMm: 305, pieces: glitter })[0];
  const card = pressCard({
    pressType: 'handheld',
    layers: [
      { layerId: 'name', materialKind: 'smooth', colourName: 'Navy' },
      { layerId: 'acorn', materialKind: 'glitter', colourName: 'Gold' },
    ],
    blank: { kind: 'tote', name: 'Tote bag', topOffsetMm: 50 },
    backPress: true,
  });
  return {
    paper,
    shopName: 'Fern & Fable Goods',
    batchLabel: 'Autumn harvest batch 3',
    sheets: [
      { ...smooth, material: { kind: 'smooth', colour: 'Navy' }, pieces },
      { ...gl, material: { kind: 'glitter', colour: 'Gold' } },
    ],
    cards: [
      { orderNumber: 'NS-1041', lineTitle: 'Fox with acorn tote', text: 'Zoë', pressCard: card },
      { orderNumber: 'NS-1042', lineTitle: 'Name tote', text: 'Łukasz', pressCard: card },
      { orderNumber: 'NS-1042', lineTitle: 'Name tote', text: '美咲', pressCard: card },
    ],
    packingSlips: [
      { orderNumber: 'NS-1041', buyerName: 'Zoë Marchetti', shipTo: ['12 Orchard Row', 'Bristol'], lines: [{ title: 'Fox with acorn tote', text: 'Zoë' }] },
      { orderNumber: 'NS-1042', buyerName: 'Łukasz Nowak', lines: [{ title: 'Name tote', text: 'Łukasz', quantity: 2 }] },
    ],
    compress: false,
    ...extra,
  } as WorksheetInput;
}

describe('buildWorksheetPdf', () => {
  it('when built on A4, then every page is 595.28 × 841.89 pt (ISO 216: 210 × 297 mm)', async () => {
    const { pages } = parsePdf(await buildWorksheetPdf(batch('A4')));
    for (const box of pages) {
      expect(box[0]).toBe(0);
      expect(box[2]).toBeCloseTo(595.28, 2);
      expect(box[3]).toBeCloseTo(841.89, 2);
    }
  });

  it('when built on Letter, then every page is 612 × 792 pt (ANSI A: 8.5 × 11 in)', async () => {
    const { pages } = parsePdf(await buildWorksheetPdf(batch('Letter')));
    expect(pages.length).toBeGreaterThan(0);
    for (const box of pages) expect(box.slice(2)).toEqual([612, 792]);
  });

  it('when built, then the page count matches the content: summary, a map per sheet, a card per line, cautions, care cards, a slip per order', async () => {
    const inp = batch('A4');
    const { pages } = parsePdf(await buildWorksheetPdf(inp));
    // 1 summary + 2 maps + 3 press cards + 1 cautions + 1 care-card page + 2 packing slips
    expect(pages).toHaveLength(1 + 2 + 3 + 1 + 1 + 2);
    expect(worksheetPageCount(inp as never)).toBe(pages.length);
  });

  it('when a sheet is longer than one page shows, then its map continues over as many pages, labelled part k of n', async () => {
    const many: NestPiece[] = Array.from({ length: 40 }, (_, i) => ({
      id: `m${i}`,
      lineId: `l${i}`,
      orderNumber: `NS-2${String(i).padStart(3, '0')}`,
      layerId: 'name',
      widthMm: 200,
      heightMm: 60,
      areaMm2: 6000,
      path: rect(200, 60),
    }));
    const long = at(nestCutSheets({ rollWidthMm: 305, pieces: many }), 0);
    const n = mapPageCount('Letter', long);
    expect(n).toBeGreaterThan(3);
    const inp = { ...batch('Letter'), sheets: [{ ...long, material: { kind: 'smooth', colour: 'Red' }, pieces: many }] };
    const pdf = parsePdf(await buildWorksheetPdf(inp));
    expect(pdf.pages).toHaveLength(1 + n + 3 + 1 + 1 + 2);
    expect(pdf.text).toContain(`part ${n} of ${n}`);
    // every piece is labelled with its order number somewhere on the map
    for (const p of many) expect(pdf.text).toContain(p.orderNumber!);
  });

  it('when built, then the text holds the order numbers, the non-ASCII names in Nunito, and names what it cannot print', async () => {
    const pdf = parsePdf(await buildWorksheetPdf(batch('A4')));
    expect(pdf.text).toContain('NS-1041');
    expect(pdf.text).toContain('NS-1042');
    expect(pdf.text).toContain('Zoë Marchetti');
    expect(pdf.text).toContain('Łukasz Nowak');
    expect(pdf.text).toContain('Fern & Fable Goods');
    expect(pdf.text).not.toContain('\uFFFD');
    expect(pdf.fontNames.every((f) => /Nunito/.test(f))).toBe(true);
    expect(pdf.text).toMatch(/U\+7F8E U\+54B2/); // 美咲: not in the font, named by code point
  });

  it('when built, then it carries the press card, placement note, cautions and care card', async () => {
    const { text } = parsePdf(await buildWorksheetPdf(batch('A4')));
    const flat = text.replace(/\s+/g, ' ');
    expect(flat).toMatch(/Pre-press the blank/);
    expect(flat).toMatch(/Tack Navy smooth for 2 s/);
    expect(flat).toMatch(/Final press at 160 °C \(320 °F\)/);
    expect(flat).toMatch(/don.t overlap/);
    expect(flat).toMatch(/Centre the design horizontally/);
    expect(flat).toMatch(/protective sheet/);
    expect(flat).toMatch(/Hot glue burns/);
    expect(flat).toMatch(/Ventilate/);
    expect(flat).toMatch(/choking hazard/);
    expect(flat).toMatch(/children under 3/);
    expect(flat).toMatch(/Wait 24 hours before the first wash/);
    expect(flat).toMatch(/Never iron directly on the design/);
    expect(flat).toMatch(/No bleach/);
  });

  it('when building, then progress rises to 1', async () => {
    const seen: number[] = [];
    await buildWorksheetPdf({ ...batch('A4'), onProgress: (f) => seen.push(f) });
    expect(seen.length).toBeGreaterThan(3);
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThanOrEqual(at(seen, i - 1));
    expect(seen.at(-1)).toBe(1);
  });

  it('when compressed (the default), then it is still a valid PDF with the same pages', async () => {
    const inp = batch('A4', { compress: true } as Partial<WorksheetInput>);
    const buf = await buildWorksheetPdf(inp);
    expect(buf.subarray(0, 5).toString()).toBe('%PDF-');
    const pdf = parsePdf(buf);
    expect(pdf.pages).toHaveLength(10);
    expect(pdf.text).toContain('NS-1042');
  });

  it('when the input is malformed, then it is refused', async () => {
    await expect(buildWorksheetPdf({ ...batch('A4'), paper: 'A3' as 'A4' })).rejects.toThrow();
    await expect(buildWorksheetPdf({ ...batch('A4'), shopName: '' })).rejects.toThrow();
  });
});
