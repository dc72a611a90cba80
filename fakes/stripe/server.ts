// A local stand-in for the subset of the Stripe API that Namesake uses (issue 5, point 2).
// The official `stripe` SDK talks to it with `new Stripe(key, { host: '127.0.0.1', port, protocol: 'http' })`.
// Behaviour follows the Stripe API docs (test cards, webhook signing, idempotency) and stripe-node's
// src/Webhooks.ts; where the fake is simpler than Stripe, a comment says so.
// This module wires the parts together and listens: the state (store.ts), the API routes to the
// resource modules (resources/*), the hosted payment page (hosted-page.ts) and webhooks (webhooks.ts).
import http from 'node:http';
import { listenLocal } from '../listen.ts';
import { ApiRouter } from './api.ts';
import type { Fake } from './context.ts';
import { handleFake } from './fake-endpoints.ts';
import { handlePage } from './hosted-page.ts';
import { ApiError, sendJson, unrecognized } from './http.ts';
import * as accounts from './resources/accounts.ts';
import { retrieveBalance } from './resources/balance.ts';
import * as charges from './resources/charges.ts';
import * as sessions from './resources/checkout-sessions.ts';
import * as events from './resources/events.ts';
import { retrievePaymentIntent } from './resources/payment-intents.ts';
import * as refunds from './resources/refunds.ts';
import * as transfers from './resources/transfers.ts';
import { Store } from './store.ts';
import { Webhooks } from './webhooks.ts';

export interface StripeFakeOptions {
  /** 0 or omitted: a free port. */
  port?: number;
  /** When `port` is taken, listen on a free port instead of failing (`url`/`port` tell which). */
  orFreePort?: boolean;
  /** State lives in `${dataDir}/stripe-state.json`. */
  dataDir: string;
  /** Where events are POSTed. Deliveries wait (without using up attempts) while no URL is set. */
  webhookUrl?: string;
  /** `whsec_…` secret used to sign deliveries. */
  webhookSecret: string;
  /** Base of the hosted payment page URLs; defaults to `http://127.0.0.1:<port>`. */
  publicUrl?: string;
  /** First retry delay; doubles each attempt (default 200 ms). */
  retryBaseMs?: number;
  /** Cap on the retry delay (default 60 s). */
  retryMaxMs?: number;
  /** Attempts per event before it is marked `failed` (default 12). */
  maxAttempts?: number;
  /** Per-attempt timeout (default 10 s). */
  deliveryTimeoutMs?: number;
  /** Clock for object timestamps and session expiry (ms). Tests use it to move time on. */
  now?: () => number;
  /** Logger; defaults to silence. */
  log?: (message: string) => void;
}

export interface StripeFake {
  url: string;
  port: number;
  close(): Promise<void>;
  setWebhookUrl(url: string): void;
}

function apiRoutes(fake: Fake): ApiRouter {
  return new ApiRouter(fake)
    .add('POST', '/v1/checkout/sessions', sessions.createSession)
    .add('GET', '/v1/checkout/sessions', sessions.listSessions)
    .add('GET', '/v1/checkout/sessions/:id', sessions.retrieveSession)
    .add('GET', '/v1/checkout/sessions/:id/line_items', sessions.listSessionLineItems)
    .add('POST', '/v1/checkout/sessions/:id/expire', sessions.expireSessionNow)
    .add('GET', '/v1/payment_intents/:id', retrievePaymentIntent)
    .add('GET', '/v1/charges', charges.listCharges)
    .add('GET', '/v1/charges/:id', charges.retrieveCharge)
    .add('POST', '/v1/accounts', accounts.createAccount)
    .add('GET', '/v1/accounts', accounts.listAccounts)
    .add('GET', '/v1/accounts/:id', accounts.retrieveAccount)
    .add('POST', '/v1/accounts/:id', accounts.updateAccount)
    .add('POST', '/v1/transfers', transfers.createTransfer)
    .add('GET', '/v1/transfers', transfers.listTransfers)
    .add('GET', '/v1/transfers/:id', transfers.retrieveTransfer)
    .add('POST', '/v1/transfers/:id/reversals', transfers.createReversal)
    .add('POST', '/v1/refunds', refunds.createRefund)
    .add('GET', '/v1/refunds', refunds.listRefunds)
    .add('GET', '/v1/refunds/:id', refunds.retrieveRefund)
    .add('GET', '/v1/events', events.listEvents)
    .add('GET', '/v1/events/:id', events.retrieveEvent)
    .add('GET', '/v1/balance', retrieveBalance);
}

export async function startStripeFake(opts: StripeFakeOptions): Promise<StripeFake> {
  const now = opts.now ?? Date.now;
  const nowSec = () => Math.floor(now() / 1000);
  const log = opts.log ?? (() => {});
  const store = new Store(opts.dataDir);
  const webhooks = new Webhooks(store, {
    url: opts.webhookUrl ?? null,
    secret: opts.webhookSecret,
    retryBaseMs: opts.retryBaseMs ?? 200,
    retryMaxMs: opts.retryMaxMs ?? 60_000,
    maxAttempts: opts.maxAttempts ?? 12,
    deliveryTimeoutMs: opts.deliveryTimeoutMs ?? 10_000,
    nowSec,
    log,
  });
  const fake: Fake = { store, webhooks, now, nowSec, publicUrl: '' };
  const api = apiRoutes(fake);

  function sweepExpired(): void {
    if (sessions.sweepExpired(fake)) void store.persist().catch((e: unknown) => log(`stripe fake: cannot save state: ${String(e)}`));
  }

  const server = http.createServer((req, res) => {
    const url = new URL(req.url ?? '/', 'http://127.0.0.1');
    const pathname = url.pathname.length > 1 ? url.pathname.replace(/\/+$/, '') : url.pathname;
    let work: Promise<void>;
    try {
      sweepExpired();
      if (pathname.startsWith('/v1/')) work = api.handle(req, res, url, pathname);
      else if (pathname.startsWith('/pay/')) work = handlePage(fake, req, res, pathname);
      else if (pathname.startsWith('/_fake/')) work = handleFake(fake, req, res, pathname);
      else work = Promise.resolve(unrecognized(res, req.method, pathname));
    } catch (e) {
      work = Promise.reject(e);
    }
    work.catch((e: unknown) => {
      if (e instanceof ApiError && !res.headersSent) return sendJson(res, e.status, e.body());
      log(`stripe fake: internal error: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}`);
      if (!res.headersSent) sendJson(res, 500, { error: { type: 'api_error', message: 'Internal error in the Stripe fake.' } }, { 'stripe-should-retry': 'false' });
      else res.destroy();
    });
  });

  const port = await listenLocal(server, () => server.address(), opts.port ?? 0, opts.orFreePort);
  const url = `http://127.0.0.1:${port}`;
  fake.publicUrl = (opts.publicUrl ?? url).replace(/\/+$/, '');
  // Open sessions made under an earlier port point at the current one after a restart.
  for (const s of store.all('checkout_sessions')) if (s.status === 'open') s.url = `${fake.publicUrl}/pay/${s.id}`;
  store.save();

  const sweepTimer = setInterval(sweepExpired, 1000);
  sweepTimer.unref();
  webhooks.schedule(); // resume deliveries left pending by an earlier run

  let closed = false;
  return {
    url,
    port,
    setWebhookUrl(next: string) {
      webhooks.setUrl(next);
    },
    async close() {
      if (closed) return;
      closed = true;
      clearInterval(sweepTimer);
      await webhooks.close();
      store.close();
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      });
    },
  };
}
