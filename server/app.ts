import fs from 'node:fs';
import path from 'node:path';
import { toNodeHandler } from 'better-auth/node';
import compression from 'compression';
import express, { type Express } from 'express';
import helmet from 'helmet';
import morgan from 'morgan';
import { createAuth } from './auth.ts';
import { DEMO_PASSWORD, hasDemoData } from './db/demo-accounts.ts';
import { pingDatabase } from './db/health.repo.ts';
import type { AppDeps } from './deps.ts';
import { featureRouters } from './features/index.ts';
import { listingImagesRouter } from './features/listing-images/index.ts';
import { builtSsrEntry, type SsrSetup, seoRouter, ssrPages } from './features/ssr/index.ts';
import { createWorksheetBuilder } from './features/workroom/index.ts';
import { DEFAULT_RATE_LIMITS, type RateLimits } from './http/account-rate-limit.ts';
import { notFound } from './http/app-error.ts';
import { withOurErrorShape } from './http/auth-errors.ts';
import { loadSession } from './http/auth-guards.ts';
import { authInput } from './http/auth-input.ts';
import { errorHandler } from './http/error-handler.ts';
import { sqliteLimitStores } from './http/rate-limit-store.ts';
import { appOrigins, sameOrigin } from './http/same-origin.ts';
import { createWorkPool, type WorkPool } from './workers/pool.ts';

export type CreateAppInput = Omit<AppDeps, 'auth' | 'now' | 'pool' | 'rateLimits' | 'worksheetBuilder' | 'limitStore'> & {
  now?: () => number;
  clientDir?: string;
  /** a pool to use; by default one is made (its threads start on first use) */
  pool?: WorkPool;
  /** time limit of one pooled task, ms (when the app makes its pool) */
  taskTimeoutMs?: number;
  rateLimits?: Partial<RateLimits>;
  /**
   * 'lease': the runtime starts the once-only work (work sheet PDFs) when this process holds the
   * lease (server/jobs/lease.ts); by default (tests, scripts) this app builds them itself.
   */
  onceOnly?: 'lease' | 'here';
  /** server rendering of the public pages; by default the build beside clientDir (dist-ssr/) */
  ssr?: SsrSetup;
};

/** Builds the Express app; never listens (tests start it on port 0, server/index.ts on PORT). */
export function createApp(input: CreateAppInput): Express & { locals: { deps: AppDeps } } {
  const { pool, taskTimeoutMs, rateLimits, onceOnly, ssr: ssrInput, ...rest } = input;
  const now = input.now ?? Date.now;
  const workPool = pool ?? createWorkPool({ timeoutMs: taskTimeoutMs });
  const deps: AppDeps = {
    ...rest,
    now,
    auth: createAuth(input),
    pool: workPool,
    rateLimits: { ...DEFAULT_RATE_LIMITS, ...rateLimits },
    worksheetBuilder: createWorksheetBuilder({ db: input.db, pool: workPool, now, dir: input.env.worksheetsDir }),
    limitStore: sqliteLimitStores(input.db, now),
  };
  if (onceOnly !== 'lease') deps.worksheetBuilder.activate();
  const { env } = deps;
  const app = express();
  app.locals.deps = deps;
  app.disable('x-powered-by');
  // who may set X-Forwarded-For/-Proto (req.ip for rate limits, req.secure): TRUST_PROXY, default loopback
  app.set('trust proxy', env.TRUST_PROXY);

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'default-src': ["'self'"],
          'script-src': ["'self'"],
          'style-src': ["'self'", "'unsafe-inline'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'font-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          'frame-src': ["'self'"],
          'object-src': ["'none'"],
          'form-action': ["'self'"],
          'upgrade-insecure-requests': env.production ? [] : null,
        },
      },
      crossOriginEmbedderPolicy: false,
      strictTransportSecurity: env.production,
    }),
  );
  if (env.LOG_REQUESTS && env.NODE_ENV !== 'test') app.use(morgan(env.production ? 'combined' : 'dev'));
  // brotli or gzip, as the client accepts, for anything worth it (compression's default threshold, 1 kB)
  app.use(compression());

  app.use('/api', sameOrigin(appOrigins(env), { sameHost: !env.production }));

  // better-auth reads its own bodies; our front guard validates and limits first
  app.use('/api/auth', authInput({ signInFailuresPerMinute: 5, session: loadSession(deps), store: deps.limitStore('sign-in') }));
  app.all('/api/auth/{*any}', toNodeHandler(withOurErrorShape(deps.auth)));

  // routes that need the raw body (payment webhooks) mount before the JSON parser
  const routers = featureRouters(deps);
  for (const r of routers.raw) app.use(r.path, r.router);

  app.use(express.json({ limit: '256kb' }));
  app.use('/api', loadSession(deps));

  app.get('/api/health', (_req, res) => {
    pingDatabase(deps.db);
    res.json({ ok: true });
  });
  app.get('/api/config', (_req, res) => {
    // the demo accounts are listed only when DEMO_DATA is on and they are really in the database
    res.json(
      env.demoData && hasDemoData(deps)
        ? {
            demoMode: true,
            demoPassword: DEMO_PASSWORD,
            demoAccounts: [
              { email: 'dana@namesake.test', role: 'shopper', label: 'Dana, a parent buying gifts' },
              { email: 'fern@namesake.test', role: 'seller', label: 'Fern & Fable Goods' },
              { email: 'comet@namesake.test', role: 'seller', label: 'Little Comet Print Co.' },
              { email: 'admin@namesake.test', role: 'admin', label: 'Namesake moderator' },
            ],
          }
        : { demoMode: false },
    );
  });
  for (const r of routers.json) app.use(r.path, r.router);

  app.use('/api', (_req, _res) => {
    throw notFound('No such API route.');
  });

  const clientDir = input.clientDir && fs.existsSync(path.join(input.clientDir, 'index.html')) ? input.clientDir : undefined;
  const ssr: SsrSetup | undefined = ssrInput ?? (clientDir ? { template: fs.readFileSync(path.join(clientDir, 'index.html'), 'utf8'), entry: builtSsrEntry(clientDir) } : undefined);
  app.use(seoRouter(deps));
  app.use('/listing-images', listingImagesRouter(deps, ssr?.entry));
  if (clientDir) {
    app.use(
      express.static(clientDir, {
        index: false,
        maxAge: '1h',
        setHeaders: (res, file) => {
          // Vite's hashed file names change with their content: cache them for good
          if (file.includes(`${path.sep}assets${path.sep}`)) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        },
      }),
    );
  }
  if (ssr) app.get('/{*any}', loadSession(deps), ssrPages(deps, ssr));

  app.use(errorHandler);
  return app as Express & { locals: { deps: AppDeps } };
}
