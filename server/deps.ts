// What every route, service and job is handed: the app's dependencies, made once by createApp
// (server/app.ts). A module of its own, with types only, so that features, jobs and the seed can
// name it without importing the app that mounts them.

import type { Auth } from './auth.ts';
import type { Db } from './db/client.ts';
import type { Env } from './env.ts';
import type { LimitStoreFactory, RateLimits } from './http/account-rate-limit.ts';
import type { Mailer } from './integrations/mailer.ts';
import type { WorkPool } from './workers/pool.ts';

export type AppDeps = {
  db: Db;
  env: Env;
  mailer: Mailer;
  /** the clock, injectable for tests */
  now: () => number;
  auth: Auth;
  /** worker threads for CPU-heavy work (server/workers/pool.ts); closed by the runtime on stop */
  pool: WorkPool;
  /** per-account limits on the routes that start heavy work */
  rateLimits: RateLimits;
  /** builds queued work sheet PDFs; active only in the process that holds the once-only lease (server/jobs/lease.ts) */
  worksheetBuilder: OnceOnlyWorker;
  /** where express-rate-limit counts: the database, so every server process shares the limits */
  limitStore: LimitStoreFactory;
};

/** Work that runs in one process only (server/features/workroom/worksheet-jobs.ts's builder): started and stopped with the lease. */
export type OnceOnlyWorker = {
  /** look for work now */
  kick(): void;
  /** start (this process holds the lease); `pollMs` also looks every so often, for work queued by other processes */
  activate(opts?: { pollMs?: number }): void;
  /** stop, after the work in hand */
  deactivate(): Promise<void>;
};
