import { and, eq, ne } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { type ShopChange, shops, uploads } from '../../db/schema.ts';

export type { ShopChange };

export const findShopBySlug = (db: Db, slug: string) => db.select().from(shops).where(eq(shops.slug, slug)).get();
export const slugTakenByOther = (db: Db, slug: string, shopId: string) =>
  !!db
    .select({ id: shops.id })
    .from(shops)
    .where(and(eq(shops.slug, slug), ne(shops.id, shopId)))
    .get();
export const updateShop = (db: Db, shopId: string, set: Partial<typeof shops.$inferInsert>) => db.update(shops).set(set).where(eq(shops.id, shopId)).returning().get();
/** an upload owned by this shop, or undefined (so another shop's id reads as "not found") */
export const findOwnUpload = (db: Db, shopId: string, uploadId: string) =>
  db
    .select()
    .from(uploads)
    .where(and(eq(uploads.id, uploadId), eq(uploads.shopId, shopId)))
    .get();
export const insertUpload = (db: Db, row: typeof uploads.$inferInsert) => db.insert(uploads).values(row).returning().get();
