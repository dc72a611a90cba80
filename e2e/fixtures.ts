// Shared Playwright helpers: sign in through the real form, and read captured mail from the
// mail fake's store (the e2e server's DATA_DIR/mail, see playwright.config.ts).
import { test as base, expect, type Page } from '@playwright/test';
import path from 'node:path';
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
  await expect(page.getByRole('button', { name: /sign out/i }).or(page.getByRole('button', { name: /menu/i })).first()).toBeVisible();
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

export const test = base;
export { expect };
