// Every database call of the business view. Reads are scoped by the seller's shop id.
import { asc, eq, inArray } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { cutSheets, jobRuns, ledger, listings, materials, motifs, orderLines, orders, shops } from '../../db/schema.ts';
import { amongShop, motifOutline, shopsWithOwner } from '../../db/shared-queries.repo.ts';

export type ShopRow = typeof shops.$inferSelect;
export type OrderRow = typeof orders.$inferSelect;
export type LineRow = typeof orderLines.$inferSelect;
export type SheetRow = typeof cutSheets.$inferSelect;
export type MaterialRow = typeof materials.$inferSelect;

export const businessRepo = {
  shop: (db: Db, shopId: string) => db.select().from(shops).where(eq(shops.id, shopId)).get(),
  /** shops that can have orders (live or suspended shops still owe what was bought) with their owner's address */
  shopsWithOwners: (db: Db) => shopsWithOwner(db).orderBy(asc(shops.createdAt)).all(),
  setShop: (db: Db, shopId: string, set: Partial<typeof shops.$inferInsert>) => db.update(shops).set(set).where(eq(shops.id, shopId)).run(),
  linesOfShop: (db: Db, shopId: string) =>
    db
      .select({ line: orderLines, order: orders })
      .from(orderLines)
      .innerJoin(orders, eq(orders.id, orderLines.orderId))
      .where(eq(orders.shopId, shopId))
      .orderBy(asc(orders.paidAt), asc(orders.number), asc(orderLines.createdAt), asc(orderLines.id))
      .all(),
  ordersOfShop: (db: Db, shopId: string) => db.select().from(orders).where(eq(orders.shopId, shopId)).all(),
  setOrder: (db: Db, orderId: string, set: Partial<typeof orders.$inferInsert>) => db.update(orders).set(set).where(eq(orders.id, orderId)).run(),
  sheetsOfShop: (db: Db, shopId: string) => db.select().from(cutSheets).where(eq(cutSheets.shopId, shopId)).orderBy(asc(cutSheets.createdAt), asc(cutSheets.id)).all(),
  materialsOfShop: (db: Db, shopId: string) => db.select().from(materials).where(eq(materials.shopId, shopId)).all(),
  motifsOfShop: (db: Db, shopId: string, ids: string[]) => amongShop(db, motifs, motifOutline, shopId, ids),
  listingsByIds: (db: Db, ids: string[]) => (ids.length ? db.select().from(listings).where(inArray(listings.id, ids)).all() : []),
  ledgerOfShop: (db: Db, shopId: string) =>
    db
      .select({ entry: ledger, orderNumber: orders.number })
      .from(ledger)
      .leftJoin(orders, eq(orders.id, ledger.orderId))
      .where(eq(ledger.shopId, shopId))
      .orderBy(asc(ledger.createdAt), asc(ledger.id))
      .all(),
  /** Claims a job key; false when it ran already (the primary key refuses a second row). */
  claimJob: (db: Db, key: string, at: number): boolean => db.insert(jobRuns).values({ key, ranAt: at }).onConflictDoNothing().run().changes === 1,
  releaseJob: (db: Db, key: string) => db.delete(jobRuns).where(eq(jobRuns.key, key)).run(),
  jobRan: (db: Db, key: string) => !!db.select().from(jobRuns).where(eq(jobRuns.key, key)).get(),
};
