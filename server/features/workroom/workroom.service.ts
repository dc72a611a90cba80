// The workroom's rules: which state a line may move to and who may move it, proofs built from the
// line's own snapshot, cut sheets nested per material, stock taken as sheets are cut, press cards,
// shipping. Every call takes the seller's shop id; a line or order of another shop is "not found".
import crypto from 'node:crypto';
import type { AppDeps } from '../../app.ts';
import type { Db } from '../../db/client.ts';
import { AppError, conflict, notFound } from '../../http/app-error.ts';
import { getFontRegistry } from '../../integrations/fonts.ts';
import type { LineSnapshot } from '../../../shared/schemas/cart.ts';
import type { LineState } from '../../../shared/schemas/order.ts';
import { parseShipTo } from '../../../shared/schemas/checkout.ts';
import { personalisationSchema, type Personalisation } from '../../../shared/schemas/listing.ts';
import {
  WORK_STATES,
  type CharInfo, type MarkCutResult, type MaterialRef, type Proof, type ProofText, type ProofVersion, type ProofWarning, type PressCardView,
  type SheetPiece, type StoredSheetPiece, type StockView, type StockWarning, type TimelineEvent, type WorkLine, type WorkLinesPage, type WorkOrder, type WorkroomSummary, type WorkSheet,
  type LinesQuery, stockQuerySchema,
} from '../../../shared/schemas/workroom.ts';
import { pageOffset, toPage, type PageQuery } from '../../../shared/schemas/pagination.ts';
import { fitText, textWarnings } from '../../../shared/engine/fit.ts';
import { defaultBlank, usableArea } from '../../../shared/engine/blanks.ts';
import { blankFor } from '../../../shared/engine/listing-design.ts';
import { parsePathData, pathArea, pathBBox } from '../../../shared/engine/path.ts';
import { CutSheetError, DEFAULT_GAP_MM, DEFAULT_MARGIN_MM, type CutSheet, type NestPiece } from '../../../shared/engine/cut-sheets.ts';
import { cutOutline } from '../../../shared/engine/cut-path.ts';
import { cutSheetSvg } from '../../../shared/engine/cut-sheet-svg.ts';
import { pressCard, type PressType } from '../../../shared/engine/press-card.ts';
import { MATERIAL_KINDS, type MaterialKind } from '../../../shared/engine/press-defaults.ts';
import { TRIM_ALLOWANCE_MM } from './worksheet-pdf.ts';
import { MAX_NEST_PIECES } from '../../../shared/engine/limits.ts';
import type { RawPiece } from '../../workers/tasks.ts';
import { changeRequestMail, shippedMail } from './workroom-mails.ts';
import { workroomRepo as repo, type LineRow, type MaterialRow, type OrderRow, type SheetRow } from './workroom.repo.ts';

export type WorkroomDeps = Pick<AppDeps, 'db' | 'now' | 'env' | 'mailer'>;
export { TRIM_ALLOWANCE_MM };

// ---------------------------------------------------------------- line views

type Row = { line: LineRow; order: OrderRow };

const snap = (l: LineRow) => l.snapshot;

/** The material ids a line uses, bottom → top (the snapshot's pieces are in press order). */
export function lineMaterialIds(s: LineSnapshot): string[] {
  const out: string[] = [];
  for (const p of s.geometry.pieces) if (p.materialId && !out.includes(p.materialId)) out.push(p.materialId);
  return out;
}

const lineText = (s: LineSnapshot) =>
  Object.values(s.choices.texts)
    .map((t) => t.text)
    .filter((t) => t.trim() !== '')
    .join(' / ');

function materialRef(m: MaterialRow | undefined, id: string, s: LineSnapshot): MaterialRef {
  if (m) return { id: m.id, kind: m.kind, colour: m.colourName, colourHex: m.colourHex };
  const hex = s.geometry.pieces.find((p) => p.materialId === id)?.colourHex ?? '#000000';
  return { id, kind: 'unknown', colour: 'a material no longer in stock', colourHex: hex };
}

function views(db: Db, shopId: string, rows: Row[], shopMaterials = repo.materialsOfShop(db, shopId)): WorkLine[] {
  const mats = new Map(shopMaterials.map((m) => [m.id, m]));
  const buyers = new Map(repo.users(db, [...new Set(rows.map((r) => r.order.buyerId))]).map((u) => [u.id, u]));
  return rows.map(({ line, order }) => {
    const s = snap(line);
    return {
      id: line.id,
      orderId: order.id,
      orderNumber: order.number,
      state: line.state as LineState,
      listingId: line.listingId,
      listingTitle: line.listingTitle,
      quantity: line.quantity,
      text: lineText(s),
      buyerName: buyers.get(order.buyerId)?.name ?? 'A shopper',
      paidAt: order.paidAt,
      version: line.version,
      materials: lineMaterialIds(s).map((id) => materialRef(mats.get(id), id, s)),
    };
  });
}

function ownLine(db: Db, shopId: string, lineId: string): Row {
  const row = repo.linesByIds(db, shopId, [lineId])[0];
  if (!row) throw notFound('We could not find that order line in your shop.');
  return row;
}

/** Moves a line and writes the timeline event; the caller checks the move is allowed. */
function move(db: Db, line: LineRow, to: LineState, actorId: string | null, at: number, message: string | null = null) {
  repo.setLine(db, line.id, { state: to, updatedAt: at });
  repo.insertEvent(db, { id: crypto.randomUUID(), lineId: line.id, actorId, fromState: line.state, toState: to, message, createdAt: at });
}

function requireState(line: LineRow, from: LineState[], doing: string) {
  if (!from.includes(line.state as LineState)) {
    throw new AppError(409, 'wrong_state', `This line is ${line.state.replace(/_/g, ' ')}; you can ${doing} only a line that is ${from.map((s) => s.replace(/_/g, ' ')).join(' or ')}.`);
  }
}

// ---------------------------------------------------------------- home: counts, lines, orders

export function summary(db: Db, shopId: string): WorkroomSummary {
  const counts = Object.fromEntries(WORK_STATES.map((s) => [s, 0])) as WorkroomSummary['counts'];
  for (const { state, n } of repo.stateCounts(db, shopId)) if (state in counts) counts[state as keyof typeof counts] = n;
  return { counts };
}

/** One page of the shop's lines (most urgent first), and what the filters can offer. */
export function listLines(db: Db, shopId: string, q: LinesQuery): WorkLinesPage {
  const { page, limit, ...filter } = q;
  const rows = repo.linesPage(db, shopId, filter, limit, pageOffset({ page, limit }));
  const mats = repo.materialsOfShop(db, shopId);
  return {
    ...toPage(views(db, shopId, rows, mats), repo.linesCount(db, shopId, filter), { page, limit }),
    options: {
      materials: mats.map((m) => ({ id: m.id, kind: m.kind, colour: m.colourName, colourHex: m.colourHex })).sort((a, b) => a.colour.localeCompare(b.colour)),
      listings: repo.soldListings(db, shopId),
    },
  };
}

export function orderView(db: Db, shopId: string, orderId: string): WorkOrder {
  const order = repo.order(db, shopId, orderId);
  if (!order) throw notFound('We could not find that order in your shop.');
  const lines = repo.linesOfOrder(db, order.id);
  const shop = repo.shop(db, shopId);
  const events = repo.events(db, lines.map((l) => l.id));
  const people = new Map(repo.users(db, [...new Set([order.buyerId, ...events.map((e) => e.actorId).filter((x): x is string => !!x)])]).map((u) => [u.id, u]));
  const buyer = people.get(order.buyerId);
  const timeline: TimelineEvent[] = events.map((e) => ({
    id: e.id,
    lineId: e.lineId,
    fromState: e.fromState as LineState | null,
    toState: e.toState as LineState,
    message: e.message,
    at: e.createdAt,
    actorName: e.actorId ? (people.get(e.actorId)?.name ?? 'Someone') : null,
    actorRole: e.actorId === null ? null : e.actorId === order.buyerId ? 'shopper' : e.actorId === shop?.ownerId ? 'shop' : 'namesake',
  }));
  return {
    id: order.id,
    number: order.number,
    buyerName: buyer?.name ?? 'A shopper',
    buyerEmail: buyer?.email ?? '',
    paidAt: order.paidAt,
    shipByDate: order.shipByDate,
    currency: order.currency,
    totalMinor: order.totalMinor,
    carrier: order.carrier,
    trackingNumber: order.trackingNumber,
    shippedAt: order.shippedAt,
    shipTo: parseShipTo(order.shipTo),
    lines: views(db, shopId, lines.map((line) => ({ line, order }))),
    timeline,
  };
}

// ---------------------------------------------------------------- proofs

/** Characters people mistake for others or can't see; named on the proof. */
const CHAR_NAMES: Record<number, string> = {
  0x20: 'space', 0xa0: 'no-break space', 0x2007: 'figure space', 0x200b: 'zero-width space', 0x200c: 'zero-width non-joiner', 0x200d: 'zero-width joiner',
  0x2060: 'word joiner', 0xfeff: 'zero-width no-break space', 0x09: 'tab',
  0x300: 'combining grave accent', 0x301: 'combining acute accent', 0x302: 'combining circumflex', 0x303: 'combining tilde', 0x304: 'combining macron',
  0x306: 'combining breve', 0x307: 'combining dot above', 0x308: 'combining diaeresis', 0x30a: 'combining ring above', 0x30b: 'combining double acute',
  0x30c: 'combining caron', 0x327: 'combining cedilla', 0x328: 'combining ogonek',
  0x2018: 'left single quotation mark', 0x2019: 'right single quotation mark (apostrophe)', 0x2010: 'hyphen', 0x2013: 'en dash', 0x2014: 'em dash',
  0x0430: 'Cyrillic small a', 0x0435: 'Cyrillic small ie', 0x043e: 'Cyrillic small o', 0x0440: 'Cyrillic small er', 0x0441: 'Cyrillic small es', 0x0456: 'Cyrillic small i',
};
const hex = (cp: number) => `U+${cp.toString(16).toUpperCase().padStart(4, '0')}`;

/** The text letter by letter: one entry per code point, so a combining mark is its own entry. */
export function charsOf(text: string): CharInfo[] {
  return [...text].map((ch) => {
    const cp = ch.codePointAt(0)!;
    return { char: ch, codePoints: [hex(cp)], ascii: cp >= 0x20 && cp < 0x7f, name: CHAR_NAMES[cp] ?? (/\p{M}/u.test(ch) ? 'combining mark' : null) };
  });
}

function normalForm(text: string): ProofText['normalized'] {
  if (/^[\x20-\x7e]*$/.test(text)) return 'ascii';
  const nfc = text.normalize('NFC') === text;
  const nfd = text.normalize('NFD') === text;
  return nfc ? 'NFC' : nfd ? 'NFD' : 'mixed';
}

function listingContent(db: Db, listingId: string): { personalisation: Personalisation | null; topOffsetMm: number | null } {
  const l = repo.listing(db, listingId);
  const c = l?.live ?? l?.draft;
  const p = personalisationSchema.safeParse(c?.personalisation);
  return { personalisation: p.success ? p.data : null, topOffsetMm: typeof c?.blank?.topOffsetMm === 'number' ? c.blank.topOffsetMm : null };
}

export function proofBlank(s: LineSnapshot, topOffsetMm: number | null): Proof['blank'] {
  const base = defaultBlank(s.blank.kind) ?? defaultBlank('tote')!;
  const top = topOffsetMm ?? base.topOffsetMm;
  return {
    kind: s.blank.kind,
    name: s.blank.label || base.name,
    widthMm: base.widthMm,
    heightMm: base.heightMm,
    printArea: { xMm: (base.widthMm - s.blank.widthMm) / 2, yMm: top, widthMm: s.blank.widthMm, heightMm: s.blank.heightMm },
  };
}

/**
 * Warnings for the seller: the engine's text warnings on the text exactly as typed (extra spaces,
 * mixed case), the fit warnings at the blank's size (small letters, very long name, characters the
 * font can't draw), and a note when the text holds letters outside ASCII or combining marks.
 */
export function proofWarnings(s: LineSnapshot, p: Personalisation | null, topOffsetMm: number | null): { texts: ProofText[]; warnings: ProofWarning[] } {
  const registry = getFontRegistry();
  const base = defaultBlank(s.blank.kind) ?? defaultBlank('tote')!;
  // the blank as the cart composed on it (the listing's print area and top offset)
  const blank = blankFor({ blank: { ...s.blank, topOffsetMm: topOffsetMm ?? base.topOffsetMm } });
  const area = usableArea(blank);
  const entries = Object.entries(s.choices.texts).filter(([, t]) => t.text.trim() !== '');
  const blocks = entries.length + (s.choices.motifId ? 1 : 0);
  const stackGaps = Math.max(0, blocks - 1) * 8;
  const texts: ProofText[] = [];
  const warnings: ProofWarning[] = [];
  for (const [fieldId, t] of entries) {
    const field = p?.textFields.find((f) => f.id === fieldId);
    const label = field?.label ?? fieldId;
    texts.push({ fieldId, label, text: t.text, fontId: t.fontId, letterHeightMm: null, chars: charsOf(t.text), normalized: normalForm(t.text) });
    for (const w of textWarnings(t.text)) warnings.push({ code: w.code, fieldId, message: `${label}: ${w.message}` });
    try {
      // The motif takes about 55 % of the height (cart/design.ts); the text gets what is left.
      const motifShare = s.choices.motifId ? Math.min(blank.printArea.heightMm * 0.55, 120) : 0;
      const fitted = fitText(registry, { text: t.text.trim(), fontId: t.fontId, letterHeightMm: t.letterHeightMm }, {
        maxWidthMm: area.widthMm,
        maxHeightMm: Math.max(1, area.heightMm - stackGaps - motifShare),
        maxChars: field?.maxLength,
      });
      texts[texts.length - 1]!.letterHeightMm = Math.round(fitted.letterHeightMm * 10) / 10;
      for (const w of fitted.warnings) {
        if (w.code === 'extra_spaces' || w.code === 'mixed_case') continue; // already said on the raw text
        warnings.push({ code: w.code, fieldId, message: `${label}: ${w.message}` });
      }
      if (fitted.scale < 0.999 && !fitted.warnings.some((w) => w.code === 'too_long')) {
        warnings.push({ code: 'shrunk_to_fit', fieldId, message: `${label}: shrunk to ${fitted.letterHeightMm.toFixed(1)} mm letters to fit the print area (chosen ${t.letterHeightMm} mm).` });
      }
    } catch {
      warnings.push({ code: 'font_unavailable', fieldId, message: `${label}: the font ${t.fontId} is not available on this server.` });
    }
    const outside = [...new Set([...t.text].filter((c) => !/[\x20-\x7e]/.test(c)))];
    if (outside.length) {
      warnings.push({ code: 'non_ascii', fieldId, message: `${label}: contains ${outside.map((c) => `“${/\p{M}/u.test(c) ? `◌${c}` : c}” ${hex(c.codePointAt(0)!)}`).join(', ')} — check the spelling letter by letter.` });
    }
    if (normalForm(t.text) === 'NFD' || normalForm(t.text) === 'mixed') {
      warnings.push({ code: 'combining_marks', fieldId, message: `${label}: an accent is typed as a separate combining mark; the cut comes out the same, but check it sits on the right letter.` });
    }
  }
  return { texts, warnings };
}

export function proof(db: Db, shopId: string, lineId: string): Proof {
  const row = ownLine(db, shopId, lineId);
  const s = snap(row.line);
  const { personalisation, topOffsetMm } = listingContent(db, row.line.listingId);
  const { texts, warnings } = proofWarnings(s, personalisation, topOffsetMm);
  const versions = repo.versions(db, row.line.id);
  const authors = new Map(repo.users(db, versions.map((v) => v.authorId).filter((x): x is string => !!x)).map((u) => [u.id, u.name]));
  const events = repo.events(db, [row.line.id]);
  const lastRequest = [...events].reverse().find((e) => e.toState === 'changes_requested');
  return {
    line: views(db, shopId, [row])[0]!,
    snapshot: s,
    blank: proofBlank(s, topOffsetMm),
    texts,
    warnings,
    versions: versions.map((v): ProofVersion => {
      const vs = v.snapshot;
      return { version: v.version, createdAt: v.createdAt, authorName: v.authorId ? (authors.get(v.authorId) ?? null) : null, summary: vs.summary, texts: Object.values(vs.choices.texts).map((t) => t.text) };
    }),
    changeRequest: row.line.state === 'changes_requested' ? (lastRequest?.message ?? null) : null,
  };
}

/** Approves one or more proofs (all or nothing): each must be the shop's and awaiting its proof. */
export function approve(deps: WorkroomDeps, shopId: string, actorId: string, lineIds: string[]): WorkLine[] {
  const { db } = deps;
  const rows = repo.linesByIds(db, shopId, lineIds);
  if (rows.length !== lineIds.length) throw notFound('Some of these lines were not found in your shop.');
  const wrong = rows.filter((r) => r.line.state !== 'awaiting_proof');
  if (wrong.length) {
    throw new AppError(409, 'wrong_state', `Only proofs waiting for a check can be approved: ${wrong.map((r) => `${r.order.number} (${r.line.state.replace(/_/g, ' ')})`).join(', ')}.`,
      Object.fromEntries(wrong.map((r) => [`lineIds.${r.line.id}`, r.line.state])));
  }
  const at = deps.now();
  db.transaction((tx) => {
    for (const r of rows) move(tx as unknown as Db, r.line, 'approved', actorId, at, `Proof approved (version ${r.line.version}).`);
  });
  return views(db, shopId, repo.linesByIds(db, shopId, lineIds));
}

export async function requestChange(deps: WorkroomDeps, shopId: string, actorId: string, lineId: string, message: string): Promise<WorkLine> {
  const { db } = deps;
  const row = ownLine(db, shopId, lineId);
  requireState(row.line, ['awaiting_proof'], 'ask for a change to');
  move(db, row.line, 'changes_requested', actorId, deps.now(), message);
  const buyer = repo.users(db, [row.order.buyerId])[0];
  const shop = repo.shop(db, shopId);
  if (buyer) {
    await deps.mailer
      .send(changeRequestMail(buyer, { shopName: shop?.name ?? 'The shop', orderNumber: row.order.number, orderId: row.order.id, lineTitle: row.line.listingTitle, text: lineText(snap(row.line)), message }, deps.env.baseUrl))
      .catch((e: unknown) => console.error('workroom: change-request e-mail failed', e));
  }
  return views(db, shopId, [ownLine(db, shopId, lineId)])[0]!;
}

// ---------------------------------------------------------------- cut sheets

const r3 = (v: number) => Math.round(v * 1000) / 1000;

function stockCheck(m: MaterialRow | undefined, needMm: number): WorkSheet['stock'] {
  const stockMm = m?.stockMm ?? 0;
  const afterMm = stockMm - needMm;
  return { stockMm, needMm, afterMm, low: afterMm < (m?.lowStockMm ?? 0), short: afterMm < 0 };
}

function sheetView(s: SheetRow, m: MaterialRow | undefined): WorkSheet {
  const pieces = s.pieces.map(({ lineId, orderNumber, layerId, xMm, yMm, widthMm, heightMm, rotated }) => ({ lineId, orderNumber, layerId, xMm, yMm, widthMm, heightMm, rotated }));
  return {
    id: s.id,
    batchId: s.batchId,
    state: s.state === 'cut' ? 'cut' : 'planned',
    material: { id: s.materialId, kind: m?.kind ?? 'unknown', colour: m?.colourName ?? 'unknown', colourHex: m?.colourHex ?? '#000000' },
    rollWidthMm: s.rollWidthMm,
    lengthMm: s.lengthMm,
    utilisation: s.utilisation,
    pieces,
    svgUrl: `/api/workroom/cut-sheets/${encodeURIComponent(s.id)}/svg`,
    consumedMm: s.consumedMm,
    cutAt: s.cutAt,
    createdAt: s.createdAt,
    stock: stockCheck(m, s.lengthMm + TRIM_ALLOWANCE_MM),
  };
}

/** The nested sheet as the core's CutSheet, for the SVG and the PDF. */
export function asCutSheet(s: SheetRow): CutSheet & { pieces: Array<{ id: string; path: string }> } {
  const stored = s.pieces;
  return {
    rollWidthMm: s.rollWidthMm,
    gapMm: DEFAULT_GAP_MM,
    marginMm: DEFAULT_MARGIN_MM,
    lengthMm: s.lengthMm,
    utilisation: s.utilisation,
    piecesAreaMm2: s.utilisation * s.rollWidthMm * s.lengthMm,
    placements: stored.map((p) => ({ pieceId: p.pieceId, lineId: p.lineId, orderNumber: p.orderNumber, layerId: p.layerId, xMm: p.xMm, yMm: p.yMm, widthMm: p.widthMm, heightMm: p.heightMm, rotated: p.rotated })),
    pieces: stored.map((p) => ({ id: p.pieceId, path: p.path })),
  };
}

/**
 * Nests the chosen approved lines' pieces: grouped by material (one sheet per material on its own
 * roll width), 6 mm gap and margins, rotation allowed (shared/engine/cut-sheets.ts). A line with
 * quantity n gives its pieces n times. All sheets of one call share a batch id.
 */
export async function buildCutSheets(deps: WorkroomDeps & Pick<AppDeps, 'pool'>, shopId: string, lineIds: string[]): Promise<{ batchId: string; sheets: WorkSheet[] }> {
  const { db } = deps;
  const rows = repo.linesByIds(db, shopId, lineIds);
  if (rows.length !== lineIds.length) throw notFound('Some of these lines were not found in your shop.');
  const wrong = rows.filter((r) => r.line.state !== 'approved');
  if (wrong.length) {
    throw new AppError(409, 'wrong_state', `Only approved lines go on cut sheets: ${wrong.map((r) => `${r.order.number} (${r.line.state.replace(/_/g, ' ')})`).join(', ')}.`,
      Object.fromEntries(wrong.map((r) => [`lineIds.${r.line.id}`, r.line.state])));
  }
  const mats = new Map(repo.materialsOfShop(db, shopId).map((m) => [m.id, m]));
  const groups = new Map<string, { material: MaterialRow; pieces: RawPiece[] }>();
  let pieceCount = 0;
  for (const { line, order } of rows) {
    const s = snap(line);
    pieceCount += line.quantity * s.geometry.pieces.length;
    if (pieceCount > MAX_NEST_PIECES) throw new AppError(400, 'limit_exceeded', `These lines make more than ${MAX_NEST_PIECES.toLocaleString('en')} pieces, the most one cut-sheet build nests. Choose fewer lines.`);
    for (let unit = 0; unit < line.quantity; unit++) {
      s.geometry.pieces.forEach((pc, i) => {
        const m = pc.materialId ? mats.get(pc.materialId) : undefined;
        if (!m) throw conflict(`Order ${order.number}: a piece's material is no longer in your materials. Add it back, or refund the line.`);
        let g = groups.get(m.id);
        if (!g) groups.set(m.id, (g = { material: m, pieces: [] }));
        g.pieces.push({
          id: `${line.id}:${unit + 1}:${i + 1}`,
          lineId: line.id,
          orderNumber: line.quantity > 1 ? `${order.number}·${unit + 1}` : order.number,
          layerId: `piece-${i + 1}`,
          path: pc.d,
        });
      });
    }
  }
  // measuring and nesting run in the worker pool (server/workers/tasks.ts measureAndNest), one
  // material at a time; an empty piece cuts nothing and is left out there
  const nestedByMaterial = new Map<string, CutSheet[]>();
  for (const g of groups.values()) {
    try {
      nestedByMaterial.set(g.material.id, await deps.pool.run({ kind: 'nest', rollWidthMm: g.material.rollWidthMm, pieces: g.pieces }));
    } catch (e) {
      if (e instanceof CutSheetError) throw new AppError(409, e.code, `${g.material.colourName} ${g.material.kind}: ${e.message}`);
      throw e;
    }
  }
  const batchId = crypto.randomUUID();
  const at = deps.now();
  const made: SheetRow[] = [];
  for (const g of groups.values()) {
    const nested = nestedByMaterial.get(g.material.id)!;
    const paths = new Map(g.pieces.map((p) => [p.id, p.path]));
    for (const n of nested) {
      const row = {
        id: crypto.randomUUID(),
        shopId,
        materialId: g.material.id,
        batchId,
        rollWidthMm: n.rollWidthMm,
        lengthMm: r3(n.lengthMm),
        utilisation: n.utilisation,
        pieces: n.placements.map((pl): StoredSheetPiece => ({
          pieceId: pl.pieceId, lineId: pl.lineId, orderNumber: pl.orderNumber ?? '', layerId: pl.layerId,
          xMm: pl.xMm, yMm: pl.yMm, widthMm: pl.widthMm, heightMm: pl.heightMm, rotated: pl.rotated, path: paths.get(pl.pieceId)!,
        })),
        state: 'planned',
        createdAt: at,
      };
      repo.insertSheet(db, row);
      made.push(repo.sheet(db, shopId, row.id)!);
    }
  }
  return { batchId, sheets: made.map((s) => sheetView(s, mats.get(s.materialId))) };
}

export function batch(db: Db, shopId: string, batchId: string): WorkSheet[] {
  const rows = repo.sheetsOfBatch(db, shopId, batchId);
  if (!rows.length) throw notFound('We could not find that batch of cut sheets.');
  const mats = new Map(repo.materialsOfShop(db, shopId).map((m) => [m.id, m]));
  return rows.map((s) => sheetView(s, mats.get(s.materialId)));
}

export function recentBatches(db: Db, shopId: string): Array<{ batchId: string; createdAt: number; sheets: number; planned: number; lineCount: number }> {
  const by = new Map<string, { batchId: string; createdAt: number; sheets: number; planned: number; lines: Set<string> }>();
  for (const s of repo.sheetsOfShop(db, shopId)) {
    let b = by.get(s.batchId);
    if (!b) by.set(s.batchId, (b = { batchId: s.batchId, createdAt: s.createdAt, sheets: 0, planned: 0, lines: new Set() }));
    b.sheets++;
    if (s.state !== 'cut') b.planned++;
    for (const p of s.pieces) b.lines.add(p.lineId);
  }
  return [...by.values()].slice(0, 20).map(({ lines, ...b }) => ({ ...b, lineCount: lines.size }));
}

export function sheetSvg(db: Db, shopId: string, sheetId: string): { svg: string; name: string } {
  const s = repo.sheet(db, shopId, sheetId);
  if (!s) throw notFound('We could not find that cut sheet.');
  const m = repo.material(db, shopId, s.materialId);
  const cs = asCutSheet(s);
  const name = `cut-sheet-${(m ? `${m.colourName}-${m.kind}` : 'material').toLowerCase().replace(/[^a-z0-9]+/g, '-')}-${s.id.slice(0, 8)}.svg`;
  // the blade follows each piece's outer outline, not the overlapping contours the font drew
  return { svg: cutSheetSvg(cs, cs.pieces.map((p) => ({ ...p, path: cutOutline(p.path) }))), name };
}

/**
 * Marks sheets cut: each takes its length plus the 25 mm trim allowance (from memory)
 * from its material's stock; a line moves to `cut` once every sheet of the batch holding its
 * pieces is cut. Stock never goes below zero: a shortfall is reported instead.
 */
export function markCut(deps: WorkroomDeps, shopId: string, actorId: string, sheetIds: string[]): MarkCutResult {
  const { db } = deps;
  const sheets = sheetIds.map((id) => repo.sheet(db, shopId, id));
  if (sheets.some((s) => !s)) throw notFound('We could not find that cut sheet.');
  const todo = (sheets as SheetRow[]).filter((s) => s.state !== 'cut');
  if (!todo.length) throw new AppError(409, 'already_cut', 'These sheets are marked cut already.');
  const at = deps.now();
  const warnings: StockWarning[] = [];
  const linesCut: string[] = [];
  db.transaction((tx) => {
    const t = tx as unknown as Db;
    for (const s of todo) {
      const m = repo.material(t, shopId, s.materialId);
      const consumed = r3(s.lengthMm + TRIM_ALLOWANCE_MM);
      const cost = m ? Math.round((consumed / 1000) * m.pricePerMetreMinor) : null;
      repo.setSheet(t, s.id, { state: 'cut', consumedMm: consumed, costMinor: cost, cutAt: at });
      if (!m) continue;
      const after = r3(m.stockMm - consumed);
      repo.setMaterial(t, m.id, { stockMm: Math.max(0, after) });
      const label = `${m.colourName} ${m.kind}`;
      if (after < 0) warnings.push({ materialId: m.id, level: 'short', message: `${label}: this sheet needed ${consumed} mm but only ${m.stockMm} mm was in stock — short by ${r3(-after)} mm. Stock is now 0; check the roll and update it.` });
      else if (after < m.lowStockMm) warnings.push({ materialId: m.id, level: 'low', message: `${label}: ${after} mm left, under your low-stock mark of ${m.lowStockMm} mm. Time to reorder.` });
    }
    const lineIds = [...new Set(todo.flatMap((s) => s.pieces.map((p) => p.lineId)))];
    for (const { line } of repo.linesByIds(t, shopId, lineIds)) {
      if (line.state !== 'approved') continue;
      const batches = new Set(todo.filter((s) => s.pieces.some((p) => p.lineId === line.id)).map((s) => s.batchId));
      const allCut = [...batches].every((b) => repo.sheetsOfBatch(t, shopId, b).filter((s) => s.pieces.some((p) => p.lineId === line.id)).every((s) => s.state === 'cut'));
      if (allCut) {
        move(t, line, 'cut', actorId, at, 'All its pieces are cut.');
        linesCut.push(line.id);
      }
    }
  });
  const mats = new Map(repo.materialsOfShop(db, shopId).map((m) => [m.id, m]));
  return { sheets: todo.map((s) => sheetView(repo.sheet(db, shopId, s.id)!, mats.get(s.materialId))), linesCut, warnings };
}

// ---------------------------------------------------------------- press cards

const asKind = (k: string): MaterialKind => ((MATERIAL_KINDS as readonly string[]).includes(k) ? (k as MaterialKind) : 'smooth');

export function pressCardFor(db: Db, shopId: string, row: Row, mats?: Map<string, MaterialRow>): PressCardView {
  const shop = repo.shop(db, shopId);
  const materials = mats ?? new Map(repo.materialsOfShop(db, shopId).map((m) => [m.id, m]));
  const s = snap(row.line);
  const layers = lineMaterialIds(s).map((id) => {
    const m = materials.get(id);
    const pp = m?.pressProfile;
    return {
      layerId: id,
      materialKind: asKind(m?.kind ?? 'smooth'),
      colourName: (m?.colourName ?? 'Unknown colour').slice(0, 40),
      ...(pp ? { profile: { handheld: pp.handheld, clamshell: pp.clamshell, tackS: pp.tackS, peel: pp.peel, topOnly: pp.topOnly } } : {}),
    };
  });
  const { topOffsetMm } = listingContent(db, row.line.listingId);
  const b = proofBlank(s, topOffsetMm);
  const card = pressCard({
    pressType: (shop?.pressType === 'handheld' ? 'handheld' : 'clamshell') as PressType,
    layers: layers.length ? layers : [{ layerId: 'design', materialKind: 'smooth', colourName: 'Design' }],
    blank: { kind: s.blank.kind, name: b.name, topOffsetMm: b.printArea.yMm },
  });
  return { line: views(db, shopId, [row])[0]!, card };
}

export function pressCards(db: Db, shopId: string, opts: { lineId?: string; state?: LineState }): PressCardView[] {
  const rows = opts.lineId ? [ownLine(db, shopId, opts.lineId)] : repo.linesOfShop(db, shopId, opts.state ?? 'cut');
  const mats = new Map(repo.materialsOfShop(db, shopId).map((m) => [m.id, m]));
  return rows.map((r) => pressCardFor(db, shopId, r, mats));
}

export function markPressed(deps: WorkroomDeps, shopId: string, actorId: string, lineIds: string[]): WorkLine[] {
  const { db } = deps;
  const rows = repo.linesByIds(db, shopId, lineIds);
  if (rows.length !== lineIds.length) throw notFound('Some of these lines were not found in your shop.');
  for (const r of rows) requireState(r.line, ['cut'], 'mark pressed');
  const at = deps.now();
  db.transaction((tx) => {
    for (const r of rows) move(tx as unknown as Db, r.line, 'pressed', actorId, at, 'Pressed.');
  });
  return views(db, shopId, repo.linesByIds(db, shopId, lineIds));
}

// ---------------------------------------------------------------- shipping

const DONE: LineState[] = ['shipped', 'cancelled', 'refunded'];

export async function ship(deps: WorkroomDeps, shopId: string, actorId: string, orderId: string, input: { carrier: string; trackingNumber: string }): Promise<WorkOrder> {
  const { db } = deps;
  const order = repo.order(db, shopId, orderId);
  if (!order) throw notFound('We could not find that order in your shop.');
  const lines = repo.linesOfOrder(db, order.id).filter((l) => !DONE.includes(l.state as LineState));
  if (!lines.length) throw new AppError(409, 'nothing_to_ship', 'Every item of this order is shipped, cancelled or refunded already.');
  const notPressed = lines.filter((l) => l.state !== 'pressed');
  if (notPressed.length) {
    throw new AppError(409, 'wrong_state', `Press every item before shipping: ${notPressed.map((l) => `${l.listingTitle} is ${l.state.replace(/_/g, ' ')}`).join('; ')}.`);
  }
  const at = deps.now();
  db.transaction((tx) => {
    const t = tx as unknown as Db;
    repo.setOrder(t, order.id, { carrier: input.carrier, trackingNumber: input.trackingNumber, shippedAt: at });
    for (const l of lines) move(t, l, 'shipped', actorId, at, `Shipped with ${input.carrier}, tracking ${input.trackingNumber}.`);
  });
  const buyer = repo.users(db, [order.buyerId])[0];
  const shop = repo.shop(db, shopId);
  if (buyer) {
    const items = lines.map((l) => `${l.quantity} × ${l.listingTitle}${lineText(snap(l)) ? ` — ${lineText(snap(l))}` : ''}`);
    await deps.mailer
      .send(shippedMail(buyer, { shopName: shop?.name ?? 'The shop', orderNumber: order.number, orderId: order.id, carrier: input.carrier, trackingNumber: input.trackingNumber, items }, deps.env.baseUrl))
      .catch((e: unknown) => console.error('workroom: shipped e-mail failed', e));
  }
  return orderView(db, shopId, order.id);
}

// ---------------------------------------------------------------- stock

/** Every roll in use with what uncut sheets will take from it; the sheets' use a page at a time. */
export function stock(db: Db, shopId: string, q: PageQuery): StockView {
  const shop = repo.shop(db, shopId);
  const sheets = repo.sheetsPage(db, shopId, q.limit, pageOffset(q));
  // each uncut sheet takes its nested length plus the trim
  const planned = new Map(repo.plannedByMaterial(db, shopId).map((p) => [p.materialId, p.lengthMm + p.sheets * TRIM_ALLOWANCE_MM]));
  return {
    currency: shop?.currency ?? 'USD',
    trimMm: TRIM_ALLOWANCE_MM,
    materials: repo.materialsOfShop(db, shopId).filter((m) => !m.archived).map((m) => ({
      id: m.id, kind: m.kind, colourName: m.colourName, colourHex: m.colourHex, rollWidthMm: m.rollWidthMm, stockMm: m.stockMm, lowStockMm: m.lowStockMm,
      low: m.stockMm < m.lowStockMm, plannedMm: r3(planned.get(m.id) ?? 0),
    })),
    sheets: toPage(
      sheets.map((s) => ({
        id: s.id, batchId: s.batchId, materialId: s.materialId, state: s.state === 'cut' ? ('cut' as const) : ('planned' as const), lengthMm: s.lengthMm, consumedMm: s.consumedMm,
        costMinor: s.costMinor, cutAt: s.cutAt, createdAt: s.createdAt, lineCount: new Set(s.pieces.map((p) => p.lineId)).size,
      })),
      repo.sheetsCount(db, shopId),
      q,
    ),
  };
}

/** Sets a roll's low-stock mark; answers with the stock view's first page. */
export function setLowStock(db: Db, shopId: string, materialId: string, lowStockMm: number): StockView {
  const m = repo.material(db, shopId, materialId);
  if (!m) throw notFound('We could not find that material in your shop.');
  repo.setMaterial(db, m.id, { lowStockMm });
  return stock(db, shopId, stockQuerySchema.parse({}));
}

export { snap as lineSnapshot, lineText, views as lineViews, ownLine };
