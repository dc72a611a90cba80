// Fault test (issue 7, point 4): the real server process is killed with SIGKILL while shoppers are
// paying, then started again on the same data folder. The Stripe fake runs as its own process, so
// it keeps taking payments and keeps retrying the webhooks it could not deliver (Stripe retries
// failed deliveries with a growing back-off; Stripe webhook docs). At the end every paid
// Checkout Session must have exactly one order per shop in its cart — none lost, none doubled —
// and every order exactly one transfer to its shop.
import type { ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import Stripe from 'stripe';
import { afterAll, describe, expect, it } from 'vitest';
import { cookieClient } from '../../scripts/lib/cookie-client.ts';
import { payOnHostedPage } from '../../scripts/lib/hosted-payment.ts';
import { freePort, type ServerProcess, startTsProcess, stopProcess, waitUntilUp } from '../../scripts/lib/server-process.ts';

const SECRET = 'whsec_fault_test';
const KEY = 'sk_test_fault_test';
const PASSWORD = 'fault-test-password-1';
const SHOPPERS = 8;

type Offer = { defaultColourId: string; sizes: Array<{ id: string }>; soldOut: string[] };
const blankChoice = (o: Offer, i: number) => {
  const inStock = o.sizes.filter((s) => !o.soldOut.includes(`${s.id}:${o.defaultColourId}`));
  return { colourId: o.defaultColourId, sizeId: inStock[i % inStock.length]!.id };
};
/** up: any answer below 500 (the fake's API answers 401 without a key) */
const answers = (res: Response) => res.status < 500;

const children: ChildProcess[] = [];
const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-fault-'));

/** Starts `script` as a process of its own; afterAll stops it. */
function start(script: string, env: Record<string, string>, log: string[]): ServerProcess {
  const started = startTsProcess(script, { ...process.env, ...env }, log);
  children.push(started.child);
  return started;
}

afterAll(async () => {
  await Promise.all(children.map((c) => stopProcess(c)));
  fs.rmSync(dataDir, { recursive: true, force: true });
});

describe('checkout survives a killed server', () => {
  it('when the server is SIGKILLed while shoppers pay and started again, then every paid session has exactly one order per shop', { timeout: 240_000 }, async () => {
    const [appPort, fakePort] = [await freePort(), await freePort()];
    const base = `http://localhost:${appPort}`;
    const fakeUrl = `http://127.0.0.1:${fakePort}`;
    const fakeLog: string[] = [];
    const appLog: string[] = [];
    const fake = start(
      'fakes/stripe/main.ts',
      {
        STRIPE_FAKE_PORT: String(fakePort),
        DATA_DIR: path.join(dataDir, 'fake'),
        STRIPE_WEBHOOK_URL: `http://127.0.0.1:${appPort}/api/payments/webhook`,
        STRIPE_WEBHOOK_SECRET: SECRET,
      },
      fakeLog,
    );
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
    await waitUntilUp(`${fakeUrl}/v1/charges`, { server: fake, ms: 60_000, ready: answers });
    await waitUntilUp(`${base}/api/health`, { server: app, ms: 60_000, ready: answers });

    // the demo's two live shops, one listing each
    const catalog = cookieClient(base);
    const listings = await Promise.all(['autumn-fox-tote-with-a-name', 'rocket-name-tee-for-kids'].map(async (slug) => (await catalog(`/api/listings/${slug}`)).body));
    expect(new Set(listings.map((l) => l.shop.slug)).size).toBe(2);

    // shoppers with a two-shop cart and an open Checkout Session each
    const sessions = await Promise.all(
      Array.from({ length: SHOPPERS }, async (_, i) => {
        const c = cookieClient(base);
        const signUp = await c('/api/auth/sign-up/email', { body: { email: `fault-${i}@namesake.test`, password: PASSWORD, name: `Fault Shopper ${i}` } });
        expect(signUp.status, JSON.stringify(signUp.body)).toBe(200);
        for (const l of listings) {
          const f = l.content.personalisation.textFields[0];
          const m = l.content.personalisation.motifChoices[0];
          const add = await c('/api/cart/lines', {
            body: {
              listingId: l.id,
              quantity: 1,
              choices: {
                texts: { [f.id]: { text: ['Mira', 'Theo', 'Kai', 'Leon'][i % 4], fontId: f.defaultFontId, letterHeightMm: f.defaultLetterHeightMm } },
                motifId: m ? m.motifId : null,
                // a listing with sizes: the shop's first colour, sizes in turn among those in stock (each shopper holds one)
                ...(l.blankOffer ? blankChoice(l.blankOffer, i) : {}),
              },
            },
          });
          expect(add.status, JSON.stringify(add.body)).toBe(201);
        }
        const co = await c('/api/checkout', { body: {} });
        expect(co.status, JSON.stringify(co.body)).toBe(201);
        return co.body as { url: string; sessionId: string; checkoutId: string };
      }),
    );

    // pay on the fake's hosted page, the same form POST a browser makes
    const pay = async (s: { url: string }) => {
      expect((await payOnHostedPage(s.url)).status).toBe(303);
    };
    // the first half pay; the server is killed while their webhooks are being delivered
    const firstHalf = sessions.slice(0, SHOPPERS / 2);
    await Promise.all(firstHalf.map(pay));
    await stopProcess(app.child, 'SIGKILL');
    // the second half pay while the server is down: the fake cannot deliver and will retry
    await Promise.all(sessions.slice(SHOPPERS / 2).map(pay));

    // restart on the same data folder
    app = start('server/index.ts', appEnv, appLog);
    await waitUntilUp(`${base}/api/health`, { server: app, ms: 60_000, ready: answers });

    // wait for the fake's retries to land and the transfers to follow
    const dbFile = path.join(appEnv.DATA_DIR, 'namesake.db');
    const ids = sessions.map((s) => s.checkoutId);
    const countOrders = () => {
      const db = new Database(dbFile, { readonly: true, fileMustExist: true });
      try {
        return db.prepare(`SELECT checkout_id AS checkoutId, shop_id AS shopId, transfer_id AS transferId FROM orders WHERE checkout_id IN (${ids.map(() => '?').join(',')})`).all(...ids) as Array<{
          checkoutId: string;
          shopId: string;
          transferId: string | null;
        }>;
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
    const demoDb = new Database(dbFile, { readonly: true, fileMustExist: true });
    const demoPaid = (demoDb.prepare(`SELECT count(*) AS n FROM checkouts WHERE state = 'paid' AND id NOT IN (${ids.map(() => '?').join(',')})`).get(...ids) as { n: number }).n;
    demoDb.close();
    expect(demoPaid).toBeGreaterThan(0);
    expect(complete.length - paid.length).toBe(demoPaid);
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
