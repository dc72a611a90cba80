// Work sheet PDFs are built in the background: POST starts a job, GET polls its progress (the
// fraction of pages buildWorksheetPdf reports), then the file is fetched once it is done. A job is a
// row in worksheet_jobs and its PDF a file in DATA_DIR/worksheets, so with several server processes
// (WORKERS) any of them answers its state and file. Only one process builds: the holder of the
// once-only lease (server/jobs/lease.ts) runs the builder, which takes queued jobs one at a time into
// its worker pool. Jobs are kept for 15 minutes; each belongs to one shop and is "not found" for any other.
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { MAX_WORKSHEET_PAGES } from '../../../shared/engine/limits.ts';
import { parseShipTo, shipToLines } from '../../../shared/schemas/checkout.ts';
import type { WorksheetJob } from '../../../shared/schemas/workroom.ts';
import type { Db } from '../../db/client.ts';
import type { OnceOnlyWorker } from '../../deps.ts';
import { AppError, notFound } from '../../http/app-error.ts';
import type { WorkPool } from '../../workers/pool.ts';
import { type Paper, worksheetInputSchema, worksheetPageCount } from '../../workers/worksheet-pdf.ts';
import { asCutSheet } from './cut-sheets.service.ts';
import { lineSnapshot, lineText, lineTitle } from './lines.service.ts';
import { pressCardFor } from './press.service.ts';
import { workroomRepo as repo } from './workroom.repo.ts';
import { worksheetJobsRepo as jobsRepo, type WorksheetJobRow } from './worksheet-jobs.repo.ts';

const TTL_MS = 15 * 60_000;
/** Progress is written to the database at most this often (and at each 5 % step). */
const PROGRESS_EVERY_MS = 250;

type BuilderDeps = { db: Db; pool: WorkPool; now: () => number; dir: string };

const fileOf = (dir: string, id: string) => path.join(dir, `${id}.pdf`);

/**
 * Builds queued jobs one at a time, while active. `kick` looks for work now (after a job is queued
 * in this process); with `pollMs` it also looks every so often, for jobs queued by other processes.
 */
export function createWorksheetBuilder({ db, pool, now, dir }: BuilderDeps) {
  let active = false;
  let poll: NodeJS.Timeout | null = null;
  let busy: Promise<void> | null = null;
  let again = false;
  let swept = 0;

  const sweep = () => {
    if (now() - swept < 60_000) return;
    swept = now();
    for (const id of jobsRepo.deleteOlderThan(db, now() - TTL_MS)) fs.rmSync(fileOf(dir, id), { force: true });
  };

  async function build(job: WorksheetJobRow) {
    let last = { at: 0, f: 0 };
    const onProgress = (f: number) => {
      if (f - last.f < 0.05 && now() - last.at < PROGRESS_EVERY_MS) return;
      last = { at: now(), f };
      jobsRepo.progress(db, job.id, Math.min(0.99, f), now());
    };
    try {
      const pdf = await pool.worksheet(worksheetInputSchema.parse(job.input), onProgress);
      fs.mkdirSync(dir, { recursive: true });
      const tmp = `${fileOf(dir, job.id)}.${process.pid}.tmp`;
      fs.writeFileSync(tmp, pdf);
      fs.renameSync(tmp, fileOf(dir, job.id));
      jobsRepo.finish(db, job.id, { state: 'done' }, now());
    } catch (e) {
      console.error('workroom: work sheet PDF failed', e);
      // a time limit or a bound says which; anything else is ours
      const error = e instanceof AppError ? e.message : 'The work sheet could not be built. Please try again.';
      jobsRepo.finish(db, job.id, { state: 'failed', error }, now());
    }
  }

  async function drain() {
    do {
      again = false;
      sweep();
      for (let job = jobsRepo.claimNext(db, now()); job && active; job = active ? jobsRepo.claimNext(db, now()) : null) await build(job);
    } while (again && active);
  }

  const kick = () => {
    if (!active) return;
    if (busy) {
      again = true;
      return;
    }
    busy = drain()
      .catch((e: unknown) => console.error('workroom: work sheet builder failed', e))
      .finally(() => (busy = null));
  };

  return {
    kick,
    /** Starts building (this process holds the lease); jobs a dead holder left running are queued again. */
    activate(opts: { pollMs?: number } = {}) {
      if (active) return;
      active = true;
      jobsRepo.requeueRunning(db, now());
      if (opts.pollMs) {
        poll = setInterval(kick, opts.pollMs);
        poll.unref();
      }
      kick();
    },
    /** Stops taking jobs and waits for the one being built. */
    async deactivate() {
      active = false;
      if (poll) clearInterval(poll);
      poll = null;
      await busy;
    },
  };
}
export type WorksheetBuilder = ReturnType<typeof createWorksheetBuilder> & OnceOnlyWorker;

/** What the routes use: start a job (queued for the builder), read its state, fetch its file. */
export function createWorksheetJobs({ db, now, dir, builder }: { db: Db; now: () => number; dir: string; builder: Pick<WorksheetBuilder, 'kick'> }) {
  const view = (j: WorksheetJobRow): WorksheetJob => ({
    id: j.id,
    // a queued job is shown as running at 0 %: to the seller it has started
    state: j.state === 'queued' ? 'running' : (j.state as WorksheetJob['state']),
    progress: Math.round(j.progress * 1000) / 1000,
    pages: j.pages,
    downloadUrl: j.state === 'done' ? `/api/workroom/worksheets/${j.id}/file` : null,
    error: j.error,
  });
  const mine = (shopId: string, id: string) => {
    const j = jobsRepo.byId(db, id);
    return j && j.shopId === shopId && now() - j.createdAt <= TTL_MS ? j : null;
  };

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
    start(shopId: string, batchId: string, paper: Paper): WorksheetJob {
      const input = inputFor(db, shopId, batchId, paper);
      const pages = worksheetPageCount(input);
      if (pages > MAX_WORKSHEET_PAGES) {
        throw new AppError(400, 'limit_exceeded', `This work sheet would have ${pages} pages; the limit is ${MAX_WORKSHEET_PAGES}. Build cut sheets for fewer lines.`);
      }
      const at = now();
      const id = crypto.randomUUID();
      jobsRepo.insert(db, { id, shopId, batchId, paper, state: 'queued', progress: 0, pages, input, error: null, createdAt: at, updatedAt: at });
      builder.kick();
      return view(jobsRepo.byId(db, id)!);
    },
    get(shopId: string, id: string): WorksheetJob {
      const j = mine(shopId, id);
      if (!j) throw notFound('We could not find that work sheet. It may have expired; build it again.');
      return view(j);
    },
    file(shopId: string, id: string): { pdf: Buffer; name: string } {
      const j = mine(shopId, id);
      let pdf: Buffer | null = null;
      try {
        if (j?.state === 'done') pdf = fs.readFileSync(fileOf(dir, j.id));
      } catch {
        pdf = null; // swept meanwhile
      }
      if (!j || !pdf) throw notFound('That work sheet is not ready, or it has expired.');
      return { pdf, name: `work-sheet-${j.paper.toLowerCase()}-${j.batchId.slice(0, 8)}.pdf` };
    },
  };
}
export type WorksheetJobs = ReturnType<typeof createWorksheetJobs>;
