// Fault test (issue 7, point 4): the real server process is killed with SIGKILL while shoppers are
// paying, then started again on the same data folder. The Stripe fake runs as its own process, so
// it keeps taking payments and keeps retrying the webhooks it could not deliver (Stripe retries
// failed deliveries with a growing back-off; Stripe webhook docs). At the end every paid
// Checkout Session must have exactly one order per shop in its cart — none lost, none doubled —
// and every order exactly one transfer to its shop.
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import Stripe from 'stripe';
import { afterAll, describe, expect, it } from 'vitest';

const root = path.resolve(import.meta.dirname, '../..');
const SECRET = 'whsec_fault_test';
const KEY = 'sk_test_fault_test';
const PASSWORD = 'fault-test-password-1';
const SHOPPERS = 8;

const children: ChildProcess[] = [];
const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-fault-'));

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

function start(script: string, env: Record<string, string>, log: string[]): ChildProcess {
  // `node --import tsx` runs the script in this one process (the tsx CLI would put it in a child
  // that a SIGKILL of the parent leaves running)
  const child = spawn(process.execPath, ['--import', 'tsx', script], { cwd: root, env: { ...process.env, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
  child.stdout!.on('data', (d: Buffer) => log.push(d.toString()));
  child.stderr!.on('data', (d: Buffer) => log.push(d.toString()));
  children.push(child);
  return child;
}

async function waitFor(url: string, ms = 60_000): Promise<void> {
  const until = Date.now() + ms;
  for (;;) {
    try {
      const r = await fetch(url);
      if (r.status < 500) return;
    } catch {
      /* not up yet */
    }
    if (Date.now() > until) throw new Error(`${url} did not come up within ${ms} ms`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

function exited(child: ChildProcess): Promise<void> {
  return new Promise((r) => (child.exitCode !== null || child.signalCode !== null ? r() : child.once('exit', () => r())));
}

/** A shopper: fetch with its own cookie jar and the app's Origin (as a browser sends). */
function shopper(base: string) {
  const jar = new Map<string, string>();
  return async (p: string, body?: unknown) => {
    const res = await fetch(base + p, {
      method: body === undefined ? 'GET' : 'POST',
      headers: { origin: base, cookie: [...jar].map(([k, v]) => `${k}=${v}`).join('; '), ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const i = pair!.indexOf('=');
      jar.set(pair!.slice(0, i), pair!.slice(i + 1));
    }
    const text = await res.text();
    return { status: res.status, body: text ? (JSON.parse(text) as Record<string, any>) : {} }; // eslint-disable-line @typescript-eslint/no-explicit-any
  };
}

afterAll(async () => {
  for (const c of children) if (c.exitCode === null && c.signalCode === null) c.kill('SIGTERM');
  await Promise.all(children.map(exited));
  fs.rmSync(dataDir, { recursive: true, force: true });
});

describe('checkout survives a killed server', () => {
  it('when the server is SIGKILLed while shoppers pay and started again, then every paid session has exactly one order per shop', { timeout: 240_000 }, async () => {
    const [appPort, fakePort] = [await freePort(), await freePort()];
    const base = `http://localhost:${appPort}`;
    const fakeUrl = `http://127.0.0.1:${fakePort}`;
    const fakeLog: string[] = [];
    const appLog: string[] = [];
    start('fakes/stripe/main.ts', {
      STRIPE_FAKE_PORT: String(fakePort),
      DATA_DIR: path.join(dataDir, 'fake'),
      STRIPE_WEBHOOK_URL: `http://127.0.0.1:${appPort}/api/payments/webhook`,
      STRIPE_WEBHOOK_SECRET: SECRET,
    }, fakeLog);
    const appEnv = {
      NODE_ENV: 'test',
      DATA_DIR: path.join(dataDir, 'app'),
      PORT: String(appPort),
      BASE_URL: base,
      SMTP_PORT: '0',
      STRIPE_FAKE: 'false',
      STRIPE_API_BASE: fakeUrl,
      STRIPE_SECRET_KEY: KEY,
      STRIPE_WEBHOOK_SECRET: SECRET,
      LOG_REQUESTS: 'false',
      DEMO_MODE: 'true',
      CLIENT_DIR: path.join(dataDir, 'no-client'), // API only
    };
    let app = start('server/index.ts', appEnv, appLog);
    await waitFor(`${fakeUrl}/v1/charges`);
    await waitFor(`${base}/api/health`);

    // the demo's two live shops, one listing each
    const catalog = shopper(base);
    const listings = await Promise.all(
      ['autumn-fox-tote-with-a-name', 'rocket-name-tee-for-kids'].map(async (slug) => (await catalog(`/api/listings/${slug}`)).body),
    );
    expect(new Set(listings.map((l) => l.shop.slug)).size).toBe(2);

    // shoppers with a two-shop cart and an open Checkout Session each
    const sessions = await Promise.all(
      Array.from({ length: SHOPPERS }, async (_, i) => {
        const c = shopper(base);
        const signUp = await c('/api/auth/sign-up/email', { email: `fault-${i}@namesake.test`, password: PASSWORD, name: `Fault Shopper ${i}` });
        expect(signUp.status, JSON.stringify(signUp.body)).toBe(200);
        for (const l of listings) {
          const f = l.content.personalisation.textFields[0];
          const m = l.content.personalisation.motifChoices[0];
          const add = await c('/api/cart/lines', {
            listingId: l.id,
            quantity: 1,
            choices: { texts: { [f.id]: { text: ['Mira', 'Theo', 'Kai', 'Leon'][i % 4], fontId: f.defaultFontId, letterHeightMm: f.defaultLetterHeightMm } }, motifId: m ? m.motifId : null },
          });
          expect(add.status, JSON.stringify(add.body)).toBe(201);
        }
        const co = await c('/api/checkout', {});
        expect(co.status, JSON.stringify(co.body)).toBe(201);
        return co.body as { url: string; sessionId: string; checkoutId: string };
      }),
    );

    // pay on the fake's hosted page, the same form POST a browser makes
    const pay = async (s: { url: string }) => {
      const r = await fetch(s.url, { method: 'POST', body: new URLSearchParams({ ship_name: 'Dana Field', ship_line1: '12 Acorn Lane', ship_city: 'Harbourtown', ship_postal_code: 'HT1 2AB', ship_country: 'GB', card_number: '4242 4242 4242 4242', card_expiry: '12/34', card_cvc: '123' }), redirect: 'manual' });
      expect(r.status).toBe(303);
    };
    // the first half pay; the server is killed while their webhooks are being delivered
    const firstHalf = sessions.slice(0, SHOPPERS / 2);
    await Promise.all(firstHalf.map(pay));
    app.kill('SIGKILL');
    await exited(app);
    // the second half pay while the server is down: the fake cannot deliver and will retry
    await Promise.all(sessions.slice(SHOPPERS / 2).map(pay));

    // restart on the same data folder
    app = start('server/index.ts', appEnv, appLog);
    await waitFor(`${base}/api/health`);

    // wait for the fake's retries to land and the transfers to follow
    const dbFile = path.join(appEnv.DATA_DIR, 'namesake.db');
    const ids = sessions.map((s) => s.checkoutId);
    const countOrders = () => {
      const db = new Database(dbFile, { readonly: true, fileMustExist: true });
      try {
        return db
          .prepare(`SELECT checkout_id AS checkoutId, shop_id AS shopId, transfer_id AS transferId FROM orders WHERE checkout_id IN (${ids.map(() => '?').join(',')})`)
          .all(...ids) as Array<{ checkoutId: string; shopId: string; transferId: string | null }>;
      } finally {
        db.close();
      }
    };
    const until = Date.now() + 120_000;
    let rows = countOrders();
    while (Date.now() < until && (rows.length < SHOPPERS * 2 || rows.some((r) => !r.transferId))) {
      await new Promise((r) => setTimeout(r, 500));
      rows = countOrders();
    }

    // every session the payment provider calls paid …
    const stripe = new Stripe(KEY, { host: '127.0.0.1', port: fakePort, protocol: 'http' });
    // (the demo seed pays its own orders at the same fake: those sessions belong to Dana's checkouts)
    const complete = (await stripe.checkout.sessions.list({ status: 'complete', limit: 100 })).data;
    const paid = complete.filter((s) => ids.includes(s.metadata!.checkoutId!));
    expect(complete.length - paid.length).toBe(4);
    expect(paid.map((s) => s.id).sort()).toEqual(sessions.map((s) => s.sessionId).sort());
    // … has exactly one order per shop, each paid out once
    for (const s of paid) {
      const mine = rows.filter((r) => r.checkoutId === s.metadata!.checkoutId);
      expect(mine, `orders for ${s.id}`).toHaveLength(2);
      expect(new Set(mine.map((r) => r.shopId)).size, `one order for each of the two shops in ${s.id}`).toBe(2);
    }
    expect(rows).toHaveLength(SHOPPERS * 2);
    const transfers = (await stripe.transfers.list({ limit: 100 })).data.filter((t) => rows.some((r) => r.transferId === t.id));
    expect(transfers).toHaveLength(rows.length);
    const perOrder = new Map<string, number>();
    for (const t of (await stripe.transfers.list({ limit: 100 })).data) perOrder.set(t.metadata.orderId!, (perOrder.get(t.metadata.orderId!) ?? 0) + 1);
    expect([...perOrder.values()].every((n) => n === 1)).toBe(true);
    expect(fakeLog.join('')).toMatch(/retrying/); // the kill really made deliveries fail
  });
});
