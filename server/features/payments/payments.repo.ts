import { and, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { ShipTo } from '../../../shared/schemas/checkout.ts';
import type { Db } from '../../db/client.ts';
import { cartLines, carts, checkouts, orders, shops, user, webhookEvents } from '../../db/schema.ts';

export type CheckoutRow = typeof checkouts.$inferSelect;

export const paymentsRepo = {
  /** records an event id; false when it was processed already (the primary key says so) */
  recordEvent: (db: Db, id: string, type: string, at: number) => db.insert(webhookEvents).values({ id, type, processedAt: at }).onConflictDoNothing().run().changes === 1,
  checkout: (db: Db, id: string) => db.select().from(checkouts).where(eq(checkouts.id, id)).get(),
  checkoutBySession: (db: Db, sessionId: string) => db.select().from(checkouts).where(eq(checkouts.providerSessionId, sessionId)).get(),
  checkoutByPaymentIntent: (db: Db, paymentIntentId: string) => db.select().from(checkouts).where(eq(checkouts.paymentIntentId, paymentIntentId)).get(),
  markPaid: (db: Db, id: string, at: number, paymentIntentId: string | null) =>
    db
      .update(checkouts)
      .set({ state: 'paid', paidAt: at, paymentIntentId })
      .where(and(eq(checkouts.id, id), inArray(checkouts.state, ['open', 'expired'])))
      .run().changes === 1,
  markExpired: (db: Db, id: string) =>
    db
      .update(checkouts)
      .set({ state: 'expired' })
      .where(and(eq(checkouts.id, id), eq(checkouts.state, 'open')))
      .run(),
  setCharge: (db: Db, id: string, chargeId: string) => db.update(checkouts).set({ chargeId }).where(eq(checkouts.id, id)).run(),
  claimMail: (db: Db, id: string, at: number) =>
    db
      .update(checkouts)
      .set({ mailedAt: at })
      .where(and(eq(checkouts.id, id), isNull(checkouts.mailedAt)))
      .run().changes === 1,
  /** the lines that were paid for leave the cart; anything added meanwhile stays */
  removeCartLines(db: Db, cartId: string, lineIds: string[], at: number) {
    if (lineIds.length)
      db.delete(cartLines)
        .where(and(eq(cartLines.cartId, cartId), inArray(cartLines.id, lineIds)))
        .run();
    db.update(carts)
      .set({ version: sql`${carts.version} + 1`, updatedAt: at })
      .where(eq(carts.id, cartId))
      .run();
  },
  /** every order of one checkout goes to the one address the shopper gave when paying */
  setShipTo: (db: Db, checkoutId: string, shipTo: ShipTo) => db.update(orders).set({ shipTo }).where(eq(orders.checkoutId, checkoutId)).run(),
  shopOwner: (db: Db, shopId: string) => db.select({ email: user.email, name: user.name }).from(shops).innerJoin(user, eq(user.id, shops.ownerId)).where(eq(shops.id, shopId)).get(),
};
