// The morning digest through the real runtime (server/runtime.ts): croner schedule, catch-up at
// start-up, job_runs keys in the same SQLite file. Three starts on one data dir: the digest lands
// in the mail fake's store once for the day, not once per start.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { eq, like } from 'drizzle-orm';
import { afterAll, expect, test } from 'vitest';
import { listMail } from '../../fakes/mail/store.ts';
import { openDb } from '../../server/db/client.ts';
import { jobRuns, orders, shops, user } from '../../server/db/schema.ts';
import { startNamesake } from '../../server/runtime.ts';

const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-digest-'));
afterAll(() => fs.rmSync(dataDir, { recursive: true, force: true }));

const env = (digest: boolean) => ({
  NODE_ENV: 'test',
  DATA_DIR: dataDir,
  PORT: '0',
  SMTP_PORT: '0',
  STRIPE_FAKE: 'false',
  LOG_REQUESTS: 'false',
  BASE_URL: 'http://localhost:3999',
  // midnight UTC has always passed today, so every start-up runs the catch-up
  DIGEST_CRON: '0 0 * * *',
  BUSINESS_TIME_ZONE: 'UTC',
  DIGEST: digest ? 'true' : 'false',
});
const digests = async () => (await listMail(path.join(dataDir, 'mail'), { to: 'fern@namesake.test' })).filter((m) => /your workroom for/.test(m.subject ?? ''));

test('when the server starts twice on the same day, then the digest is in the mail store once', async () => {
  // 1: seed the demo with the digest off, then make one of Fern's orders late for certain
  let run = await startNamesake({ envSource: env(false), seed: true, log: () => {} });
  await run.stop();
  {
    const { db, sqlite } = openDb(path.join(dataDir, 'namesake.db'));
    const owner = db.select().from(user).where(eq(user.email, 'fern@namesake.test')).get()!;
    const shop = db.select().from(shops).where(eq(shops.ownerId, owner.id)).get()!;
    const o = db.select().from(orders).where(eq(orders.shopId, shop.id)).all()[0]!;
    db.update(orders).set({ shipByDate: '2020-01-06' }).where(eq(orders.id, o.id)).run();
    sqlite.close();
  }
  expect(await digests()).toHaveLength(0);

  // 2: start with the digest on: the catch-up sends today's digest
  run = await startNamesake({ envSource: env(true), seed: true, log: () => {} });
  await run.stop(); // waits for a digest in flight
  const first = await digests();
  expect(first).toHaveLength(1);
  expect(first[0]!.text).toMatch(/Late \(past the ship-by date\)[\s\S]*ship by 2020-01-06/);

  // 3: a restart the same day: the key digest:<today>:<shop> is already there, nothing is sent
  run = await startNamesake({ envSource: env(true), seed: true, log: () => {} });
  await new Promise((r) => setTimeout(r, 500));
  await run.stop();
  expect(await digests()).toHaveLength(1);
  const { db, sqlite } = openDb(path.join(dataDir, 'namesake.db'));
  const today = new Date().toISOString().slice(0, 10);
  expect(
    db
      .select()
      .from(jobRuns)
      .where(like(jobRuns.key, `digest:${today}:%`))
      .all().length,
  ).toBeGreaterThanOrEqual(1);
  sqlite.close();
}, 120_000);
