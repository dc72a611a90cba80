// Issue 17: the work sheet's cut map must draw what the blade cuts — each piece's outer outline, as
// the SVG has it — not the overlapping contours a font draws for "Z" or "ë".
import { inflateSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { buildWorksheetPdf } from '../../server/workers/worksheet-pdf.ts';
import { withCutOutlines } from '../../shared/engine/cut-path.ts';
import { cutSheetSvg } from '../../shared/engine/cut-sheet-svg.ts';
import { type NestPiece, nestCutSheets } from '../../shared/engine/cut-sheets.ts';
import { at } from '../support/at.ts';

/** Each page's content stream, in page order (pdfkit writes pages in order; compress: false). */
function pageStreams(buf: Buffer): string[] {
  const src = buf.toString('latin1');
  const objs = new Map<number, string>();
  for (const m of src.matchAll(/(\d+) 0 obj\s*([\s\S]*?)endobj/g)) objs.set(Number(m[1]), at(m, 2));
  const out: string[] = [];
  for (const body of objs.values()) {
    if (!/\/Type \/Page\b/.test(body)) continue;
    const c = /\/Contents (\d+) 0 R/.exec(body);
    const s = c ? (objs.get(Number(c[1])) ?? '') : '';
    const si = s.indexOf('stream');
    let raw = s.slice(si + 6).replace(/^\r?\n/, '');
    raw = raw.slice(0, raw.lastIndexOf('endstream'));
    out.push(/\/FlateDecode/.test(s.slice(0, si)) ? inflateSync(Buffer.from(raw, 'latin1')).toString('latin1') : raw);
  }
  return out;
}

/** Contours drawn with path operators: one `x y m` per subpath (the roll and piece boxes use `re`). */
const contours = (stream: string) => (stream.match(/^-?[\d.]+ -?[\d.]+ m$/gm) ?? []).length;

describe('work sheet cut map', () => {
  it('when a piece is drawn from overlapping contours, then the map draws its outer outline only, as many contours as the SVG cuts', async () => {
    // a "Z"-like piece: two overlapping squares (2 contours, 1 outline), and an "ë"-like one: a body
    // and two separate dots (3 contours, 3 outlines, nothing to merge)
    const overlapping: NestPiece = { id: 'z', lineId: 'l1', orderNumber: 'NS-1', layerId: 'name', widthMm: 45, heightMm: 45, areaMm2: 1575, path: 'M0 0H30V30H0Z M15 15H45V45H15Z' };
    const dotted: NestPiece = { id: 'e', lineId: 'l2', orderNumber: 'NS-2', layerId: 'name', widthMm: 30, heightMm: 40, areaMm2: 700, path: 'M0 10H30V40H0Z M2 0H8V6H2Z M22 0H28V6H22Z' };
    const pieces = [overlapping, dotted];
    const sheet = at(nestCutSheets({ rollWidthMm: 305, pieces }), 0);
    const pdf = await buildWorksheetPdf({
      paper: 'A4',
      shopName: 'Fern & Fable Goods',
      batchLabel: 'cut map',
      sheets: [{ ...sheet, material: { kind: 'smooth', colour: 'Navy' }, pieces }],
      cards: [],
      packingSlips: [],
      compress: false,
    });
    const map = at(pageStreams(pdf), 1); // page 1 is the summary, page 2 the map
    const svg = cutSheetSvg(sheet, withCutOutlines(pieces));
    const svgContours = [...svg.matchAll(/ d="([^"]*)"/g)].reduce((n, m) => n + (at(m, 1).match(/M/g) ?? []).length, 0);
    expect(svgContours).toBe(1 + 3);
    expect(contours(map)).toBe(svgContours);
  });
});
