/**
 * WORKERS=N: N server processes (node:cluster) answer on one port and share the SQLite file (WAL,
 * busy_timeout; server/db/client.ts). The primary does what must happen once per start — migrations,
 * the demo seed, the local mail and payment fakes, the pid file — then forks the workers and restarts
 * one that dies. The workers serve requests; among them, the holder of the once-only lease runs the
 * scheduled jobs and builds the work sheet PDFs (server/jobs/lease.ts), and rate limits count in the
 * database, so they hold across processes. SIGTERM/SIGINT: each worker finishes its requests and
 * closes; then the primary closes the fakes and the database.
 */
import cluster, { type Worker } from 'node:cluster';
import fs from 'node:fs';
import { createApp } from './app.ts';
import { openDb } from './db/client.ts';
import { hasDemoData } from './db/demo-accounts.ts';
import { isEmpty, seedDemo } from './db/seed.ts';
import { loadEnv } from './env.ts';
import { createMailer } from './integrations/mailer.ts';
import { type Running, type StartOptions, startFakes } from './runtime.ts';
import { writePidFile } from './runtime-lock.ts';

type Ready = { type: 'namesake:ready'; url: string };
const isReady = (m: unknown): m is Ready => typeof m === 'object' && m !== null && (m as Ready).type === 'namesake:ready';

/** In a worker: tells the primary this process is listening. */
export function reportReady(url: string): void {
  process.send?.({ type: 'namesake:ready', url } satisfies Ready);
}

/** How long a worker may take to stop before it is killed. */
const STOP_GRACE_MS = 15_000;
const MAX_RESTARTS = 5;
const RESTART_WINDOW_MS = 60_000;

export async function startCluster(workers: number, opts: Omit<StartOptions, 'clusterWorker'> = {}): Promise<Running> {
  const log = opts.log ?? ((s: string) => console.log(s));
  let env = loadEnv(opts.envSource ?? process.env);
  fs.mkdirSync(env.dataDir, { recursive: true });
  const fakes = await startFakes(env, log);
  env = fakes.env;
  const closeFakes = async () => {
    for (const c of fakes.closers.reverse()) await c();
  };
  // migrations (openDb) and the demo seed, once, here
  const { db, sqlite } = openDb(env.dbFile);
  try {
    if ((opts.seed ?? env.demoData) && isEmpty({ db })) {
      log('  seeding the demo scenario …');
      const mailer = createMailer(env);
      const app = createApp({ db, env, mailer, onceOnly: 'lease' });
      try {
        await seedDemo(app.locals.deps);
      } finally {
        await app.locals.deps.pool.close();
        mailer.close();
      }
    }
  } catch (err) {
    sqlite.close();
    await closeFakes();
    throw err;
  }

  // the workers read the same environment, pointed at the fakes this process runs
  const workerEnv: Record<string, string> = { WORKERS: String(workers) };
  if (env.startMailFake) Object.assign(workerEnv, { MAIL_FAKE: 'false', SMTP_HOST: env.SMTP_HOST, SMTP_PORT: String(env.SMTP_PORT) });
  if (env.startStripeFake) Object.assign(workerEnv, { STRIPE_FAKE: 'false', STRIPE_API_BASE: env.STRIPE_API_BASE });
  if (opts.clientDir) workerEnv.CLIENT_DIR = opts.clientDir;

  let stopping = false;
  const live = new Set<Worker>();
  // a worker that keeps dying (a bug at start, a full disk) is not restarted for ever: past
  // MAX_RESTARTS in RESTART_WINDOW_MS the whole server stops, with that said, and exits non-zero
  const restarts: number[] = [];
  const fork = () => {
    const w = cluster.fork(workerEnv);
    live.add(w);
    w.on('exit', (code, signal) => {
      live.delete(w);
      if (stopping) return;
      // a worker that dies is replaced; the lease moves to a live one if it held it
      const now = Date.now();
      restarts.push(now);
      while (restarts.length && now - restarts[0]! > RESTART_WINDOW_MS) restarts.shift();
      if (restarts.length > MAX_RESTARTS) {
        console.error(`worker ${w.process.pid} exited (${signal ?? code}); ${restarts.length} exits within a minute, so Namesake stops.`);
        process.exitCode = 1;
        process.kill(process.pid, 'SIGTERM'); // server/index.ts stops everything cleanly
        return;
      }
      console.error(`worker ${w.process.pid} exited (${signal ?? code}); starting another`);
      fork();
    });
    return w;
  };

  let url: string;
  try {
    url = await new Promise<string>((resolve, reject) => {
      let ready = 0;
      let first = '';
      const started = Array.from({ length: workers }, fork);
      for (const w of started) {
        w.on('message', (m: unknown) => {
          if (!isReady(m)) return;
          first ||= m.url;
          if (++ready === workers) resolve(first);
        });
        // a worker that cannot start (bad port, …) fails the whole start, with its own message printed
        w.once('exit', (code) => {
          if (ready < workers) reject(new Error(`Namesake cannot start: a server process exited during start-up (code ${code}).`));
        });
      }
    });
  } catch (err) {
    stopping = true;
    await stopWorkers(live);
    sqlite.close();
    await closeFakes();
    throw err;
  }
  fakes.onListening(url.replace('localhost', '127.0.0.1'));
  const removePidFile = writePidFile(env.dataDir);
  log(`  ${workers} server processes: ${[...live].map((w) => w.process.pid).join(', ')}`);

  let stopped: Promise<void> | null = null;
  return {
    url,
    env,
    demo: env.demoData && hasDemoData({ db }),
    noAccounts: isEmpty({ db }),
    stop() {
      stopped ??= (async () => {
        stopping = true;
        await stopWorkers(live);
        await closeFakes();
        sqlite.close(); // the last connection: SQLite checkpoints the WAL
        removePidFile();
      })();
      return stopped;
    },
  };
}

/** SIGTERM to each worker (it finishes its requests, then exits), SIGKILL after the grace period. */
async function stopWorkers(live: Set<Worker>): Promise<void> {
  await Promise.all(
    [...live].map(
      (w) =>
        new Promise<void>((resolve) => {
          if (w.isDead()) return resolve();
          const kill = setTimeout(() => w.process.kill('SIGKILL'), STOP_GRACE_MS);
          w.once('exit', () => (clearTimeout(kill), resolve()));
          w.process.kill('SIGTERM');
        }),
    ),
  );
}
