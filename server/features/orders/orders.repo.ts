// Every database call for orders, their lines, versions, events and ledger rows.
import { and, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { FIRST_LINE_STATE, LineState } from '../../../shared/schemas/order.ts';
import type { Db } from '../../db/client.ts';
import { checkouts, ledger, lineEvents, lineVersions, orderLines, orders, refunds, shops, user } from '../../db/schema.ts';

export type OrderRow = typeof orders.$inferSelect;
export type OrderLineRow = typeof orderLines.$inferSelect;

/**
 * A line's state is written in two places only: insertLine (a new line, always in FIRST_LINE_STATE)
 * and moveLine (called by transition() in line-state.ts, which checks every move against the table).
 * There is deliberately no general "update a line" here.
 */
type LineColumns = Partial<Omit<typeof orderLines.$inferInsert, 'id' | 'state'>>;
type NewLine = Omit<typeof orderLines.$inferInsert, 'state'> & { state: typeof FIRST_LINE_STATE };

export const ordersRepo = {
  find: (db: Db, id: string) => db.select().from(orders).where(eq(orders.id, id)).get(),
  /** one page of the shopper's orders, newest first */
  forBuyer: (db: Db, buyerId: string, limit: number, offset: number) =>
    db.select().from(orders).where(eq(orders.buyerId, buyerId)).orderBy(desc(orders.paidAt), desc(orders.number), orders.id).limit(limit).offset(offset).all(),
  countForBuyer: (db: Db, buyerId: string) => db.select({ n: sql<number>`count(*)` }).from(orders).where(eq(orders.buyerId, buyerId)).get()?.n ?? 0,
  ofCheckout: (db: Db, checkoutId: string) => db.select().from(orders).where(eq(orders.checkoutId, checkoutId)).orderBy(orders.number).all(),
  lines: (db: Db, orderIds: string[]) => (orderIds.length ? db.select().from(orderLines).where(inArray(orderLines.orderId, orderIds)).orderBy(orderLines.createdAt, orderLines.id).all() : []),
  events: (db: Db, lineIds: string[]) => (lineIds.length ? db.select().from(lineEvents).where(inArray(lineEvents.lineId, lineIds)).orderBy(lineEvents.createdAt, lineEvents.id).all() : []),
  shopsByIds: (db: Db, ids: string[]) => (ids.length ? db.select().from(shops).where(inArray(shops.id, ids)).all() : []),
  userEmail: (db: Db, id: string) => db.select({ email: user.email, name: user.name }).from(user).where(eq(user.id, id)).get(),
  nextNumber(db: Db): string {
    const row = db.get<{ n: number | null }>(sql`select max(cast(substr(number, 4) as integer)) as n from orders where number like 'NS-%'`);
    return `NS-${Math.max(1000, row?.n ?? 1000) + 1}`;
  },
  insertOrder: (db: Db, row: typeof orders.$inferInsert) => db.insert(orders).values(row).run(),
  /** a new line starts in FIRST_LINE_STATE, nowhere else (its first timeline event: line-state.ts recordFirstState) */
  insertLine: (db: Db, row: NewLine) => db.insert(orderLines).values(row).run(),
  insertVersion: (db: Db, row: typeof lineVersions.$inferInsert) => db.insert(lineVersions).values(row).run(),
  insertEvent: (db: Db, row: typeof lineEvents.$inferInsert) => db.insert(lineEvents).values(row).run(),
  insertLedger: (db: Db, row: typeof ledger.$inferInsert) => db.insert(ledger).values(row).run(),
  ledgerOf: (db: Db, orderId: string) => db.select().from(ledger).where(eq(ledger.orderId, orderId)).all(),
  /** claims the order's transfer slot; false when another delivery already recorded it */
  setTransfer: (db: Db, orderId: string, transferId: string) =>
    db
      .update(orders)
      .set({ transferId })
      .where(and(eq(orders.id, orderId), isNull(orders.transferId)))
      .run().changes === 1,
  /** writes a state move only while the line is still in `from`; false when another move got there first (only line-state.ts transition() calls it) */
  moveLine: (db: Db, lineId: string, from: LineState, set: LineColumns & { state: LineState }) =>
    db
      .update(orderLines)
      .set(set)
      .where(and(eq(orderLines.id, lineId), eq(orderLines.state, from)))
      .run().changes === 1,
  refundsOf: (db: Db, orderId: string) => db.select().from(refunds).where(eq(refunds.orderId, orderId)).all(),
  insertRefund: (db: Db, row: typeof refunds.$inferInsert) => db.insert(refunds).values(row).run(),
  refundByProviderId: (db: Db, id: string) => db.select().from(refunds).where(eq(refunds.providerRefundId, id)).get(),
  checkout: (db: Db, id: string) => db.select().from(checkouts).where(eq(checkouts.id, id)).get(),
};
