// What every route, service and job is handed: the app's dependencies, made once by createApp
// (server/app.ts). A module of its own, with types only, so that features, jobs and the seed can
// name it without importing the app that mounts them.

import type { Auth } from './auth.ts';
import type { Db } from './db/client.ts';
import type { Env } from './env.ts';
import type { WorksheetBuilder } from './features/workroom/worksheet-jobs.ts';
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
  worksheetBuilder: WorksheetBuilder;
  /** where express-rate-limit counts: the database, so every server process shares the limits */
  limitStore: LimitStoreFactory;
};
