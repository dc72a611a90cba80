// Wires env → database → fakes → mailer → app. Used by server/index.ts and the e2e/bench launchers.
import fs from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { startMailFake } from '../fakes/mail/server.ts';
import { createApp } from './app.ts';
import { openDb } from './db/client.ts';
import { hasDemoData } from './db/demo-accounts.ts';
import { isEmpty, seedDemo } from './db/seed.ts';
import { type Env, loadEnv } from './env.ts';
import { createMailer } from './integrations/mailer.ts';
import { startLease } from './jobs/lease.ts';
import { type Jobs, startJobs } from './jobs/scheduler.ts';
import { writePidFile } from './runtime-lock.ts';

export type Running = {
  url: string;
  env: Env;
  /** the demo accounts are there (and DEMO_DATA is on), so the sign-in page lists them */
  demo: boolean;
  /** no account at all yet: the first admin comes from `npm run admin:create -- EMAIL` */
  noAccounts: boolean;
  stop(): Promise<void>;
};

export type StartOptions = {
  envSource?: Record<string, string | undefined>;
  clientDir?: string;
  seed?: boolean;
  log?: (s: string) => void;
  /**
   * One of the processes WORKERS starts (server/cluster.ts): the primary has migrated, seeded and
   * started the fakes and writes the pid file; this process serves requests and competes for the lease.
   */
  clusterWorker?: boolean;
};

/** The lease whose holder runs the scheduled jobs and builds the work sheet PDFs. */
export const ONCE_ONLY_LEASE = 'once-only';

export async function startNamesake(opts: StartOptions = {}): Promise<Running> {
  const log = opts.log ?? ((s: string) => console.log(s));
  let env = loadEnv(opts.envSource ?? process.env);
  fs.mkdirSync(env.dataDir, { recursive: true });
  const closers: Array<() => Promise<void> | void> = [];

  const closeAll = async () => {
    for (const c of closers.reverse()) await c();
  };
  try {
    const fakes = await startFakes(env, log);
    env = fakes.env;
    closers.push(...fakes.closers);
    return await startApp(env, opts, log, closers, fakes.onListening);
  } catch (err) {
    await closeAll();
    throw err;
  }
}

/** The local mail and payment fakes this environment asks for; `env` comes back pointing at them. */
export async function startFakes(env: Env, log: (s: string) => void): Promise<{ env: Env; closers: Array<() => Promise<void> | void>; onListening: (appUrl: string) => void }> {
  const closers: Array<() => Promise<void> | void> = [];
  try {
    if (env.startMailFake) {
      // the usual port, or any free one when another Namesake on this machine holds it
      const mail = await startMailFake({ port: env.SMTP_PORT, dir: env.mailDir, orFreePort: true });
      closers.push(() => mail.close());
      env = { ...env, SMTP_PORT: mail.port, SMTP_HOST: '127.0.0.1' };
      log(`  mail fake       smtp://127.0.0.1:${mail.port} (stored in ${path.relative(process.cwd(), env.mailDir) || env.mailDir})`);
    }
    const extra = await startExtraFakes(env, log);
    closers.push(...extra.closers);
    return { env: extra.env, closers, onListening: extra.onListening };
  } catch (err) {
    for (const c of closers.reverse()) await c();
    throw err;
  }
}

async function startApp(env: Env, opts: StartOptions, log: (s: string) => void, closers: Array<() => Promise<void> | void>, onListening: (appUrl: string) => void): Promise<Running> {
  const { db, sqlite } = openDb(env.dbFile, { migrate: !opts.clusterWorker });
  const mailer = createMailer(env);
  let app: ReturnType<typeof createApp>;
  let server: Server;
  try {
    // the once-only work (work sheet PDFs, scheduled jobs) starts below, once this process holds the lease
    app = createApp({ db, env, mailer, clientDir: opts.clientDir, onceOnly: 'lease' });
    // the worker pool: closed (its threads ended) after the server stops taking requests
    closers.push(() => app.locals.deps.pool.close());
    // the demo scenario only when asked for (DEMO_DATA; never implied in production)
    if (!opts.clusterWorker && (opts.seed ?? env.demoData) && isEmpty({ db })) {
      log('  seeding the demo scenario …');
      await seedDemo(app.locals.deps);
    }
    server = await listen(app, env);
  } catch (err) {
    mailer.close();
    sqlite.close();
    throw err; // the caller closes the fakes and the pool
  }
  // worker threads start now, in the background, so the first heavy request need not wait for one
  app.locals.deps.pool.warm();
  // Once-only work, in the one process that holds the lease (with WORKERS=1, this one): the work
  // sheet PDF builder and the morning digest (croner) with its start-up catch-up — after the seed, so
  // the demo shops get it. Another process takes the lease over if this one dies.
  const deps = app.locals.deps;
  let jobs: Jobs | null = null;
  const lease = startLease(db, {
    name: ONCE_ONLY_LEASE,
    onAcquire() {
      deps.worksheetBuilder.activate({ pollMs: 500 });
      if (env.DIGEST) jobs = startJobs(deps, log);
      if (opts.clusterWorker) log(`  process ${process.pid} runs the scheduled jobs and work sheet PDFs`);
    },
    async onRelease() {
      const j = jobs;
      jobs = null;
      await Promise.all([j?.stop(), deps.worksheetBuilder.deactivate()]);
    },
  });
  const port = (server.address() as AddressInfo).port;
  // while it runs, DATA_DIR/namesake.pid says so (scripts/db-restore.ts refuses then); the primary's, with WORKERS
  const removePidFile = opts.clusterWorker ? () => {} : writePidFile(env.dataDir);
  const url = `http://localhost:${port}`;
  onListening(`http://127.0.0.1:${port}`);
  let stopping: Promise<void> | null = null;
  return {
    url,
    env,
    demo: env.demoData && hasDemoData({ db }),
    noAccounts: isEmpty({ db }),
    stop() {
      // finish in-flight requests, then close fakes and the database
      stopping ??= (async () => {
        await new Promise<void>((resolve) => {
          // a keep-alive connection whose request finishes after this point turns idle later:
          // keep closing idle ones, so the process need not wait for the 5 s cut-off
          const idle = setInterval(() => server.closeIdleConnections(), 100);
          server.close(() => (clearInterval(idle), resolve()));
          server.closeIdleConnections();
          setTimeout(() => server.closeAllConnections(), 5000).unref();
        });
        await lease.stop();
        for (const c of closers.reverse()) await c();
        mailer.close();
        sqlite.close();
        removePidFile();
      })();
      return stopping;
    },
  };
}

/** The app on PORT; a taken port is a clear one-line refusal, not a stack trace. */
function listen(app: ReturnType<typeof createApp>, env: Env): Promise<Server> {
  return new Promise((resolve, reject) => {
    const s = app.listen(env.PORT, env.HOST);
    s.once('listening', () => resolve(s));
    s.once('error', (err: NodeJS.ErrnoException) => {
      reject(err.code === 'EADDRINUSE' ? new Error(`Namesake cannot start: ${env.HOST}:${env.PORT} is already in use (by another program or another Namesake); set PORT to a free port.`) : err);
    });
  });
}

function portOf(url: string): number | null {
  try {
    return Number(new URL(url).port) || null;
  } catch {
    return null;
  }
}

/** The local payment fake (fakes/stripe), when STRIPE_API_BASE points at this machine. */
async function startExtraFakes(env: Env, log: (s: string) => void): Promise<{ env: Env; closers: Array<() => Promise<void>>; onListening: (appUrl: string) => void }> {
  if (!env.startStripeFake) return { env, closers: [], onListening: () => {} };
  const { startStripeFake } = await import('../fakes/stripe/server.ts');
  const port = env.STRIPE_FAKE_PORT ?? portOf(env.STRIPE_API_BASE) ?? 12111;
  // the usual port, or any free one when another Namesake on this machine holds it
  const fake = await startStripeFake({ port, orFreePort: true, dataDir: path.join(env.dataDir, 'stripe'), webhookSecret: env.STRIPE_WEBHOOK_SECRET });
  log(`  payment fake    ${fake.url} (test cards only; state in ${path.join(env.dataDir, 'stripe')})`);
  return {
    env: { ...env, STRIPE_API_BASE: fake.url },
    closers: [() => fake.close()],
    onListening: (appUrl) => fake.setWebhookUrl(`${appUrl}/api/payments/webhook`),
  };
}
