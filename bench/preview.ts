/**
 * `npm run bench -- preview`: keystroke → preview painted, in Chromium, on the built app.
 * Starts the server (dist/ must be built; run `vite build` first) on a free port with a temp
 * DATA_DIR, opens a live demo listing, types 30 names into the personaliser one key at a time and
 * reads the page's `preview` performance measures (marks `preview-input` → `preview-painted`, set
 * by the personaliser). Prints `preview p50: X ms` and `preview p95: Y ms`; target p95 < 50 ms.
 */
import { type ChildProcess, spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { freePort } from '../scripts/lib/server-process.ts';

export const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

const NAMES = [
  'Mira',
  'Theo',
  'Anouk',
  'Kai',
  'Priya',
  'Leon',
  'Zoë',
  'Bartholomew',
  'Ada',
  'Felix',
  'Ines',
  'Oskar',
  'Maya',
  'Jonah',
  'Elif',
  'Ravi',
  'Lotte',
  'Samir',
  'Nora',
  'Hugo',
  'Ayla',
  'Emil',
  'Freya',
  'Tomás',
  'Hana',
  'Milo',
  'Sofia',
  'Arlo',
  'Juno',
  'Wren',
];

/** Minimal cookie-keeping client for the API (Node's fetch keeps no cookies). */
function apiAgent(base: string) {
  let cookie = '';
  return async function call<T>(method: string, url: string, body?: unknown, form?: FormData): Promise<T> {
    const res = await fetch(base + url, {
      method,
      headers: { Origin: base, Accept: 'application/json', ...(cookie ? { Cookie: cookie } : {}), ...(body !== undefined ? { 'Content-Type': 'application/json' } : {}) },
      body: form ?? (body !== undefined ? JSON.stringify(body) : undefined),
    });
    const set = res.headers.getSetCookie();
    if (set.length) cookie = set.map((c) => c.split(';')[0]).join('; ');
    const text = await res.text();
    if (!res.ok) throw new Error(`${method} ${url} → ${res.status} ${text.slice(0, 300)}`);
    return (text ? JSON.parse(text) : undefined) as T;
  };
}

type ListingSummary = { slug: string; title: string; textFields: number; fonts: number; motifs: number };

/**
 * A live listing with a text field, from the demo seed. If the seed has none (yet), one is made the
 * way a seller and an admin would: materials, a two-layer motif, a listing, submit, approve.
 */
export async function ensureLiveDemoListing(base: string): Promise<ListingSummary> {
  const anon = apiAgent(base);
  const page = await anon<{ items: { slug: string }[] }>('GET', '/api/listings?sort=newest');
  const found: ListingSummary[] = [];
  for (const item of page.items) {
    const l = await anon<{ content: { title: string; personalisation: { textFields: { fontIds: string[] }[]; motifChoices: unknown[] } } }>('GET', `/api/listings/${item.slug}`);
    const p = l.content.personalisation;
    const first = p.textFields[0];
    if (first) found.push({ slug: item.slug, title: l.content.title, textFields: p.textFields.length, fonts: first.fontIds.length, motifs: p.motifChoices.length });
  }
  found.sort((a, b) => b.fonts + b.motifs - (a.fonts + a.motifs));
  if (found[0]) return found[0];

  const fern = apiAgent(base);
  await fern('POST', '/api/auth/sign-in/email', { email: 'fern@namesake.test', password: 'namesake-demo' });
  const mat = async (kind: string, colourName: string, colourHex: string) =>
    (await fern<{ material: { id: string } }>('POST', '/api/materials', { kind, colourName, colourHex, rollWidthMm: 305, stockMm: 5000 })).material.id;
  const green = await mat('smooth', 'Thread green', '#2f7d6d');
  const navy = await mat('smooth', 'Ink navy', '#1f2a44');
  const gold = await mat('glitter', 'Glitter gold', '#d4a017');
  const orange = await mat('smooth', 'Fox orange', '#d9692b');
  const cream = await mat('smooth', 'Cream', '#fbf7f0');
  const form = new FormData();
  form.set('name', 'Fox with acorn');
  form.set('file', new Blob([fs.readFileSync(path.resolve('server/db/demo-motifs/fox-with-acorn.svg'))], { type: 'image/svg+xml' }), 'fox-with-acorn.svg');
  const motif = (await fern<{ motif: { id: string; layers: { id: string }[] } }>('POST', '/api/motifs', undefined, form)).motif;
  const title = 'Autumn fox name tote';
  const created = await fern<{ listing: { id: string; slug: string } }>('POST', '/api/seller/listings', {
    title,
    description: 'A natural cotton tote with a fox, an acorn and the name you type, pressed by hand.',
    blank: { kind: 'tote' },
    basePriceMinor: 2400,
    extraLayerPriceMinor: 150,
    occasions: ['autumn-harvest', 'back-to-school'],
    personalisation: {
      textFields: [
        {
          id: 'name',
          label: 'Name',
          maxLength: 12,
          fontIds: ['baloo-bold', 'dancing-script-bold', 'bebas-neue', 'bitter-bold'],
          defaultLetterHeightMm: 45,
          required: true,
          colourChoices: [green, navy, gold],
        },
      ],
      motifChoices: [
        {
          motifId: motif.id,
          label: 'Fox with acorn',
          layers: motif.layers.map((l) =>
            l.id === 'body' ? { layerId: l.id, mode: 'shopper', colourChoices: [orange, gold, navy] } : { layerId: l.id, mode: 'fixed', materialId: l.id === 'face' ? cream : navy },
          ),
        },
      ],
    },
  });
  await fern('POST', `/api/seller/listings/${created.listing.id}/submit`, {});
  const admin = apiAgent(base);
  await admin('POST', '/api/auth/sign-in/email', { email: 'admin@namesake.test', password: 'namesake-demo' });
  const shown = await admin<{ listing: { revision: number } }>('GET', `/api/moderation/listings/${created.listing.id}`);
  await admin('POST', `/api/moderation/listings/${created.listing.id}/approve`, { revision: shown.listing.revision });
  const live = await anon<{ slug: string }>('GET', `/api/listings/${created.listing.slug}`);
  return { slug: live.slug, title, textFields: 1, fonts: 4, motifs: 1 };
}

async function startServer(): Promise<{ base: string; child: ChildProcess; dataDir: string }> {
  if (!fs.existsSync('dist/index.html')) throw new Error('dist/ is missing: run `node_modules/.bin/vite build` first.');
  const port = await freePort();
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-bench-preview-'));
  const base = `http://localhost:${port}`;
  const child = spawn(process.execPath, ['node_modules/tsx/dist/cli.mjs', 'server/index.ts'], {
    stdio: ['ignore', 'ignore', 'inherit'],
    env: { ...process.env, DATA_DIR: dataDir, PORT: String(port), BASE_URL: base, SMTP_PORT: '0', STRIPE_FAKE_PORT: '0', LOG_REQUESTS: 'false', DEMO_MODE: 'true' },
  });
  for (let i = 0; i < 300; i++) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) return { base, child, dataDir };
    } catch {
      /* not yet */
    }
    if (child.exitCode !== null) throw new Error('the server exited while starting');
    await new Promise((r) => setTimeout(r, 200));
  }
  child.kill('SIGTERM');
  throw new Error('the server did not start within 60 s');
}

const pct = (xs: number[], q: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil(q * s.length) - 1))] ?? NaN; // NaN: no samples
};

export async function run(): Promise<void> {
  const { chromium } = await import('@playwright/test');
  const { base, child, dataDir } = await startServer();
  const samples: number[] = [];
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS });
  try {
    const listing = await ensureLiveDemoListing(base);
    const page = await browser.newPage();
    await page.goto(`${base}/listings/${listing.slug}`);
    const input = page.getByRole('textbox', { name: /name/i }).first();
    await input.waitFor();
    await page
      .getByTestId('design-size')
      .filter({ hasText: /type a name|cm/ })
      .waitFor({ timeout: 30_000 });
    await page.evaluate(() => performance.clearMeasures('preview'));
    for (const name of NAMES) {
      await input.fill('');
      await page.evaluate(() => performance.clearMeasures('preview'));
      // one key at a time with a short human-ish pause, so each keystroke is its own frame
      await input.pressSequentially(name, { delay: 40 });
      await page.waitForTimeout(120);
      const ms = await page.evaluate(() => performance.getEntriesByName('preview').map((e) => e.duration));
      samples.push(...ms);
    }
    console.log(`listing: ${listing.title} (/listings/${listing.slug}); ${samples.length} keystrokes over ${NAMES.length} names`);
    console.log(`preview p50: ${pct(samples, 0.5).toFixed(1)} ms`);
    console.log(`preview p95: ${pct(samples, 0.95).toFixed(1)} ms`);
  } finally {
    await browser.close();
    child.kill('SIGTERM');
    await new Promise((r) => child.once('exit', r));
    fs.rmSync(dataDir, { recursive: true, force: true });
  }
}
