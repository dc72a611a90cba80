// Shared Playwright helpers: sign in through the real form, and read captured mail from the
// mail fake's store (the e2e server's DATA_DIR/mail, see playwright.config.ts).

import path from 'node:path';
import { test as base, expect, type Locator, type Page } from '@playwright/test';
import { listMail, type StoredMail } from '../fakes/mail/store.ts';

export const DEMO_PASSWORD = 'namesake-demo';
export const demo = {
  shopper: 'dana@namesake.test',
  fern: 'fern@namesake.test',
  comet: 'comet@namesake.test',
  admin: 'admin@namesake.test',
} as const;

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expectSignedIn(page);
}

/** The header shows a signed-in person's controls (sign out, or the menu that holds it on a phone). */
export async function expectSignedIn(page: Page) {
  await expect(
    page
      .getByRole('button', { name: /sign out/i })
      .or(page.getByRole('button', { name: /menu/i }))
      .first(),
  ).toBeVisible();
}

const mailDir = () => path.join(process.env.E2E_DATA_DIR!, 'mail');

/** Waits for a message to `to` whose subject matches, newer than `since` (ms). */
export async function waitForMail(to: string, subject: RegExp, since = 0, timeoutMs = 15_000): Promise<StoredMail> {
  const start = Date.now();
  for (;;) {
    const found = (await listMail(mailDir(), { to })).find((m) => subject.test(m.subject) && Date.parse(m.date) >= since - 1000);
    if (found) return found;
    if (Date.now() - start > timeoutMs) throw new Error(`no mail to ${to} matching ${subject} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/**
 * The parent's two-shop cart of journey 1, from browsing by occasion: the fox tote (Fern & Fable
 * Goods) personalised with "Mira" — the name adds a layer, so the price goes up; another colour for
 * it keeps the price — and the rocket tee (Little Comet Print Co.) with "Theo". `press` clicks or
 * taps a control (the phone spec checks its size first); `check` runs at the search results and at
 * the personalised listing (the phone spec checks the layout there).
 */
export async function addParentCart(
  page: Page,
  {
    press = (target: Locator) => target.click(),
    check = async () => {},
  }: { press?: (target: Locator) => Promise<void>; check?: (where: 'search' | 'listing with personaliser') => Promise<void> } = {},
) {
  await page.goto('/search?occasion=autumn-harvest');
  await check('search');
  await press(page.getByRole('link', { name: /Autumn fox tote with a name/ }).first());
  await expect(page.getByRole('heading', { level: 1, name: 'Autumn fox tote with a name' })).toBeVisible();

  const form = page.getByRole('form', { name: 'Personalise this item' });
  const price = page.getByTestId('price');
  await expect(price).toContainText('$');
  const motifOnly = await price.textContent();
  // the name adds a layer of its own colour: the price goes up by the listing's extra-layer price
  await form.getByLabel('Name', { exact: true }).fill('Mira');
  await expect(price).not.toHaveText(motifOnly!);
  const withName = await price.textContent();
  // another colour for the name (green, not used by the fox): still one more layer, same price
  await press(form.getByRole('group', { name: 'Name colour' }).locator('label').nth(2));
  await expect(page.getByTestId('design-preview')).toBeVisible();
  await expect(price).toHaveText(withName!);
  await check('listing with personaliser');
  await press(form.getByRole('button', { name: /Add to cart/ }));
  await expect(page.getByText(/Added to your cart with “Mira”/)).toBeVisible();

  // a kids' tee from the second shop
  await page.goto('/search?q=rocket');
  await press(page.getByRole('link', { name: /Rocket name tee for kids/ }).first());
  const form2 = page.getByRole('form', { name: 'Personalise this item' });
  // the tee comes in sizes: one is picked (no size is chosen for the shopper)
  await press(form2.getByRole('group', { name: 'Size' }).locator('label').filter({ hasText: /^4T$/ }));
  await form2.getByLabel('Name', { exact: true }).fill('Theo');
  await press(form2.getByRole('button', { name: /Add to cart/ }));
  await expect(page.getByText(/Added to your cart with “Theo”/)).toBeVisible();
}

export const test = base;
export { expect };
