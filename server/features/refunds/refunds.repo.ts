// Every database call of refunds that the orders repo does not already make: refund intents, the
// shop of an order, the audit row.
import { and, eq } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { auditLog, refundIntents, shops } from '../../db/schema.ts';

export type RefundIntentRow = typeof refundIntents.$inferSelect;

export const refundsRepo = {
  intentsOf: (db: Db, orderId: string) => db.select().from(refundIntents).where(eq(refundIntents.orderId, orderId)).orderBy(refundIntents.createdAt).all(),
  intent: (db: Db, id: string) => db.select().from(refundIntents).where(eq(refundIntents.id, id)).get(),
  insertIntent: (db: Db, row: typeof refundIntents.$inferInsert) => db.insert(refundIntents).values(row).run(),
  /** pending → succeeded; false when it is not pending (recorded already, or released) */
  markSucceeded: (db: Db, id: string, providerRefundId: string, at: number) =>
    db
      .update(refundIntents)
      .set({ state: 'succeeded', providerRefundId, error: null, updatedAt: at })
      .where(and(eq(refundIntents.id, id), eq(refundIntents.state, 'pending')))
      .run().changes === 1,
  /** releases a pending claim; false when it is no longer pending */
  markFailed: (db: Db, id: string, error: string, at: number) =>
    db
      .update(refundIntents)
      .set({ state: 'failed', error: error.slice(0, 500), updatedAt: at })
      .where(and(eq(refundIntents.id, id), eq(refundIntents.state, 'pending')))
      .run().changes === 1,
  shop: (db: Db, id: string) => db.select().from(shops).where(eq(shops.id, id)).get(),
  insertAudit: (db: Db, row: typeof auditLog.$inferInsert) => db.insert(auditLog).values(row).run(),
};
