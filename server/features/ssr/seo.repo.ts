import { and, eq, max } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { listings, shops } from '../../db/schema.ts';

/** Every live listing of a live shop (what the catalogue shows), with when it last changed. */
export function liveListingSlugs(db: Db): Array<{ slug: string; updatedAt: number }> {
  return db
    .select({ slug: listings.slug, updatedAt: listings.updatedAt })
    .from(listings)
    .innerJoin(shops, eq(shops.id, listings.shopId))
    .where(and(eq(listings.state, 'live'), eq(shops.state, 'live')))
    .orderBy(listings.slug)
    .all();
}

/** Every live shop, with the last change of its live listings (null when it has none). */
export function liveShopSlugs(db: Db): Array<{ slug: string; updatedAt: number | null }> {
  return db
    .select({ slug: shops.slug, updatedAt: max(listings.updatedAt) })
    .from(shops)
    .leftJoin(listings, and(eq(listings.shopId, shops.id), eq(listings.state, 'live')))
    .where(eq(shops.state, 'live'))
    .groupBy(shops.id)
    .orderBy(shops.slug)
    .all();
}
