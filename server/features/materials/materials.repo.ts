import { and, asc, eq, like, or } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { listings, materials } from '../../db/schema.ts';

export type MaterialRow = typeof materials.$inferSelect;

export const listMaterials = (db: Db, shopId: string, archived?: boolean) =>
  db.select().from(materials)
    .where(archived === undefined ? eq(materials.shopId, shopId) : and(eq(materials.shopId, shopId), eq(materials.archived, archived)))
    .orderBy(asc(materials.kind), asc(materials.colourName)).all();
/** scoped by shop: another shop's id is simply not found */
export const findMaterial = (db: Db, shopId: string, id: string) =>
  db.select().from(materials).where(and(eq(materials.id, id), eq(materials.shopId, shopId))).get();
export const insertMaterial = (db: Db, row: typeof materials.$inferInsert) => db.insert(materials).values(row).returning().get();
export const updateMaterial = (db: Db, shopId: string, id: string, set: Partial<typeof materials.$inferInsert>) =>
  db.update(materials).set(set).where(and(eq(materials.id, id), eq(materials.shopId, shopId))).returning().get();
export const deleteMaterial = (db: Db, shopId: string, id: string) =>
  db.delete(materials).where(and(eq(materials.id, id), eq(materials.shopId, shopId))).run();
/** listings of this shop whose draft or live copy mention the material id (ids are UUIDs: no LIKE wildcards) */
export const listingsUsing = (db: Db, shopId: string, id: string) =>
  db.select({ id: listings.id, title: listings.liveTitle }).from(listings)
    .where(and(eq(listings.shopId, shopId), or(like(listings.draft, `%"${id}"%`), like(listings.live, `%"${id}"%`)))).all();
