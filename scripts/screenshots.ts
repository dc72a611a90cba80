// `npm run screenshots`: pictures of the main screens for the README (issue 7, point 6).
// Builds the client if dist/ is missing, starts the app on a free port with a throw-away seeded
// DATA_DIR, signs in as each demo role in Chromium and saves small PNGs (palette-quantised with
// sharp, ≤ 200 KB each) to public/screenshots/. Chromium: /usr/bin/chromium (Debian's package).
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { type Browser, chromium, type Page } from '@playwright/test';
import sharp from 'sharp';
import { fillShipTo } from '../e2e/api-helpers.ts';
import { startBuiltApp, stopProcess, waitUntilUp } from './lib/server-process.ts';

const root = path.resolve(import.meta.dirname, '..');
const outDir = path.join(root, 'public/screenshots');
const PASSWORD = 'namesake-demo';
const MAX_BYTES = 200 * 1024;

async function save(page: Page, name: string, opts: { fullPage?: boolean } = {}): Promise<void> {
  await page.waitForLoadState('networkidle').catch(() => undefined);
  await page.evaluate(() => document.fonts.ready);
  await page.waitForTimeout(300);
  const raw = await page.screenshot({ fullPage: opts.fullPage ?? false, animations: 'disabled', caret: 'hide' });
  let png = await sharp(raw).png({ palette: true, colours: 128, compressionLevel: 9, effort: 10 }).toBuffer();
  if (png.length > MAX_BYTES) png = await sharp(raw).png({ palette: true, colours: 48, compressionLevel: 9, effort: 10 }).toBuffer();
  if (png.length > MAX_BYTES) {
    const meta = await sharp(raw).metadata();
    png = await sharp(raw)
      .resize({ width: Math.round((meta.width ?? 1280) * 0.75) })
      .png({ palette: true, colours: 64, compressionLevel: 9 })
      .toBuffer();
  }
  fs.writeFileSync(path.join(outDir, `${name}.png`), png);
  console.log(`  ${name}.png  ${(png.length / 1024).toFixed(0)} KB`);
}

async function signedIn(browser: Browser, base: string, email: string, viewport = { width: 1280, height: 860 }): Promise<Page> {
  const ctx = await browser.newContext({ baseURL: base, viewport, deviceScaleFactor: 1 });
  const page = await ctx.newPage();
  const r = await page.request.post('/api/auth/sign-in/email', { data: { email, password: PASSWORD }, headers: { origin: base } });
  if (!r.ok()) throw new Error(`sign-in ${email}: ${r.status()} ${await r.text()}`);
  return page;
}

async function main(): Promise<void> {
  fs.mkdirSync(outDir, { recursive: true });
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-screenshots-'));
  const { server, base } = await startBuiltApp(dataDir, { DEMO_MODE: 'true' });
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  try {
    await waitUntilUp(`${base}/api/health`, { server });
    console.log(`screenshots of ${base} → ${path.relative(root, outDir)}/`);

    // guest: home and a listing with the personaliser filled in
    const guestCtx = await browser.newContext({ baseURL: base, viewport: { width: 1280, height: 860 }, deviceScaleFactor: 1 });
    const guest = await guestCtx.newPage();
    await guest.goto('/');
    await save(guest, 'home');

    // shopper: personalise, cart with two shops, the payment page, orders
    const dana = await signedIn(browser, base, 'dana@namesake.test');
    await dana.goto('/listings/autumn-fox-tote-with-a-name');
    const form = dana.getByRole('form', { name: 'Personalise this item' });
    await form.getByLabel('Name', { exact: true }).fill('Mira');
    await form.getByRole('group', { name: 'Name colour' }).locator('label').nth(2).click();
    await dana.getByTestId('design-preview').waitFor();
    // tall enough for the title, the preview and the fields side by side
    await dana.setViewportSize({ width: 1280, height: 1080 });
    await dana.evaluate(() => window.scrollTo(0, 0));
    await save(dana, 'listing-personaliser');
    await dana.setViewportSize({ width: 1280, height: 860 });
    await form.getByRole('button', { name: /Add to cart/ }).click();
    await dana
      .getByText(/Added to your cart/)
      .first()
      .waitFor();
    await dana.goto('/listings/rocket-name-tee-for-kids');
    await dana.getByRole('form', { name: 'Personalise this item' }).getByLabel('Name', { exact: true }).fill('Theo');
    await dana
      .getByRole('form', { name: 'Personalise this item' })
      .getByRole('button', { name: /Add to cart/ })
      .click();
    await dana
      .getByText(/Added to your cart/)
      .first()
      .waitFor();
    await dana.goto('/cart');
    await dana.getByTestId('cart-total').waitFor();
    await save(dana, 'cart');
    await dana.getByRole('button', { name: /^Pay / }).click();
    await dana.getByLabel('Card number').waitFor();
    await fillShipTo(dana, 'Dana Whitlock');
    await dana.getByLabel('Card number').fill('4242 4242 4242 4242');
    await save(dana, 'payment-page');
    await dana.goto('/orders');
    await dana
      .getByRole('link', { name: /NS-\d+/ })
      .first()
      .waitFor();
    await save(dana, 'orders');
    await dana
      .getByRole('link', { name: /NS-\d+/ })
      .first()
      .click();
    await dana.getByRole('heading', { level: 1 }).waitFor();
    await save(dana, 'order-detail');

    // phone width: the listing as a shopper sees it on a phone
    const phone = await signedIn(browser, base, 'dana@namesake.test', { width: 375, height: 812 });
    await phone.goto('/listings/spring-picnic-tote-with-hot-air-balloon');
    await phone.getByRole('form', { name: 'Personalise this item' }).getByLabel('Name', { exact: true }).fill('Anouk');
    await phone.getByTestId('design-preview').waitFor();
    await save(phone, 'phone-listing');

    // seller: the workroom, a proof with warnings, a cut sheet, press cards
    const fern = await signedIn(browser, base, 'fern@namesake.test');
    await fern.goto('/workroom');
    await fern.getByRole('heading', { level: 1 }).waitFor();
    await save(fern, 'workroom');
    const { lines } = (await (await fern.request.get('/api/workroom/lines')).json()) as { lines: Array<{ id: string; state: string; text: string }> };
    const proofLine = lines.find((l) => l.state === 'awaiting_proof' && l.text === 'mIRA') ?? lines.find((l) => l.state === 'awaiting_proof');
    if (proofLine) {
      await fern.goto(`/workroom/lines/${proofLine.id}`);
      await fern.getByRole('heading', { level: 1 }).waitFor();
      await save(fern, 'proof');
    }
    const approved = lines.filter((l) => l.state === 'approved').map((l) => l.id);
    if (approved.length) {
      const r = await fern.request.post('/api/workroom/cut-sheets', { data: { lineIds: approved }, headers: { origin: base } });
      const body = (await r.json()) as { batch?: { id: string }; id?: string; batchId?: string };
      const batchId = body.batch?.id ?? body.batchId ?? body.id;
      await fern.goto(batchId ? `/workroom/cut-sheets?batch=${encodeURIComponent(batchId)}` : '/workroom/cut-sheets');
      await fern.getByRole('heading', { level: 1 }).waitFor();
      // the nested sheets themselves, below the summary
      const first = fern.getByRole('heading', { name: /^Sheet 1:/ });
      await first.waitFor();
      await first.evaluate((el) => window.scrollTo(0, el.getBoundingClientRect().top + window.scrollY - 24));
      await save(fern, 'cut-sheet');
      // cut the batch, so the press cards have items
      if (batchId) await fern.request.post(`/api/workroom/batches/${encodeURIComponent(batchId)}/cut`, { data: {}, headers: { origin: base } });
    }
    await fern.goto('/workroom/press');
    await fern.getByRole('heading', { level: 1 }).waitFor();
    await save(fern, 'press-cards');

    // admin: the moderation desk
    const admin = await signedIn(browser, base, 'admin@namesake.test');
    await admin.goto('/moderation');
    await admin.getByRole('heading', { level: 1 }).waitFor();
    await save(admin, 'moderation-desk');
  } finally {
    await browser.close();
    await stopProcess(server.child);
    fs.rmSync(dataDir, { recursive: true, force: true });
  }
}

await main();
