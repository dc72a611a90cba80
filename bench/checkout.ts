/**
 * Checkout benchmark (`npm run bench -- checkout`): 50 shoppers check out at the same time, end to
 * end against the local Stripe fake — add a line from each of two shops, open the Checkout
 * Session, pay on the hosted page (the same form POST a browser makes, test card 4242), and wait
 * for the webhook to turn the payment into orders. On a throw-away data folder.
 * Prints `orders: N`, `duplicates: 0`, `lost: 0` and `checkouts/s: X`.
 */

import crypto from 'node:crypto';
import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import Stripe from 'stripe';
import { startMailFake } from '../fakes/mail/server.ts';
import { listMailIds } from '../fakes/mail/store.ts';
import { startStripeFake } from '../fakes/stripe/server.ts';
import { cookieClient } from '../scripts/lib/cookie-client.ts';
import { payOnHostedPage } from '../scripts/lib/hosted-payment.ts';
import { createApp } from '../server/app.ts';
import { openDb } from '../server/db/client.ts';
import { checkouts, listings, materials, orders, shops } from '../server/db/schema.ts';
import { loadEnv } from '../server/env.ts';
import { createMailer } from '../server/integrations/mailer.ts';
import { defaultPressProfile } from '../shared/engine/press-defaults.ts';

const SHOPPERS = Number(process.env.BENCH_CHECKOUTS ?? 50);
const PASSWORD = 'bench-password-not-secret';
const SECRET = 'whsec_bench_checkout';
const KEY = 'sk_test_bench_checkout';
const NAMES = ['Mira', 'Theo', 'Anouk', 'Kai', 'Priya', 'Leon', 'Zoë', 'Bartholomew'];

export async function run(): Promise<void> {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-bench-checkout-'));
  const mail = await startMailFake({ port: 0, dir: path.join(dataDir, 'mail') });
  const fake = await startStripeFake({ port: 0, dataDir: path.join(dataDir, 'stripe'), webhookSecret: SECRET, retryBaseMs: 100, retryMaxMs: 2000 });
  const env = loadEnv({
    NODE_ENV: 'test',
    DATA_DIR: dataDir,
    SMTP_PORT: String(mail.port),
    STRIPE_API_BASE: fake.url,
    STRIPE_SECRET_KEY: KEY,
    STRIPE_WEBHOOK_SECRET: SECRET,
    STRIPE_FAKE: 'false',
    LOG_REQUESTS: 'false',
    BASE_URL: 'http://localhost:3000',
  });
  const { db, sqlite } = openDb(env.dbFile);
  const mailer = createMailer(env);
  const app = createApp({ db, env, mailer });
  const server = http.createServer(app);
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  fake.setWebhookUrl(`${base}/api/payments/webhook`);
  const auth = app.locals.deps.auth;

  try {
    // two live shops with one listing each
    const at = Date.now();
    const listingIds: string[] = [];
    for (const [i, name] of ['Fern & Fable Goods', 'Little Comet Print Co.'].entries()) {
      const owner = await auth.api.signUpEmail({ body: { email: `bench-seller-${i}@namesake.test`, password: PASSWORD, name } });
      const shopId = crypto.randomUUID();
      db.insert(shops)
        .values({ id: shopId, ownerId: owner.user.id, name, slug: `bench-shop-${i}`, state: 'live', shippingMinor: 450 + i * 50, createdAt: at, updatedAt: at })
        .run();
      const mat = crypto.randomUUID();
      db.insert(materials)
        .values({ id: mat, shopId, kind: 'smooth', colourName: 'Navy', colourHex: '#1f2a44', rollWidthMm: 305, stockMm: 50_000, pressProfile: defaultPressProfile('smooth'), createdAt: at })
        .run();
      const content = {
        title: i === 0 ? 'Named holiday tote' : "Kids' name tee",
        description: '',
        descriptionFormat: 'plain',
        blank: i === 0 ? { kind: 'tote', label: 'Tote bag', widthMm: 250, heightMm: 250, topOffsetMm: 50 } : { kind: 'kids_tee', label: "Kids' tee", widthMm: 200, heightMm: 200, topOffsetMm: 50 },
        basePriceMinor: 2400 + i * 150,
        extraLayerPriceMinor: 300,
        occasions: ['birthday'],
        photoIds: [],
        hasSmallDecorations: false,
        personalisation: {
          textFields: [{ id: 'name', label: 'Name', maxLength: 14, fontIds: ['baloo-bold'], defaultFontId: 'baloo-bold', defaultLetterHeightMm: 45, required: true, colourChoices: [mat] }],
          motifChoices: [],
          motifRequired: false,
          outline: null,
        },
        blankCostMinor: 0,
        minutesPerLayer: 0,
      };
      const id = crypto.randomUUID();
      db.insert(listings)
        .values({
          id,
          shopId,
          slug: `bench-listing-${i}`,
          state: 'live',
          draft: content as never,
          live: content as never,
          liveTitle: content.title,
          livePriceMinor: content.basePriceMinor,
          currency: 'USD',
          publishedAt: at,
          createdAt: at,
          updatedAt: at,
        })
        .run();
      listingIds.push(id);
    }

    // shoppers signed in before the clock starts (password hashing is not what we measure)
    const shoppers = await Promise.all(
      Array.from({ length: SHOPPERS }, async (_, i) => {
        const email = `bench-shopper-${i}@namesake.test`;
        await auth.api.signUpEmail({ body: { email, password: PASSWORD, name: `Shopper ${i}` } });
        const c = cookieClient(base, env.baseUrl);
        const r = await c('/api/auth/sign-in/email', { body: { email, password: PASSWORD } });
        if (r.status !== 200) throw new Error(`sign-in ${i}: ${r.status} ${JSON.stringify(r.body)}`);
        return c;
      }),
    );

    const started = performance.now();
    const results = await Promise.allSettled(
      shoppers.map(async (c, i) => {
        for (const listingId of listingIds) {
          const r = await c('/api/cart/lines', {
            body: { listingId, quantity: 1 + (i % 2), choices: { texts: { name: { text: NAMES[i % NAMES.length], fontId: 'baloo-bold', letterHeightMm: 45 } } } },
          });
          if (r.status !== 201) throw new Error(`add line: ${r.status} ${JSON.stringify(r.body)}`);
        }
        const co = await c('/api/checkout', { body: {} });
        if (co.status !== 201) throw new Error(`checkout: ${co.status} ${JSON.stringify(co.body)}`);
        const pay = await payOnHostedPage(co.body.url);
        if (pay.status !== 303) throw new Error(`pay: ${pay.status}`);
        for (;;) {
          const s = await c(`/api/checkout/${co.body.sessionId}/status?wait=10000`);
          if (s.body.state === 'paid') return co.body.checkoutId as string;
          if (s.status !== 200) throw new Error(`status: ${s.status}`);
        }
      }),
    );
    const seconds = (performance.now() - started) / 1000;
    const failed = results.filter((r) => r.status === 'rejected');
    for (const f of failed.slice(0, 3)) console.error('  failed:', (f as PromiseRejectedResult).reason);

    // transfers follow the commit; give them a moment, then count
    const deadline = Date.now() + 20_000;
    while (
      Date.now() < deadline &&
      db
        .select()
        .from(orders)
        .all()
        .some((o) => !o.transferId)
    )
      await new Promise((r) => setTimeout(r, 100));

    // and let the e-mails (one to the shopper, one per shop) reach the mail fake before closing
    const mails = (SHOPPERS - failed.length) * (1 + listingIds.length);
    while (Date.now() < deadline && listMailIds(mail.dir).length < mails) await new Promise((r) => setTimeout(r, 100));

    const stripe = new Stripe(KEY, { host: '127.0.0.1', port: fake.port, protocol: 'http' });
    const allOrders = db.select().from(orders).all();
    const paidSessions = (await stripe.checkout.sessions.list({ status: 'complete', limit: 100 })).data;
    const transfers = (await stripe.transfers.list({ limit: 100 })).data;
    let duplicates = 0;
    let lost = 0;
    const perCheckout = new Map<string, number>();
    for (const o of allOrders) perCheckout.set(o.checkoutId, (perCheckout.get(o.checkoutId) ?? 0) + 1);
    for (const n of perCheckout.values()) if (n > listingIds.length) duplicates += n - listingIds.length;
    const perOrder = new Map<string, number>();
    for (const t of transfers) perOrder.set(t.metadata.orderId!, (perOrder.get(t.metadata.orderId!) ?? 0) + 1);
    for (const n of perOrder.values()) if (n > 1) duplicates += n - 1;
    for (const s of paidSessions) {
      const c = db.select().from(checkouts).where(eq(checkouts.id, s.metadata!.checkoutId!)).get();
      const made = c ? (perCheckout.get(c.id) ?? 0) : 0;
      if (made < listingIds.length) lost += listingIds.length - made;
    }
    lost += allOrders.filter((o) => !o.transferId).length; // an order whose shop was never paid is lost money
    const charges = (await stripe.charges.list({ limit: 100 })).data.filter((c) => c.status === 'succeeded');
    if (charges.length !== paidSessions.length) duplicates += Math.max(0, charges.length - paidSessions.length);

    console.log(`checkouts: ${SHOPPERS - failed.length}/${SHOPPERS} paid in ${seconds.toFixed(2)} s`);
    console.log(`orders: ${allOrders.length}`);
    console.log(`duplicates: ${duplicates}`);
    console.log(`lost: ${lost}`);
    console.log(`checkouts/s: ${((SHOPPERS - failed.length) / seconds).toFixed(1)}`);
    if (failed.length || duplicates || lost) process.exitCode = 1;
  } finally {
    await new Promise<void>((r) => {
      server.close(() => r());
      server.closeAllConnections();
    });
    await fake.close();
    mailer.close();
    await mail.close();
    sqlite.close();
    fs.rmSync(dataDir, { recursive: true, force: true });
  }
}
