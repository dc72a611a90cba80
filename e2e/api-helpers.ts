// API shortcuts for the hardening specs (a11y, xss, phone journey): make fresh rows through the
// same HTTP API the client uses, on the page's own cookie jar, so the browser then sees them.
// Every call sends the app's Origin, as a browser would (the CSRF guard refuses other sites).
import { type APIResponse, expect, type Page } from '@playwright/test';
import { hostedPaymentForm } from '../scripts/lib/hosted-payment.ts';
import { DEMO_PASSWORD } from './fixtures.ts';

export const FOX_TOTE = 'autumn-fox-tote-with-a-name';
export const ROCKET_TEE = 'rocket-name-tee-for-kids';

// playwright.config.ts puts the run's port in E2E_PORT before the workers start
function origin(_page: Page): string {
  return `http://localhost:${process.env.E2E_PORT ?? 4319}`;
}

async function json<T = any>(res: APIResponse, what: string): Promise<T> {
  // eslint-disable-line @typescript-eslint/no-explicit-any
  const text = await res.text();
  expect(res.ok(), `${what}: HTTP ${res.status()} ${text.slice(0, 300)}`).toBe(true);
  return (text ? JSON.parse(text) : {}) as T;
}

export async function apiPost<T = any>(page: Page, path: string, data: unknown, method: 'POST' | 'PUT' | 'PATCH' = 'POST'): Promise<T> {
  // eslint-disable-line @typescript-eslint/no-explicit-any
  const res = await page.request.fetch(path, { method, data: data as object, headers: { origin: origin(page) } });
  return json<T>(res, `${method} ${path}`);
}

export async function apiGet<T = any>(page: Page, path: string): Promise<T> {
  // eslint-disable-line @typescript-eslint/no-explicit-any
  return json<T>(await page.request.get(path), `GET ${path}`);
}

/**
 * A client address of its own for each test user. Sign-up is rate-limited per address (a few per
 * 10 s), and every spec runs from 127.0.0.1; the app trusts X-Forwarded-For only from loopback
 * (`trust proxy: loopback`), so this is how a test speaks for many different people.
 */
export function testClientAddress(): string {
  const n = Math.floor(Math.random() * 65_536);
  return `10.77.${n >> 8}.${n & 255}`;
}

async function authPost(page: Page, path: string, data: object): Promise<void> {
  const res = await page.request.post(path, { data, headers: { origin: origin(page), 'x-forwarded-for': testClientAddress() } });
  await json(res, `POST ${path}`);
}

/** Signs a fresh account up (and in: the session cookie lands in the page's context). */
export async function signUpApi(page: Page, email: string, name: string, password = DEMO_PASSWORD): Promise<void> {
  await authPost(page, '/api/auth/sign-up/email', { email, password, name });
}

export async function signInApi(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await authPost(page, '/api/auth/sign-in/email', { email, password });
}

export function uniqueEmail(prefix: string): string {
  return `${prefix}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 6)}@namesake.test`;
}

/** Puts one named line of a live listing into the current cart (guest or signed in). */
export async function addToCartApi(page: Page, slug: string, name: string): Promise<void> {
  const l = await apiGet(page, `/api/listings/${slug}`);
  const p = l.content.personalisation;
  const field = p.textFields[0];
  const motif = p.motifChoices[0]; // the first motif with its default colours
  await apiPost(page, '/api/cart/lines', {
    listingId: l.id,
    quantity: 1,
    choices: {
      texts: { [field.id]: { text: name, fontId: field.defaultFontId ?? field.fontIds[0], letterHeightMm: field.defaultLetterHeightMm } },
      motifId: motif ? motif.motifId : null,
      // a listing with sizes: the first size in stock in the shop's first colour
      ...(l.blankOffer
        ? {
            colourId: l.blankOffer.defaultColourId,
            sizeId: l.blankOffer.sizes.find((s: { id: string }) => !l.blankOffer.soldOut.includes(`${s.id}:${l.blankOffer.defaultColourId}`))?.id,
          }
        : {}),
    },
  });
}

/** Opens a checkout session for the cart and pays it on the fake's hosted page with card 4242. */
export async function payCartApi(page: Page): Promise<{ sessionId: string; checkoutId: string }> {
  const co = await apiPost(page, '/api/checkout', {});
  const pay = await page.request.post(co.url, {
    form: hostedPaymentForm(),
    maxRedirects: 0,
  });
  expect(pay.status(), 'the payment page accepts the test card').toBe(303);
  for (let i = 0; i < 20; i++) {
    const s = await apiGet(page, `/api/checkout/${co.sessionId}/status?wait=5000`);
    if (s.state === 'paid') return { sessionId: co.sessionId, checkoutId: co.checkoutId };
  }
  throw new Error('the checkout never became paid');
}

/** Fills the parcel address on the fake's hosted payment page (invented, like all demo data). */
export async function fillShipTo(page: Page, name = 'Dana Field'): Promise<void> {
  await page.getByLabel('Full name').fill(name);
  await page.getByLabel('Address line 1').fill('12 Acorn Lane');
  await page.getByLabel('Town or city').fill('Harbourtown');
  await page.getByLabel('Postal code').fill('HT1 2AB');
  await page.getByLabel('Country').selectOption('GB');
}
