/**
 * `npm run bench -- catalog`: 10,000 live listings in a temp database, then autocannon (50
 * connections, ~10 s each) against GET /api/listings?q=… on the real app and against a bare
 * Express JSON route. The servers run in a child process so the load generator does not share
 * their event loop. Prints req/s and p50/p99 for both, the search's uncached query time, and
 * a last line `ratio: X` (search req/s ÷ bare req/s). Targets (issue 4): ratio ≥ 0.5, p99 < 25 ms.
 */
import { type ChildProcess, fork } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const LISTINGS = 10_000;
const QUERIES = ['fox', 'rocket name', 'winter', 'pumpkin tote', 'whale', 'balloon', 'birthday tee', 'snowman'];

async function server(): Promise<void> {
  const express = (await import('express')).default;
  const { loadEnv } = await import('../server/env.ts');
  const { openDb } = await import('../server/db/client.ts');
  const { createApp } = await import('../server/app.ts');
  const { createMailer } = await import('../server/integrations/mailer.ts');
  const { shops, listings } = await import('../server/db/schema.ts');
  const { listingInputSchema, liveColumns, OCCASIONS, BLANK_KINDS } = await import('../shared/schemas/listing.ts');
  const { search } = await import('../server/features/catalog/index.ts');

  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-bench-'));
  const env = loadEnv({ NODE_ENV: 'test', DATA_DIR: dataDir, LOG_REQUESTS: 'false', STRIPE_FAKE: 'false', MAIL_FAKE: 'false' });
  const { db, sqlite } = openDb(env.dbFile);
  const mailer = createMailer(env);
  const app = createApp({ db, env, mailer });

  // 20 sellers with live shops, 500 listings each, titles and descriptions from the demo's words
  const nouns = ['fox', 'rocket', 'snowman', 'pumpkin', 'whale', 'balloon', 'acorn', 'star', 'comet', 'leaf'];
  const names = ['Mira', 'Theo', 'Anouk', 'Kai', 'Priya', 'Leon', 'Zoë', 'Bartholomew'];
  const things = ['tote', 'tee', 'pouch', 'drawstring bag'];
  const at = Date.now();
  const shopIds: string[] = [];
  for (let s = 0; s < 20; s++) {
    const u = await app.locals.deps.auth.api.signUpEmail({ body: { email: `bench-${s}@namesake.test`, password: 'bench-password-123', name: `Bench ${s}` } });
    const id = crypto.randomUUID();
    shopIds.push(id);
    db.insert(shops)
      .values({ id, ownerId: u.user.id, name: `Bench Shop ${s}`, slug: `bench-shop-${s}`, state: 'live', createdAt: at, updatedAt: at })
      .run();
  }
  db.transaction((tx) => {
    for (let i = 0; i < LISTINGS; i++) {
      const noun = nouns[i % nouns.length],
        shopId = shopIds[i % shopIds.length];
      if (noun === undefined || shopId === undefined) throw new Error('unreachable: indexes are taken modulo the list lengths');
      const thing = things[(i >> 3) % things.length];
      const content = listingInputSchema.parse({
        title: `${noun.charAt(0).toUpperCase()}${noun.slice(1)} ${thing} for ${names[i % names.length]} #${i}`,
        description: `A ${thing} with a ${noun} and a name. Pressed by hand. Shown with the name ${names[(i >> 2) % names.length]}.`,
        blank: { kind: BLANK_KINDS[i % BLANK_KINDS.length] },
        basePriceMinor: 1200 + (i % 40) * 50,
        occasions: [OCCASIONS[i % OCCASIONS.length], OCCASIONS[(i >> 1) % OCCASIONS.length]],
        personalisation: { textFields: [{ id: 'name', label: 'Name', fontIds: ['baloo-bold'], colourChoices: ['m1'] }] },
      });
      tx.insert(listings)
        .values({
          id: crypto.randomUUID(),
          shopId,
          slug: `bench-${i}`,
          state: 'live',
          draft: content as never,
          live: content as never,
          ...liveColumns(content),
          publishedAt: at - i * 1000,
          createdAt: at,
          updatedAt: at,
        })
        .run();
    }
  });
  sqlite.pragma('optimize');

  // uncached query time: every call below has a new cache key (a different maxPrice)
  const times: number[] = [];
  for (let i = 0; i < 400; i++) {
    const t0 = process.hrtime.bigint();
    search(db, { q: QUERIES[i % QUERIES.length], sort: 'newest', page: 1, limit: 24, maxPrice: 100_000 + i });
    times.push(Number(process.hrtime.bigint() - t0) / 1e6);
  }
  times.sort((a, b) => a - b);
  const uncached = { p50: times[Math.floor(times.length * 0.5)], p99: times[Math.floor(times.length * 0.99)] };

  const bare = express();
  bare.get('/bare', (_req, res) => {
    res.json({ ok: true });
  });
  const s1 = app.listen(0, '127.0.0.1');
  const s2 = bare.listen(0, '127.0.0.1');
  await Promise.all([new Promise((r) => s1.once('listening', r)), new Promise((r) => s2.once('listening', r))]);
  const port = (s: typeof s1) => (s.address() as { port: number }).port;
  process.send!({ appPort: port(s1), barePort: port(s2), uncached, dataDir });
  process.on('message', () => {
    s1.close();
    s2.close();
    mailer.close();
    sqlite.close();
    fs.rmSync(dataDir, { recursive: true, force: true });
    process.exit(0);
  });
}

type Ready = { appPort: number; barePort: number; uncached: { p50: number; p99: number } };

export async function run(): Promise<void> {
  // autocannon ships no types; this is the part of its API used here
  type Result = { requests: { average: number }; latency: { p50: number; p99: number }; errors: number; non2xx: number };
  const modName = 'autocannon';
  const autocannon = (await import(modName)).default as (o: { url: string; connections: number; duration: number; requests: { method: string; path: string }[] }) => Promise<Result>;
  const child: ChildProcess = fork(fileURLToPath(import.meta.url), [], {
    env: { ...process.env, NAMESAKE_BENCH_CATALOG_SERVER: '1', NODE_ENV: 'test' },
    execArgv: ['--import', 'tsx'],
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
  console.log(`seeding ${LISTINGS.toLocaleString('en')} listings …`);
  const ready = await new Promise<Ready>((resolve, reject) => {
    child.once('message', (m) => resolve(m as Ready));
    child.once('exit', (code) => reject(new Error(`bench server exited (${code})`)));
  });
  const load = (url: string, paths: string[]) => autocannon({ url, connections: 50, duration: 10, requests: paths.map((p) => ({ method: 'GET', path: p })) });
  try {
    const search = await load(
      `http://127.0.0.1:${ready.appPort}`,
      QUERIES.map((q) => `/api/listings?q=${encodeURIComponent(q)}`),
    );
    const bare = await load(`http://127.0.0.1:${ready.barePort}`, ['/bare']);
    const line = (name: string, r: typeof search) =>
      `${name.padEnd(28)} ${Math.round(r.requests.average).toString().padStart(7)} req/s   p50 ${r.latency.p50} ms   p99 ${r.latency.p99} ms   errors ${r.errors + r.non2xx}`;
    console.log(line('GET /api/listings?q=…', search));
    console.log(line('bare express JSON route', bare));
    console.log(`search SQL without cache (in process): p50 ${ready.uncached.p50.toFixed(2)} ms   p99 ${ready.uncached.p99.toFixed(2)} ms`);
    console.log(`ratio: ${(search.requests.average / bare.requests.average).toFixed(2)}`);
  } finally {
    child.send('stop');
  }
}

if (process.env.NAMESAKE_BENCH_CATALOG_SERVER === '1') await server();
