// Query pieces that several features' repos make the same way: the listing-with-shop and
// shop-with-owner joins, and "the rows among these ids that belong to this shop". Each feature's
// repo builds on these, so a join or a shop scope is written once.
import { and, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { SelectResultFields } from 'drizzle-orm/query-builders/select.types';
import type { SelectedFields, SQLiteColumn, SQLiteTable } from 'drizzle-orm/sqlite-core';
import type { Db } from './client.ts';
import { listings, materials, motifs, reviews, shops, user } from './schema.ts';

/** Listings joined to their shop, as `{ listing, shop }`; the caller adds the where/order. */
export const listingsWithShop = (db: Db) => db.select({ listing: listings, shop: shops }).from(listings).innerJoin(shops, eq(shops.id, listings.shopId));

/** Shops joined to their owner's name and e-mail, as `{ shop, ownerEmail, ownerName }`; the caller adds the where/order. */
export const shopsWithOwner = (db: Db) => db.select({ shop: shops, ownerEmail: user.email, ownerName: user.name }).from(shops).innerJoin(user, eq(user.id, shops.ownerId));

type ShopScoped = SQLiteTable & { id: SQLiteColumn; shopId: SQLiteColumn };

/**
 * The given columns of the rows among `ids` that belong to the shop: another shop's ids are simply
 * absent. No ids, no query.
 */
export function amongShop<F extends SelectedFields>(db: Db, table: ShopScoped, fields: F, shopId: string, ids: string[]): SelectResultFields<F>[] {
  if (!ids.length) return [];
  return db
    .select(fields)
    .from(table)
    .where(and(eq(table.shopId, shopId), inArray(table.id, ids)))
    .all() as SelectResultFields<F>[];
}

/** What a preview or a cut needs of a material: its kind and colour. */
export const materialSwatch = { id: materials.id, kind: materials.kind, colourName: materials.colourName, colourHex: materials.colourHex };
/** What a preview or a cut needs of a motif: its name and normalised geometry. */
export const motifOutline = { id: motifs.id, name: motifs.name, geometry: motifs.geometry };

/**
 * Sum and count of the visible (not hidden) review ratings of one listing or one shop: the reviews
 * feature pages them, the catalogue puts the summary on the listing and shop pages (and so in the
 * listing's structured data).
 */
export function visibleRatings(db: Db, by: { listingId: string } | { shopId: string }): { sum: number; count: number } {
  const scope = 'listingId' in by ? eq(reviews.listingId, by.listingId) : eq(reviews.shopId, by.shopId);
  const row = db
    .select({ sum: sql<number>`coalesce(sum(${reviews.rating}), 0)`, count: sql<number>`count(*)` })
    .from(reviews)
    .where(and(scope, isNull(reviews.hiddenAt)))
    .get();
  return { sum: row?.sum ?? 0, count: row?.count ?? 0 };
}
