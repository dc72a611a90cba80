// Every database call of the workroom. Each read that takes an id from the client is scoped by
// the seller's shop, so another shop's ids simply find nothing (→ 404, nothing revealed).
import { and, desc, eq, inArray } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { cutSheets, lineEvents, lineVersions, listings, materials, motifs, orderLines, orders, shops, user } from '../../db/schema.ts';

export type LineRow = typeof orderLines.$inferSelect;
export type OrderRow = typeof orders.$inferSelect;
export type MaterialRow = typeof materials.$inferSelect;
export type SheetRow = typeof cutSheets.$inferSelect;

export const workroomRepo = {
  /** every line of the shop with its order */
  linesOfShop: (db: Db, shopId: string, state?: string) =>
    db
      .select({ line: orderLines, order: orders })
      .from(orderLines)
      .innerJoin(orders, eq(orders.id, orderLines.orderId))
      .where(state ? and(eq(orders.shopId, shopId), eq(orderLines.state, state)) : eq(orders.shopId, shopId))
      .orderBy(desc(orders.paidAt), orders.number, orderLines.createdAt)
      .all(),
  /** the shop's lines among `ids` (others' ids are simply absent) */
  linesByIds: (db: Db, shopId: string, ids: string[]) =>
    ids.length
      ? db
          .select({ line: orderLines, order: orders })
          .from(orderLines)
          .innerJoin(orders, eq(orders.id, orderLines.orderId))
          .where(and(eq(orders.shopId, shopId), inArray(orderLines.id, ids)))
          .all()
      : [],
  linesOfOrder: (db: Db, orderId: string) => db.select().from(orderLines).where(eq(orderLines.orderId, orderId)).orderBy(orderLines.createdAt, orderLines.id).all(),
  order: (db: Db, shopId: string, orderId: string) => db.select().from(orders).where(and(eq(orders.id, orderId), eq(orders.shopId, shopId))).get(),
  orderById: (db: Db, orderId: string) => db.select().from(orders).where(eq(orders.id, orderId)).get(),
  lineById: (db: Db, lineId: string) => db.select().from(orderLines).where(eq(orderLines.id, lineId)).get(),
  setLine: (db: Db, lineId: string, set: Partial<typeof orderLines.$inferInsert>) => db.update(orderLines).set(set).where(eq(orderLines.id, lineId)).run(),
  setOrder: (db: Db, orderId: string, set: Partial<typeof orders.$inferInsert>) => db.update(orders).set(set).where(eq(orders.id, orderId)).run(),
  insertEvent: (db: Db, row: typeof lineEvents.$inferInsert) => db.insert(lineEvents).values(row).run(),
  insertVersion: (db: Db, row: typeof lineVersions.$inferInsert) => db.insert(lineVersions).values(row).run(),
  events: (db: Db, lineIds: string[]) => (lineIds.length ? db.select().from(lineEvents).where(inArray(lineEvents.lineId, lineIds)).orderBy(lineEvents.createdAt, lineEvents.id).all() : []),
  versions: (db: Db, lineId: string) => db.select().from(lineVersions).where(eq(lineVersions.lineId, lineId)).orderBy(lineVersions.version).all(),
  users: (db: Db, ids: string[]) => (ids.length ? db.select({ id: user.id, name: user.name, email: user.email }).from(user).where(inArray(user.id, ids)).all() : []),
  shop: (db: Db, shopId: string) => db.select().from(shops).where(eq(shops.id, shopId)).get(),
  materialsOfShop: (db: Db, shopId: string) => db.select().from(materials).where(eq(materials.shopId, shopId)).orderBy(materials.kind, materials.colourName).all(),
  material: (db: Db, shopId: string, id: string) => db.select().from(materials).where(and(eq(materials.id, id), eq(materials.shopId, shopId))).get(),
  setMaterial: (db: Db, id: string, set: Partial<typeof materials.$inferInsert>) => db.update(materials).set(set).where(eq(materials.id, id)).run(),
  motifsOfShop: (db: Db, shopId: string, ids: string[]) =>
    ids.length ? db.select({ id: motifs.id, name: motifs.name, geometry: motifs.geometry }).from(motifs).where(and(eq(motifs.shopId, shopId), inArray(motifs.id, ids))).all() : [],
  listing: (db: Db, id: string) => db.select().from(listings).where(eq(listings.id, id)).get(),
  insertSheet: (db: Db, row: typeof cutSheets.$inferInsert) => db.insert(cutSheets).values(row).run(),
  sheet: (db: Db, shopId: string, id: string) => db.select().from(cutSheets).where(and(eq(cutSheets.id, id), eq(cutSheets.shopId, shopId))).get(),
  sheetsOfBatch: (db: Db, shopId: string, batchId: string) =>
    db.select().from(cutSheets).where(and(eq(cutSheets.batchId, batchId), eq(cutSheets.shopId, shopId))).orderBy(cutSheets.createdAt, cutSheets.id).all(),
  sheetsOfShop: (db: Db, shopId: string) => db.select().from(cutSheets).where(eq(cutSheets.shopId, shopId)).orderBy(desc(cutSheets.createdAt), cutSheets.id).all(),
  setSheet: (db: Db, id: string, set: Partial<typeof cutSheets.$inferInsert>) => db.update(cutSheets).set(set).where(eq(cutSheets.id, id)).run(),
};
