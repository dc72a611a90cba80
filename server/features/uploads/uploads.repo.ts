import { and, desc, eq, like, or } from 'drizzle-orm';
import { motifFingerprint } from '../../../shared/engine/motif-fingerprint.ts';
import type { Db } from '../../db/client.ts';
import { listings, motifs, shops, uploads } from '../../db/schema.ts';

export type UploadRow = typeof uploads.$inferSelect;
export type MotifRow = typeof motifs.$inferSelect;

export const insertUpload = (db: Db, row: typeof uploads.$inferInsert) => db.insert(uploads).values(row).returning().get();
export const listUploads = (db: Db, shopId: string) => db.select().from(uploads).where(eq(uploads.shopId, shopId)).orderBy(desc(uploads.createdAt)).all();
export const findUpload = (db: Db, shopId: string, id: string) =>
  db
    .select()
    .from(uploads)
    .where(and(eq(uploads.id, id), eq(uploads.shopId, shopId)))
    .get();
export const deleteUpload = (db: Db, shopId: string, id: string) =>
  db
    .delete(uploads)
    .where(and(eq(uploads.id, id), eq(uploads.shopId, shopId)))
    .run();

export const insertMotif = (db: Db, row: typeof motifs.$inferInsert) =>
  db
    .insert(motifs)
    .values({ ...row, geometryHash: motifFingerprint(row.geometry) })
    .returning()
    .get();
export const listMotifs = (db: Db, shopId: string) => db.select().from(motifs).where(eq(motifs.shopId, shopId)).orderBy(desc(motifs.createdAt)).all();
export const findMotif = (db: Db, shopId: string, id: string) =>
  db
    .select()
    .from(motifs)
    .where(and(eq(motifs.id, id), eq(motifs.shopId, shopId)))
    .get();
export const findMotifAnyShop = (db: Db, id: string) => db.select().from(motifs).where(eq(motifs.id, id)).get();
export const deleteMotif = (db: Db, shopId: string, id: string) =>
  db
    .delete(motifs)
    .where(and(eq(motifs.id, id), eq(motifs.shopId, shopId)))
    .run();

/** listings of the shop whose draft or live copy mention the id (our ids are UUIDs: no LIKE wildcards in them) */
export const listingsMentioning = (db: Db, shopId: string, id: string) =>
  db
    .select({ id: listings.id })
    .from(listings)
    .where(and(eq(listings.shopId, shopId), or(like(listings.draft, `%"${id}"%`), like(listings.live, `%"${id}"%`))))
    .all();

/** is the motif offered by a listing on sale (live listing, live shop)? Then shoppers may see it. */
export const motifOnSale = (db: Db, motif: MotifRow) =>
  !!db
    .select({ id: listings.id })
    .from(listings)
    .innerJoin(shops, eq(shops.id, listings.shopId))
    .where(and(eq(listings.shopId, motif.shopId), eq(listings.state, 'live'), eq(shops.state, 'live'), like(listings.live, `%"motifId":"${motif.id}"%`)))
    .get();
