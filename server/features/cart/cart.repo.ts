// Every database call of the cart.
import { and, desc, eq, inArray, sql } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { cartLines, carts, listings, materials, motifs } from '../../db/schema.ts';
import { amongShop, listingsWithShop, materialSwatch, motifOutline } from '../../db/shared-queries.repo.ts';

export type CartRow = typeof carts.$inferSelect;
export type CartLineRow = typeof cartLines.$inferSelect;

export const cartRepo = {
  find: (db: Db, id: string) => db.select().from(carts).where(eq(carts.id, id)).get(),
  findForUser: (db: Db, userId: string) => db.select().from(carts).where(eq(carts.userId, userId)).orderBy(desc(carts.updatedAt)).get(),
  create(db: Db, row: { id: string; userId: string | null; at: number }): CartRow {
    db.insert(carts).values({ id: row.id, userId: row.userId, version: 1, createdAt: row.at, updatedAt: row.at }).run();
    return cartRepo.find(db, row.id)!;
  },
  /** every change to the lines bumps the version (two tabs checking out one version share one session) */
  touch: (db: Db, id: string, at: number) =>
    db
      .update(carts)
      .set({ version: sql`${carts.version} + 1`, updatedAt: at })
      .where(eq(carts.id, id))
      .run(),
  claim: (db: Db, id: string, userId: string, at: number) =>
    db
      .update(carts)
      .set({ userId, version: sql`${carts.version} + 1`, updatedAt: at })
      .where(eq(carts.id, id))
      .run(),
  remove: (db: Db, id: string) => db.delete(carts).where(eq(carts.id, id)).run(),

  lines: (db: Db, cartId: string) => db.select().from(cartLines).where(eq(cartLines.cartId, cartId)).orderBy(cartLines.createdAt, cartLines.id).all(),
  line: (db: Db, cartId: string, lineId: string) =>
    db
      .select()
      .from(cartLines)
      .where(and(eq(cartLines.cartId, cartId), eq(cartLines.id, lineId)))
      .get(),
  addLine: (db: Db, row: typeof cartLines.$inferInsert) => db.insert(cartLines).values(row).run(),
  setQuantity: (db: Db, lineId: string, quantity: number) => db.update(cartLines).set({ quantity }).where(eq(cartLines.id, lineId)).run(),
  deleteLine: (db: Db, lineId: string) => db.delete(cartLines).where(eq(cartLines.id, lineId)).run(),
  deleteLines: (db: Db, cartId: string, lineIds: string[]) =>
    lineIds.length
      ? db
          .delete(cartLines)
          .where(and(eq(cartLines.cartId, cartId), inArray(cartLines.id, lineIds)))
          .run()
      : undefined,
  moveLines: (db: Db, from: string, to: string) => db.update(cartLines).set({ cartId: to }).where(eq(cartLines.cartId, from)).run(),

  listingWithShop: (db: Db, listingId: string) => listingsWithShop(db).where(eq(listings.id, listingId)).get(),
  listingsWithShops: (db: Db, ids: string[]) => (ids.length ? listingsWithShop(db).where(inArray(listings.id, ids)).all() : []),
  materials: (db: Db, shopId: string, ids: string[]) => amongShop(db, materials, materialSwatch, shopId, ids),
  motifs: (db: Db, shopId: string, ids: string[]) => amongShop(db, motifs, motifOutline, shopId, ids),
};
