// Production configuration, through the real entry points: `tsx server/index.ts` (what `npm start`
// runs) and `tsx scripts/admin-create.ts` (`npm run admin:create`), each a child process with a clean
// environment of its own, so nothing from the test runner's environment leaks in.

import { type ChildProcess, spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import request from 'supertest';
import { afterAll, describe, expect, test } from 'vitest';
import { freePort } from '../../scripts/lib/server-process.ts';
import { seedDemo } from '../../server/db/seed.ts';
import { loadEnv } from '../../server/env.ts';
import { makeTestApp } from '../factories/app.ts';

const TSX = ['node_modules/tsx/dist/cli.mjs'];
const SECRET = 'a-test-secret-of-forty-characters-xxxxxxx';
const REQUIRED = ['AUTH_SECRET', 'BASE_URL', 'STRIPE_SECRET_KEY', 'STRIPE_WEBHOOK_SECRET', 'SMTP_HOST'];

const dirs: string[] = [];
const children: ChildProcess[] = [];
const tmp = () => {
  const d = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-prod-'));
  dirs.push(d);
  return d;
};
afterAll(() => {
  for (const c of children) if (c.exitCode === null && c.signalCode === null) c.kill('SIGKILL');
  for (const d of dirs) fs.rmSync(d, { recursive: true, force: true });
});

/** Only what a shell would pass on: no NODE_ENV=test or other settings of the test runner. */
const clean = (env: Record<string, string>) => ({ PATH: process.env.PATH ?? '', HOME: process.env.HOME ?? os.tmpdir(), ...env });

function run(script: string, args: string[], env: Record<string, string>): Promise<{ code: number | null; out: string; err: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [...TSX, script, ...args], { env: clean(env), stdio: ['ignore', 'pipe', 'pipe'] });
    children.push(child);
    let out = '';
    let err = '';
    child.stdout.on('data', (d) => (out += d));
    child.stderr.on('data', (d) => (err += d));
    child.on('close', (code) => resolve({ code, out, err }));
  });
}

/** A server on `dataDir` and `port` with its fakes on ports the OS picks, no client build, no request log and no digest. */
const quietServerEnv = (dataDir: string, port: number) => ({
  DATA_DIR: dataDir,
  PORT: String(port),
  SMTP_PORT: '0',
  STRIPE_FAKE_PORT: '0',
  LOG_REQUESTS: 'false',
  DIGEST: 'false',
  CLIENT_DIR: path.join(dataDir, 'no-client'),
});

/** Starts `server/index.ts` and resolves once it has printed its whole start-up message. */
function startServer(env: Record<string, string>): Promise<{ proc: ChildProcess; output: () => string }> {
  const proc = spawn(process.execPath, [...TSX, 'server/index.ts'], { env: clean(env), stdio: ['ignore', 'pipe', 'pipe'] });
  children.push(proc);
  let out = '';
  proc.stdout!.on('data', (d) => (out += d));
  proc.stderr!.on('data', (d) => (out += d));
  return new Promise((resolve, reject) => {
    proc.stdout!.on('data', () => {
      if (out.includes('Press Ctrl-C to stop.')) resolve({ proc, output: () => out });
    });
    proc.on('close', (code) => reject(new Error(`server exited ${code} before starting:\n${out}`)));
  });
}

const stopServer = (proc: ChildProcess) =>
  new Promise<number | null>((resolve) => {
    proc.on('close', (code) => resolve(code));
    proc.kill('SIGTERM');
  });

/** A JSON call to the app on 127.0.0.1, with the Origin a browser page of `origin` would send. */
async function call(port: number, pathname: string, opts: { method?: string; origin?: string; body?: unknown; cookie?: string } = {}) {
  const res = await fetch(`http://127.0.0.1:${port}${pathname}`, {
    method: opts.method ?? (opts.body ? 'POST' : 'GET'),
    redirect: 'manual',
    headers: {
      ...(opts.origin ? { origin: opts.origin } : {}),
      ...(opts.body ? { 'content-type': 'application/json' } : {}),
      // better-auth checks the Origin of requests that carry cookies, as a browser's would
      cookie: opts.cookie ?? 'seen=1',
    },
    body: opts.body ? JSON.stringify(opts.body) : undefined,
  });
  const text = await res.text();
  let json: any = null; // eslint-disable-line @typescript-eslint/no-explicit-any
  try {
    json = JSON.parse(text);
  } catch {
    /* not JSON (a redirect) */
  }
  return { status: res.status, json, headers: res.headers };
}

describe('loadEnv: production needs its own secrets', () => {
  const complete: Record<string, string> = {
    NODE_ENV: 'production',
    AUTH_SECRET: SECRET,
    BASE_URL: 'https://shop.example.com',
    STRIPE_SECRET_KEY: 'sk_live_x',
    STRIPE_WEBHOOK_SECRET: 'whsec_x',
    SMTP_HOST: 'smtp.example.com',
  };
  const problemsOf = (env: Record<string, string>) => {
    try {
      loadEnv(env);
      return [];
    } catch (e) {
      return (e as Error).message
        .split('\n')
        .slice(1)
        .map((l) => l.trim().split(':')[0]);
    }
  };

  test('when every required variable is set, then production starts with those values, no fakes and no demo data', () => {
    const env = loadEnv(complete);
    expect(env.STRIPE_SECRET_KEY).toBe('sk_live_x');
    expect(env.STRIPE_WEBHOOK_SECRET).toBe('whsec_x');
    expect(env.authSecret).toBe(SECRET);
    expect(env.STRIPE_API_BASE).toBe(''); // the real Stripe API
    expect([env.startMailFake, env.startStripeFake, env.demoData]).toEqual([false, false, false]);
  });

  test('when any one is missing or empty, then exactly that variable is named', () => {
    for (const name of REQUIRED) {
      expect(problemsOf({ ...complete, [name]: '' })).toEqual([name]);
      const { [name]: _, ...without } = complete;
      expect(problemsOf(without)).toEqual([name]);
    }
  });

  test('when AUTH_SECRET is short, BASE_URL is plain http on a public host, a fake is asked for without LOCAL_FAKES, or TRUST_PROXY trusts anyone, then it is refused', () => {
    expect(problemsOf({ ...complete, AUTH_SECRET: 'short' })).toEqual(['AUTH_SECRET']);
    expect(problemsOf({ ...complete, BASE_URL: 'http://shop.example.com' })).toEqual(['BASE_URL']);
    expect(problemsOf({ ...complete, STRIPE_FAKE: 'true', MAIL_FAKE: 'true' })).toEqual(['MAIL_FAKE', 'STRIPE_FAKE']);
    expect(problemsOf({ ...complete, TRUST_PROXY: 'true' })).toEqual(['TRUST_PROXY']);
    expect(loadEnv({ ...complete, TRUST_PROXY: '127.0.0.1, 172.16.0.0/12' }).TRUST_PROXY).toBe('127.0.0.1, 172.16.0.0/12');
  });

  test('when LOCAL_FAKES=true, then only AUTH_SECRET is required and the fakes run with their own keys', () => {
    expect(problemsOf({ NODE_ENV: 'production', LOCAL_FAKES: 'true' })).toEqual(['AUTH_SECRET']);
    const env = loadEnv({ NODE_ENV: 'production', LOCAL_FAKES: 'true', AUTH_SECRET: SECRET });
    expect([env.startMailFake, env.startStripeFake, env.demoData]).toEqual([true, true, false]);
    expect(env.STRIPE_SECRET_KEY).toMatch(/^sk_test_/);
    expect(env.STRIPE_API_BASE).toMatch(/^http:\/\/127\.0\.0\.1:/);
  });

  test('when DEMO_DATA is not set, then demo data is on in development and off in production', () => {
    expect(loadEnv({ NODE_ENV: 'development' }).demoData).toBe(true);
    expect(loadEnv({ NODE_ENV: 'production', LOCAL_FAKES: 'true', AUTH_SECRET: SECRET }).demoData).toBe(false);
    expect(loadEnv({ NODE_ENV: 'production', LOCAL_FAKES: 'true', AUTH_SECRET: SECRET, DEMO_DATA: 'true' }).demoData).toBe(true);
    expect(loadEnv({ NODE_ENV: 'development', DEMO_DATA: 'false' }).demoData).toBe(false);
  });
});

describe('npm start with NODE_ENV=production', () => {
  test('when no secret is set, then the server exits 1 naming each missing variable on its own line, before touching DATA_DIR', async () => {
    const dataDir = path.join(tmp(), 'data');
    const r = await run('server/index.ts', [], { NODE_ENV: 'production', DATA_DIR: dataDir, PORT: '0' });
    expect(r.code).toBe(1);
    const named = r.err
      .split('\n')
      .filter((l) => /^\s+[A-Z_]+:/.test(l))
      .map((l) => l.trim().split(':')[0]);
    expect(named.sort()).toEqual([...REQUIRED].sort());
    expect(r.err).not.toMatch(/\n\s+at /); // a message, not a stack trace
    expect(fs.existsSync(dataDir)).toBe(false);
  }, 30_000);

  test('when LOCAL_FAKES=true: no listings, no demo account, only BASE_URL’s origin; admin:create gives a link that sets the password of an admin', async () => {
    const dataDir = tmp();
    const port = await freePort();
    const base = `http://localhost:${port}`;
    const env = { NODE_ENV: 'production', LOCAL_FAKES: 'true', AUTH_SECRET: SECRET, ...quietServerEnv(dataDir, port) };
    // a bad address is refused before anything is opened (run meanwhile: start-ups are the slow part)
    const refusal = run('scripts/admin-create.ts', ['not-an-email'], env);
    const { proc, output } = await startServer(env);
    expect(output()).toMatch(/mail fake/);
    expect(output()).toMatch(/payment fake/);
    expect(output()).toMatch(/npm run admin:create/);

    const listings = await call(port, '/api/listings');
    expect(listings.status).toBe(200);
    expect(listings.json.total).toBe(0);
    expect(listings.json.items).toEqual([]);
    expect((await call(port, '/api/config')).json).toEqual({ demoMode: false });
    const demo = await call(port, '/api/auth/sign-in/email', { origin: base, body: { email: 'admin@namesake.test', password: 'namesake-demo' } });
    expect(demo.status).toBe(401);

    // production trusts BASE_URL's origin only: not 127.0.0.1 for the same port, not Vite's dev server
    for (const origin of [`http://127.0.0.1:${port}`, 'http://localhost:5173']) {
      const r = await call(port, '/api/auth/sign-in/email', { origin, body: { email: 'someone@example.com', password: 'whatever-it-is' } });
      expect(r.status, origin).toBe(403);
    }

    // the first admin
    const bad = await refusal;
    expect(bad.code).toBe(1);
    expect(bad.err).toMatch(/"not-an-email" is not an e-mail address/);
    const made = await run('scripts/admin-create.ts', ['--', 'Boss@Example.com'], env);
    expect(made.code, made.err).toBe(0);
    const link = /(\S+\/api\/auth\/reset-password\/\S+)/.exec(made.out)?.[1];
    expect(link?.startsWith(`${base}/api/auth/reset-password/`)).toBe(true);
    const db = new Database(path.join(dataDir, 'namesake.db'), { readonly: true });
    const row = db.prepare(`select u.role, (select count(*) from account a where a.user_id = u.id) as accounts from user u where email = ?`).get('boss@example.com');
    db.close();
    expect(row).toEqual({ role: 'admin', accounts: 0 }); // no password of any kind yet

    // the link leads to the app's reset page with a token, which sets the password once
    const open = await call(port, new URL(link!).pathname + new URL(link!).search);
    expect(open.status).toBe(302);
    const page = new URL(open.headers.get('location')!);
    expect(`${page.origin}${page.pathname}`).toBe(`${base}/reset-password`);
    const token = page.searchParams.get('token')!;
    const password = 'a-long-new-admin-passphrase';
    expect((await call(port, '/api/auth/reset-password', { origin: base, body: { token, newPassword: password } })).status).toBe(200);
    expect((await call(port, '/api/auth/reset-password', { origin: base, body: { token, newPassword: 'another-long-passphrase' } })).status).toBe(400);

    const signIn = await call(port, '/api/auth/sign-in/email', { origin: base, body: { email: 'boss@example.com', password } });
    expect(signIn.status).toBe(200);
    const cookie = signIn.headers
      .getSetCookie()
      .map((c) => c.split(';')[0])
      .join('; ');
    expect(cookie).toMatch(/__Secure-/); // production cookies are Secure
    const session = await call(port, '/api/auth/get-session', { cookie });
    expect(session.json.user).toMatchObject({ email: 'boss@example.com', role: 'admin' });

    expect(await stopServer(proc)).toBe(0);
  }, 90_000);
});

describe('npm start in development', () => {
  test('when the page is opened at 127.0.0.1 instead of localhost, then sign-up and sign-in work; another site is still refused', async () => {
    const dataDir = tmp();
    const port = await freePort();
    const { proc } = await startServer({ NODE_ENV: 'development', DEMO_DATA: 'false', ...quietServerEnv(dataDir, port) });
    const account = { email: 'dev@example.com', password: 'a-long-dev-passphrase', name: 'Dev' };
    const own = `http://127.0.0.1:${port}`;
    expect((await call(port, '/api/auth/sign-up/email', { origin: own, body: account })).status).toBe(200);
    expect((await call(port, '/api/auth/sign-in/email', { origin: own, body: account })).status).toBe(200);
    expect((await call(port, '/api/auth/sign-in/email', { origin: 'http://localhost:5173', body: account })).status).toBe(200);
    expect((await call(port, '/api/auth/sign-in/email', { origin: 'https://evil.example', body: account })).status).toBe(403);
    expect((await call(port, '/api/config')).json).toEqual({ demoMode: false }); // DEMO_DATA=false: nothing seeded, nothing listed
    expect(await stopServer(proc)).toBe(0);
  }, 60_000);
});

describe("the sign-in page's demo list (/api/config)", () => {
  const DEMO_EMAILS = ['dana@namesake.test', 'fern@namesake.test', 'comet@namesake.test', 'harbour@namesake.test', 'admin@namesake.test'];

  test('when DEMO_DATA is on, then the demo accounts are listed only once they are in the database', async () => {
    const t = await makeTestApp();
    try {
      expect((await request(t.app).get('/api/config')).body).toEqual({ demoMode: false });
      for (const email of DEMO_EMAILS) await t.makeUser('shopper', { email });
      const config = (await request(t.app).get('/api/config')).body;
      expect(config.demoMode).toBe(true);
      expect(config.demoAccounts.map((a: { email: string }) => a.email)).toContain('admin@namesake.test');
    } finally {
      await t.close();
    }
  });

  test('when DEMO_DATA is off, then nothing is listed even with the demo accounts there, and seeding is refused', async () => {
    const t = await makeTestApp({ env: { DEMO_DATA: 'false' } });
    try {
      for (const email of DEMO_EMAILS) await t.makeUser('shopper', { email });
      expect((await request(t.app).get('/api/config')).body).toEqual({ demoMode: false });
      await expect(seedDemo(t.deps)).rejects.toThrow(/DEMO_DATA=true/);
    } finally {
      await t.close();
    }
  });
});
