// A fresh Namesake app per test file: its own temp DATA_DIR and SQLite file, a real mail fake on
// a free port, and helpers to make users and sign in through the real auth routes.

import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { startMailFake } from '../../fakes/mail/server.ts';
import { listMail } from '../../fakes/mail/store.ts';
import { startStripeFake } from '../../fakes/stripe/server.ts';
import { type CreateAppInput, createApp } from '../../server/app.ts';
import { openDb } from '../../server/db/client.ts';
import { shops, user } from '../../server/db/schema.ts';
import { seedDemo } from '../../server/db/seed.ts';
import { loadEnv } from '../../server/env.ts';
import { createMailer } from '../../server/integrations/mailer.ts';
import type { Role } from '../../shared/schemas/auth.ts';

export const TEST_PASSWORD = 'correct-horse-battery';

export async function makeTestApp(
  opts: { seed?: boolean; env?: Record<string, string>; now?: () => number; app?: Pick<CreateAppInput, 'rateLimits' | 'taskTimeoutMs' | 'pool' | 'ssr' | 'clientDir'> } = {},
) {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-test-'));
  const mail = await startMailFake({ port: 0, dir: path.join(dataDir, 'mail') });
  // the demo orders are paid at a payment fake: one on a free port, unless the test names its own
  const fake = opts.seed && !opts.env?.STRIPE_API_BASE ? await startStripeFake({ port: 0, dataDir: path.join(dataDir, 'stripe'), webhookSecret: 'whsec_namesake_local' }) : null;
  const env = loadEnv({
    NODE_ENV: 'test',
    DATA_DIR: dataDir,
    SMTP_PORT: String(mail.port),
    BASE_URL: 'http://localhost:3000',
    LOG_REQUESTS: 'false',
    STRIPE_FAKE: 'false',
    ...(fake ? { STRIPE_API_BASE: fake.url } : {}),
    ...opts.env,
  });
  const { db, sqlite } = openDb(env.dbFile);
  const mailer = createMailer(env);
  const app = createApp({ db, env, mailer, now: opts.now, ...opts.app });
  const deps = app.locals.deps;
  if (opts.seed) await seedDemo(deps);

  /** Makes an account through better-auth (real password hashing) with the given role. */
  async function makeUser(role: Role = 'shopper', overrides: { email?: string; name?: string } = {}) {
    const email = overrides.email ?? `${role}-${crypto.randomBytes(4).toString('hex')}@namesake.test`;
    const res = await deps.auth.api.signUpEmail({ body: { email, password: TEST_PASSWORD, name: overrides.name ?? `Test ${role}` } });
    db.update(user).set({ role }).where(eq(user.id, res.user.id)).run();
    return { id: res.user.id, email, password: TEST_PASSWORD };
  }

  /** A seller with a live shop of their own. */
  async function makeSeller(shop: { name?: string; state?: string } = {}) {
    const u = await makeUser('seller');
    const id = crypto.randomUUID();
    const name = shop.name ?? `Shop ${id.slice(0, 6)}`;
    const at = Date.now();
    db.insert(shops)
      .values({ id, ownerId: u.id, name, slug: `shop-${id.slice(0, 8)}`, state: shop.state ?? 'live', createdAt: at, updatedAt: at })
      .run();
    return { ...u, shopId: id };
  }

  /** A supertest agent holding the session cookie of the account. */
  async function signIn(email: string, password = TEST_PASSWORD) {
    const agent = request.agent(app);
    const res = await agent.post('/api/auth/sign-in/email').send({ email, password });
    if (res.status !== 200) throw new Error(`sign-in failed for ${email}: ${res.status} ${JSON.stringify(res.body)}`);
    return agent;
  }

  return {
    app,
    db,
    sqlite,
    env,
    deps,
    mailDir: mail.dir,
    makeUser,
    makeSeller,
    signIn,
    mailTo: (to: string) => listMail(mail.dir, { to }),
    async close() {
      await deps.pool.close();
      mailer.close();
      await mail.close();
      await fake?.close();
      sqlite.close();
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
export type TestApp = Awaited<ReturnType<typeof makeTestApp>>;

/** Waits until `fn` returns a truthy value (mail delivery is asynchronous). */
export async function eventually<T>(fn: () => Promise<T | undefined | null | false> | T, timeoutMs = 5000): Promise<T> {
  const start = Date.now();
  for (;;) {
    const v = await fn();
    if (v) return v;
    if (Date.now() - start > timeoutMs) throw new Error('condition not met in time');
    await new Promise((r) => setTimeout(r, 50));
  }
}
