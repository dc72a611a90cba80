import { and, desc, eq, getTableColumns, like, sql } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { listings, materials, motifs, uploads } from '../../db/schema.ts';
import { amongShop } from '../../db/shared-queries.repo.ts';

export type ListingRow = typeof listings.$inferSelect;

const ownWhere = (shopId: string, state?: string) => (state ? and(eq(listings.shopId, shopId), eq(listings.state, state)) : eq(listings.shopId, shopId));
/** one page of the shop's listings, last changed first */
export const listOwn = (db: Db, shopId: string, state: string | undefined, limit: number, offset: number) =>
  db.select().from(listings).where(ownWhere(shopId, state)).orderBy(desc(listings.updatedAt), listings.id).limit(limit).offset(offset).all();
export const countOwn = (db: Db, shopId: string, state?: string) => db.select({ n: sql<number>`count(*)` }).from(listings).where(ownWhere(shopId, state)).get()?.n ?? 0;
/** scoped by shop: another shop's listing id is not found */
export const findOwn = (db: Db, shopId: string, id: string) =>
  db
    .select()
    .from(listings)
    .where(and(eq(listings.id, id), eq(listings.shopId, shopId)))
    .get();
export const insertListing = (db: Db, row: typeof listings.$inferInsert) => db.insert(listings).values(row).returning().get();
export const updateOwn = (db: Db, shopId: string, id: string, set: Partial<typeof listings.$inferInsert>) =>
  db
    .update(listings)
    .set(set)
    .where(and(eq(listings.id, id), eq(listings.shopId, shopId)))
    .returning()
    .get();
export const deleteOwn = (db: Db, shopId: string, id: string) =>
  db
    .delete(listings)
    .where(and(eq(listings.id, id), eq(listings.shopId, shopId)))
    .run();
export const slugExists = (db: Db, slug: string) => !!db.select({ id: listings.id }).from(listings).where(eq(listings.slug, slug)).get();
export const slugsLike = (db: Db, base: string) =>
  db
    .select({ slug: listings.slug })
    .from(listings)
    .where(like(listings.slug, `${base}%`))
    .all()
    .map((r) => r.slug);

// ownership lookups for what a listing refers to: only rows of this shop come back
export const ownMaterials = (db: Db, shopId: string, ids: string[]) => amongShop(db, materials, { id: materials.id, archived: materials.archived }, shopId, ids);
export const ownMotifs = (db: Db, shopId: string, ids: string[]) => amongShop(db, motifs, getTableColumns(motifs), shopId, ids);
export const ownPhotos = (db: Db, shopId: string, ids: string[]) => amongShop(db, uploads, { id: uploads.id, kind: uploads.kind }, shopId, ids);
