// The rate_limit_hits table: every Drizzle call of the shared rate-limit store (rate-limit-store.ts).
import { eq, lt, sql } from 'drizzle-orm';
import type { Db } from '../db/client.ts';
import { rateLimitHits } from '../db/schema.ts';

export const rateLimitRepo = {
  /**
   * One more hit for `key` in one statement (atomic across processes): a window that has ended starts
   * again at 1 with a new reset time. Returns the hits in the window and when it ends.
   */
  hit(db: Db, key: string, now: number, windowMs: number): { hits: number; resetAt: number } {
    return db
      .insert(rateLimitHits)
      .values({ key, hits: 1, resetAt: now + windowMs })
      .onConflictDoUpdate({
        target: rateLimitHits.key,
        set: {
          hits: sql`CASE WHEN ${rateLimitHits.resetAt} <= ${now} THEN 1 ELSE ${rateLimitHits.hits} + 1 END`,
          resetAt: sql`CASE WHEN ${rateLimitHits.resetAt} <= ${now} THEN ${now + windowMs} ELSE ${rateLimitHits.resetAt} END`,
        },
      })
      .returning({ hits: rateLimitHits.hits, resetAt: rateLimitHits.resetAt })
      .get()!;
  },
  get(db: Db, key: string, now: number): { hits: number; resetAt: number } | undefined {
    const row = db.select({ hits: rateLimitHits.hits, resetAt: rateLimitHits.resetAt }).from(rateLimitHits).where(eq(rateLimitHits.key, key)).get();
    return row && row.resetAt > now ? row : undefined;
  },
  unhit(db: Db, key: string, now: number): void {
    db.update(rateLimitHits)
      .set({ hits: sql`max(0, ${rateLimitHits.hits} - 1)` })
      .where(sql`${rateLimitHits.key} = ${key} AND ${rateLimitHits.resetAt} > ${now}`)
      .run();
  },
  reset(db: Db, key: string): void {
    db.delete(rateLimitHits).where(eq(rateLimitHits.key, key)).run();
  },
  /** Rows whose window ended: nobody reads them again. */
  prune(db: Db, now: number): void {
    db.delete(rateLimitHits).where(lt(rateLimitHits.resetAt, now)).run();
  },
};
