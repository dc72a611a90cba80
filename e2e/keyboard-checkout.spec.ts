// Keyboard only (issue 7, point 2; WCAG 2.2 2.1.1 Keyboard, 2.4.7 Focus Visible): personalise a
// tote, add it to the cart, go to the payment page, type the test card and pay — with Tab, arrow
// keys, typing and Enter/Space, never the mouse. Every control we stop on must show a focus ring.
import type { Locator, Page } from '@playwright/test';
import { FOX_TOTE, signUpApi, uniqueEmail } from './api-helpers.ts';
import { expect, test } from './fixtures.ts';

/** Presses Tab (up to `max` times) until `target` has focus; fails if it never does. */
async function tabTo(page: Page, target: Locator, max = 60): Promise<void> {
  for (let i = 0; i < max; i++) {
    if (await target.evaluate((el) => el === document.activeElement).catch(() => false)) {
      await expectFocusVisible(target);
      return;
    }
    await page.keyboard.press('Tab');
  }
  throw new Error(`Tab never reached ${target}`);
}

/** A visible focus indicator: an outline or a box-shadow ring on the focused control. */
async function expectFocusVisible(target: Locator): Promise<void> {
  const ring = await target.evaluate((el) => {
    const s = getComputedStyle(el);
    const outline = s.outlineStyle !== 'none' && parseFloat(s.outlineWidth) > 0;
    const shadow = s.boxShadow !== 'none' && s.boxShadow !== '';
    // a visually hidden radio shows its focus on its label (peer-focus-visible)
    const label = el.closest('label') ?? (el.id ? document.querySelector(`label[for="${el.id}"]`) : null);
    const ls = label ? getComputedStyle(label) : null;
    const labelRing = !!ls && ((ls.outlineStyle !== 'none' && parseFloat(ls.outlineWidth) > 0) || (ls.boxShadow !== 'none' && ls.boxShadow !== ''));
    return outline || shadow || labelRing;
  });
  expect(ring, `focus is visible on ${target}`).toBe(true);
}

test('a shopper personalises, adds to cart and pays using only the keyboard', async ({ page }) => {
  await signUpApi(page, uniqueEmail('keyboard'), 'Zoë Keys');
  await page.goto(`/listings/${FOX_TOTE}`);
  const form = page.getByRole('form', { name: 'Personalise this item' });
  await expect(form).toBeVisible();

  const name = form.getByLabel('Name', { exact: true });
  await tabTo(page, name);
  await page.keyboard.type('Anouk');
  await expect(name).toHaveValue('Anouk');

  // a colour for the name: Tab into the radio group, arrow to the next colour
  const colours = form.getByRole('group', { name: 'Name colour' }).getByRole('radio');
  const checkedIndex = () => colours.evaluateAll((els) => els.findIndex((e) => (e as HTMLInputElement).checked || e.getAttribute('aria-checked') === 'true'));
  const before = await checkedIndex();
  // Tab enters a radio group on its checked radio (or the first when none is checked)
  await tabTo(page, before >= 0 ? colours.nth(before) : colours.first());
  await page.keyboard.press('ArrowRight');
  await expect.poll(checkedIndex).not.toBe(before);
  await expect(page.getByTestId('design-preview')).toBeVisible();

  const add = form.getByRole('button', { name: /Add to cart/ });
  await tabTo(page, add);
  await page.keyboard.press('Enter');
  await expect(page.getByText(/Added to your cart with “Anouk”/)).toBeVisible();

  // to the cart through the header link, by keyboard
  const cartLink = page.getByRole('link', { name: /cart/i }).first();
  // Shift+Tab walks back up from the form to the header's cart link
  for (let i = 0; i < 80 && !(await cartLink.evaluate((el) => el === document.activeElement)); i++) await page.keyboard.press('Shift+Tab');
  await expectFocusVisible(cartLink);
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL(/\/cart$/);

  const pay = page.getByRole('button', { name: /^Pay / });
  await tabTo(page, pay, 80);
  await page.keyboard.press('Enter');

  // the payment page: type the card with the keyboard, Enter on Pay
  const card = page.getByLabel('Card number');
  await expect(card).toBeVisible();
  // the parcel address first, field by field (invented, like all demo data)
  for (const [label, value] of [
    ['Full name', 'Anouk Field'],
    ['Address line 1', '12 Acorn Lane'],
    ['Town or city', 'Harbourtown'],
    ['Postal code', 'HT1 2AB'],
  ] as const) {
    await tabTo(page, page.getByLabel(label));
    await page.keyboard.type(value);
  }
  const country = page.getByLabel('Country');
  await tabTo(page, country);
  // a focused select picks the option whose name starts with what is typed
  await page.keyboard.type('United Kingdom');
  await expect(country).toHaveValue('GB');
  await tabTo(page, card);
  await page.keyboard.type('4242 4242 4242 4242');
  await tabTo(page, page.getByLabel('Expiry date (MM/YY)'));
  await page.keyboard.type('12/34');
  await tabTo(page, page.getByLabel('Security code (CVC)'));
  await page.keyboard.type('123');
  await tabTo(page, page.getByRole('button', { name: /^Pay / }));
  await page.keyboard.press('Enter');

  await expect(page).toHaveURL(/\/checkout\/return\?session_id=/);
  await expect(page.getByRole('heading', { name: 'Thank you, your order is confirmed' })).toBeVisible({ timeout: 20_000 });
  await expect(page.getByText(/^NS-\d+$/)).toHaveCount(1);
});
