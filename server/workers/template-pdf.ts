/**
 * The 1:1 placement template (pdfkit): one item's design at true scale, to lay on the blank before
 * pressing. It shows the blank's top edge (or collar) line, the centre line, the print area's
 * outline and the design's pieces where they go, with the distance from the top edge / collar to
 * the design's top. Larger than a page, it is tiled over A4 or Letter pages: each tile is framed by
 * a dashed trim line with cross marks at its corners, named "row r, column c", so the pages are
 * trimmed on the dashed lines and butted together with the marks meeting.
 *
 * Scale: everything is drawn in PDF points straight from millimetres, 1 pt = 1/72 in and
 * 1 in = 25.4 mm, so 1 mm = 72 / 25.4 pt (no transform scales the page). Each page carries a 100 mm
 * test bar to check the printer did not scale it ("actual size" / 100 %).
 */
import PDFDocument from 'pdfkit';
import { z } from 'zod';
import { cutOutline } from '../../shared/engine/cut-path.ts';
import { formatPath, parsePathData, pathBBox, transformPath } from '../../shared/engine/path.ts';
import { formatLength, MM_PER_IN } from '../../shared/units.ts';
import { PDF_FONT, pdfBytes, registerPdfFonts } from './pdf-fonts.ts';
import { PAPER_PT } from './worksheet-pdf.ts';

/** PDF points per millimetre: 72 pt per inch ÷ 25.4 mm per inch. */
export const PT_PER_MM = 72 / MM_PER_IN;
/** The test bar's length on every page. */
export const TEST_BAR_MM = 100;

/** Page margin and the header band (title, test bar) above the tile, mm. */
const PAGE_MARGIN_MM = 10;
const HEADER_MM = 24;
/** How far the template reaches beyond the print area and the design, mm. */
const BLEED_MM = 12;
/** Cross marks at tile corners: arm length, mm. */
const MARK_MM = 5;

const INK = '#1f2a44';
const GREEN = '#2f7d6d';
const SOFT = '#9aa3b5';

const str = (max: number) => z.string().max(max);
const num = z.number().finite().min(-20_000).max(20_000);
export const templateInputSchema = z.object({
  paper: z.enum(['A4', 'Letter']),
  orderNumber: str(64).min(1),
  title: str(200),
  text: str(500),
  /** the blank laid flat: its size and name (mm) */
  blank: z.object({ name: str(120), widthMm: z.number().positive().max(5000), heightMm: z.number().positive().max(5000), topOffsetFrom: z.enum(['top edge', 'collar']) }),
  /** the print area on the blank, mm from its top-left (for a blank with sizes: the chosen size's) */
  printArea: z.object({ xMm: num, yMm: num, widthMm: z.number().positive().max(5000), heightMm: z.number().positive().max(5000) }),
  /** the design's pieces, path data in mm on the blank (as the preview draws them, not mirrored) */
  pieces: z.array(z.object({ d: str(2_000_000), colourHex: z.string().regex(/^#[0-9a-fA-F]{6}$/) })).max(200),
});
export type TemplateInput = z.input<typeof templateInputSchema>;

export interface TemplatePlan {
  /** the template's region on the blank, mm */
  region: { x: number; y: number; w: number; h: number };
  /** tile size (mm) and grid */
  tileW: number;
  tileH: number;
  cols: number;
  rows: number;
  /** the design's box on the blank, mm */
  design: { minX: number; minY: number; maxX: number; maxY: number } | null;
}

/** Where the design is, and how the template is cut into page-sized tiles. */
export function planTemplate(input: z.infer<typeof templateInputSchema>): TemplatePlan {
  const pa = input.printArea;
  let design: TemplatePlan['design'] = null;
  for (const p of input.pieces) {
    const bb = pathBBox(parsePathData(p.d));
    design = design ? { minX: Math.min(design.minX, bb.minX), minY: Math.min(design.minY, bb.minY), maxX: Math.max(design.maxX, bb.maxX), maxY: Math.max(design.maxY, bb.maxY) } : bb;
  }
  const minX = Math.min(pa.xMm, design?.minX ?? Infinity) - BLEED_MM;
  const maxX = Math.max(pa.xMm + pa.widthMm, design?.maxX ?? -Infinity) + BLEED_MM;
  // from just above the top edge / collar (y = 0), so the template lines up with it
  const minY = Math.min(0, pa.yMm, design?.minY ?? Infinity) - BLEED_MM;
  const maxY = Math.max(pa.yMm + pa.heightMm, design?.maxY ?? -Infinity) + BLEED_MM;
  const page = PAPER_PT[input.paper];
  const tileW = page.width / PT_PER_MM - 2 * PAGE_MARGIN_MM;
  const tileH = page.height / PT_PER_MM - 2 * PAGE_MARGIN_MM - HEADER_MM;
  const region = { x: minX, y: minY, w: maxX - minX, h: maxY - minY };
  return { region, tileW, tileH, cols: Math.ceil(region.w / tileW - 1e-9), rows: Math.ceil(region.h / tileH - 1e-9), design };
}

type Doc = PDFKit.PDFDocument;
const pt = (mm: number) => mm * PT_PER_MM;

/** The 100 mm test bar: a filled bar exactly TEST_BAR_MM long, with its ends ticked and labelled. */
function testBar(doc: Doc, xPt: number, yPt: number) {
  const len = pt(TEST_BAR_MM);
  doc.save().rect(xPt, yPt, len, 4).fill(INK).restore();
  for (let cm = 0; cm <= TEST_BAR_MM / 10; cm++)
    doc
      .save()
      .lineWidth(0.5)
      .strokeColor(INK)
      .moveTo(xPt + pt(cm * 10), yPt - 3)
      .lineTo(xPt + pt(cm * 10), yPt)
      .stroke()
      .restore();
  doc
    .font(PDF_FONT.regular)
    .fontSize(7)
    .fillColor(INK)
    .text(`${TEST_BAR_MM} mm test bar: measure it; if it is not ${TEST_BAR_MM} mm, print at 100 %.`, xPt + len + 6, yPt - 3, {
      width: doc.page.width - (xPt + len + 6) - pt(PAGE_MARGIN_MM),
      height: 20,
    });
}

function crossMark(doc: Doc, xPt: number, yPt: number) {
  const a = pt(MARK_MM);
  doc
    .save()
    .lineWidth(0.6)
    .strokeColor(INK)
    .moveTo(xPt - a, yPt)
    .lineTo(xPt + a, yPt)
    .moveTo(xPt, yPt - a)
    .lineTo(xPt, yPt + a)
    .stroke()
    .restore();
}

/** Builds the template PDF: one page when it fits, else one page per tile. */
export async function buildTemplatePdf(raw: TemplateInput & { compress?: boolean }): Promise<Buffer> {
  const { compress, ...rest } = raw;
  const input = templateInputSchema.parse(rest);
  const plan = planTemplate(input);
  const size = PAPER_PT[input.paper];
  const doc = new PDFDocument({
    size: [size.width, size.height],
    margin: 0,
    autoFirstPage: false,
    compress: compress ?? true,
    info: { Title: `Placement template — order ${input.orderNumber}`, Creator: 'Namesake' },
  });
  registerPdfFonts(doc);
  const done = pdfBytes(doc);
  const pa = input.printArea;
  // drawn as the blade cuts them: each piece's outer outline, not the overlapping font contours
  const pieces = input.pieces.map((p) => ({ path: parsePathData(cutOutline(p.d)), colour: p.colourHex }));
  const tiles = plan.cols * plan.rows;
  const tileLeft = pt(PAGE_MARGIN_MM);
  const tileTop = pt(PAGE_MARGIN_MM + HEADER_MM);
  for (let r = 0; r < plan.rows; r++) {
    for (let c = 0; c < plan.cols; c++) {
      doc.addPage({ size: [size.width, size.height], margin: 0 });
      const tileX = plan.region.x + c * plan.tileW; // the tile's top-left on the blank, mm
      const tileY = plan.region.y + r * plan.tileH;
      const w = Math.min(plan.tileW, plan.region.x + plan.region.w - tileX);
      const h = Math.min(plan.tileH, plan.region.y + plan.region.h - tileY);
      // header
      doc
        .font(PDF_FONT.bold)
        .fontSize(12)
        .fillColor(INK)
        .text(`Placement template — order ${input.orderNumber}: ${input.title}`, pt(PAGE_MARGIN_MM), pt(PAGE_MARGIN_MM), {
          width: size.width - 2 * pt(PAGE_MARGIN_MM),
          height: 16,
          ellipsis: true,
          lineBreak: false,
        });
      const where = plan.design
        ? `Design top ${formatLength(plan.design.minY)} below the ${input.blank.topOffsetFrom}, centred ${formatLength((plan.design.minX + plan.design.maxX) / 2 - input.blank.widthMm / 2)} from the centre line. `
        : '';
      doc
        .font(PDF_FONT.regular)
        .fontSize(8)
        .fillColor(GREEN)
        .text(
          `${input.blank.name}, true size (1:1). ${where}${tiles > 1 ? `Page ${r * plan.cols + c + 1} of ${tiles}: row ${r + 1}, column ${c + 1} — trim on the dashed line and match the cross marks.` : ''}`,
          pt(PAGE_MARGIN_MM),
          pt(PAGE_MARGIN_MM) + 15,
          {
            width: size.width - 2 * pt(PAGE_MARGIN_MM),
            height: 22,
            ellipsis: true,
          },
        );
      testBar(doc, pt(PAGE_MARGIN_MM), pt(PAGE_MARGIN_MM + HEADER_MM) - 8);
      // the tile: blank mm (X, Y) → page pt (tileLeft + pt(X − tileX), tileTop + pt(Y − tileY))
      const X = (mm: number) => tileLeft + pt(mm - tileX);
      const Y = (mm: number) => tileTop + pt(mm - tileY);
      doc.save();
      doc.rect(tileLeft, tileTop, pt(w), pt(h)).clip();
      // the blank's top edge / collar line and the centre line
      doc
        .save()
        .lineWidth(1.2)
        .strokeColor(INK)
        .moveTo(X(plan.region.x), Y(0))
        .lineTo(X(plan.region.x + plan.region.w), Y(0))
        .stroke()
        .restore();
      doc
        .font(PDF_FONT.bold)
        .fontSize(8)
        .fillColor(INK)
        .text(`${input.blank.topOffsetFrom === 'collar' ? 'Collar' : 'Top edge'} — lay this line on it`, X(plan.region.x) + 4, Y(0) - 11, { lineBreak: false });
      doc
        .save()
        .lineWidth(0.6)
        .strokeColor(SOFT)
        .dash(6, { space: 3 })
        .moveTo(X(input.blank.widthMm / 2), Y(plan.region.y))
        .lineTo(X(input.blank.widthMm / 2), Y(plan.region.y + plan.region.h))
        .stroke()
        .undash()
        .restore();
      // print area
      doc.save().lineWidth(0.9).strokeColor(GREEN).dash(4, { space: 3 }).rect(X(pa.xMm), Y(pa.yMm), pt(pa.widthMm), pt(pa.heightMm)).stroke().undash().restore();
      doc
        .font(PDF_FONT.regular)
        .fontSize(7)
        .fillColor(GREEN)
        .text(`Print area ${formatLength(pa.widthMm)} × ${formatLength(pa.heightMm)}`, X(pa.xMm) + 3, Y(pa.yMm) + 3, { lineBreak: false });
      // the design, where it goes (as seen on the blank, not mirrored)
      for (const p of pieces) {
        const d = formatPath(transformPath(p.path, [PT_PER_MM, 0, 0, PT_PER_MM, tileLeft - pt(tileX), tileTop - pt(tileY)]));
        doc.save().path(d).fillOpacity(0.25).fill(p.colour).restore();
        doc.save().path(d).lineWidth(0.5).strokeColor(INK).stroke().restore();
      }
      if (plan.design) {
        // the design's top, measured from the top edge / collar
        const x = X(plan.design.maxX) + 6;
        doc.save().lineWidth(0.6).strokeColor(INK).moveTo(x, Y(0)).lineTo(x, Y(plan.design.minY)).stroke().restore();
        doc
          .font(PDF_FONT.regular)
          .fontSize(7)
          .fillColor(INK)
          .text(formatLength(plan.design.minY), x + 3, (Y(0) + Y(plan.design.minY)) / 2 - 4, { lineBreak: false });
      }
      doc.restore();
      // trim line and alignment marks at the tile's corners
      doc.save().lineWidth(0.4).strokeColor(SOFT).dash(3, { space: 3 }).rect(tileLeft, tileTop, pt(w), pt(h)).stroke().undash().restore();
      if (tiles > 1)
        for (const [cx, cy] of [
          [0, 0],
          [w, 0],
          [0, h],
          [w, h],
        ] as const)
          crossMark(doc, tileLeft + pt(cx), tileTop + pt(cy));
      await new Promise<void>((res) => setImmediate(res));
    }
  }
  doc.end();
  return done;
}
