import { and, desc, eq } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { checkouts, orders, shops } from '../../db/schema.ts';

export type CheckoutRow = typeof checkouts.$inferSelect;

export const checkoutRepo = {
  find: (db: Db, id: string) => db.select().from(checkouts).where(eq(checkouts.id, id)).get(),
  forCartVersion: (db: Db, cartId: string, version: number) =>
    db
      .select()
      .from(checkouts)
      .where(and(eq(checkouts.cartId, cartId), eq(checkouts.cartVersion, version)))
      .get(),
  openForCart: (db: Db, cartId: string) =>
    db
      .select()
      .from(checkouts)
      .where(and(eq(checkouts.cartId, cartId), eq(checkouts.state, 'open')))
      .all(),
  bySession: (db: Db, sessionId: string) => db.select().from(checkouts).where(eq(checkouts.providerSessionId, sessionId)).get(),
  latestOpenForUser: (db: Db, userId: string) =>
    db
      .select()
      .from(checkouts)
      .where(and(eq(checkouts.userId, userId), eq(checkouts.state, 'open')))
      .orderBy(desc(checkouts.createdAt))
      .get(),
  /** insert or, when the other tab won the race for this (cart, version), nothing */
  insertIfAbsent: (db: Db, row: typeof checkouts.$inferInsert) => db.insert(checkouts).values(row).onConflictDoNothing().run(),
  setSession: (db: Db, id: string, sessionId: string) => db.update(checkouts).set({ providerSessionId: sessionId }).where(eq(checkouts.id, id)).run(),
  setState: (db: Db, id: string, state: string) =>
    db
      .update(checkouts)
      .set({ state })
      .where(and(eq(checkouts.id, id), eq(checkouts.state, 'open')))
      .run(),
  ordersOf: (db: Db, checkoutId: string) =>
    db
      .select({ id: orders.id, number: orders.number, totalMinor: orders.totalMinor, shopName: shops.name })
      .from(orders)
      .innerJoin(shops, eq(shops.id, orders.shopId))
      .where(eq(orders.checkoutId, checkoutId))
      .orderBy(orders.number)
      .all(),
};
