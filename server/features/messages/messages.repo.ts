// Every database call of order messages.
import { and, asc, eq, isNull, ne, sql } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { orderMessages, orders, shops, user } from '../../db/schema.ts';

export type MessageRow = typeof orderMessages.$inferSelect;

export const messagesRepo = {
  insert: (db: Db, row: typeof orderMessages.$inferInsert) => db.insert(orderMessages).values(row).returning().get(),
  thread: (db: Db, orderId: string) =>
    db
      .select({ m: orderMessages, authorName: user.name })
      .from(orderMessages)
      .innerJoin(user, eq(user.id, orderMessages.authorId))
      .where(eq(orderMessages.orderId, orderId))
      .orderBy(asc(orderMessages.createdAt), asc(sql`order_messages.rowid`))
      .all(),
  count: (db: Db, orderId: string) => db.select({ n: sql<number>`count(*)` }).from(orderMessages).where(eq(orderMessages.orderId, orderId)).get()?.n ?? 0,
  find: (db: Db, orderId: string, id: string) =>
    db
      .select()
      .from(orderMessages)
      .where(and(eq(orderMessages.orderId, orderId), eq(orderMessages.id, id)))
      .get(),
  /** marks the other side's messages read for the shopper */
  markShopperRead: (db: Db, orderId: string, at: number) =>
    db
      .update(orderMessages)
      .set({ shopperReadAt: at })
      .where(and(eq(orderMessages.orderId, orderId), ne(orderMessages.side, 'shopper'), isNull(orderMessages.shopperReadAt)))
      .run().changes,
  /** marks the other side's messages read for the shop */
  markShopRead: (db: Db, orderId: string, at: number) =>
    db
      .update(orderMessages)
      .set({ shopReadAt: at })
      .where(and(eq(orderMessages.orderId, orderId), ne(orderMessages.side, 'shop'), isNull(orderMessages.shopReadAt)))
      .run().changes,
  /** messages waiting for this user: as a shopper on their orders, and as the owner of a shop on its orders */
  unread(db: Db, userId: string, shopId: string | null): { asShopper: number; asShop: number } {
    const n = (where: ReturnType<typeof and>) => db.select({ n: sql<number>`count(*)` }).from(orderMessages).innerJoin(orders, eq(orders.id, orderMessages.orderId)).where(where).get()?.n ?? 0;
    return {
      asShopper: n(and(eq(orders.buyerId, userId), ne(orderMessages.side, 'shopper'), isNull(orderMessages.shopperReadAt))),
      asShop: shopId ? n(and(eq(orders.shopId, shopId), ne(orderMessages.side, 'shop'), isNull(orderMessages.shopReadAt))) : 0,
    };
  },
  buyer: (db: Db, userId: string) => db.select({ email: user.email, name: user.name }).from(user).where(eq(user.id, userId)).get(),
  shopOwner: (db: Db, shopId: string) =>
    db.select({ email: user.email, name: user.name, shopName: shops.name }).from(shops).innerJoin(user, eq(user.id, shops.ownerId)).where(eq(shops.id, shopId)).get(),
};
