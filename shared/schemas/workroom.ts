/**
 * The workroom: a seller's proofs, cut sheets, press cards, shipping and stock. Inputs (zod, used
 * by the routes and the forms) and the shapes the API answers with. Lengths mm, money minor units.
 */
import { z } from 'zod';
import { MAX_CUT_SHEET_LINES } from '../engine/limits.ts';
import type { PressCard } from '../engine/press-card.ts';
import type { LineSnapshot } from './cart.ts';
import type { ShipTo } from './checkout.ts';
import { type Choices, choicesSchema } from './listing.ts';
import { LINE_STATES, type LineState } from './order.ts';
import { type Page, pageQuery } from './pagination.ts';

export { LINE_STATES, type LineState };

/** The states the workroom counts and filters on (DEVELOPERS.md, "Order-line states"), in production order. */
export const WORK_STATES = ['awaiting_proof', 'changes_requested', 'approved', 'planned', 'cut', 'pressed', 'shipped'] as const satisfies readonly LineState[];

const id = z.string().trim().min(1).max(64);
export const idParams = z.object({ id });
export const lineIdsSchema = z.object({
  lineIds: z
    .array(id, { error: 'Choose at least one line.' })
    .min(1, 'Choose at least one line.')
    .max(MAX_CUT_SHEET_LINES, `At most ${MAX_CUT_SHEET_LINES} lines at once.`)
    .transform((ids) => [...new Set(ids)]),
});
export type LineIdsInput = z.input<typeof lineIdsSchema>;

/** How a batch's sheets are laid out: the tightest nest, or each order kept together. */
export const GROUPINGS = ['tightest', 'order'] as const;
export type Grouping = (typeof GROUPINGS)[number];
/** POST /api/workroom/cut-sheets: the lines, and how to lay out the batch (tightest by default). */
export const buildCutSheetsSchema = lineIdsSchema.extend({
  grouping: z.enum(GROUPINGS, { error: 'Choose "tightest" or "keep each order together".' }).default('tightest'),
  weedingLines: z.boolean().default(false),
});
export type BuildCutSheetsInput = z.input<typeof buildCutSheetsSchema>;

/** an instant as milliseconds since 1970 (the client turns its calendar day into these) */
const instant = z.coerce
  .number({ error: 'Give a time as milliseconds since 1970.' })
  .int('Give a time as milliseconds since 1970.')
  .min(0, 'Give a time after 1970.')
  .max(8_640_000_000_000_000, 'Give a real date.');

/**
 * GET /api/workroom/lines: the shop's lines a page at a time, most urgent first (open lines by
 * ship-by date, then finished ones), filtered by state, time paid, material and listing.
 */
export const LINES_PAGE_SIZE = 50;
export const linesQuerySchema = pageQuery(LINES_PAGE_SIZE)
  .extend({
    state: z.enum(LINE_STATES, { error: 'Pick one of the line states.' }).optional(),
    paidFrom: instant.optional(),
    paidTo: instant.optional(),
    material: id.optional(),
    listing: id.optional(),
  })
  .refine((q) => q.paidFrom === undefined || q.paidTo === undefined || q.paidFrom <= q.paidTo, { message: 'The first day must not be after the last.', path: ['paidFrom'] });
export type LinesQuery = z.output<typeof linesQuerySchema>;
export type LinesFilter = Omit<LinesQuery, 'page' | 'limit'>;

export const requestChangeSchema = z.object({
  message: z.string({ error: 'Tell the shopper what to change.' }).trim().min(3, 'Tell the shopper what to change (at least 3 characters).').max(1000, 'Use at most 1,000 characters.'),
});
export type RequestChangeInput = z.input<typeof requestChangeSchema>;

export const PAPERS = ['A4', 'Letter'] as const;
export const worksheetRequestSchema = z.object({ paper: z.enum(PAPERS, { error: 'Choose A4 or Letter.' }).default('A4') });
export type WorksheetRequest = z.input<typeof worksheetRequestSchema>;
export type Paper = (typeof PAPERS)[number];
/** GET /api/workroom/lines/:id/template?paper=A4|Letter: the 1:1 placement template */
export const templateQuerySchema = z.object({ paper: z.enum(PAPERS, { error: 'Choose A4 or Letter.' }).default('A4') });

export const CARRIERS = ['Royal Mail', 'USPS', 'UPS', 'FedEx', 'DHL', 'Canada Post', 'Other'] as const;
export const shipSchema = z.object({
  carrier: z.string({ error: 'Enter the carrier.' }).trim().min(2, 'Enter the carrier.').max(40, 'Use at most 40 characters.'),
  trackingNumber: z
    .string({ error: 'Enter the tracking number.' })
    .trim()
    .min(4, 'Enter the tracking number (at least 4 characters).')
    .max(40, 'Use at most 40 characters.')
    .regex(/^[A-Za-z0-9][A-Za-z0-9 -]*$/, 'Use letters, digits, spaces and dashes only.'),
});
export type ShipInput = z.input<typeof shipSchema>;

export const lowStockSchema = z.object({
  lowStockMm: z.number({ error: 'Enter the length in mm.' }).min(0, 'Cannot be negative.').max(1_000_000, 'At most 1 km.'),
});
export type LowStockInput = z.input<typeof lowStockSchema>;

/** The shopper's edit after a change request: the same choices the listing's personaliser takes. */
export const personalisationEditSchema = z.object({ choices: choicesSchema });
export type PersonalisationEditInput = z.input<typeof personalisationEditSchema>;

/** GET /api/order-lines/:id/personalisation: what the shopper may change after a change request. */
export type EditableTextField = {
  id: string;
  label: string;
  maxLength: number;
  required: boolean;
  fonts: Array<{ id: string; label: string }>;
  colours: Array<{ id: string; label: string; hex: string }>;
};
export type PersonalisationEdit = {
  line: { id: string; orderId: string; state: string; listingTitle: string; version: number };
  editable: boolean;
  changeRequest: string | null;
  choices: Choices;
  textFields: EditableTextField[];
};

// ---------------------------------------------------------------- answers
export type MaterialRef = { id: string; kind: string; colour: string; colourHex: string };

export type WorkLine = {
  id: string;
  orderId: string;
  orderNumber: string;
  state: LineState;
  listingId: string;
  listingTitle: string;
  quantity: number;
  /** the personalisation text(s), joined, for the table */
  text: string;
  /** the blank's size and colour, "4T · Heather grey" (null when the listing offers none) */
  blankChoice: string | null;
  buyerName: string;
  paidAt: number;
  version: number;
  materials: MaterialRef[];
};

/** A page of lines, with what the filters can offer across all of the shop's lines. */
export type WorkLinesPage = Page<WorkLine> & { options: { materials: MaterialRef[]; listings: Array<{ id: string; title: string }> } };

export type WorkroomSummary = { counts: Record<(typeof WORK_STATES)[number], number> };

export type CharInfo = { char: string; codePoints: string[]; ascii: boolean; name: string | null };
export type ProofText = { fieldId: string; label: string; text: string; fontId: string; letterHeightMm: number | null; chars: CharInfo[]; normalized: 'NFC' | 'NFD' | 'mixed' | 'ascii' };
export type ProofWarning = { code: string; fieldId: string | null; message: string };
export type ProofVersion = { version: number; createdAt: number; authorName: string | null; summary: Array<{ label: string; value: string }>; texts: string[] };

export type Proof = {
  line: WorkLine;
  snapshot: LineSnapshot;
  /** the whole blank laid flat and where the print area sits on it, mm */
  blank: { kind: string; name: string; widthMm: number; heightMm: number; printArea: { xMm: number; yMm: number; widthMm: number; heightMm: number } };
  texts: ProofText[];
  warnings: ProofWarning[];
  versions: ProofVersion[];
  /** the seller's latest change request, when the line waits for the shopper */
  changeRequest: string | null;
};

export type TimelineEvent = {
  id: string;
  lineId: string;
  fromState: LineState | null;
  toState: LineState;
  message: string | null;
  at: number;
  actorName: string | null;
  actorRole: 'shopper' | 'shop' | 'namesake' | null;
};

export type WorkOrder = {
  id: string;
  number: string;
  buyerName: string;
  buyerEmail: string;
  paidAt: number;
  shipByDate: string | null;
  currency: string;
  totalMinor: number;
  carrier: string | null;
  trackingNumber: string | null;
  shippedAt: number | null;
  /** where to post the parcel; null for orders paid before the payment page asked */
  shipTo: ShipTo | null;
  lines: WorkLine[];
  timeline: TimelineEvent[];
};

export type SheetPiece = {
  lineId: string;
  orderNumber: string;
  layerId: string;
  xMm: number;
  yMm: number;
  widthMm: number;
  heightMm: number;
  rotated: boolean;
  /** clockwise turn in degrees (0/90/180/270); absent on older sheets: 90 when rotated */
  rotation?: 0 | 90 | 180 | 270;
};
/** An order group on a sheet: its weeding border (a cut), labelled with the order number. */
export type SheetGroupView = { label: string; xMm: number; yMm: number; widthMm: number; heightMm: number };
export type SheetLayout = {
  grouping: Grouping;
  weedingLines: boolean;
  groups: SheetGroupView[];
  lines: Array<{ x1: number; y1: number; x2: number; y2: number }>;
  /** the same pieces' length nested tightest, to show what grouping costs */
  tightestLengthMm: number;
};
/** A nested piece as a cut sheet stores it: where it lies, which piece of the nest it is, its cut path. */
export type StoredSheetPiece = SheetPiece & { pieceId: string; path: string };
export type StockCheck = { stockMm: number; needMm: number; afterMm: number; low: boolean; short: boolean };
export type WorkSheet = {
  id: string;
  batchId: string;
  state: 'planned' | 'cut';
  material: { id: string; kind: string; colour: string; colourHex: string };
  rollWidthMm: number;
  lengthMm: number;
  utilisation: number;
  pieces: SheetPiece[];
  svgUrl: string;
  consumedMm: number | null;
  cutAt: number | null;
  createdAt: number;
  stock: StockCheck;
  grouping: Grouping;
  groups: SheetGroupView[];
  /** extra roll the order groups take against the tightest nest of the same pieces (0 when tightest) */
  extraLengthMm: number;
};

export type StockWarning = { materialId: string; level: 'low' | 'short'; message: string };
export type MarkCutResult = { sheets: WorkSheet[]; linesCut: string[]; warnings: StockWarning[] };

/** One item's press card, with its design on the blank at its size (the placement figure of the press run). */
export type PressCardView = { line: WorkLine; card: PressCard; figure: { blank: Proof['blank']; pieces: LineSnapshot['geometry']['pieces'] } };

export type WorksheetJob = { id: string; state: 'running' | 'done' | 'failed'; progress: number; pages: number | null; downloadUrl: string | null; error: string | null };

export type StockMaterial = {
  id: string;
  kind: string;
  colourName: string;
  colourHex: string;
  rollWidthMm: number;
  stockMm: number;
  lowStockMm: number;
  low: boolean;
  /** planned (not yet cut) sheets' length + trim on this material */
  plannedMm: number;
};
export type StockSheetUse = {
  id: string;
  batchId: string;
  materialId: string;
  state: 'planned' | 'cut';
  lengthMm: number;
  consumedMm: number | null;
  costMinor: number | null;
  cutAt: number | null;
  createdAt: number;
  lineCount: number;
};
/** GET /api/workroom/stock: every roll in use, and the cut sheets' use a page at a time (newest first) */
export const STOCK_SHEETS_PAGE_SIZE = 25;
export const stockQuerySchema = pageQuery(STOCK_SHEETS_PAGE_SIZE);
export type StockView = { currency: string; trimMm: number; materials: StockMaterial[]; sheets: Page<StockSheetUse> };
