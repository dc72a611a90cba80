// Blank sizes and colours (issue 14), in a real browser on the demo data: a parent picks 4T and the
// grey tee, types "Bartholomew", is told it comes out too small at 4T and which size takes it,
// picks that size, is warned that a pale vinyl will hardly show on grey, picks another and pays;
// the shop's line names the size and colour. Then the pickers by keyboard and with axe, and the
// last tee of a size × colour going to one shopper only, the other told before paying.
import AxeBuilder from '@axe-core/playwright';
import { apiGet, apiPost, fillShipTo, ROCKET_TEE, signUpApi, uniqueEmail } from './api-helpers.ts';
import { demo, expect, signIn, test } from './fixtures.ts';

test.describe.configure({ timeout: 120_000 });

test('a parent picks 4T in grey, moves up a size for a long name, changes a pale vinyl and pays; the shop reads size · colour', async ({ page, browser }) => {
  await signIn(page, demo.shopper);
  await page.goto(`/listings/${ROCKET_TEE}`);
  const form = page.getByRole('form', { name: 'Personalise this item' });
  const size = form.getByRole('group', { name: 'Size' });
  const colour = form.getByRole('group', { name: 'Tee colour' });
  const price = page.getByTestId('price');

  // no size is picked for her: Add to cart waits and says why
  await form.getByLabel('Name', { exact: true }).fill('Bartholomew');
  await expect(form.getByRole('button', { name: /Add to cart/ })).toBeDisabled();
  await expect(form.getByText('Not yet: Size: Pick a size.')).toBeVisible();
  await size.getByRole('radio', { name: '4T' }).check({ force: true });
  await colour.getByRole('radio', { name: 'Heather grey' }).check({ force: true });
  await expect(page.getByTestId('chosen-blank')).toHaveText('Size: 4T · Heather grey');

  // the fit at 4T: too small, and the size that takes it is named
  const fit = form.locator('[data-warning="below_min_letter_height"]');
  await expect(fit).toContainText('At size 4T, “Bartholomew” comes out at');
  await expect(fit).toContainText('Choose size 8 or larger');
  const at4T = await price.textContent();

  // a larger size: no fit warning, and the size's price difference (+$2.00) is in the price
  await size.getByRole('radio', { name: /^8/ }).check({ force: true });
  await expect(fit).toHaveCount(0);
  await expect(page.getByTestId('chosen-blank')).toHaveText('Size: 8 · Heather grey');
  const cents = (t: string | null) => Math.round(Number(t!.replace(/[^0-9.]/g, '')) * 100);
  await expect.poll(async () => cents(await price.textContent()) - cents(at4T)).toBe(200);

  // a pale vinyl on the grey tee: the pair is named; another colour clears it
  const contrast = page.locator('[data-warning="low_contrast"]');
  await form
    .getByRole('group', { name: 'Name colour' })
    .getByRole('radio', { name: /Gold glitter/ })
    .check({ force: true });
  await expect(contrast).toContainText('Gold glitter on a heather grey tee');
  await form
    .getByRole('group', { name: 'Name colour' })
    .getByRole('radio', { name: /Night navy/ })
    .check({ force: true });
  await expect(contrast).toHaveCount(0);

  await form.getByRole('button', { name: /Add to cart/ }).click();
  await expect(page.getByText(/Added to your cart with “Bartholomew”/)).toBeVisible();

  // the cart line carries the size and colour; pay on the payment page
  await page.goto('/cart');
  await expect(page.getByText('Heather grey').first()).toBeVisible();
  const total = (await page.getByTestId('cart-total').textContent())!;
  await page.getByRole('button', { name: `Pay ${total}` }).click();
  await fillShipTo(page);
  await page.getByLabel('Card number').fill('4242 4242 4242 4242');
  await page.getByLabel('Expiry date (MM/YY)').fill('12/34');
  await page.getByLabel('Security code (CVC)').fill('123');
  await page.getByRole('button', { name: /^Pay / }).click();
  await expect(page.getByRole('heading', { name: 'Thank you, your order is confirmed' })).toBeVisible({ timeout: 20_000 });

  // the shop's line reads "<size> · <colour>"
  const shop = await browser.newPage();
  await signIn(shop, demo.comet);
  await shop.goto('/workroom');
  const row = shop.getByRole('row').filter({ hasText: 'Bartholomew' }).first();
  await expect(row.getByTestId('blank-choice')).toHaveText('8 · Heather grey');
  await shop.close();
});

test('the size and colour pickers work by keyboard and pass axe', async ({ page }) => {
  await page.goto(`/listings/${ROCKET_TEE}`);
  const form = page.getByRole('form', { name: 'Personalise this item' });
  const size = form.getByRole('group', { name: 'Size' });
  await expect(size.getByRole('radio')).toHaveCount(7);
  // Tab lands in the group; arrows move the choice (native radios), skipping nothing in stock
  await size.getByRole('radio', { name: '2T' }).focus();
  await page.keyboard.press('Space');
  await expect(size.getByRole('radio', { name: '2T' })).toBeChecked();
  await page.keyboard.press('ArrowRight');
  await expect(size.getByRole('radio', { name: '3T' })).toBeChecked();
  await expect(page.getByTestId('chosen-blank')).toContainText('Size: 3T');
  // the colour group follows in tab order and moves by arrows too
  await page.keyboard.press('Tab');
  await page.keyboard.press('Tab'); // past the size chart
  const colour = form.getByRole('group', { name: 'Tee colour' });
  await expect(colour.getByRole('radio', { checked: true })).toBeFocused();
  await page.keyboard.press('ArrowRight');
  await expect(colour.getByRole('radio', { name: 'White' })).toBeChecked();
  await expect(page.getByTestId('chosen-blank')).toContainText('3T · White');
  // a sold-out pair cannot be picked: 10 in white
  await expect(size.getByRole('radio', { name: /^10/ })).toBeDisabled();
  // the size chart gives garment measurements in cm and in
  await form.getByText('Size chart').click();
  await expect(form.getByRole('table')).toContainText('cm (');
  await expect(form.getByRole('table')).toContainText(' in)');

  const results = await new AxeBuilder({ page }).include('form[aria-label="Personalise this item"]').withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
  expect(results.violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`)).toEqual([]);
});

test('the last 3T grey tee goes to one shopper; the other is told before paying', async ({ page, browser }) => {
  // someone else opens the payment page for the last 3T in heather grey (demo stock: 1)
  const other = await browser.newPage();
  await signUpApi(other, uniqueEmail('first'), 'First Shopper');
  const l = await apiGet(other, `/api/listings/${ROCKET_TEE}`);
  const sizeId = l.blankOffer.sizes.find((s: { label: string }) => s.label === '3T').id;
  const grey = l.blankOffer.colours.find((c: { name: string }) => c.name === 'Heather grey').id;
  const choices = { texts: { name: { text: 'Kai', fontId: 'baloo-bold', letterHeightMm: 45 } }, motifId: l.content.personalisation.motifChoices[0].motifId, sizeId, colourId: grey };
  await apiPost(other, '/api/cart/lines', { listingId: l.id, quantity: 1, choices });

  await signUpApi(page, uniqueEmail('second'), 'Second Shopper');
  await apiPost(page, '/api/cart/lines', { listingId: l.id, quantity: 1, choices: { ...choices, texts: { name: { ...choices.texts.name, text: 'Leon' } } } });
  const first = await apiPost(other, '/api/checkout', {});
  expect(first.url).toBeTruthy();

  await page.goto('/cart');
  const total = (await page.getByTestId('cart-total').textContent())!;
  await page.getByRole('button', { name: `Pay ${total}` }).click();
  await expect(page.getByRole('alert')).toContainText('in size 3T, heather grey, has just sold out');
  await expect(page).toHaveURL(/\/cart/);
  await other.close();
});

test('a seller keeps blank sizes, colours and stock in forms, with low and sold-out marks, and offers them on a listing', async ({ page }) => {
  await signIn(page, demo.comet);
  await page.goto('/workroom/blanks');
  const tee = page.getByRole('region', { name: 'Tee' });
  await expect(tee.getByRole('table')).toContainText('sold out');
  await expect(tee.getByRole('table')).toContainText(/low: \d+ left/);
  // a count changed and saved: the mark follows
  await tee.getByLabel('10 in Mint green').fill('0');
  await tee.getByRole('button', { name: 'Save stock' }).click();
  await expect(page.getByText('Stock of tee saved.')).toBeVisible();
  await expect(tee.getByLabel('10 in Mint green')).toHaveValue('0');

  // a new blank type: bad input is named next to its field and nothing is saved
  await page.getByRole('button', { name: 'Add zip pouch' }).click();
  await page.getByLabel('Print width (mm)').first().fill('5');
  await page.getByRole('button', { name: 'Add blank type' }).click();
  await expect(page.getByText('The print width is at least 20 mm.')).toBeVisible();
  await page.getByLabel('Print width (mm)').first().fill('180');
  await page.getByLabel('Colour 1 name').fill('Sand');
  await page.getByRole('button', { name: 'Add blank type' }).click();
  await expect(page.getByRole('region', { name: 'Zip pouch' })).toBeVisible();
  const axe = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa']).analyze();
  expect(axe.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => v.id)).toEqual([]);

  // the listing editor offers the shop's blank types
  await page.goto('/workroom/listings');
  await page
    .getByRole('link', { name: /Rocket name tee for kids/ })
    .first()
    .click();
  await expect(page.getByLabel('Sizes and colours from')).toHaveValue(/.+/);
  await expect(page.getByRole('group', { name: 'Sizes offered' }).getByRole('checkbox')).toHaveCount(7);
});
