// Journey 1 ("Parent ordering a named holiday tote", DEVELOPERS.md) on a phone-sized screen
// (375 × 740 CSS px, touch): the same steps as parent-journey.spec.ts, but as a guest who builds
// the cart first and creates an account at checkout, through the phone menu. At each step the
// page must not scroll sideways (WCAG 2.2 1.4.10 Reflow: no two-dimensional scrolling at 320+ px)
// and the controls we tap must be at least 24 × 24 px (2.5.8).
import type { Locator, Page } from '@playwright/test';
import { fillShipTo, testClientAddress, uniqueEmail } from './api-helpers.ts';
import { addParentCart, expect, test, waitForMail } from './fixtures.ts';

// this parent's own client address: sign-up is rate-limited per address (see api-helpers.ts)
test.use({ viewport: { width: 375, height: 740 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2, extraHTTPHeaders: { 'x-forwarded-for': testClientAddress() } });

async function expectNoSideScroll(page: Page, where: string) {
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow, `${where}: the page scrolls sideways by ${overflow}px at 375 px`).toBeLessThanOrEqual(1);
}

async function tap(target: Locator) {
  await target.scrollIntoViewIfNeeded();
  const box = await target.boundingBox();
  expect(box, `${target} is on screen`).not.toBeNull();
  expect(Math.min(box!.width, box!.height), `${target} is at least 24 px`).toBeGreaterThanOrEqual(24);
  await target.tap();
}

test('on a phone, a parent builds a two-shop cart, signs up at checkout, pays and follows the order', async ({ page }) => {
  test.setTimeout(120_000);
  const since = Date.now();
  const email = uniqueEmail('phone-parent');

  // browse by occasion from the home page
  await page.goto('/');
  await expectNoSideScroll(page, 'home');
  // the fox tote with “Mira” and a kids' tee with “Theo”, tapped, checked at each stop
  await addParentCart(page, {
    press: tap,
    check: async (where) => {
      if (where === 'listing with personaliser') {
        // the preview fits the phone's width
        const pbox = await page.getByTestId('design-preview').boundingBox();
        expect(pbox!.x).toBeGreaterThanOrEqual(0);
        expect(pbox!.x + pbox!.width).toBeLessThanOrEqual(376);
      }
      await expectNoSideScroll(page, where);
    },
  });

  // to the cart through the phone menu
  await tap(page.getByRole('button', { name: 'Menu' }));
  await tap(page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: /cart/i }).first());
  await expect(page).toHaveURL(/\/cart$/);
  await expect(page.getByRole('heading', { name: /From Fern & Fable Goods/ })).toBeVisible();
  await expect(page.getByRole('heading', { name: /From Little Comet Print Co\./ })).toBeVisible();
  await expectNoSideScroll(page, 'cart');

  // a guest is asked to sign up; the cart survives it
  await tap(page.getByRole('link', { name: 'Create an account' }));
  await page.getByLabel('Your name').fill('Dana Phone');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill('phone-parent-password-1');
  await expectNoSideScroll(page, 'sign-up');
  await tap(page.getByRole('button', { name: 'Create account' }));
  await expect(page).toHaveURL(/\/cart$/);
  await expect(page.getByRole('img', { name: /Preview of the design: .*Mira/ })).toBeVisible();
  const total = (await page.getByTestId('cart-total').textContent())!;
  await tap(page.getByRole('button', { name: `Pay ${total}` }));

  // the payment page at phone width
  await expect(page.getByLabel('Card number')).toBeVisible();
  await expectNoSideScroll(page, 'payment page');
  await fillShipTo(page);
  await page.getByLabel('Card number').fill('4242 4242 4242 4242');
  await page.getByLabel('Expiry date (MM/YY)').fill('12/34');
  await page.getByLabel('Security code (CVC)').fill('123');
  await tap(page.getByRole('button', { name: /^Pay / }));

  await expect(page).toHaveURL(/\/checkout\/return\?session_id=/);
  await expect(page.getByRole('heading', { name: 'Thank you, your order is confirmed' })).toBeVisible({ timeout: 20_000 });
  await expectNoSideScroll(page, 'checkout return');
  const numbers = await page.getByText(/^NS-\d+$/).allTextContents();
  expect(numbers).toHaveLength(2);

  const mail = await waitForMail(email, /Your Namesake order/, since);
  for (const n of numbers) expect(mail.subject).toContain(n);
  expect(mail.text).toContain('Name: Mira');
  expect(mail.text).toContain('Name: Theo');

  // the order's progress, reached through the phone menu
  await tap(page.getByRole('button', { name: 'Menu' }));
  await tap(
    page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: /orders/i })
      .first(),
  );
  await expect(page).toHaveURL(/\/orders$/);
  await expectNoSideScroll(page, 'orders');
  await tap(page.getByRole('link', { name: new RegExp(numbers[0]!) }));
  await expect(page.getByText('Waiting for the proof check').first()).toBeVisible();
  await expectNoSideScroll(page, 'order detail');
});
