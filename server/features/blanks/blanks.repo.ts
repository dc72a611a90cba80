import { and, eq, inArray, sql } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { blankStock, blankTypes, stockHolds, uploads } from '../../db/schema.ts';

export type BlankTypeRow = typeof blankTypes.$inferSelect;
export type StockHoldRow = typeof stockHolds.$inferSelect;

export const blanksRepo = {
  types: (db: Db, shopId: string) => db.select().from(blankTypes).where(eq(blankTypes.shopId, shopId)).orderBy(blankTypes.createdAt).all(),
  type: (db: Db, shopId: string, id: string) =>
    db
      .select()
      .from(blankTypes)
      .where(and(eq(blankTypes.shopId, shopId), eq(blankTypes.id, id)))
      .get(),
  count: (db: Db, shopId: string) => db.select({ n: sql<number>`count(*)` }).from(blankTypes).where(eq(blankTypes.shopId, shopId)).get()!.n,
  insertType: (db: Db, row: typeof blankTypes.$inferInsert) => db.insert(blankTypes).values(row).run(),
  updateType: (db: Db, shopId: string, id: string, set: Partial<typeof blankTypes.$inferInsert>) =>
    db
      .update(blankTypes)
      .set(set)
      .where(and(eq(blankTypes.shopId, shopId), eq(blankTypes.id, id)))
      .run(),
  stock: (db: Db, blankTypeId: string) => db.select().from(blankStock).where(eq(blankStock.blankTypeId, blankTypeId)).all(),
  upsertStock: (db: Db, row: typeof blankStock.$inferInsert) =>
    db
      .insert(blankStock)
      .values(row)
      .onConflictDoUpdate({ target: [blankStock.blankTypeId, blankStock.sizeId, blankStock.colourId], set: { quantity: row.quantity, lowStock: row.lowStock } })
      .run(),
  /** takes `n` from the free count only if that many are there: the one guard against selling the last item twice */
  take: (db: Db, k: { blankTypeId: string; sizeId: string; colourId: string }, n: number) =>
    db
      .update(blankStock)
      .set({ quantity: sql`${blankStock.quantity} - ${n}` })
      .where(and(eq(blankStock.blankTypeId, k.blankTypeId), eq(blankStock.sizeId, k.sizeId), eq(blankStock.colourId, k.colourId), sql`${blankStock.quantity} >= ${n}`))
      .run().changes === 1,
  /** a change of the free count whatever it is (giving a hold back; a late payment after release) */
  adjust: (db: Db, k: { blankTypeId: string; sizeId: string; colourId: string }, delta: number) =>
    db
      .update(blankStock)
      .set({ quantity: sql`${blankStock.quantity} + ${delta}` })
      .where(and(eq(blankStock.blankTypeId, k.blankTypeId), eq(blankStock.sizeId, k.sizeId), eq(blankStock.colourId, k.colourId)))
      .run(),
  insertHold: (db: Db, row: typeof stockHolds.$inferInsert) => db.insert(stockHolds).values(row).run(),
  holdsOf: (db: Db, checkoutId: string) => db.select().from(stockHolds).where(eq(stockHolds.checkoutId, checkoutId)).all(),
  /** moves one hold on only from the state it was read in (so two expiries give back once) */
  moveHold: (db: Db, id: string, from: string, to: string) =>
    db
      .update(stockHolds)
      .set({ state: to })
      .where(and(eq(stockHolds.id, id), eq(stockHolds.state, from)))
      .run().changes === 1,
  heldFor: (db: Db, blankTypeId: string) =>
    db
      .select({ sizeId: stockHolds.sizeId, colourId: stockHolds.colourId, n: sql<number>`sum(${stockHolds.quantity})` })
      .from(stockHolds)
      .where(and(eq(stockHolds.blankTypeId, blankTypeId), eq(stockHolds.state, 'held')))
      .groupBy(stockHolds.sizeId, stockHolds.colourId)
      .all(),
  photos: (db: Db, shopId: string, ids: string[]) =>
    ids.length
      ? db
          .select({ id: uploads.id, path: uploads.path, thumbPath: uploads.thumbPath })
          .from(uploads)
          .where(and(eq(uploads.shopId, shopId), inArray(uploads.id, ids)))
          .all()
      : [],
};
