/**
 * An express-rate-limit store that counts in the SQLite file (rate_limit_hits), so every server
 * process started by WORKERS sees the same counts and a limit holds across them: a client cannot get
 * N times the limit by landing on N processes. Each hit is one upsert statement (atomic in SQLite);
 * windows are fixed, as with the library's memory store. Ended windows are pruned now and then.
 */
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import type { Db } from '../db/client.ts';
import { rateLimitRepo as repo } from './rate-limit.repo.ts';

const PRUNE_EVERY_MS = 60_000;

export class SqliteLimitStore implements Store {
  /** counts live in the database, shared by every process */
  localKeys = false;
  prefix: string;
  private windowMs = 60_000;
  private pruned = 0;

  constructor(
    private readonly db: Db,
    name: string,
    private readonly now: () => number = Date.now,
  ) {
    this.prefix = `${name}:`;
  }

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  private key = (k: string) => `${this.prefix}${k}`;
  private info = (r: { hits: number; resetAt: number }): ClientRateLimitInfo => ({ totalHits: r.hits, resetTime: new Date(r.resetAt) });

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const r = repo.get(this.db, this.key(key), this.now());
    return r ? this.info(r) : undefined;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const now = this.now();
    if (now - this.pruned > PRUNE_EVERY_MS) {
      this.pruned = now;
      repo.prune(this.db, now);
    }
    return this.info(repo.hit(this.db, this.key(key), now, this.windowMs));
  }

  async decrement(key: string): Promise<void> {
    repo.unhit(this.db, this.key(key), this.now());
  }

  async resetKey(key: string): Promise<void> {
    repo.reset(this.db, this.key(key));
  }
}

/** The app's store factory (AppDeps.limitStore): one store per limiter, named so their counts never mix. */
export const sqliteLimitStores =
  (db: Db, now?: () => number) =>
  (name: string): Store =>
    new SqliteLimitStore(db, name, now);
