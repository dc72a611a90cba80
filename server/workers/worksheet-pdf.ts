/**
 * The work sheet PDF for one batch (pdfkit): a summary, a to-scale map of every cut sheet with its
 * pieces labelled by order number, a press card per line with its placement note, the cautions, a
 * page of care cards to go in the parcels, and a packing slip per order.
 *
 * Page sizes: A4 = 210 × 297 mm (ISO 216) = 595.28 × 841.89 pt; Letter = 8.5 × 11 in (ANSI A) =
 * 612 × 792 pt (1 pt = 1/72 in). Text never flows onto a page of its own accord (every block gets
 * the height left on its page), so the page count follows from the content: see worksheetPageCount.
 */
import PDFDocument from 'pdfkit';
import { z } from 'zod';
import { withCutOutlines } from '../../shared/engine/cut-path.ts';
import { groupLabelAt, placedCutPath } from '../../shared/engine/cut-sheet-svg.ts';
import { type CutSheet, DEFAULT_GAP_MM } from '../../shared/engine/cut-sheets.ts';
import { LimitError, MAX_WORKSHEET_PAGES } from '../../shared/engine/limits.ts';
import { formatPath } from '../../shared/engine/path.ts';
import type { PressCard } from '../../shared/engine/press-card.ts';
import { formatLength, MM_PER_IN } from '../../shared/units.ts';
import { codePoints, missingCharacters, PDF_FONT, pdfBytes, registerPdfFonts } from './pdf-fonts.ts';

const PT_PER_MM = 72 / MM_PER_IN;
/** PDF page sizes in points: ISO 216 A4 (210 × 297 mm) and ANSI Letter (8.5 × 11 in). */
export const PAPER_PT = {
  A4: { width: 210 * PT_PER_MM, height: 297 * PT_PER_MM },
  Letter: { width: 8.5 * 72, height: 11 * 72 },
} as const;
export type Paper = keyof typeof PAPER_PT;

const MARGIN = 48;
const MAP_HEADER = 62; // heading + scale line above the roll drawing
const CARE_PER_PAGE = 6;
const SUMMARY_ROWS_FIRST = 18;
const SUMMARY_ROWS_NEXT = 34;
/** Stock is taken as the nested length plus a 25 mm trim allowance (from memory). */
export const TRIM_ALLOWANCE_MM = 25;

const str = (max: number) => z.string().max(max);
const placementSchema = z.object({
  pieceId: str(128),
  lineId: str(128),
  orderNumber: str(64).optional(),
  layerId: str(128).optional(),
  xMm: z.number().finite(),
  yMm: z.number().finite(),
  widthMm: z.number().positive(),
  heightMm: z.number().positive(),
  rotated: z.boolean(),
  rotation: z.union([z.literal(0), z.literal(90), z.literal(180), z.literal(270)]).optional(),
});
const sheetSchema = z.object({
  id: str(128).optional(),
  material: z.object({ kind: str(40), colour: str(60) }),
  rollWidthMm: z.number().positive().max(5000),
  lengthMm: z.number().nonnegative().max(1_000_000),
  utilisation: z.number().min(0).max(1.0001),
  gapMm: z.number().nonnegative().optional(),
  marginMm: z.number().nonnegative().optional(),
  piecesAreaMm2: z.number().nonnegative().optional(),
  placements: z.array(placementSchema).max(20_000),
  /** Order groups: weeding borders (labelled with the order number) and weeding lines, mm. */
  groups: z
    .array(z.object({ label: str(64), xMm: z.number().finite(), yMm: z.number().finite(), widthMm: z.number().positive(), heightMm: z.number().positive() }))
    .max(20_000)
    .optional(),
  weedingLines: z
    .array(z.object({ x1: z.number().finite(), y1: z.number().finite(), x2: z.number().finite(), y2: z.number().finite() }))
    .max(20_000)
    .optional(),
  /** Preview paths by piece id: when given, the map draws the real (mirrored) outlines. */
  pieces: z.array(z.object({ id: str(128), path: str(2_000_000) })).optional(),
});
const cardSchema = z.object({
  orderNumber: str(64).min(1),
  lineTitle: str(200),
  text: str(500),
  pressCard: z.custom<PressCard>((v) => typeof v === 'object' && v !== null && Array.isArray((v as PressCard).steps), 'A press card from pressCard().'),
});
const slipSchema = z.object({
  orderNumber: str(64).min(1),
  buyerName: str(200),
  shipTo: z.array(str(200)).max(10).optional(),
  lines: z.array(z.object({ title: str(200), text: str(500).optional(), quantity: z.number().int().positive().max(1000).optional() })).max(200),
});
export const worksheetInputSchema = z.object({
  paper: z.enum(['A4', 'Letter']),
  shopName: str(120).min(1),
  batchLabel: str(120),
  sheets: z.array(sheetSchema).max(200),
  cards: z.array(cardSchema).max(2000),
  packingSlips: z.array(slipSchema).max(2000),
});
export type WorksheetSheet = z.infer<typeof sheetSchema> & Partial<Pick<CutSheet, 'gapMm' | 'marginMm'>>;
export type WorksheetInput = z.input<typeof worksheetInputSchema> & { onProgress?: (fraction: number) => void };

// ---- page plan: how many pages each part takes ----

function mapGeometry(paper: Paper, rollWidthMm: number) {
  const { width, height } = PAPER_PT[paper];
  const cw = width - 2 * MARGIN;
  const ch = height - 2 * MARGIN - MAP_HEADER;
  const scale = cw / rollWidthMm; // pt per mm: the roll's width fills the page's width
  return { scale, segmentMm: ch / scale, left: MARGIN, top: MARGIN + MAP_HEADER };
}

/** Length of roll that one map page shows, mm. */
export const mapSegmentLengthMm = (paper: Paper, rollWidthMm: number): number => mapGeometry(paper, rollWidthMm).segmentMm;
export const mapPageCount = (paper: Paper, sheet: { rollWidthMm: number; lengthMm: number }): number => Math.max(1, Math.ceil(sheet.lengthMm / mapSegmentLengthMm(paper, sheet.rollWidthMm) - 1e-9));
const summaryPageCount = (sheets: number) => (sheets <= SUMMARY_ROWS_FIRST ? 1 : 1 + Math.ceil((sheets - SUMMARY_ROWS_FIRST) / SUMMARY_ROWS_NEXT));

/** Pages: summary + map pages per sheet + one per press card + cautions + care cards (6 a page) + one slip per order. */
export function worksheetPageCount(input: Pick<z.infer<typeof worksheetInputSchema>, 'paper' | 'sheets' | 'cards' | 'packingSlips'>): number {
  return (
    summaryPageCount(input.sheets.length) +
    input.sheets.reduce((s, sh) => s + mapPageCount(input.paper, sh), 0) +
    input.cards.length +
    1 +
    Math.max(1, Math.ceil(input.packingSlips.length / CARE_PER_PAGE)) +
    input.packingSlips.length
  );
}

// ---- text helpers that never spill onto a new page ----

type Doc = PDFKit.PDFDocument;
const INK = '#1f2a44';
const GREEN = '#2f7d6d';
const MARIGOLD = '#e0a526';

function block(doc: Doc, text: string, opts: { size?: number; bold?: boolean; color?: string; x?: number; width?: number; gap?: number; indent?: number } = {}) {
  const x = opts.x ?? MARGIN;
  const width = opts.width ?? doc.page.width - MARGIN - x;
  const room = doc.page.maxY() - doc.y;
  if (room < 4) return;
  doc
    .font(opts.bold ? PDF_FONT.bold : PDF_FONT.regular)
    .fontSize(opts.size ?? 10)
    .fillColor(opts.color ?? INK);
  doc.text(text, x, doc.y, { width, height: room, ellipsis: true, indent: opts.indent });
  if (opts.gap) doc.y += opts.gap;
}

/** A name or text as printed, with any characters the font can't draw named by code point. */
function printable(text: string): string {
  const missing = missingCharacters(text);
  if (missing.length === 0) return text;
  return `${text.replace(new RegExp(`[${missing.map((c) => c.replace(/[\\\]^-]/g, '\\$&')).join('')}]`, 'gu'), '?')} (characters this sheet can't print: ${codePoints(missing)})`;
}

/** One character as printed, or its code point when the font can't draw it (or it is invisible). */
function printableChar(c: string): string {
  const cp = c.codePointAt(0)!;
  return missingCharacters(c).length || cp < 0x20 || (cp >= 0x300 && cp <= 0x36f) ? codePoints([c]) : c;
}

const pct = (v: number) => `${(v * 100).toFixed(1)} %`;
const materialLabel = (m: { kind: string; colour: string }) => `${m.colour} ${m.kind}`;

function heading(doc: Doc, title: string, sub?: string) {
  doc.x = MARGIN;
  doc.y = MARGIN;
  block(doc, title, { size: 18, bold: true, gap: 2 });
  if (sub) block(doc, sub, { size: 10, color: GREEN, gap: 8 });
}

// ---- the parts ----

function summaryPages(doc: Doc, inp: z.infer<typeof worksheetInputSchema>, newPage: () => void) {
  heading(doc, `${inp.shopName} — work sheet`, inp.batchLabel);
  const orders = new Set([...inp.cards.map((c) => c.orderNumber), ...inp.packingSlips.map((s) => s.orderNumber)]);
  block(
    doc,
    `${orders.size} order${orders.size === 1 ? '' : 's'}, ${inp.cards.length} item${inp.cards.length === 1 ? '' : 's'} to press, ${inp.sheets.length} cut sheet${inp.sheets.length === 1 ? '' : 's'}.`,
    { size: 11, gap: 4 },
  );
  block(doc, `Orders: ${[...orders].join(', ') || '—'}`, { size: 10, gap: 6 });
  block(doc, 'In this work sheet: a map of each cut sheet, a press card per item with its placement note, the cautions, care cards for the parcels and a packing slip per order.', {
    size: 9,
    gap: 10,
  });
  block(doc, 'Cut sheets', { size: 13, bold: true, gap: 4 });
  block(doc, `Stock to take per sheet: its length plus ${TRIM_ALLOWANCE_MM} mm trim. Cut files are mirrored.`, { size: 9, gap: 6 });
  const cols = [0, 150, 250, 360, 430];
  const row = (cells: string[], bold = false) => {
    const y = doc.y;
    doc
      .font(bold ? PDF_FONT.bold : PDF_FONT.regular)
      .fontSize(9)
      .fillColor(INK);
    cells.forEach((c, i) => {
      const x = cols[i] ?? 0; // one cell per column: `cells` never outnumbers `cols`
      doc.text(c, MARGIN + x, y, { width: (cols[i + 1] ?? doc.page.width - 2 * MARGIN) - x - 6, height: 14, ellipsis: true, lineBreak: false });
    });
    doc.y = y + 16;
  };
  const header = () => row(['Material', 'Roll width', 'Length (+ trim)', 'Used', 'Pieces'], true);
  header();
  inp.sheets.forEach((s, i) => {
    if (i === SUMMARY_ROWS_FIRST || (i > SUMMARY_ROWS_FIRST && (i - SUMMARY_ROWS_FIRST) % SUMMARY_ROWS_NEXT === 0)) {
      newPage();
      heading(doc, 'Cut sheets (continued)');
      header();
    }
    row([materialLabel(s.material), formatLength(s.rollWidthMm), `${formatLength(s.lengthMm)} (+ ${TRIM_ALLOWANCE_MM} mm)`, pct(s.utilisation), String(s.placements.length)]);
  });
}

function mapPages(doc: Doc, paper: Paper, sheet: WorksheetSheet, index: number, newPage: () => void) {
  const g = mapGeometry(paper, sheet.rollWidthMm);
  const pages = mapPageCount(paper, sheet);
  // the blade's path, as the SVG has it: each piece's outer outline, never the overlapping contours
  // a font draws (issue 17: a "Z" or "ë" drawn from several contours)
  const paths = new Map(withCutOutlines(sheet.pieces ?? []).map((p) => [p.id, p.path]));
  const drawn = sheet.placements.map((pl) => {
    const src = paths.get(pl.pieceId);
    let d: string | null = null;
    if (src) {
      try {
        d = formatPath(placedCutPath(pl, src));
      } catch {
        d = null;
      }
    }
    return { pl, d };
  });
  for (let k = 0; k < pages; k++) {
    newPage();
    const y0 = k * g.segmentMm;
    const y1 = Math.min(sheet.lengthMm, y0 + g.segmentMm);
    heading(doc, `Cut sheet ${index + 1}: ${materialLabel(sheet.material)}${pages > 1 ? ` — part ${k + 1} of ${pages}` : ''}`);
    block(
      doc,
      `Roll ${formatLength(sheet.rollWidthMm)} wide; ${formatLength(sheet.lengthMm)} used (${pct(sheet.utilisation)}); this page shows ${formatLength(y0)} to ${formatLength(y1)}. To scale, 1 : ${(1 / (g.scale / PT_PER_MM)).toFixed(2)}; pieces as cut (mirrored), labelled by order number.`,
      { size: 8.5 },
    );
    const hPt = (y1 - y0) * g.scale;
    const wPt = sheet.rollWidthMm * g.scale;
    doc.save();
    doc.lineWidth(0.8).strokeColor(GREEN).rect(g.left, g.top, wPt, Math.max(hPt, 1)).stroke();
    doc.rect(g.left, g.top, wPt, Math.max(hPt, 1)).clip();
    for (const { pl, d } of drawn) {
      if (pl.yMm + pl.heightMm < y0 || pl.yMm > y1) continue;
      const x = g.left + pl.xMm * g.scale;
      const y = g.top + (pl.yMm - y0) * g.scale;
      doc
        .lineWidth(0.4)
        .strokeColor('#9aa3b5')
        .dash(2, { space: 2 })
        .rect(x, y, pl.widthMm * g.scale, pl.heightMm * g.scale)
        .stroke()
        .undash();
      if (d) {
        doc.save();
        doc.translate(g.left, g.top - y0 * g.scale).scale(g.scale);
        doc
          .path(d)
          .lineWidth(0.5 / g.scale)
          .strokeColor(INK)
          .stroke();
        doc.restore();
      }
      const label = pl.orderNumber ?? pl.lineId;
      const boxW = pl.widthMm * g.scale;
      const size = Math.max(4, Math.min(9, (boxW - 4) / Math.max(1, label.length * 0.55), pl.heightMm * g.scale * 0.5));
      doc.font(PDF_FONT.bold).fontSize(size).fillColor(MARIGOLD);
      const tw = doc.widthOfString(label);
      doc.text(label, x + (boxW - tw) / 2, y + (pl.heightMm * g.scale - size) / 2, { lineBreak: false });
    }
    // order groups: each weeding border (a cut) with its order number, and the weeding lines
    const gap = sheet.gapMm ?? DEFAULT_GAP_MM;
    for (const gr of sheet.groups ?? []) {
      if (gr.yMm + gr.heightMm < y0 || gr.yMm > y1) continue;
      const gx = g.left + gr.xMm * g.scale;
      const gy = g.top + (gr.yMm - y0) * g.scale;
      doc
        .lineWidth(0.9)
        .strokeColor(GREEN)
        .rect(gx, gy, gr.widthMm * g.scale, gr.heightMm * g.scale)
        .stroke();
      const at = groupLabelAt(gr, gap);
      doc
        .font(PDF_FONT.bold)
        .fontSize(Math.max(5, Math.min(10, at.sizeMm * g.scale * 1.6)))
        .fillColor(GREEN);
      doc.text(gr.label, g.left + at.x * g.scale, g.top + (gr.yMm - y0) * g.scale + 1, { lineBreak: false });
    }
    for (const l of sheet.weedingLines ?? []) {
      if (Math.max(l.y1, l.y2) < y0 || Math.min(l.y1, l.y2) > y1) continue;
      doc
        .lineWidth(0.7)
        .strokeColor(GREEN)
        .moveTo(g.left + l.x1 * g.scale, g.top + (l.y1 - y0) * g.scale)
        .lineTo(g.left + l.x2 * g.scale, g.top + (l.y2 - y0) * g.scale)
        .stroke();
    }
    doc.restore();
  }
}

function cardPage(doc: Doc, card: z.infer<typeof cardSchema>) {
  const pc = card.pressCard;
  heading(doc, `Press card — order ${card.orderNumber}`, printable(card.lineTitle));
  block(doc, `Text: ${printable(card.text)}`, { size: 12, bold: true, gap: 2 });
  block(doc, `Letter by letter: ${[...card.text].map((c) => (c === ' ' ? '(space)' : printableChar(c))).join(' · ')}`, { size: 9, gap: 6 });
  block(doc, `${pc.pressType === 'handheld' ? 'Handheld' : 'Clamshell'} press · final ${pc.tempLabel}, ${pc.finalTimeS} s, peel ${pc.peel}`, { size: 11, bold: true, color: GREEN, gap: 4 });
  block(doc, `Layers, bottom to top: ${pc.layers.map((l, i) => `${i + 1}. ${l.colourName} ${l.materialKind}`).join('   ')}`, { size: 10, gap: 6 });
  if (pc.warnings.length) {
    for (const w of pc.warnings) block(doc, `Warning: ${w.message}`, { size: 10, bold: true, color: '#9a5b00', gap: 2 });
    doc.y += 4;
  }
  block(doc, 'Steps', { size: 12, bold: true, gap: 2 });
  pc.steps.forEach((s, i) => {
    block(doc, `${i + 1}. ${s.text}${s.protectiveSheet && !/protective sheet/.test(s.text) ? ' (under a protective sheet)' : ''}`, { size: 10, gap: 2, x: MARGIN + 8 });
  });
  doc.y += 6;
  block(doc, 'Placement', { size: 12, bold: true, gap: 2 });
  block(doc, pc.placementNote, { size: 10, gap: 6 });
  for (const n of pc.notes) block(doc, n, { size: 8, color: GREEN });
  block(doc, 'Heat burns: keep hands clear, use a protective sheet, let the press cool, keep away from children.', { size: 8, gap: 0 });
}

export const CAUTIONS: readonly string[] = [
  'Heat presses and irons burn: keep hands clear of the platen, use a protective sheet (parchment or PTFE), let the press cool before putting it away, and keep it away from children.',
  'Hot glue burns: keep a bowl of cold water at hand and let glued parts cool before handling.',
  'Ventilate the room when pressing vinyl.',
  "Bows, buttons, gems and other small decorations are a choking hazard on items for children under 3 (US CPSC, 16 CFR 1501: parts that fit the small-parts test cylinder). Whether an item is exempt is a question for the seller: follow your local rules and the maker's own instructions.",
  "These notes are general cautions; local rules and each maker's instructions come first.",
];

export const CARE_STEPS: readonly string[] = ['Wait 24 hours before the first wash.', 'Wash inside out, cool.', 'No bleach.', 'Tumble dry low, or hang to dry.', 'Never iron directly on the design.'];

function cautionsPage(doc: Doc) {
  heading(doc, 'Cautions', 'Read before pressing');
  for (const c of CAUTIONS) block(doc, `• ${c}`, { size: 11, gap: 8 });
}

function carePages(doc: Doc, shopName: string, count: number, newPage: () => void) {
  const pages = Math.max(1, Math.ceil(count / CARE_PER_PAGE));
  const w = (doc.page.width - 2 * MARGIN - 12) / 2;
  const h = (doc.page.height - 2 * MARGIN - 30 - 24) / 3;
  for (let p = 0; p < pages; p++) {
    if (p > 0) newPage();
    heading(doc, 'Care cards', 'Cut out one card for each parcel');
    for (let i = 0; i < CARE_PER_PAGE; i++) {
      const x = MARGIN + (i % 2) * (w + 12);
      const y = MARGIN + 42 + Math.floor(i / 2) * (h + 12);
      doc.save().lineWidth(0.6).strokeColor('#9aa3b5').dash(3, { space: 3 }).roundedRect(x, y, w, h, 8).stroke().undash().restore();
      doc.y = y + 12;
      block(doc, 'Caring for your personalised piece', { x: x + 12, width: w - 24, size: 11, bold: true, gap: 4 });
      for (const s of CARE_STEPS) block(doc, `• ${s}`, { x: x + 12, width: w - 24, size: 9.5, gap: 1 });
      doc.y += 4;
      block(doc, `With thanks from ${shopName}`, { x: x + 12, width: w - 24, size: 9, color: GREEN });
    }
  }
}

function slipPage(doc: Doc, shopName: string, slip: z.infer<typeof slipSchema>) {
  heading(doc, `Packing slip — order ${slip.orderNumber}`, shopName);
  block(doc, `For: ${printable(slip.buyerName)}`, { size: 12, bold: true, gap: 2 });
  if (slip.shipTo?.length) {
    block(doc, 'Ship to', { size: 10, bold: true, color: GREEN });
    for (const l of slip.shipTo) block(doc, printable(l), { size: 10 });
    doc.y += 8;
  }
  block(doc, 'In this parcel', { size: 12, bold: true, gap: 4 });
  for (const l of slip.lines) {
    block(doc, `${l.quantity ?? 1} × ${printable(l.title)}${l.text ? ` — “${printable(l.text)}”` : ''}`, { size: 10, gap: 3 });
  }
  doc.y += 10;
  block(doc, `Care: ${CARE_STEPS.join(' ')}`, { size: 9, gap: 4 });
  block(doc, `Thank you for your order from ${shopName}.`, { size: 9, color: GREEN });
}

/** Builds the work sheet PDF; `onProgress` hears the fraction of pages done, ending with 1. */
export async function buildWorksheetPdf(input: WorksheetInput & { compress?: boolean }): Promise<Buffer> {
  const { onProgress, compress, ...rest } = input;
  const inp = worksheetInputSchema.parse(rest);
  const total = worksheetPageCount(inp);
  if (total > MAX_WORKSHEET_PAGES) throw new LimitError('MAX_WORKSHEET_PAGES', `The work sheet would have ${total} pages; the limit is ${MAX_WORKSHEET_PAGES}.`);
  const size = PAPER_PT[inp.paper];
  const doc = new PDFDocument({
    size: [size.width, size.height],
    margin: MARGIN,
    autoFirstPage: false,
    compress: compress ?? true,
    info: { Title: `${inp.shopName} — work sheet — ${inp.batchLabel}`, Author: inp.shopName, Creator: 'Namesake' },
  });
  registerPdfFonts(doc);
  const done = pdfBytes(doc);

  let pages = 0;
  const newPage = () => {
    doc.addPage({ size: [size.width, size.height], margin: MARGIN });
    pages++;
    onProgress?.(Math.min(0.99, pages / total));
  };
  // Give the event loop a turn between parts, so progress can reach the client while we build.
  const yieldTurn = () => new Promise<void>((r) => setImmediate(r));

  newPage();
  summaryPages(doc, inp, newPage);
  await yieldTurn();
  for (const [i, sheet] of inp.sheets.entries()) {
    mapPages(doc, inp.paper, sheet, i, newPage);
    await yieldTurn();
  }
  for (const card of inp.cards) {
    newPage();
    cardPage(doc, card);
    await yieldTurn();
  }
  newPage();
  cautionsPage(doc);
  newPage();
  carePages(doc, inp.shopName, inp.packingSlips.length, newPage);
  for (const slip of inp.packingSlips) {
    newPage();
    slipPage(doc, inp.shopName, slip);
    await yieldTurn();
  }
  doc.end();
  const buf = await done;
  onProgress?.(1);
  return buf;
}
