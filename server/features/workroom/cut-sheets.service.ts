// Cut sheets: approved lines' pieces nested per material on the roll, their SVG for the cutter,
// and marking sheets cut — which takes the vinyl from stock and moves a line to `cut` once all its
// pieces are cut (through orders' transition()). Building moves its lines to `planned`, so they are
// not offered again; discarding a batch that is not cut brings them back to `approved`.
import crypto from 'node:crypto';
import { withCutOutlines } from '../../../shared/engine/cut-path.ts';
import { cutSheetSvg } from '../../../shared/engine/cut-sheet-svg.ts';
import { type CutSheet, CutSheetError, DEFAULT_GAP_MM, DEFAULT_MARGIN_MM } from '../../../shared/engine/cut-sheets.ts';
import { MAX_NEST_PIECES } from '../../../shared/engine/limits.ts';
import { materialLabel } from '../../../shared/material-label.ts';
import { canMoveLine, type LineState } from '../../../shared/schemas/order.ts';
import type { Grouping, MarkCutResult, SheetLayout, StockWarning, StoredSheetPiece, WorkSheet } from '../../../shared/schemas/workroom.ts';
import { formatLength } from '../../../shared/units.ts';
import type { Db } from '../../db/client.ts';
import { AppError, conflict, notFound } from '../../http/app-error.ts';
import type { NestedSheet, RawPiece } from '../../workers/tasks.ts';
import { TRIM_ALLOWANCE_MM } from '../../workers/worksheet-pdf.ts';
import { assertEachCanMove, transition, transitionAll } from '../orders/index.ts';
import { lineSnapshot, type WorkroomDeps, type WorkroomPoolDeps } from './lines.service.ts';
import { type MaterialRow, workroomRepo as repo, type SheetRow } from './workroom.repo.ts';

/** Rounds a length to the micrometre, as stored. */
export const r3 = (v: number) => Math.round(v * 1000) / 1000;

function stockCheck(m: MaterialRow | undefined, needMm: number): WorkSheet['stock'] {
  const stockMm = m?.stockMm ?? 0;
  const afterMm = stockMm - needMm;
  return { stockMm, needMm, afterMm, low: afterMm < (m?.lowStockMm ?? 0), short: afterMm < 0 };
}

function sheetView(s: SheetRow, m: MaterialRow | undefined): WorkSheet {
  const pieces = s.pieces.map(({ lineId, orderNumber, layerId, xMm, yMm, widthMm, heightMm, rotated, rotation }) => ({
    lineId,
    orderNumber,
    layerId,
    xMm,
    yMm,
    widthMm,
    heightMm,
    rotated,
    ...(rotation !== undefined ? { rotation } : {}),
  }));
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
    grouping: s.layout?.grouping ?? 'tightest',
    groups: s.layout?.groups ?? [],
    extraLengthMm: s.layout ? r3(s.lengthMm - s.layout.tightestLengthMm) : 0,
  };
}

/** The nested sheet as the core's CutSheet, for the SVG and the PDF. */
export function asCutSheet(s: SheetRow): CutSheet & { pieces: Array<{ id: string; path: string }>; groups: SheetLayout['groups']; weedingLines: SheetLayout['lines'] } {
  const stored = s.pieces;
  return {
    rollWidthMm: s.rollWidthMm,
    gapMm: DEFAULT_GAP_MM,
    marginMm: DEFAULT_MARGIN_MM,
    lengthMm: s.lengthMm,
    utilisation: s.utilisation,
    piecesAreaMm2: s.utilisation * s.rollWidthMm * s.lengthMm,
    placements: stored.map((p) => ({
      pieceId: p.pieceId,
      lineId: p.lineId,
      orderNumber: p.orderNumber,
      layerId: p.layerId,
      xMm: p.xMm,
      yMm: p.yMm,
      widthMm: p.widthMm,
      heightMm: p.heightMm,
      rotated: p.rotated,
      ...(p.rotation !== undefined ? { rotation: p.rotation } : {}),
    })),
    pieces: stored.map((p) => ({ id: p.pieceId, path: p.path })),
    groups: s.layout?.groups ?? [],
    weedingLines: s.layout?.lines ?? [],
  };
}

/**
 * Nests the chosen approved lines' pieces: grouped by material (one sheet per material on its own
 * roll width), 6 mm gap and margins, rotation allowed (shared/engine/cut-sheets.ts). A line with
 * quantity n gives its pieces n times. All sheets of one call share a batch id.
 */
export async function buildCutSheets(
  deps: WorkroomPoolDeps,
  shopId: string,
  actorId: string,
  lineIds: string[],
  layout: { grouping?: Grouping; weedingLines?: boolean } = {},
): Promise<{ batchId: string; sheets: WorkSheet[] }> {
  const { db } = deps;
  const rows = repo.linesByIds(db, shopId, lineIds);
  if (rows.length !== lineIds.length) throw notFound('Some of these lines were not found in your shop.');
  assertNotPlanned(db, shopId, rows);
  // a line goes on a sheet when planning its cut is its next move
  assertEachCanMove(
    rows.map((r) => ({ id: r.line.id, state: r.line.state, name: r.order.number })),
    'planned',
    'shop',
    'Only approved lines go on cut sheets',
  );
  const mats = new Map(repo.materialsOfShop(db, shopId).map((m) => [m.id, m]));
  const groups = new Map<string, { material: MaterialRow; pieces: RawPiece[] }>();
  let pieceCount = 0;
  for (const { line, order } of rows) {
    const s = lineSnapshot(line);
    pieceCount += line.quantity * s.geometry.pieces.length;
    if (pieceCount > MAX_NEST_PIECES)
      throw new AppError(400, 'limit_exceeded', `These lines make more than ${MAX_NEST_PIECES.toLocaleString('en')} pieces, the most one cut-sheet build nests. Choose fewer lines.`);
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
          group: order.number,
          layerId: `piece-${i + 1}`,
          path: pc.d,
        });
      });
    }
  }
  // measuring and nesting run in the worker pool (server/workers/tasks.ts measureAndNest), each
  // material its own task; an empty piece cuts nothing and is left out there
  const nestedByMaterial = new Map<string, NestedSheet[]>();
  // materials nest side by side on the pool's threads
  await Promise.all(
    [...groups.values()].map(async (g) => {
      try {
        nestedByMaterial.set(g.material.id, await deps.pool.run({ kind: 'nest', rollWidthMm: g.material.rollWidthMm, pieces: g.pieces, grouping: layout.grouping, weedingLines: layout.weedingLines }));
      } catch (e) {
        if (e instanceof CutSheetError) throw new AppError(409, e.code, `${materialLabel(g.material)}: ${e.message}`);
        throw e;
      }
    }),
  );
  const batchId = crypto.randomUUID();
  const at = deps.now();
  const made: SheetRow[] = [];
  db.transaction((tx) => {
    const db = tx as unknown as Db;
    // read again inside the write: a build that finished while this one was nesting has planned them
    const now = repo.linesByIds(db, shopId, lineIds);
    assertNotPlanned(db, shopId, now);
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
          pieces: n.placements.map(
            (pl): StoredSheetPiece => ({
              pieceId: pl.pieceId,
              lineId: pl.lineId,
              orderNumber: pl.orderNumber ?? '',
              layerId: pl.layerId,
              xMm: pl.xMm,
              yMm: pl.yMm,
              widthMm: pl.widthMm,
              heightMm: pl.heightMm,
              rotated: pl.rotated,
              ...(pl.rotation !== undefined ? { rotation: pl.rotation } : {}),
              path: paths.get(pl.pieceId)!,
            }),
          ),
          layout:
            layout.grouping === 'order'
              ? { grouping: 'order' as const, weedingLines: layout.weedingLines ?? false, groups: n.groups ?? [], lines: n.weedingLines ?? [], tightestLengthMm: r3(n.tightestLengthMm ?? n.lengthMm) }
              : null,
          state: 'planned',
          createdAt: at,
        };
        repo.insertSheet(db, row);
        made.push(repo.sheet(db, shopId, row.id)!);
      }
    }
    transitionAll(
      db,
      now.map(({ line }) => ({ line, to: 'planned' as const, actor: 'shop' as const, actorId, at, message: `On cut-sheet batch ${batchName(batchId, at)}.` })),
    );
  });
  return { batchId, sheets: made.map((s) => sheetView(s, mats.get(s.materialId))) };
}

/** How a batch is named to people: its build time and the first characters of its id ("2 Dec 16:40 · 3f9a12c4"). */
export function batchName(batchId: string, createdAt: number): string {
  const d = new Date(createdAt);
  const month = d.toLocaleString('en-GB', { month: 'short', timeZone: 'UTC' });
  const hm = `${String(d.getUTCHours()).padStart(2, '0')}:${String(d.getUTCMinutes()).padStart(2, '0')}`;
  return `${d.getUTCDate()} ${month} ${hm} UTC · ${batchId.slice(0, 8)}`;
}

/** The uncut batch each of `lineIds` is planned on (a line is on at most one: building refuses a planned line). */
function plannedBatches(db: Db, shopId: string, lineIds: Set<string>): Map<string, { batchId: string; createdAt: number }> {
  const out = new Map<string, { batchId: string; createdAt: number }>();
  for (const s of repo.sheetsOfShop(db, shopId)) {
    if (s.state === 'cut') continue;
    for (const p of s.pieces) if (lineIds.has(p.lineId) && !out.has(p.lineId)) out.set(p.lineId, { batchId: s.batchId, createdAt: s.createdAt });
  }
  return out;
}

/**
 * A planned line is already on a cut sheet that is not cut yet: building with it again would cut
 * it twice and take its vinyl from stock twice. Answers 409 naming the batch (each line a field
 * `lineIds.<id>` holding its batch id) until that batch is discarded or cut.
 */
function assertNotPlanned(db: Db, shopId: string, rows: Array<{ line: { id: string; state: string }; order: { number: string } }>): void {
  const planned = rows.filter((r) => r.line.state === 'planned');
  if (!planned.length) return;
  const where = plannedBatches(db, shopId, new Set(planned.map((r) => r.line.id)));
  const parts = planned.map((r) => {
    const b = where.get(r.line.id);
    return `${r.order.number} is on batch ${b ? batchName(b.batchId, b.createdAt) : '(not found)'}`;
  });
  throw new AppError(
    409,
    'already_planned',
    `Already on a cut sheet: ${parts.join('; ')}. Cut that batch, or discard it to build again.`,
    Object.fromEntries(planned.map((r) => [`lineIds.${r.line.id}`, where.get(r.line.id)?.batchId ?? 'unknown'])),
  );
}

/**
 * Discards a batch none of whose sheets is cut: its sheets are deleted and its planned lines go
 * back to `approved` (through transition()), to be offered and built again.
 */
export function discardBatch(deps: WorkroomDeps, shopId: string, actorId: string, batchId: string): { batchId: string; linesReleased: string[] } {
  const { db } = deps;
  const sheets = repo.sheetsOfBatch(db, shopId, batchId);
  if (!sheets.length) throw notFound('We could not find that batch of cut sheets.');
  if (sheets.some((s) => s.state === 'cut')) throw new AppError(409, 'already_cut', 'Some sheets of this batch are cut already, so it cannot be discarded. Mark the rest cut instead.');
  const lineIds = [...new Set(sheets.flatMap((s) => s.pieces.map((p) => p.lineId)))];
  const at = deps.now();
  const released: string[] = [];
  db.transaction((tx) => {
    const t = tx as unknown as Db;
    const rows = repo.linesByIds(t, shopId, lineIds).filter((r) => r.line.state === 'planned');
    transitionAll(
      t,
      rows.map(({ line }) => ({ line, to: 'approved' as const, actor: 'shop' as const, actorId, at, message: `Cut-sheet batch ${batchName(batchId, sheets[0]!.createdAt)} discarded.` })),
    );
    repo.deleteBatch(t, shopId, batchId);
    released.push(...rows.map((r) => r.line.id));
  });
  return { batchId, linesReleased: released };
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

export function sheetSvg(db: Db, shopId: string, sheetId: string, opts: { labels?: boolean } = {}): { svg: string; name: string } {
  const s = repo.sheet(db, shopId, sheetId);
  if (!s) throw notFound('We could not find that cut sheet.');
  const m = repo.material(db, shopId, s.materialId);
  const cs = asCutSheet(s);
  const name = `cut-sheet-${(m ? `${m.colourName}-${m.kind}` : 'material').toLowerCase().replace(/[^a-z0-9]+/g, '-')}-${s.id.slice(0, 8)}.svg`;
  // the blade follows each piece's outer outline, not the overlapping contours the font drew
  return {
    svg: cutSheetSvg(cs, withCutOutlines(cs.pieces), opts),
    name,
  };
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
      const label = materialLabel(m);
      if (after < 0)
        warnings.push({
          materialId: m.id,
          level: 'short',
          message: `${label}: this sheet needed ${formatLength(consumed)} but only ${formatLength(m.stockMm)} was in stock — short by ${formatLength(-after)}. Stock is now 0; check the roll and update it.`,
        });
      else if (after < m.lowStockMm)
        warnings.push({ materialId: m.id, level: 'low', message: `${label}: ${formatLength(after)} left, under your low-stock mark of ${formatLength(m.lowStockMm)}. Time to reorder.` });
    }
    const lineIds = [...new Set(todo.flatMap((s) => s.pieces.map((p) => p.lineId)))];
    for (const { line } of repo.linesByIds(t, shopId, lineIds)) {
      if (!canMoveLine(line.state as LineState, 'cut', 'shop')) continue;
      const batches = new Set(todo.filter((s) => s.pieces.some((p) => p.lineId === line.id)).map((s) => s.batchId));
      const allCut = [...batches].every((b) =>
        repo
          .sheetsOfBatch(t, shopId, b)
          .filter((s) => s.pieces.some((p) => p.lineId === line.id))
          .every((s) => s.state === 'cut'),
      );
      if (allCut) {
        transition(t, { line, to: 'cut', actor: 'shop', actorId, at, message: 'All its pieces are cut.' });
        linesCut.push(line.id);
      }
    }
  });
  const mats = new Map(repo.materialsOfShop(db, shopId).map((m) => [m.id, m]));
  return { sheets: todo.map((s) => sheetView(repo.sheet(db, shopId, s.id)!, mats.get(s.materialId))), linesCut, warnings };
}
