// The worksheet_jobs table: every Drizzle call of the work sheet PDF jobs (worksheet-jobs.ts).
import { and, asc, eq, lt } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { worksheetJobs } from '../../db/schema.ts';

export type WorksheetJobRow = typeof worksheetJobs.$inferSelect;

export const worksheetJobsRepo = {
  insert(db: Db, row: typeof worksheetJobs.$inferInsert): void {
    db.insert(worksheetJobs).values(row).run();
  },
  byId(db: Db, id: string): WorksheetJobRow | undefined {
    return db.select().from(worksheetJobs).where(eq(worksheetJobs.id, id)).get();
  },
  /** The oldest queued job, marked running in the same step; null when none is waiting (or another took it). */
  claimNext(db: Db, now: number): WorksheetJobRow | null {
    const next = db.select({ id: worksheetJobs.id }).from(worksheetJobs).where(eq(worksheetJobs.state, 'queued')).orderBy(asc(worksheetJobs.createdAt)).limit(1).get();
    if (!next) return null;
    const r = db
      .update(worksheetJobs)
      .set({ state: 'running', updatedAt: now })
      .where(and(eq(worksheetJobs.id, next.id), eq(worksheetJobs.state, 'queued')))
      .run();
    return r.changes === 1 ? (this.byId(db, next.id) ?? null) : null;
  },
  progress(db: Db, id: string, progress: number, now: number): void {
    db.update(worksheetJobs)
      .set({ progress, updatedAt: now })
      .where(and(eq(worksheetJobs.id, id), eq(worksheetJobs.state, 'running')))
      .run();
  },
  finish(db: Db, id: string, set: { state: 'done' | 'failed'; error?: string | null }, now: number): void {
    db.update(worksheetJobs)
      .set({ state: set.state, error: set.error ?? null, progress: set.state === 'done' ? 1 : undefined, input: null, updatedAt: now })
      .where(eq(worksheetJobs.id, id))
      .run();
  },
  /** Jobs left running by a holder that died: queued again for the new holder. */
  requeueRunning(db: Db, now: number): number {
    return db.update(worksheetJobs).set({ state: 'queued', progress: 0, updatedAt: now }).where(eq(worksheetJobs.state, 'running')).run().changes;
  },
  /** Ids of jobs made before `before` (expired), then removed. */
  deleteOlderThan(db: Db, before: number): string[] {
    return db
      .delete(worksheetJobs)
      .where(lt(worksheetJobs.createdAt, before))
      .returning({ id: worksheetJobs.id })
      .all()
      .map((r) => r.id);
  },
};
