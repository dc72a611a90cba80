// Every database call of the demo seed (seed.ts, seed-catalog.ts, seed-orders.ts) and of the
// demo-account check. What the seed does through a feature (the cart, checkout, payment, approval)
// goes through that feature's public module instead.
import { and, eq, inArray, sql } from 'drizzle-orm';
import { motifFingerprint } from '../../shared/engine/motif-fingerprint.ts';
import type { Db } from './client.ts';
import { discountCodes, listings, materials, motifs, orderByDates, orderLines, orders, shops, uploads, user } from './schema.ts';

export const seedRepo = {
  userCount: (db: Db) => db.get<{ n: number }>(sql`select count(*) as n from user`)?.n ?? 0,
  usersWithEmails: (db: Db, emails: readonly string[]) =>
    emails.length
      ? db
          .select({ id: user.id })
          .from(user)
          .where(inArray(user.email, [...emails]))
          .all().length
      : 0,
  setRole: (db: Db, userId: string, role: string) => db.update(user).set({ role, emailVerified: true }).where(eq(user.id, userId)).run(),
  insertShop: (db: Db, row: typeof shops.$inferInsert) => db.insert(shops).values(row).run(),
  insertMaterial: (db: Db, row: typeof materials.$inferInsert) => db.insert(materials).values(row).run(),
  insertMotif: (db: Db, row: typeof motifs.$inferInsert) =>
    db
      .insert(motifs)
      .values({ ...row, geometryHash: motifFingerprint(row.geometry) })
      .run(),
  insertUpload: (db: Db, row: typeof uploads.$inferInsert) => db.insert(uploads).values(row).run(),
  insertListing: (db: Db, row: typeof listings.$inferInsert) => db.insert(listings).values(row).run(),
  insertDiscountCode: (db: Db, row: typeof discountCodes.$inferInsert) => db.insert(discountCodes).values(row).run(),
  insertOrderByDate: (db: Db, row: typeof orderByDates.$inferInsert) => db.insert(orderByDates).values(row).run(),
  materialsOf: (db: Db, shopId: string) => db.select().from(materials).where(eq(materials.shopId, shopId)).all(),
  liveListingsOf: (db: Db, shopId: string) =>
    db
      .select()
      .from(listings)
      .where(and(eq(listings.shopId, shopId), eq(listings.state, 'live')))
      .all(),
  ordersOfCheckout: (db: Db, checkoutId: string) => db.select().from(orders).where(eq(orders.checkoutId, checkoutId)).orderBy(orders.number).all(),
  linesOf: (db: Db, orderId: string) => db.select().from(orderLines).where(eq(orderLines.orderId, orderId)).all(),
  userEmail: (db: Db, userId: string) => db.select({ email: user.email, name: user.name }).from(user).where(eq(user.id, userId)).get(),
  /** the demo blanks (seed-blanks.ts) give a listing its sizes and colours in both copies */
  setListingContent: (db: Db, id: string, content: NonNullable<(typeof listings.$inferSelect)['live']>) => db.update(listings).set({ draft: content, live: content }).where(eq(listings.id, id)).run(),
};
