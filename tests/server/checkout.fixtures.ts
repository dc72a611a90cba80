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
import { listings, materials, shops } from '../../server/db/schema.ts';
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

/** The parcel address typed on the payment page (invented, like all demo data). */
export const SHIP_FORM = {
  ship_name: 'Dana Field',
  ship_line1: '12 Acorn Lane',
  ship_line2: 'Flat 3',
  ship_city: 'Harbourtown',
  ship_postal_code: 'HT1 2AB',
  ship_state: '',
  ship_country: 'GB',
} as const;

/** Pays on the fake's hosted page the way the browser's form does, address included. */
export function payOnPage(url: string, card: string) {
  return fetch(url, { method: 'POST', body: new URLSearchParams({ ...SHIP_FORM, card_number: card, card_expiry: '12/34', card_cvc: '123' }), redirect: 'manual' });
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

export const CARDS = { ok: '4242 4242 4242 4242', declined: '4000 0000 0000 0002', noFunds: '4000 0000 0000 9995' };

type Agent = Awaited<ReturnType<TestApp['signIn']>>;

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
