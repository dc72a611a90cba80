// The database calls of the request guards (auth-guards.ts).
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client.ts';
import { session, shops } from '../db/schema.ts';

export type ShopRow = typeof shops.$inferSelect;

export const authRepo = {
  deleteSession: (db: Db, id: string) => db.delete(session).where(eq(session.id, id)).run(),
  shopOfOwner: (db: Db, userId: string): ShopRow | undefined => db.select().from(shops).where(eq(shops.ownerId, userId)).get(),
};
