// Every database call of the workroom. Each read that takes an id from the client is scoped by
// the seller's shop, so another shop's ids simply find nothing (→ 404, nothing revealed). A line's
// state and its timeline are written only by orders' transition(), never from here.
import { and, desc, eq, gte, inArray, lte, ne, type SQL, sql } from 'drizzle-orm';
import { FINISHED_LINE_STATES, UNCUT_LINE_STATES } from '../../../shared/schemas/order.ts';
import type { LinesFilter } from '../../../shared/schemas/workroom.ts';
import type { Db } from '../../db/client.ts';
import { cutSheets, lineEvents, lineVersions, listings, materials, motifs, orderLines, orders, shops, user } from '../../db/schema.ts';
import { amongShop, motifOutline } from '../../db/shared-queries.repo.ts';

export type LineRow = typeof orderLines.$inferSelect;
export type OrderRow = typeof orders.$inferSelect;
export type MaterialRow = typeof materials.$inferSelect;
export type SheetRow = typeof cutSheets.$inferSelect;

/** The shop's lines that pass the workroom's filters (always scoped by the shop). */
function linesWhere(shopId: string, f: LinesFilter): SQL | undefined {
  return and(
    eq(orders.shopId, shopId),
    f.state ? eq(orderLines.state, f.state) : undefined,
    f.paidFrom !== undefined ? gte(orders.paidAt, f.paidFrom) : undefined,
    f.paidTo !== undefined ? lte(orders.paidAt, f.paidTo) : undefined,
    f.listing ? eq(orderLines.listingId, f.listing) : undefined,
    // a line uses a material when one of its snapshot's pieces is cut from it
    f.material ? sql`exists (select 1 from json_each(${orderLines.snapshot}, '$.geometry.pieces') as p where json_extract(p.value, '$.materialId') = ${f.material})` : undefined,
  );
}

/**
 * Most urgent first: lines still to ship before finished ones, then by ship-by date (late ones
 * have the earliest dates), lines not yet cut before cut ones on the same date, then newest paid.
 */
const urgency = [
  sql`case when ${inArray(orderLines.state, FINISHED_LINE_STATES)} then 1 else 0 end`,
  sql`coalesce(${orders.shipByDate}, '9999-12-31')`,
  sql`case when ${inArray(orderLines.state, UNCUT_LINE_STATES)} then 0 else 1 end`,
  desc(orders.paidAt),
  orders.number,
  orderLines.createdAt,
  orderLines.id,
];

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
  /** one page of the shop's lines that pass the filters, most urgent first */
  linesPage: (db: Db, shopId: string, f: LinesFilter, limit: number, offset: number) =>
    db
      .select({ line: orderLines, order: orders })
      .from(orderLines)
      .innerJoin(orders, eq(orders.id, orderLines.orderId))
      .where(linesWhere(shopId, f))
      .orderBy(...urgency)
      .limit(limit)
      .offset(offset)
      .all(),
  linesCount: (db: Db, shopId: string, f: LinesFilter) =>
    db.select({ n: sql<number>`count(*)` }).from(orderLines).innerJoin(orders, eq(orders.id, orderLines.orderId)).where(linesWhere(shopId, f)).get()?.n ?? 0,
  /** how many of the shop's lines are in each state */
  stateCounts: (db: Db, shopId: string) =>
    db
      .select({ state: orderLines.state, n: sql<number>`count(*)` })
      .from(orderLines)
      .innerJoin(orders, eq(orders.id, orderLines.orderId))
      .where(eq(orders.shopId, shopId))
      .groupBy(orderLines.state)
      .all(),
  /** every listing the shop has sold (id and the title on its latest line), for the listing filter */
  soldListings: (db: Db, shopId: string) =>
    db
      .select({ id: orderLines.listingId, title: sql<string>`max(${orderLines.listingTitle})` })
      .from(orderLines)
      .innerJoin(orders, eq(orders.id, orderLines.orderId))
      .where(eq(orders.shopId, shopId))
      .groupBy(orderLines.listingId)
      .orderBy(sql`max(${orderLines.listingTitle})`)
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
  order: (db: Db, shopId: string, orderId: string) =>
    db
      .select()
      .from(orders)
      .where(and(eq(orders.id, orderId), eq(orders.shopId, shopId)))
      .get(),
  orderById: (db: Db, orderId: string) => db.select().from(orders).where(eq(orders.id, orderId)).get(),
  lineById: (db: Db, lineId: string) => db.select().from(orderLines).where(eq(orderLines.id, lineId)).get(),
  setOrder: (db: Db, orderId: string, set: Partial<typeof orders.$inferInsert>) => db.update(orders).set(set).where(eq(orders.id, orderId)).run(),
  insertVersion: (db: Db, row: typeof lineVersions.$inferInsert) => db.insert(lineVersions).values(row).run(),
  events: (db: Db, lineIds: string[]) => (lineIds.length ? db.select().from(lineEvents).where(inArray(lineEvents.lineId, lineIds)).orderBy(lineEvents.createdAt, lineEvents.id).all() : []),
  versions: (db: Db, lineId: string) => db.select().from(lineVersions).where(eq(lineVersions.lineId, lineId)).orderBy(lineVersions.version).all(),
  users: (db: Db, ids: string[]) => (ids.length ? db.select({ id: user.id, name: user.name, email: user.email }).from(user).where(inArray(user.id, ids)).all() : []),
  shop: (db: Db, shopId: string) => db.select().from(shops).where(eq(shops.id, shopId)).get(),
  materialsOfShop: (db: Db, shopId: string) => db.select().from(materials).where(eq(materials.shopId, shopId)).orderBy(materials.kind, materials.colourName).all(),
  material: (db: Db, shopId: string, id: string) =>
    db
      .select()
      .from(materials)
      .where(and(eq(materials.id, id), eq(materials.shopId, shopId)))
      .get(),
  setMaterial: (db: Db, id: string, set: Partial<typeof materials.$inferInsert>) => db.update(materials).set(set).where(eq(materials.id, id)).run(),
  motifsOfShop: (db: Db, shopId: string, ids: string[]) => amongShop(db, motifs, motifOutline, shopId, ids),
  listing: (db: Db, id: string) => db.select().from(listings).where(eq(listings.id, id)).get(),
  insertSheet: (db: Db, row: typeof cutSheets.$inferInsert) => db.insert(cutSheets).values(row).run(),
  sheet: (db: Db, shopId: string, id: string) =>
    db
      .select()
      .from(cutSheets)
      .where(and(eq(cutSheets.id, id), eq(cutSheets.shopId, shopId)))
      .get(),
  sheetsOfBatch: (db: Db, shopId: string, batchId: string) =>
    db
      .select()
      .from(cutSheets)
      .where(and(eq(cutSheets.batchId, batchId), eq(cutSheets.shopId, shopId)))
      .orderBy(cutSheets.createdAt, cutSheets.id)
      .all(),
  sheetsOfShop: (db: Db, shopId: string) => db.select().from(cutSheets).where(eq(cutSheets.shopId, shopId)).orderBy(desc(cutSheets.createdAt), cutSheets.id).all(),
  /** one page of the shop's cut sheets, newest first */
  sheetsPage: (db: Db, shopId: string, limit: number, offset: number) =>
    db.select().from(cutSheets).where(eq(cutSheets.shopId, shopId)).orderBy(desc(cutSheets.createdAt), cutSheets.id).limit(limit).offset(offset).all(),
  sheetsCount: (db: Db, shopId: string) => db.select({ n: sql<number>`count(*)` }).from(cutSheets).where(eq(cutSheets.shopId, shopId)).get()?.n ?? 0,
  /** per material: the sheets not cut yet (their count and nested length) */
  plannedByMaterial: (db: Db, shopId: string) =>
    db
      .select({ materialId: cutSheets.materialId, sheets: sql<number>`count(*)`, lengthMm: sql<number>`sum(${cutSheets.lengthMm})` })
      .from(cutSheets)
      .where(and(eq(cutSheets.shopId, shopId), ne(cutSheets.state, 'cut')))
      .groupBy(cutSheets.materialId)
      .all(),
  deleteBatch: (db: Db, shopId: string, batchId: string) =>
    db
      .delete(cutSheets)
      .where(and(eq(cutSheets.batchId, batchId), eq(cutSheets.shopId, shopId)))
      .run(),
  setSheet: (db: Db, id: string, set: Partial<typeof cutSheets.$inferInsert>) => db.update(cutSheets).set(set).where(eq(cutSheets.id, id)).run(),
};
