import { and, asc, eq, like, or, sql } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { listings, materials } from '../../db/schema.ts';

export type MaterialRow = typeof materials.$inferSelect;

const listWhere = (shopId: string, archived?: boolean) => (archived === undefined ? eq(materials.shopId, shopId) : and(eq(materials.shopId, shopId), eq(materials.archived, archived)));
/** one page of the shop's materials, by kind then colour name */
export const listMaterials = (db: Db, shopId: string, archived: boolean | undefined, limit: number, offset: number) =>
  db.select().from(materials).where(listWhere(shopId, archived)).orderBy(asc(materials.kind), asc(materials.colourName), asc(materials.id)).limit(limit).offset(offset).all();
export const countMaterials = (db: Db, shopId: string, archived?: boolean) => db.select({ n: sql<number>`count(*)` }).from(materials).where(listWhere(shopId, archived)).get()?.n ?? 0;
/** scoped by shop: another shop's id is simply not found */
export const findMaterial = (db: Db, shopId: string, id: string) =>
  db
    .select()
    .from(materials)
    .where(and(eq(materials.id, id), eq(materials.shopId, shopId)))
    .get();
export const insertMaterial = (db: Db, row: typeof materials.$inferInsert) => db.insert(materials).values(row).returning().get();
export const updateMaterial = (db: Db, shopId: string, id: string, set: Partial<typeof materials.$inferInsert>) =>
  db
    .update(materials)
    .set(set)
    .where(and(eq(materials.id, id), eq(materials.shopId, shopId)))
    .returning()
    .get();
export const deleteMaterial = (db: Db, shopId: string, id: string) =>
  db
    .delete(materials)
    .where(and(eq(materials.id, id), eq(materials.shopId, shopId)))
    .run();
/** listings of this shop whose draft or live copy mention the material id (ids are UUIDs: no LIKE wildcards) */
export const listingsUsing = (db: Db, shopId: string, id: string) =>
  db
    .select({ id: listings.id, title: listings.liveTitle })
    .from(listings)
    .where(and(eq(listings.shopId, shopId), or(like(listings.draft, `%"${id}"%`), like(listings.live, `%"${id}"%`))))
    .all();
