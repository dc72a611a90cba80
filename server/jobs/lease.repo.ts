// The leases table (server/db/schema.ts): every Drizzle call of the once-only lease.
import { and, eq, lte, or, sql } from 'drizzle-orm';
import type { Db } from '../db/client.ts';
import { leases } from '../db/schema.ts';

export const leaseRepo = {
  /**
   * Takes the lease, or renews it, in one statement (so two processes can never both win): the row
   * is written when it is missing, already ours, or expired. True when `holder` holds it now.
   */
  take(db: Db, name: string, holder: string, now: number, ttlMs: number): boolean {
    const r = db
      .insert(leases)
      .values({ name, holder, expiresAt: now + ttlMs })
      .onConflictDoUpdate({
        target: leases.name,
        set: { holder, expiresAt: now + ttlMs },
        setWhere: or(eq(leases.holder, holder), lte(leases.expiresAt, now)),
      })
      .run();
    return r.changes > 0;
  },
  /** Gives the lease up (only when `holder` has it), so another process may take it at once. */
  release(db: Db, name: string, holder: string): void {
    db.delete(leases)
      .where(and(eq(leases.name, name), eq(leases.holder, holder)))
      .run();
  },
  /** Ends `holder`'s lease now (its process is gone), so the next take succeeds. */
  expire(db: Db, name: string, holder: string): void {
    db.update(leases)
      .set({ expiresAt: 0 })
      .where(and(eq(leases.name, name), eq(leases.holder, holder)))
      .run();
  },
  /** Who holds the lease now (an expired row counts as nobody). */
  holder(db: Db, name: string, now: number): string | null {
    const row = db
      .select({ holder: leases.holder })
      .from(leases)
      .where(and(eq(leases.name, name), sql`${leases.expiresAt} > ${now}`))
      .get();
    return row?.holder ?? null;
  },
};
