// Accessibility (issue 7, point 2): axe-core on every main page, as each role sees it, with the
// WCAG 2.2 AA rule tags (W3C WCAG 2.2). No serious or critical
// violation is allowed; axe's `label` rule is what proves every form field has a label. Then two
// checks axe cannot make: a failed form's errors are announced (3.3.1), and the checkout can be
// done with the keyboard alone (e2e/keyboard-checkout.spec.ts).
import AxeBuilder from '@axe-core/playwright';
import type { Page } from '@playwright/test';
import { addToCartApi, apiGet, FOX_TOTE, fillShipTo, payCartApi, ROCKET_TEE, signUpApi, uniqueEmail } from './api-helpers.ts';
import { demo, expect, signIn, test } from './fixtures.ts';

test.describe.configure({ timeout: 180_000 });

const TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

type Finding = { page: string; rule: string; impact: string; help: string; targets: string[] };

/** Loads `url`, waits for the page to settle, runs axe; returns serious/critical findings. */
async function audit(page: Page, name: string, url: string | null, ready?: () => Promise<void>): Promise<Finding[]> {
  if (url) await page.goto(url);
  await expect(page.getByRole('heading', { level: 1 }).first()).toBeVisible();
  // no page is judged while it still shows a spinner
  await expect(page.getByRole('status').filter({ hasText: /Loading/i })).toHaveCount(0, { timeout: 15_000 });
  if (ready) await ready();
  const result = await new AxeBuilder({ page }).withTags(TAGS).analyze();
  const bad = result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  checked.push(name);
  return bad.map((v) => ({ page: name, rule: v.id, impact: v.impact!, help: v.help, targets: v.nodes.slice(0, 5).map((n) => n.target.join(' ')) }));
}

const checked: string[] = [];

function report(findings: Finding[]) {
  for (const f of findings) console.log(`  ${f.page}: [${f.impact}] ${f.rule} — ${f.help}\n      ${f.targets.join('\n      ')}`);
  expect(findings, findings.map((f) => `${f.page}: ${f.rule}`).join('; ')).toEqual([]);
}

test.afterAll(() => console.log(`a11y: axe ran on ${checked.length} pages: ${checked.join(', ')}`));

test('guest pages have no serious or critical axe violations', async ({ page }) => {
  const f: Finding[] = [];
  f.push(...(await audit(page, 'home', '/')));
  f.push(
    ...(await audit(page, 'search', '/search?occasion=autumn-harvest', async () => {
      await expect(page.getByRole('link', { name: /Autumn fox tote with a name/ }).first()).toBeVisible();
    })),
  );
  f.push(...(await audit(page, 'search (no results)', '/search?q=zzzzqqq')));
  f.push(
    ...(await audit(page, 'listing with personaliser', `/listings/${FOX_TOTE}`, async () => {
      await page.getByRole('form', { name: 'Personalise this item' }).getByLabel('Name', { exact: true }).fill('Anouk');
      await expect(page.getByTestId('design-preview')).toBeVisible();
    })),
  );
  f.push(...(await audit(page, 'shop page', '/shops/fern-and-fable-goods')));
  f.push(...(await audit(page, 'empty cart', '/cart')));
  await addToCartApi(page, FOX_TOTE, 'Kai');
  f.push(...(await audit(page, 'guest cart', '/cart')));
  f.push(...(await audit(page, 'sign-in', '/sign-in')));
  f.push(...(await audit(page, 'sign-up', '/sign-up')));
  f.push(...(await audit(page, 'forgot password', '/forgot-password')));
  f.push(...(await audit(page, 'not found', '/no-such-page')));
  report(f);
});

test('shopper pages, the payment page and the checkout return have no serious or critical violations', async ({ page }) => {
  const f: Finding[] = [];
  await signIn(page, demo.shopper);
  f.push(...(await audit(page, 'orders', '/orders')));
  const { items: orders } = await apiGet(page, '/api/orders');
  f.push(...(await audit(page, 'order detail', `/orders/${orders[0].id}`)));
  f.push(...(await audit(page, 'open a shop', '/open-shop')));

  // a fresh shopper pays, so the demo account's cart stays as other specs expect it
  await page.context().clearCookies();
  await signUpApi(page, uniqueEmail('a11y-shopper'), 'Priya Shah');
  await addToCartApi(page, FOX_TOTE, 'Priya');
  await addToCartApi(page, ROCKET_TEE, 'Leon');
  f.push(...(await audit(page, 'cart with two shops', '/cart')));
  await page.getByRole('button', { name: /^Pay / }).click();
  await expect(page.getByLabel('Card number')).toBeVisible();
  f.push(...(await audit(page, 'payment page (Stripe fake)', null)));
  await fillShipTo(page, 'Priya Shah');
  await page.getByLabel('Card number').fill('4000 0000 0000 0002'); // declined test card
  await page.getByLabel('Expiry date (MM/YY)').fill('12/34');
  await page.getByLabel('Security code (CVC)').fill('123');
  await page.getByRole('button', { name: /^Pay / }).click();
  await expect(page.getByRole('alert').first()).toBeVisible();
  f.push(...(await audit(page, 'payment page, card declined', null)));

  await page.goto('/cart');
  await payCartApi(page).then(async ({ sessionId }) => {
    f.push(
      ...(await audit(page, 'checkout return', `/checkout/return?session_id=${sessionId}`, async () => {
        await expect(page.getByRole('heading', { name: 'Thank you, your order is confirmed' })).toBeVisible({ timeout: 20_000 });
      })),
    );
  });
  report(f);
});

test('seller pages (workroom, proof, cut sheets, press, stock, shop, listings) have no serious or critical violations', async ({ page }) => {
  const f: Finding[] = [];
  await signIn(page, demo.fern);
  const { items: lines } = await apiGet(page, '/api/workroom/lines?limit=100');
  const waiting = lines.find((l: { state: string }) => l.state === 'awaiting_proof') ?? lines[0];
  const { items: listings } = await apiGet(page, '/api/seller/listings');
  f.push(...(await audit(page, 'workroom', '/workroom')));
  f.push(...(await audit(page, 'workroom order', `/workroom/orders/${waiting.orderId}`)));
  f.push(...(await audit(page, 'proof', `/workroom/lines/${waiting.id}`)));
  f.push(...(await audit(page, 'cut sheets', '/workroom/cut-sheets')));
  f.push(...(await audit(page, 'press cards', '/workroom/press')));
  f.push(...(await audit(page, 'stock', '/workroom/stock')));
  f.push(...(await audit(page, 'shop settings', '/workroom/shop')));
  f.push(...(await audit(page, 'codes and dates', '/workroom/offers')));
  f.push(...(await audit(page, 'materials', '/workroom/materials')));
  f.push(...(await audit(page, 'seller listings', '/workroom/listings')));
  f.push(...(await audit(page, 'new listing', '/workroom/listings/new')));
  f.push(...(await audit(page, 'edit listing', `/workroom/listings/${listings[0].id}/edit`)));
  report(f);
});

test('moderation desk pages have no serious or critical violations', async ({ page }) => {
  const f: Finding[] = [];
  await signIn(page, demo.admin);
  const queue = { listings: (await apiGet(page, '/api/moderation/queue/listings')).items };
  f.push(...(await audit(page, 'moderation desk', '/moderation')));
  if (queue.listings[0]) f.push(...(await audit(page, 'review listing', `/moderation/listings/${queue.listings[0].id}`)));
  f.push(...(await audit(page, 'audit log', '/moderation/audit')));
  f.push(...(await audit(page, 'mail', '/moderation/mail')));
  report(f);
});

test('a failed form names its errors in text and announces them (WCAG 3.3.1)', async ({ page }) => {
  // sign-in with a wrong password: the message is in a live region or an alert
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(demo.shopper);
  await page.getByLabel('Password', { exact: true }).fill('not-the-password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  const announced = page.locator('[role=alert], [role=status], [aria-live=polite], [aria-live=assertive]').filter({ hasText: /password|e-mail|sign/i });
  await expect(announced.first()).toBeVisible();

  // sign-up with a bad e-mail and a short password: each field is marked invalid, the error text
  // is tied to it (aria-describedby) and focus moves to the first one, so a screen reader reads it
  await page.goto('/sign-up');
  await page.getByLabel('E-mail').fill('not-an-email');
  await page.getByLabel('Password', { exact: true }).fill('short');
  await page.getByRole('button', { name: /sign up|create/i }).click();
  const email = page.getByLabel('E-mail');
  await expect(email).toHaveAttribute('aria-invalid', 'true');
  const described = await email.getAttribute('aria-describedby');
  expect(described).toBeTruthy();
  const errorText = await page.locator(`[id="${described!.split(' ').pop()}"]`).textContent();
  expect(errorText?.trim().length).toBeGreaterThan(3);
  await expect(page.locator(':focus')).toHaveAttribute('aria-invalid', 'true');

  // the personaliser names characters the font cannot draw, in a live region
  await page.goto(`/listings/${FOX_TOTE}`);
  const form = page.getByRole('form', { name: 'Personalise this item' });
  await form.getByLabel('Name', { exact: true }).fill('Mira☃');
  await expect(
    form
      .locator('[aria-live], [role=alert]')
      .filter({ hasText: /☃|character|can.t/i })
      .first(),
  ).toBeVisible();
});
