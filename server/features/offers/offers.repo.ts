// Every database call of the shop offers: discount codes and their uses, the shopper's per-shop
// choices in a cart, order-by dates, the shop's shipping estimate.
import { and, desc, eq, gte, inArray, ne, sql } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { cartShopChoices, checkouts, discountCodes, discountUses, listings, orderByDates, orders, shops } from '../../db/schema.ts';

export type DiscountCodeRow = typeof discountCodes.$inferSelect;
export type ChoiceRow = typeof cartShopChoices.$inferSelect;
export type OffersShopRow = typeof shops.$inferSelect;

export const offersRepo = {
  // ---------------------------------------------------------------- codes
  codes: (db: Db, shopId: string) => db.select().from(discountCodes).where(eq(discountCodes.shopId, shopId)).orderBy(desc(discountCodes.createdAt)).all(),
  code: (db: Db, shopId: string, id: string) =>
    db
      .select()
      .from(discountCodes)
      .where(and(eq(discountCodes.shopId, shopId), eq(discountCodes.id, id)))
      .get(),
  codeByText: (db: Db, shopId: string, code: string) =>
    db
      .select()
      .from(discountCodes)
      .where(and(eq(discountCodes.shopId, shopId), eq(discountCodes.code, code)))
      .get(),
  codeById: (db: Db, id: string) => db.select().from(discountCodes).where(eq(discountCodes.id, id)).get(),
  insertCode: (db: Db, row: typeof discountCodes.$inferInsert) => db.insert(discountCodes).values(row).run(),
  updateCode: (db: Db, id: string, set: Partial<typeof discountCodes.$inferInsert>) => db.update(discountCodes).set(set).where(eq(discountCodes.id, id)).run(),
  deleteCode: (db: Db, id: string) => db.delete(discountCodes).where(eq(discountCodes.id, id)).run(),
  hasUses: (db: Db, codeId: string) => !!db.select({ id: discountUses.id }).from(discountUses).where(eq(discountUses.codeId, codeId)).get(),
  shopListingIds: (db: Db, shopId: string, ids: string[]) =>
    ids.length
      ? db
          .select({ id: listings.id })
          .from(listings)
          .where(and(eq(listings.shopId, shopId), inArray(listings.id, ids)))
          .all()
          .map((r) => r.id)
      : [],

  // ---------------------------------------------------------------- uses
  /** uses that count against the limit (reserved or used), leaving out checkouts of one cart (the asker's own) */
  usesTaken: (db: Db, codeId: string, exceptCartId: string | null) =>
    db
      .select({ n: sql<number>`count(*)` })
      .from(discountUses)
      .innerJoin(checkouts, eq(checkouts.id, discountUses.checkoutId))
      .where(and(eq(discountUses.codeId, codeId), ne(discountUses.state, 'released'), exceptCartId ? ne(checkouts.cartId, exceptCartId) : undefined))
      .get()!.n,
  findUse: (db: Db, codeId: string, checkoutId: string) =>
    db
      .select()
      .from(discountUses)
      .where(and(eq(discountUses.codeId, codeId), eq(discountUses.checkoutId, checkoutId)))
      .get(),
  insertUse: (db: Db, row: typeof discountUses.$inferInsert) => db.insert(discountUses).values(row).run(),
  setUseState: (db: Db, id: string, state: string, at: number) => db.update(discountUses).set({ state, updatedAt: at }).where(eq(discountUses.id, id)).run(),
  /** moves every use of a checkout in state `from` to `to` */
  moveUses: (db: Db, checkoutId: string, from: string, to: string, at: number) =>
    db
      .update(discountUses)
      .set({ state: to, updatedAt: at })
      .where(and(eq(discountUses.checkoutId, checkoutId), eq(discountUses.state, from)))
      .run(),
  countUses: (db: Db, shopId: string) =>
    db
      .select({ codeId: discountUses.codeId, state: discountUses.state, n: sql<number>`count(*)` })
      .from(discountUses)
      .innerJoin(discountCodes, eq(discountCodes.id, discountUses.codeId))
      .where(eq(discountCodes.shopId, shopId))
      .groupBy(discountUses.codeId, discountUses.state)
      .all(),
  /** what codes took off the shop's paid orders, per code text */
  givenAway: (db: Db, shopId: string) =>
    db
      .select({ code: orders.discountCode, minor: sql<number>`sum(${orders.discountMinor})`, n: sql<number>`count(*)` })
      .from(orders)
      .where(and(eq(orders.shopId, shopId), gte(orders.discountMinor, 1)))
      .groupBy(orders.discountCode)
      .all(),

  // ---------------------------------------------------------------- the shopper's choices in a cart
  choices: (db: Db, cartId: string) => db.select().from(cartShopChoices).where(eq(cartShopChoices.cartId, cartId)).all(),
  setChoice: (db: Db, cartId: string, shopId: string, set: { code?: string | null; neededBy?: string | null }, at: number) =>
    db
      .insert(cartShopChoices)
      .values({ cartId, shopId, code: set.code ?? null, neededBy: set.neededBy ?? null, updatedAt: at })
      .onConflictDoUpdate({ target: [cartShopChoices.cartId, cartShopChoices.shopId], set: { ...set, updatedAt: at } })
      .run(),

  // ---------------------------------------------------------------- shops, dates
  shop: (db: Db, id: string) => db.select().from(shops).where(eq(shops.id, id)).get(),
  shops: (db: Db, ids: string[]) => (ids.length ? db.select().from(shops).where(inArray(shops.id, ids)).all() : []),
  setShippingDays: (db: Db, shopId: string, shippingDays: number, at: number) => db.update(shops).set({ shippingDays, updatedAt: at }).where(eq(shops.id, shopId)).run(),
  liveListingShop: (db: Db, slug: string) =>
    db.select({ shop: shops, listingState: listings.state, live: listings.live }).from(listings).innerJoin(shops, eq(shops.id, listings.shopId)).where(eq(listings.slug, slug)).get(),
  orderByDates: (db: Db, shopId: string, fromDay?: string) =>
    db
      .select({ id: orderByDates.id, occasion: orderByDates.occasion, orderBy: orderByDates.orderBy })
      .from(orderByDates)
      .where(and(eq(orderByDates.shopId, shopId), fromDay ? gte(orderByDates.orderBy, fromDay) : undefined))
      .orderBy(orderByDates.orderBy)
      .all(),
  countOrderByDates: (db: Db, shopId: string) => db.select({ n: sql<number>`count(*)` }).from(orderByDates).where(eq(orderByDates.shopId, shopId)).get()!.n,
  insertOrderByDate: (db: Db, row: typeof orderByDates.$inferInsert) => db.insert(orderByDates).values(row).run(),
  deleteOrderByDate: (db: Db, shopId: string, id: string) =>
    db
      .delete(orderByDates)
      .where(and(eq(orderByDates.shopId, shopId), eq(orderByDates.id, id)))
      .run().changes > 0,
};
