// What a parent tripped over, each checked in the browser where it showed: an add-to-cart that
// failed without a word, the letter-height slider that ignored the fit, the preview scrolling away
// on a phone, the payment page's expiry field and a declined card wiping the address, and a
// tracking number that was plain text.
import type { Page } from '@playwright/test';
import { apiGet, apiPost, FOX_TOTE, fillShipTo, signInApi, signUpApi, uniqueEmail } from './api-helpers.ts';
import { demo, expect, signIn, test } from './fixtures.ts';

type Listing = { id: string; content: { personalisation: { textFields: { id: string; label: string; maxLength: number }[] } } };

const nameBox = (page: Page) => page.getByRole('form', { name: 'Personalise this item' }).getByLabel('Name', { exact: true });

test('a name too long for the field disables Add to cart and says why, next to the button', async ({ page }) => {
  const listing = await apiGet<Listing>(page, `/api/listings/${FOX_TOTE}`);
  const field = listing.content.personalisation.textFields[0]!;
  await page.goto(`/listings/${FOX_TOTE}`);
  const add = page.getByRole('button', { name: /Add to cart/ });
  const tooLong = 'Bartholomew-Alexander'.slice(0, field.maxLength + 3);
  await nameBox(page).fill(tooLong);
  await expect(add).toBeDisabled();
  const reason = page.getByTestId('add-blocker');
  await expect(reason).toHaveText(`Not yet: ${field.label}: Use at most ${field.maxLength} characters.`);
  await expect(add).toHaveAttribute('aria-describedby', (await reason.getAttribute('id'))!);
  // the reason sits by the button: when the button is on screen, so is the reason
  await add.scrollIntoViewIfNeeded();
  await expect(reason).toBeInViewport();
  // nothing typed is lost; shortening it lets the design go
  await expect(nameBox(page)).toHaveValue(tooLong);
  await nameBox(page).fill('Mira');
  await expect(add).toBeEnabled();
  await expect(reason).toHaveCount(0);
});

test('when the server refuses the line, the page scrolls back to the field it names and focuses it', async ({ page }) => {
  await page.goto(`/listings/${FOX_TOTE}`);
  await nameBox(page).fill('Mira');
  // a refusal the page cannot foresee (the shop changed the listing in the meantime, say)
  await page.route('**/api/cart/lines', (route) =>
    route.fulfill({
      status: 400,
      contentType: 'application/json',
      body: JSON.stringify({ error: { code: 'validation', message: 'Check the name.', fields: { 'choices.texts.name.text': 'The shop no longer offers this spelling.' } } }),
    }),
  );
  const add = page.getByRole('button', { name: /Add to cart/ });
  await add.scrollIntoViewIfNeeded();
  await expect(nameBox(page)).not.toBeInViewport();
  await add.click();
  await expect(page.getByText('The shop no longer offers this spelling.')).toBeInViewport();
  await expect(nameBox(page)).toBeFocused();
  await expect(nameBox(page)).toHaveAttribute('aria-invalid', 'true');
});

test('the letter-height slider follows the height the name is shrunk to', async ({ page }) => {
  await page.goto(`/listings/${FOX_TOTE}`);
  await nameBox(page).fill('Mira');
  const shown = page.getByTestId('letter-height-name');
  const slider = page.getByRole('slider', { name: 'Letter height' });
  await expect(shown).toHaveText(/^50 mm/);
  // a long name does not fit at 50 mm: the summary gives the fitted height, and so must the slider
  await nameBox(page).fill('Wilhelmina');
  const summary = page.locator('p', { hasText: /^Name letter height:/ });
  await expect(summary).not.toContainText('50 mm');
  const fitted = /letter height:\s*([\d.]+) mm/.exec((await summary.textContent())!)![1]!;
  expect(Number(fitted)).toBeLessThan(50);
  await expect(shown).toHaveText(new RegExp(`^${fitted.replace('.', '\\.')} mm`));
  expect(Number(await slider.inputValue())).toBeCloseTo(Number(fitted), 1);
  await expect(page.getByText(/Made smaller to fit the print area \(you chose 50 mm/)).toBeVisible();
});

test.describe('on a phone', () => {
  test.use({ viewport: { width: 375, height: 740 }, isMobile: true, hasTouch: true });

  test('the preview stays on screen while the parent types and picks colours', async ({ page }) => {
    await page.goto(`/listings/${FOX_TOTE}`);
    await nameBox(page).fill('Mira');
    const box = page.getByTestId('preview-box');
    for (const target of [page.getByRole('group', { name: 'Name colour' }), page.getByRole('group', { name: /body colour/ }), page.getByRole('button', { name: /Add to cart/ })]) {
      await target.scrollIntoViewIfNeeded();
      await expect(target).toBeInViewport();
      await expect(box).toBeInViewport({ ratio: 0.95 });
      // and it does not cover what is being picked
      const b = (await box.boundingBox())!;
      const t = (await target.boundingBox())!;
      expect(t.y + t.height <= b.y || t.y >= b.y + b.height, 'the picked control is not under the preview').toBe(true);
    }
    // a colour picked down the page repaints the preview that is still in view
    await page.getByRole('group', { name: 'Name colour' }).locator('label').nth(2).tap();
    await expect(page.getByTestId('design-preview')).toBeInViewport();
  });

  test('browsing shows listings on the first screen; the filters open from one button', async ({ page }) => {
    await page.goto('/search?occasion=autumn-harvest');
    // the results start on the first screen: the count, and the top of the first card
    await expect(page.getByText(/^\d+ listings?$/)).toBeInViewport();
    const cardTop = await page
      .getByRole('link', { name: /Autumn fox tote with a name/ })
      .first()
      .evaluate((a) => (a.closest('li, article') ?? a).getBoundingClientRect().top);
    expect(cardTop).toBeLessThan(740);
    const occasion = page.getByLabel('Occasion', { exact: true });
    await expect(occasion).toBeHidden();
    const toggle = page.getByRole('button', { name: 'Filters and sort (1 set)' });
    // the page arrives rendered by the server: the button works once React has taken it over
    await expect(page.locator('html[data-hydrated="true"]')).toHaveCount(1);
    await toggle.tap();
    await expect(occasion).toBeVisible();
    await expect(occasion).toHaveValue('autumn-harvest');
    await expect(page.getByRole('button', { name: 'Hide filters' })).toHaveAttribute('aria-expanded', 'true');
  });

  test("the cart's total and Pay button are on the first screen", async ({ page }) => {
    await page.goto(`/listings/${FOX_TOTE}`);
    await nameBox(page).fill('Mira');
    await page.getByRole('button', { name: /Add to cart/ }).tap();
    await expect(page.getByTestId('added-to-cart')).toBeVisible();
    await page.goto('/cart');
    await expect(page.getByTestId('cart-total')).toBeInViewport();
    await expect(page.getByRole('link', { name: 'Sign in to check out' }).or(page.getByRole('button', { name: /^Pay / }))).toBeInViewport();
  });
});

test('on the payment page the expiry takes "12/30" and "1230", and a declined card keeps the address', async ({ page }) => {
  await page.goto('/');
  await signUpApi(page, uniqueEmail('expiry'), 'Dana Expiry', 'expiry-parent-password-1');
  await page.goto(`/listings/${FOX_TOTE}`);
  await nameBox(page).fill('Mira');
  await page.getByRole('button', { name: /Add to cart/ }).click();
  await expect(page.getByTestId('added-to-cart')).toBeVisible();
  await page.goto('/cart');
  await page.getByRole('button', { name: /^Pay / }).click();

  const expiry = page.getByLabel('Expiry date (MM/YY)');
  await expect(expiry).toBeVisible();
  // a keypad with "/" on it: text, not the digits-only numeric pad
  await expect(expiry).toHaveAttribute('inputmode', 'text');
  await expiry.pressSequentially('12/30');
  await expect(expiry).toHaveValue('12/30');

  // a declined card: the card is asked for again, the address is still there
  await fillShipTo(page, 'Dana Expiry');
  await page.getByLabel('Card number').fill('4000 0000 0000 0002');
  await page.getByLabel('Security code (CVC)').fill('123');
  await page.getByRole('button', { name: /^Pay / }).click();
  await expect(page.getByText(/Your card was declined/)).toBeVisible();
  await expect(page.getByLabel('Full name')).toHaveValue('Dana Expiry');
  await expect(page.getByLabel('Address line 1')).toHaveValue('12 Acorn Lane');
  await expect(page.getByLabel('Town or city')).toHaveValue('Harbourtown');
  await expect(page.getByLabel('Postal code')).toHaveValue('HT1 2AB');
  await expect(page.getByLabel('Country')).toHaveValue('GB');

  // the digits alone are an expiry too
  await page.getByLabel('Card number').fill('4242 4242 4242 4242');
  await page.getByLabel('Expiry date (MM/YY)').fill('1230');
  await page.getByLabel('Security code (CVC)').fill('123');
  await page.getByRole('button', { name: /^Pay / }).click();
  await expect(page).toHaveURL(/\/checkout\/return\?session_id=/);
  await expect(page.getByRole('heading', { name: 'Thank you, your order is confirmed' })).toBeVisible({ timeout: 20_000 });
});

test("the tracking number on the parent's order is a link to the carrier's tracking page", async ({ page }) => {
  // Fern ships one of Dana's demo orders (cut, pressed, then sent with a tracking number)
  await page.goto('/');
  await signInApi(page, demo.fern);
  const approved = await apiGet<{ items: { id: string; orderId: string; text: string }[] }>(page, '/api/workroom/lines?state=approved&limit=100');
  const line = approved.items.find((l) => l.text === 'Priya') ?? approved.items[0]!;
  const order = (await apiGet<{ order: { lines: { id: string }[] } }>(page, `/api/workroom/orders/${line.orderId}`)).order;
  const ids = order.lines.map((l) => l.id);
  const built = await apiPost<{ batchId: string }>(page, '/api/workroom/cut-sheets', { lineIds: ids });
  await apiPost(page, `/api/workroom/batches/${built.batchId}/cut`, {});
  await apiPost(page, '/api/workroom/pressed', { lineIds: ids });
  await apiPost(page, `/api/workroom/orders/${line.orderId}/ship`, { carrier: 'UPS', trackingNumber: '1Z999AA10123456784' });

  await page.context().clearCookies();
  await signIn(page, demo.shopper);
  await page.goto(`/orders/${line.orderId}`);
  const link = page.getByRole('link', { name: /1Z999AA10123456784/ });
  await expect(link).toBeVisible();
  await expect(link).toHaveAttribute('href', 'https://www.ups.com/track?tracknum=1Z999AA10123456784');
  await expect(link).toHaveAttribute('target', '_blank');
});
