// The health check's one query: the database answers (throws when it does not).
import { sql } from 'drizzle-orm';
import type { Db } from './client.ts';

export function pingDatabase(db: Db): void {
  db.get(sql`select 1`);
}
