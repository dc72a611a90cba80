// Work sheet PDFs are built in the background: POST starts a job, GET polls its progress (the
// fraction of pages buildWorksheetPdf reports), then the file is fetched once it is done. Jobs live
// in memory for 15 minutes; each belongs to one shop and is "not found" for any other.
import crypto from 'node:crypto';
import { MAX_WORKSHEET_PAGES } from '../../../shared/engine/limits.ts';
import { parseShipTo, shipToLines } from '../../../shared/schemas/checkout.ts';
import type { WorksheetJob } from '../../../shared/schemas/workroom.ts';
import type { Db } from '../../db/client.ts';
import { AppError, notFound } from '../../http/app-error.ts';
import type { WorkPool } from '../../workers/pool.ts';
import { type Paper, worksheetInputSchema, worksheetPageCount } from '../../workers/worksheet-pdf.ts';
import { asCutSheet } from './cut-sheets.service.ts';
import { lineSnapshot, lineText, lineTitle } from './lines.service.ts';
import { pressCardFor } from './press.service.ts';
import { workroomRepo as repo } from './workroom.repo.ts';

type Job = { id: string; shopId: string; batchId: string; paper: Paper; state: WorksheetJob['state']; progress: number; pages: number | null; pdf: Buffer | null; error: string | null; at: number };

const TTL_MS = 15 * 60_000;

/** The PDFs are built in the worker pool (server/workers), with its time limit. */
export function createWorksheetJobs(pool: WorkPool, now: () => number = Date.now) {
  const jobs = new Map<string, Job>();
  const sweep = () => {
    for (const [id, j] of jobs) if (now() - j.at > TTL_MS) jobs.delete(id);
  };
  const view = (j: Job): WorksheetJob => ({
    id: j.id,
    state: j.state,
    progress: Math.round(j.progress * 1000) / 1000,
    pages: j.pages,
    downloadUrl: j.state === 'done' ? `/api/workroom/worksheets/${j.id}/file` : null,
    error: j.error,
  });

  /** The PDF's input for one batch: its sheets, a press card per line, a packing slip per order. */
  function inputFor(db: Db, shopId: string, batchId: string, paper: Paper) {
    const sheets = repo.sheetsOfBatch(db, shopId, batchId);
    if (!sheets.length) throw notFound('We could not find that batch of cut sheets.');
    const shop = repo.shop(db, shopId)!;
    const mats = new Map(repo.materialsOfShop(db, shopId).map((m) => [m.id, m]));
    const lineIds = [...new Set(sheets.flatMap((s) => s.pieces.map((p) => p.lineId)))];
    const rows = repo.linesByIds(db, shopId, lineIds).sort((a, b) => a.order.number.localeCompare(b.order.number));
    const buyers = new Map(repo.users(db, [...new Set(rows.map((r) => r.order.buyerId))]).map((u) => [u.id, u.name]));
    const orders = new Map<string, { orderNumber: string; buyerName: string; shipTo?: string[]; lines: Array<{ title: string; text?: string; quantity: number }> }>();
    for (const r of rows) {
      let o = orders.get(r.order.id);
      if (!o) {
        const shipTo = parseShipTo(r.order.shipTo);
        o = { orderNumber: r.order.number, buyerName: buyers.get(r.order.buyerId) ?? 'A shopper', ...(shipTo ? { shipTo: shipToLines(shipTo).map((l) => l.slice(0, 200)) } : {}), lines: [] };
        orders.set(r.order.id, o);
      }
      o.lines.push({ title: lineTitle(r.line).slice(0, 200), text: lineText(lineSnapshot(r.line)).slice(0, 500), quantity: r.line.quantity });
    }
    return worksheetInputSchema.parse({
      paper,
      shopName: shop.name,
      batchLabel: `Batch of ${new Date(sheets[0]!.createdAt).toISOString().slice(0, 10)} — ${sheets.length} sheet${sheets.length === 1 ? '' : 's'}, ${rows.length} item${rows.length === 1 ? '' : 's'}`,
      sheets: sheets.map((s) => {
        const m = mats.get(s.materialId);
        const cs = asCutSheet(s);
        return { id: s.id, material: { kind: m?.kind ?? 'unknown', colour: m?.colourName ?? 'unknown' }, ...cs };
      }),
      cards: rows.map((r) => ({
        orderNumber: r.order.number,
        lineTitle: lineTitle(r.line).slice(0, 200),
        text: lineText(lineSnapshot(r.line)).slice(0, 500),
        pressCard: pressCardFor(db, shopId, r, mats).card,
      })),
      packingSlips: [...orders.values()],
    });
  }

  return {
    start(db: Db, shopId: string, batchId: string, paper: Paper): WorksheetJob {
      sweep();
      const input = inputFor(db, shopId, batchId, paper);
      const pages = worksheetPageCount(input);
      if (pages > MAX_WORKSHEET_PAGES) {
        throw new AppError(400, 'limit_exceeded', `This work sheet would have ${pages} pages; the limit is ${MAX_WORKSHEET_PAGES}. Build cut sheets for fewer lines.`);
      }
      const job: Job = { id: crypto.randomUUID(), shopId, batchId, paper, state: 'running', progress: 0, pages, pdf: null, error: null, at: now() };
      jobs.set(job.id, job);
      pool
        .worksheet(input, (f) => (job.progress = f))
        .then((pdf) => {
          job.pdf = pdf;
          job.progress = 1;
          job.state = 'done';
        })
        .catch((e: unknown) => {
          console.error('workroom: work sheet PDF failed', e);
          job.state = 'failed';
          // a time limit or a bound says which; anything else is ours
          job.error = e instanceof AppError ? e.message : 'The work sheet could not be built. Please try again.';
        });
      return view(job);
    },
    get(shopId: string, id: string): WorksheetJob {
      const j = jobs.get(id);
      if (!j || j.shopId !== shopId) throw notFound('We could not find that work sheet. It may have expired; build it again.');
      return view(j);
    },
    file(shopId: string, id: string): { pdf: Buffer; name: string } {
      const j = jobs.get(id);
      if (!j || j.shopId !== shopId || !j.pdf) throw notFound('That work sheet is not ready, or it has expired.');
      return { pdf: j.pdf, name: `work-sheet-${j.paper.toLowerCase()}-${j.batchId.slice(0, 8)}.pdf` };
    },
  };
}
export type WorksheetJobs = ReturnType<typeof createWorksheetJobs>;
