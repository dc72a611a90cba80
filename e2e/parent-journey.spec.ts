// Journey 1 (DEVELOPERS.md), "Parent ordering a named holiday tote", up to the confirmation e-mail:
// browse by occasion, open a tote listing, type a child's name, pick colours, watch the price,
// add to cart with an item from a second shop, pay with the test card 4242 on the payment page,
// land on the confirmation, read the e-mail from the mail fake's store, then follow the order.

import { fillShipTo } from './api-helpers.ts';
import { addParentCart, demo, expect, signIn, test, waitForMail } from './fixtures.ts';

test('a parent orders a named tote and a tee from two shops and pays once', async ({ page }) => {
  const since = Date.now();
  await signIn(page, demo.shopper);

  // the fox tote with “Mira” and a kids' tee with “Theo”, from two shops
  await addParentCart(page);

  // the cart: grouped by shop, each with its shipping, one payment
  await page.goto('/cart');
  await expect(page.getByRole('heading', { name: /From Fern & Fable Goods/ })).toBeVisible();
  await expect(page.getByRole('heading', { name: /From Little Comet Print Co\./ })).toBeVisible();
  await expect(page.getByRole('img', { name: /Preview of the design: .*Mira/ })).toBeVisible();
  const total = (await page.getByTestId('cart-total').textContent())!;
  await page.getByRole('button', { name: `Pay ${total}` }).click();

  // the payment page (the Stripe fake's hosted page)
  await expect(page.getByRole('button', { name: /^Pay / })).toBeVisible();
  await expect(page.getByRole('button', { name: /^Pay / })).toContainText(total.replace('$', ''));
  await fillShipTo(page);
  await page.getByLabel('Card number').fill('4242 4242 4242 4242');
  await page.getByLabel('Expiry date (MM/YY)').fill('12/34');
  await page.getByLabel('Security code (CVC)').fill('123');
  await page.getByRole('button', { name: /^Pay / }).click();

  // back on Namesake: waiting, then confirmed with one order number per shop
  await expect(page).toHaveURL(/\/checkout\/return\?session_id=/);
  await expect(page.getByRole('heading', { name: 'Thank you, your order is confirmed' })).toBeVisible({ timeout: 20_000 });
  const numbers = await page.getByText(/^NS-\d+$/).allTextContents();
  expect(numbers).toHaveLength(2);

  // the confirmation e-mail lists both shops' parts and the names
  const mail = await waitForMail(demo.shopper, /Your Namesake order/, since);
  for (const n of numbers) expect(mail.subject).toContain(n);
  expect(mail.text).toContain('Fern & Fable Goods');
  expect(mail.text).toContain('Little Comet Print Co.');
  expect(mail.text).toContain('Name: Mira');
  expect(mail.text).toContain('Name: Theo');

  // the cart is empty now; the order page shows the line waiting for the proof check
  await page.goto('/cart');
  await expect(page.getByText('Your cart is empty')).toBeVisible();
  await page.goto('/orders');
  await page.getByRole('link', { name: new RegExp(numbers[0]!) }).click();
  await expect(page.getByText('Waiting for the proof check').first()).toBeVisible();
  // the address typed on the payment page is where the parcel goes
  await expect(page.getByTestId('ship-to')).toContainText('12 Acorn Lane');
  await expect(page.getByTestId('ship-to')).toContainText('HT1 2AB');
});
