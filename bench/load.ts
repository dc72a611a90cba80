/**
 * Load benchmark (`npm run bench -- load`, issue 7 point 4): the built app (dist/, built first if
 * missing) runs as its own process on a free port with a throw-away, seeded DATA_DIR; autocannon
 * then drives a mixed load for BENCH_LOAD_SECONDS (default 60) s, all kinds at once:
 *   home      GET /  and  GET /api/listings            (browse)
 *   search    GET /api/listings?q=…&occasion=…
 *   listing   GET /api/listings/:slug
 *   layout    POST /api/layout/text                   (the personaliser's live preview)
 *   cart      POST /api/cart/lines, POST /api/checkout (Checkout Session on the local Stripe
 *             fake), DELETE the line again — as signed-in shoppers, one session per connection
 * and prints per kind and overall: requests, throughput, p50/p99 latency and errors by cause.
 * It runs once per server-process count in BENCH_WORKERS (default "1,2": WORKERS=1, then WORKERS=2,
 * each on a fresh data folder) and ends with one table of p50/p99 per kind side by side.
 *
 * The preview endpoint is rate-limited per client address (240/min). Real shoppers come from many
 * addresses, so each layout request carries its own X-Forwarded-For from a pool of 10 000 (the app
 * trusts that header from loopback only); a 429 still counts as an error if one shows up.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
// @ts-expect-error autocannon ships no type declarations; the few calls used are typed below
import autocannonUntyped from 'autocannon';
import { startBuiltApp, stopProcess, waitUntilUp } from '../scripts/lib/server-process.ts';
import { DEMO_PASSWORD } from '../server/db/demo-accounts.ts';
import { MAX_STOCK } from '../shared/schemas/blanks.ts';

type AcRequest = { method?: string; path?: string; headers?: Record<string, string>; body?: string };
type AcRequestStep = AcRequest & {
  setupRequest?: (req: AcRequest, context: Record<string, unknown>) => AcRequest;
  onResponse?: (status: number, body: string, context: Record<string, unknown>) => void;
};
type AcResult = { errors: number; timeouts: number; non2xx: number; requests: { total: number }; duration: number };
type AcInstance = { on(ev: 'response', fn: (client: object, status: number, bytes: number, ms: number) => void): void; on(ev: 'done', fn: (r: AcResult) => void): void };
type AcOptions = { url: string; connections: number; duration: number; pipelining?: number; timeout?: number; requests: AcRequestStep[] };
const autocannon = autocannonUntyped as (opts: AcOptions) => AcInstance & PromiseLike<AcResult>;

const SECONDS = Number(process.env.BENCH_LOAD_SECONDS ?? 60);
const SHOPPERS = 20;
/** accounts the shoppers' connections take turns with: each stays under the per-account cart-add limit (60 a minute) */
const ACCOUNTS = 100;
const PASSWORD = 'bench-load-password-1';
const NAMES = ['Mira', 'Theo', 'Anouk', 'Kai', 'Priya', 'Leon', 'Zoë', 'Bartholomew'];

/** fetch with a cookie jar; returns the jar's Cookie header after the call */
/**
 * Fern's blanks get plenty of stock: every checkout holds an item until its payment page expires, so
 * the demo's few totes would sell out in seconds and turn the rest of the run into refusals.
 */
async function stockUp(base: string): Promise<void> {
  const signIn = await fetch(`${base}/api/auth/sign-in/email`, {
    method: 'POST',
    headers: { origin: base, 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'fern@namesake.test', password: DEMO_PASSWORD }),
  });
  if (!signIn.ok) throw new Error(`seller sign-in: ${signIn.status}`);
  const cookie = signIn.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
  const headers = { origin: base, 'content-type': 'application/json', cookie };
  const { blankTypes } = (await (await fetch(`${base}/api/seller/blanks`, { headers })).json()) as { blankTypes: Array<{ id: string; sizes: Array<{ id: string }>; colours: Array<{ id: string }> }> };
  for (const b of blankTypes) {
    const rows = b.sizes.flatMap((sz) => b.colours.map((c) => ({ sizeId: sz.id, colourId: c.id, quantity: MAX_STOCK, lowStock: 3 })));
    const res = await fetch(`${base}/api/seller/blanks/${b.id}/stock`, { method: 'PUT', headers, body: JSON.stringify({ rows }) });
    if (!res.ok) throw new Error(`stock: ${res.status} ${await res.text()}`);
  }
}

async function signedInCookie(base: string, i: number): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-up/email`, {
    method: 'POST',
    // each shopper from its own address: sign-up is rate-limited per address
    headers: { origin: base, 'content-type': 'application/json', 'x-forwarded-for': `10.1.${i >> 8}.${i & 255}` },
    body: JSON.stringify({ email: `load-${i}@namesake.test`, password: PASSWORD, name: `Load Shopper ${i}` }),
  });
  if (!res.ok) throw new Error(`sign-up ${i}: ${res.status} ${await res.text()}`);
  return res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
}

function pct(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]!;
}

type Stats = { kind: string; ms: number[]; byStatus: Map<number, number> };
type RunResult = { workers: number; rows: Array<{ kind: string; p50: number; p99: number; n: number; errors: number }>; failed: number };

export async function run(): Promise<void> {
  const counts = (process.env.BENCH_WORKERS ?? '1,2').split(',').map((v) => Number(v.trim()));
  if (counts.some((n) => !Number.isInteger(n) || n < 1 || n > 16)) throw new Error('BENCH_WORKERS: process counts from 1 to 16, separated by commas (e.g. 1,2)');
  const results: RunResult[] = [];
  for (const workers of counts) results.push(await runOnce(workers));
  const kinds = results[0]!.rows.map((r) => r.kind);
  const cell = (r: RunResult, kind: string) => {
    const row = r.rows.find((x) => x.kind === kind);
    return row ? `${row.p50.toFixed(1).padStart(7)} ${row.p99.toFixed(1).padStart(7)}` : ''.padStart(15);
  };
  console.log(`
p50 / p99 in ms per kind, ${SECONDS} s each, all kinds at once (carts and checkouts included):`);
  console.log(`  ${'kind'.padEnd(26)}${results.map((r) => `  WORKERS=${r.workers}`.padEnd(17)).join('')}`);
  console.log(`  ${''.padEnd(26)}${results.map(() => `  ${'p50'.padStart(7)} ${'p99'.padStart(7)}`).join('')}`);
  for (const k of kinds) console.log(`  ${k.padEnd(26)}${results.map((r) => `  ${cell(r, k)}`).join('')}`);
  if (results.some((r) => r.failed > 0)) process.exitCode = 1;
}

async function runOnce(workers: number): Promise<RunResult> {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-bench-load-'));
  const { server, base } = await startBuiltApp(dataDir, {
    WORKERS: String(workers),
    NODE_ENV: 'production',
    AUTH_SECRET: crypto.randomBytes(24).toString('hex'),
    // production settings with the local fakes and their keys, and the demo scenario to drive
    LOCAL_FAKES: 'true',
    DEMO_DATA: 'true',
  });

  try {
    await waitUntilUp(`${base}/api/health`, { server });
    const fox = (await (await fetch(`${base}/api/listings/autumn-fox-tote-with-a-name`)).json()) as {
      id: string;
      content: { personalisation: { textFields: Array<{ id: string; defaultFontId: string; defaultLetterHeightMm: number }>; motifChoices: Array<{ motifId: string }> } };
    };
    const field = fox.content.personalisation.textFields[0]!;
    const cookies = await Promise.all(Array.from({ length: ACCOUNTS }, (_, i) => signedInCookie(base, i)));
    await stockUp(base);

    const all: Stats[] = [];
    const track = (kind: string): Stats => {
      const s = { kind, ms: [], byStatus: new Map<number, number>() };
      all.push(s);
      return s;
    };
    const json = { 'content-type': 'application/json', origin: base };
    let ipSeq = 0;
    let cookieSeq = 0;

    /** runs one autocannon instance; `kinds` names its requests in pipeline order */
    const load = (kinds: string[], connections: number, requests: AcRequestStep[]) => {
      const stats = kinds.map(track);
      const inst = autocannon({ url: base, connections, duration: SECONDS, timeout: 20, requests });
      // with pipelining 1 each connection walks its requests in order: the n-th response is kinds[n % k]
      const seq = new WeakMap<object, number>();
      inst.on('response', (client, status, _bytes, ms) => {
        const n = seq.get(client) ?? 0;
        seq.set(client, n + 1);
        const s = stats[n % stats.length]!;
        s.ms.push(ms);
        s.byStatus.set(status, (s.byStatus.get(status) ?? 0) + 1);
      });
      return Promise.resolve(inst).then((r) => ({ kinds, r }));
    };

    console.log(`\nload: ${SECONDS} s against ${base} (WORKERS=${workers}, NODE_ENV=production, seeded demo, ${SHOPPERS} signed-in shoppers) …`);
    // Warm-up, not measured: each server process starts its worker threads in the background, and the
    // first design a thread composes loads the engine and fonts. Fresh connections spread over the
    // processes; the load starts once every one of these has been answered.
    const warm = await Promise.all(
      Array.from({ length: 4 * workers }, async (_, i) => {
        const r = await fetch(`${base}/api/layout/text`, {
          method: 'POST',
          headers: { ...json, connection: 'close', 'x-forwarded-for': `10.2.0.${i}` },
          body: JSON.stringify({ text: NAMES[i % NAMES.length], fontId: field.defaultFontId, letterHeightMm: 30 + i }),
          signal: AbortSignal.timeout(180_000),
        });
        return r.status;
      }),
    );
    if (warm.some((s) => s !== 200)) throw new Error(`warm-up: layout answered ${warm.join(', ')}`);
    const started = performance.now();
    const results = await Promise.all([
      load(['home (GET /)', 'home (GET /api/listings)'], 8, [
        { method: 'GET', path: '/' },
        { method: 'GET', path: '/api/listings' },
      ]),
      load(['search'], 8, [
        {
          method: 'GET',
          path: '/api/listings?q=tote',
          setupRequest: (req) => ({ ...req, path: `/api/listings?q=${['tote', 'name', 'bag', 'rocket', 'fox'][ipSeq++ % 5]}&occasion=${ipSeq % 2 ? 'autumn-harvest' : 'birthday'}` }),
        },
      ]),
      load(['listing'], 8, [{ method: 'GET', path: '/api/listings/autumn-fox-tote-with-a-name' }]),
      load(['layout'], 8, [
        {
          method: 'POST',
          path: '/api/layout/text',
          headers: json,
          setupRequest: (req) => {
            const n = ipSeq++;
            const k = n % 10_000; // a pool of 10 000 shopper addresses
            return {
              ...req,
              headers: { ...json, 'x-forwarded-for': `10.0.${k >> 8}.${k & 255}` },
              body: JSON.stringify({ text: NAMES[n % NAMES.length], fontId: field.defaultFontId, letterHeightMm: 40 + (n % 20) }),
            };
          },
        },
      ]),
      load(['cart add', 'checkout session', 'cart remove'], SHOPPERS, [
        {
          method: 'POST',
          path: '/api/cart/lines',
          setupRequest: (req, ctx) => {
            ctx.cookie = cookies[cookieSeq++ % cookies.length];
            const name = NAMES[Math.floor(Math.random() * NAMES.length)];
            const choices = {
              texts: { [field.id]: { text: name, fontId: field.defaultFontId, letterHeightMm: field.defaultLetterHeightMm } },
              motifId: fox.content.personalisation.motifChoices[0]?.motifId ?? null,
            };
            return { ...req, headers: { ...json, cookie: String(ctx.cookie) }, body: JSON.stringify({ listingId: fox.id, quantity: 1, choices }) };
          },
          onResponse: (status, body, ctx) => {
            if (status !== 201) return;
            const cart = JSON.parse(body) as { shops?: Array<{ lines?: Array<{ id: string }> }> };
            ctx.lineId = (cart.shops ?? []).flatMap((s) => s.lines ?? []).at(-1)?.id;
          },
        },
        { method: 'POST', path: '/api/checkout', setupRequest: (req, ctx) => ({ ...req, headers: { ...json, cookie: String(ctx.cookie) }, body: '{}' }) },
        {
          method: 'DELETE',
          path: '/api/cart/lines/x',
          setupRequest: (req, ctx) => ({ ...req, path: `/api/cart/lines/${String(ctx.lineId ?? 'none')}`, headers: { origin: base, cookie: String(ctx.cookie) } }),
        },
      ]),
    ]);
    const seconds = (performance.now() - started) / 1000;

    const rows: RunResult['rows'] = [];
    const line = (kind: string, ms: number[], byStatus: Map<number, number>, extra = 0) => {
      const sorted = [...ms].sort((a, b) => a - b);
      rows.push({ kind, p50: pct(sorted, 50), p99: pct(sorted, 99), n: ms.length, errors: [...byStatus].filter(([s]) => s >= 400 || s === 0).reduce((n, [, v]) => n + v, 0) + extra });
      const errs = [...byStatus].filter(([s]) => s >= 400 || s === 0).map(([s, n]) => `${s}×${n}`);
      if (extra) errs.push(`connection/timeouts×${extra}`);
      console.log(
        `  ${kind.padEnd(26)} ${String(ms.length).padStart(7)} req  ${(ms.length / seconds).toFixed(0).padStart(6)} req/s  p50 ${pct(sorted, 50).toFixed(1).padStart(6)} ms  p99 ${pct(sorted, 99).toFixed(1).padStart(7)} ms  errors: ${errs.length ? errs.join(', ') : '0'}`,
      );
    };
    // the machine's load (1-minute average) says how much else ran beside the bench: compare runs at a similar load
    console.log(`\nresults over ${seconds.toFixed(1)} s (${os.cpus().length} CPUs, Node ${process.version}, load average ${os.loadavg()[0]!.toFixed(1)}):`);
    for (const s of all) line(s.kind, s.ms, s.byStatus);
    const allMs = all.flatMap((s) => s.ms);
    const allStatus = new Map<number, number>();
    for (const s of all) for (const [k, v] of s.byStatus) allStatus.set(k, (allStatus.get(k) ?? 0) + v);
    const socketErrors = results.reduce((n, { r }) => n + r.errors + r.timeouts, 0);
    line('overall', allMs, allStatus, socketErrors);
    const failed = [...allStatus].filter(([s]) => s >= 400).reduce((n, [, v]) => n + v, 0) + socketErrors;
    console.log(`\nthroughput: ${(allMs.length / seconds).toFixed(0)} req/s; errors: ${failed} of ${allMs.length} (${((100 * failed) / Math.max(1, allMs.length)).toFixed(2)} %)`);
    return { workers, rows, failed };
  } finally {
    await stopProcess(server.child);
    fs.rmSync(dataDir, { recursive: true, force: true });
  }
}
