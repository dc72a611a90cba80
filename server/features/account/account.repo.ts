import { eq, like } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { shops, user } from '../../db/schema.ts';

export const findShopByOwner = (db: Db, ownerId: string) => db.select().from(shops).where(eq(shops.ownerId, ownerId)).get();
export const slugsLike = (db: Db, base: string) =>
  db
    .select({ slug: shops.slug })
    .from(shops)
    .where(like(shops.slug, `${base}%`))
    .all()
    .map((r) => r.slug);
export const insertShop = (db: Db, row: typeof shops.$inferInsert) => db.insert(shops).values(row).returning().get();
export const setUserRole = (db: Db, userId: string, role: string) => db.update(user).set({ role }).where(eq(user.id, userId)).run();
