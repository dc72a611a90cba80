// Shared arrangements for the cart / checkout / webhook / orders / refunds tests: a test app wired
// to a real Stripe fake (fakes/stripe) on a free port, listening so the fake's webhooks reach it,
// and shops with live listings whose rows each test makes itself.

import crypto from 'node:crypto';
import fs from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import Stripe from 'stripe';
import { type StripeFake, startStripeFake } from '../../fakes/stripe/server.ts';
import { payOnHostedPage, TEST_CARD_OK } from '../../scripts/lib/hosted-payment.ts';
import { listings, materials, orders, shops } from '../../server/db/schema.ts';
import { defaultPressProfile } from '../../shared/engine/press-defaults.ts';
import type { ChoicesInput } from '../../shared/schemas/listing.ts';
import { makeTestApp, type TestApp } from '../factories/app.ts';

export const WEBHOOK_SECRET = 'whsec_checkout_tests';
const SECRET_KEY = 'sk_test_checkout_tests';

/** `stripe`: the official SDK on the world's fake, with the app's key (what the provider's dashboard would show). */
export type World = TestApp & { fake: StripeFake; stripe: Stripe; appUrl: string; fakeDir: string; stopApp(): Promise<void>; startApp(): Promise<void>; teardown(): Promise<void> };

export async function makeWorld(opts: { fakeOpts?: { retryBaseMs?: number } } = {}): Promise<World> {
  const fakeDir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-stripe-'));
  const fake = await startStripeFake({ port: 0, dataDir: fakeDir, webhookSecret: WEBHOOK_SECRET, retryBaseMs: opts.fakeOpts?.retryBaseMs ?? 50, retryMaxMs: 400 });
  const t = await makeTestApp({ env: { STRIPE_API_BASE: fake.url, STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET, STRIPE_SECRET_KEY: SECRET_KEY } });
  let server: http.Server | null = null;
  let port = 0;
  const startApp = async () => {
    server = http.createServer(t.app);
    await new Promise<void>((r) => server!.listen(port, '127.0.0.1', () => r()));
    port = (server.address() as AddressInfo).port;
  };
  const stopApp = async () => {
    if (!server) return;
    const s = server;
    server = null;
    await new Promise<void>((r) => {
      s.close(() => r());
      s.closeAllConnections();
    });
  };
  await startApp();
  const appUrl = `http://127.0.0.1:${port}`;
  fake.setWebhookUrl(`${appUrl}/api/payments/webhook`);
  return Object.assign(t, {
    fake,
    stripe: new Stripe(SECRET_KEY, { host: '127.0.0.1', port: fake.port, protocol: 'http' }),
    appUrl,
    fakeDir,
    startApp,
    stopApp,
    async teardown() {
      // let deliveries in flight finish (their handlers still use the database)
      const until = Date.now() + 5000;
      while (Date.now() < until) {
        const evs = ((await (await fetch(`${fake.url}/_fake/events`)).json()) as { data: Array<{ delivery: { status: string } | null }> }).data;
        if (!server || evs.every((e) => e.delivery?.status !== 'pending')) break;
        await new Promise((r) => setTimeout(r, 50));
      }
      await new Promise((r) => setTimeout(r, 200));
      await stopApp();
      await fake.close();
      await t.close();
      fs.rmSync(fakeDir, { recursive: true, force: true });
    },
  });
}

/** A seller with a live shop, two vinyl colours and one live listing (a name field, optional outline). */
export async function makeShopWithListing(
  t: TestApp,
  o: { shopName?: string; shippingMinor?: number; basePriceMinor?: number; extraLayerPriceMinor?: number; outline?: boolean; currency?: string } = {},
) {
  const seller = await t.makeSeller({ name: o.shopName });
  const at = Date.now();
  t.db
    .update(shops)
    .set({ shippingMinor: o.shippingMinor ?? 450, currency: o.currency ?? 'USD' })
    .where(eq(shops.id, seller.shopId))
    .run();
  const mat = (kind: 'smooth' | 'glitter', colourName: string, colourHex: string) => {
    const id = crypto.randomUUID();
    t.db
      .insert(materials)
      .values({ id, shopId: seller.shopId, kind, colourName, colourHex, rollWidthMm: 305, stockMm: 5000, pressProfile: defaultPressProfile(kind), createdAt: at })
      .run();
    return id;
  };
  const navy = mat('smooth', 'Navy', '#1f2a44');
  const gold = mat('glitter', 'Gold', '#d4a017');
  const listingId = crypto.randomUUID();
  const content = {
    title: 'Named holiday tote',
    description: '',
    descriptionFormat: 'plain',
    blank: { kind: 'tote', label: 'Tote bag', widthMm: 250, heightMm: 250, topOffsetMm: 50 },
    basePriceMinor: o.basePriceMinor ?? 2400,
    extraLayerPriceMinor: o.extraLayerPriceMinor ?? 300,
    occasions: ['winter-lights'],
    photoIds: [],
    hasSmallDecorations: false,
    personalisation: {
      textFields: [{ id: 'name', label: 'Name', maxLength: 12, fontIds: ['baloo-bold'], defaultFontId: 'baloo-bold', defaultLetterHeightMm: 50, required: true, colourChoices: [navy, gold] }],
      motifChoices: [],
      motifRequired: false,
      outline: o.outline ? { offsetMm: 3, colourChoices: [gold, navy] } : null,
    },
    blankCostMinor: 0,
    minutesPerLayer: 0,
  };
  t.db
    .insert(listings)
    .values({
      id: listingId,
      shopId: seller.shopId,
      slug: `tote-${listingId.slice(0, 8)}`,
      state: 'live',
      draft: content as never,
      live: content as never,
      liveTitle: content.title,
      livePriceMinor: content.basePriceMinor,
      currency: o.currency ?? 'USD',
      publishedAt: at,
      createdAt: at,
      updatedAt: at,
    })
    .run();
  return { seller, listingId, navy, gold, content };
}

export const nameChoices = (name: string, colour?: string): ChoicesInput => ({
  texts: { name: { text: name, fontId: 'baloo-bold', letterHeightMm: 50 } },
  ...(colour ? { textColours: { name: colour } } : {}),
});

/**
 * Pays on the fake's hosted page the way the browser's form does, address included; the optional
 * fields are typed too (line 2 filled, state left empty), so tests can see what becomes of them.
 */
export function payOnPage(url: string, card: string) {
  return payOnHostedPage(url, card, { ship_line2: 'Flat 3', ship_state: '' });
}

export async function waitFor<T>(fn: () => T | undefined | null | false | Promise<T | undefined | null | false>, ms = 10_000): Promise<T> {
  const start = Date.now();
  for (;;) {
    const v = await fn();
    if (v) return v;
    if (Date.now() - start > ms) throw new Error('timed out waiting');
    await new Promise((r) => setTimeout(r, 50));
  }
}

export const CARDS = { ok: TEST_CARD_OK, declined: '4000 0000 0000 0002', noFunds: '4000 0000 0000 9995' };

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

/** One cart line of a name-field listing: `name` typed, optionally in `colour`, `quantity` times. */
export type NameLine = { listingId: string; name: string; colour?: string; quantity?: number };

/** Adds the line through the cart API, which must accept it (201); answers with the cart. */
export async function addNameLine(agent: Pick<Agent, 'post'>, line: NameLine) {
  const res = await agent
    .post('/api/cart/lines')
    .send({ listingId: line.listingId, ...(line.quantity ? { quantity: line.quantity } : {}), choices: nameChoices(line.name, line.colour) })
    .expect(201);
  return res.body;
}

/** A new shopper, signed in, whose cart holds `lines`. */
export async function shopperWithCart(t: TestApp, ...lines: NameLine[]) {
  const buyer = await t.makeUser('shopper');
  const agent = await t.signIn(buyer.email);
  for (const line of lines) await addNameLine(agent, line);
  return { buyer, agent };
}

/** Starts a checkout for the agent's cart, pays it with `card` and (for 4242) waits for the orders. */
export async function checkoutAndPay(w: World, agent: Agent, card = CARDS.ok) {
  const started = await agent.post('/api/checkout').send({});
  if (started.status !== 201) throw new Error(`checkout failed: ${started.status} ${JSON.stringify(started.body)}`);
  const pay = await payOnPage(started.body.url, card);
  if (card !== CARDS.ok) return { started: started.body as { checkoutId: string; sessionId: string; url: string }, pay, orders: [] as Array<{ id: string; number: string }> };
  const status = await waitFor(async () => {
    const s = await agent.get(`/api/checkout/${started.body.sessionId}/status?wait=2000`);
    return s.body.state === 'paid' && s.body;
  });
  return { started: started.body as { checkoutId: string; sessionId: string; url: string }, pay, orders: status.orders as Array<{ id: string; number: string }> };
}

/**
 * One paid order of 6500 from a new shop: "Mira" 2000 + "Theo" × 2 = 4000 + shipping 500. Fee
 * round(6500 × 800 / 10000) = 520, so the shop's transfer is 5980 (awaited unless `brokenAccount`,
 * which makes the shop's transfers fail: the provider answers "No such destination" until the
 * account is put right). `mira` and `theo` are the order's line ids; `seller` is the shop owner signed in.
 */
export async function paidTwoLineOrder(w: World, opts: { brokenAccount?: boolean } = {}) {
  const shop = await makeShopWithListing(w, { basePriceMinor: 2000, shippingMinor: 500, extraLayerPriceMinor: 0 });
  if (opts.brokenAccount) w.db.update(shops).set({ paymentAccountId: 'acct_closedaccount1' }).where(eq(shops.id, shop.seller.shopId)).run();
  const { buyer, agent } = await shopperWithCart(w, { listingId: shop.listingId, name: 'Mira' }, { listingId: shop.listingId, name: 'Theo', quantity: 2 });
  const { orders: made, started } = await checkoutAndPay(w, agent);
  const orderId = made[0]!.id;
  if (!opts.brokenAccount) await waitFor(() => w.db.select().from(orders).where(eq(orders.id, orderId)).get()?.transferId);
  const detail = (await agent.get(`/api/orders/${orderId}`)).body as { lines: Array<{ id: string; quantity: number }> };
  const mira = detail.lines.find((l) => l.quantity === 1)!.id;
  const theo = detail.lines.find((l) => l.quantity === 2)!.id;
  const seller = await w.signIn(shop.seller.email);
  return { shop, buyer, agent, seller, orderId, mira, theo, sessionId: started.sessionId };
}
