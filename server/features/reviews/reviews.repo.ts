// Every database call of reviews.
import { and, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { Db } from '../../db/client.ts';
import { listings, reviews, user } from '../../db/schema.ts';

export type ReviewRow = typeof reviews.$inferSelect;

const withNames = (db: Db) =>
  db
    .select({ r: reviews, authorName: user.name, listingSlug: listings.slug, listingTitle: listings.liveTitle })
    .from(reviews)
    .innerJoin(user, eq(user.id, reviews.authorId))
    .innerJoin(listings, eq(listings.id, reviews.listingId));
export type ReviewWithNames = Awaited<ReturnType<ReturnType<typeof withNames>['all']>>[number];

export const reviewsRepo = {
  insert: (db: Db, row: typeof reviews.$inferInsert) => db.insert(reviews).values(row).run(),
  find: (db: Db, id: string) => db.select().from(reviews).where(eq(reviews.id, id)).get(),
  ofLines: (db: Db, lineIds: string[]) => (lineIds.length ? withNames(db).where(inArray(reviews.lineId, lineIds)).all() : []),
  byId: (db: Db, id: string) => withNames(db).where(eq(reviews.id, id)).get(),
  /** one page of the visible reviews of a listing or a shop, newest first */
  visiblePage: (db: Db, by: { listingId: string } | { shopId: string }, limit: number, offset: number) =>
    withNames(db)
      .where(and('listingId' in by ? eq(reviews.listingId, by.listingId) : eq(reviews.shopId, by.shopId), isNull(reviews.hiddenAt)))
      .orderBy(desc(reviews.createdAt), desc(sql`reviews.rowid`))
      .limit(limit)
      .offset(offset)
      .all(),
  /** the shop's one reply: written only while there is none */
  setReply: (db: Db, id: string, reply: string, at: number) =>
    db
      .update(reviews)
      .set({ reply, repliedAt: at })
      .where(and(eq(reviews.id, id), isNull(reviews.reply)))
      .run().changes === 1,
  hide: (db: Db, id: string, reason: string, at: number) =>
    db
      .update(reviews)
      .set({ hiddenAt: at, hiddenReason: reason })
      .where(and(eq(reviews.id, id), isNull(reviews.hiddenAt)))
      .run().changes === 1,
};
