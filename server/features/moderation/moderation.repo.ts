import { and, asc, desc, eq, inArray, isNotNull, or, type SQL, sql } from 'drizzle-orm';
import type { SQLiteColumn } from 'drizzle-orm/sqlite-core';
import type { Db } from '../../db/client.ts';
import { auditLog, listings, motifs, shops, uploads, user } from '../../db/schema.ts';
import { listingsWithShop, shopsWithOwner } from '../../db/shared-queries.repo.ts';

export type ShopRow = typeof shops.$inferSelect;
export type ListingRow = typeof listings.$inferSelect;

/** One page of shops with their owner that pass `where`, in `order`; and how many pass in all. */
const shopOwnerPage = (db: Db, where: SQL | undefined, order: (SQLiteColumn | SQL)[], limit: number, offset: number) =>
  shopsWithOwner(db)
    .where(where)
    .orderBy(...order)
    .limit(limit)
    .offset(offset)
    .all();
const shopOwnerCount = (db: Db, where: SQL | undefined) => db.select({ n: sql<number>`count(*)` }).from(shops).innerJoin(user, eq(user.id, shops.ownerId)).where(where).get()?.n ?? 0;

// the review queue, oldest first (a page at a time)
const shopWaits = eq(shops.state, 'in_review');
export const shopsInReview = (db: Db, limit: number, offset: number) => shopOwnerPage(db, shopWaits, [shops.createdAt, shops.id], limit, offset);
export const shopsInReviewCount = (db: Db) => shopOwnerCount(db, shopWaits);
const listingWaits = or(eq(listings.state, 'in_review'), eq(listings.pendingReview, true));
export const listingsInReview = (db: Db, limit: number, offset: number) => listingsWithShop(db).where(listingWaits).orderBy(listings.updatedAt, listings.id).limit(limit).offset(offset).all();
export const listingInReview = (db: Db, id: string) =>
  listingsWithShop(db)
    .where(and(eq(listings.id, id), listingWaits))
    .get();
export const listingsInReviewCount = (db: Db) => db.select({ n: sql<number>`count(*)` }).from(listings).innerJoin(shops, eq(shops.id, listings.shopId)).where(listingWaits).get()?.n ?? 0;
/** live (or suspended) shops whose name/description change waits for review, oldest first */
const shopHasChange = isNotNull(shops.pendingChange);
export const shopsWithChanges = (db: Db, limit: number, offset: number) => shopOwnerPage(db, shopHasChange, [shops.updatedAt, shops.id], limit, offset);
export const shopsWithChangesCount = (db: Db) => shopOwnerCount(db, shopHasChange);

export const findShop = (db: Db, id: string) => db.select().from(shops).where(eq(shops.id, id)).get();
export const findListing = (db: Db, id: string) => db.select().from(listings).where(eq(listings.id, id)).get();
export const ownerOf = (db: Db, shopId: string) => db.select({ email: user.email, name: user.name }).from(shops).innerJoin(user, eq(user.id, shops.ownerId)).where(eq(shops.id, shopId)).get();
export const updateShop = (db: Db, id: string, set: Partial<typeof shops.$inferInsert>) => db.update(shops).set(set).where(eq(shops.id, id)).returning().get();
/** updates only while the listing is still at the revision the moderator saw; undefined otherwise */
export const updateListingAt = (db: Db, id: string, revision: number, set: Partial<typeof listings.$inferInsert>) =>
  db
    .update(listings)
    .set(set)
    .where(and(eq(listings.id, id), eq(listings.revision, revision)))
    .returning()
    .get();
/** updates only while the shop's pending change is still the revision the moderator saw */
export const updateShopAt = (db: Db, id: string, changeRevision: number, set: Partial<typeof shops.$inferInsert>) =>
  db
    .update(shops)
    .set(set)
    .where(and(eq(shops.id, id), eq(shops.changeRevision, changeRevision), isNotNull(shops.pendingChange)))
    .returning()
    .get();
export const thumbOf = (db: Db, shopId: string, uploadId: string | undefined) =>
  uploadId
    ? (db
        .select({ t: uploads.thumbPath })
        .from(uploads)
        .where(and(eq(uploads.id, uploadId), eq(uploads.shopId, shopId)))
        .get()?.t ?? null)
    : null;

export const insertAudit = (db: Db, row: typeof auditLog.$inferInsert) => db.insert(auditLog).values(row).run();
const auditWhere = (action: string | undefined) => (action ? eq(auditLog.action, action) : undefined);
export const auditPage = (db: Db, limit: number, offset: number, action?: string) =>
  db
    .select({ entry: auditLog, actorName: user.name, actorEmail: user.email })
    .from(auditLog)
    .innerJoin(user, eq(user.id, auditLog.actorId))
    .where(auditWhere(action))
    .orderBy(desc(auditLog.createdAt), desc(sql`audit_log.rowid`))
    .limit(limit)
    .offset(offset)
    .all();
export const auditCount = (db: Db, action?: string) => db.select({ n: sql<number>`count(*)` }).from(auditLog).where(auditWhere(action)).get()?.n ?? 0;
export const shopNames = (db: Db, ids: string[]) => (ids.length ? db.select({ id: shops.id, name: shops.name, slug: shops.slug }).from(shops).where(inArray(shops.id, ids)).all() : []);
export const listingTitles = (db: Db, ids: string[]) =>
  ids.length ? db.select({ id: listings.id, draft: listings.draft, slug: listings.slug }).from(listings).where(inArray(listings.id, ids)).all() : [];

/** Every shop, filtered by a case-insensitive substring of name, slug or owner e-mail and by state. */
function shopFilter(q: string, state: string | undefined): SQL | undefined {
  const conds: (SQL | undefined)[] = [];
  if (state) conds.push(eq(shops.state, state));
  if (q) {
    // LIKE wildcards in the search text are literal
    const pat = `%${q.toLowerCase().replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    conds.push(or(sql`lower(${shops.name}) like ${pat} escape '\\'`, sql`lower(${shops.slug}) like ${pat} escape '\\'`, sql`lower(${user.email}) like ${pat} escape '\\'`));
  }
  return conds.length ? and(...conds) : undefined;
}
export const shopsPage = (db: Db, f: { q: string; state?: string }, limit: number, offset: number) =>
  shopOwnerPage(db, shopFilter(f.q, f.state), [asc(sql`lower(${shops.name})`), asc(shops.id)], limit, offset);
export const shopsCount = (db: Db, f: { q: string; state?: string }) => shopOwnerCount(db, shopFilter(f.q, f.state));

/** Motifs of other shops with the same fingerprint as these motifs of `shopId` (same artwork uploaded twice). */
export function motifsSharedWithOtherShops(db: Db, shopId: string, motifIds: string[]) {
  if (motifIds.length === 0) return [];
  const own = db
    .select({ id: motifs.id, name: motifs.name, hash: motifs.geometryHash })
    .from(motifs)
    .where(and(eq(motifs.shopId, shopId), inArray(motifs.id, motifIds), isNotNull(motifs.geometryHash)))
    .all();
  const hashes = [...new Set(own.map((m) => m.hash!))];
  if (hashes.length === 0) return [];
  const others = db
    .select({ hash: motifs.geometryHash, name: motifs.name, shopName: shops.name, shopSlug: shops.slug })
    .from(motifs)
    .innerJoin(shops, eq(shops.id, motifs.shopId))
    .where(and(inArray(motifs.geometryHash, hashes), sql`${motifs.shopId} <> ${shopId}`))
    .limit(50)
    .all();
  return own.flatMap((m) => others.filter((o) => o.hash === m.hash).map((o) => ({ motifId: m.id, motifName: m.name, otherShop: { name: o.shopName, slug: o.shopSlug }, otherMotifName: o.name })));
}
