// "Must show" step 2 of issue 16: a parent orders another item with a needed-by date and a shop's
// discount code. She sees the shop's order-by banner and checks her date on the listing, names the
// date for the shop's parcel in the cart, types a wrong code (and is told why), then the shop's own
// code, pays the discounted total once, and finds both on her order; the shop's business view flags
// the date.
import { FOX_TOTE, fillShipTo } from './api-helpers.ts';
import { demo, expect, signIn, test } from './fixtures.ts';

const inDays = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);

test('a parent orders a tote with a needed-by date and the shop’s code', async ({ page }) => {
  const neededBy = inDays(40);
  await signIn(page, demo.shopper);

  // the listing: the shop's Winter lights banner, and her date checked before she personalises
  await page.goto(`/listings/${FOX_TOTE}`);
  await expect(page.getByTestId('order-by-banner')).toContainText(/Order by \d{4}-12-14 for Winter lights/);
  await page.getByLabel('Need it by a certain day?').fill(neededBy);
  await expect(page.getByTestId('listing-needed-by-verdict')).toContainText('Yes: ordered today, it can be with you by');
  const form = page.getByRole('form', { name: 'Personalise this item' });
  await form.getByLabel('Name', { exact: true }).fill('Kai');
  await form.getByRole('button', { name: /Add to cart/ }).click();
  await expect(page.getByText(/Added to your cart with “Kai”/)).toBeVisible();

  // the cart: the date for Fern & Fable's parcel, a wrong code, then the shop's code
  await page.goto('/cart');
  const fern = page.getByRole('region', { name: /From Fern & Fable Goods/ });
  const before = (await page.getByTestId('cart-total').textContent())!;
  await fern.getByLabel('Needed by').fill(neededBy);
  await expect(fern.getByTestId('needed-by-verdict')).toContainText('Fern & Fable Goods can make it');
  const code = fern.getByLabel('Code from Fern & Fable Goods');
  await code.fill('WINTER99');
  await fern.getByRole('button', { name: 'Apply' }).click();
  await expect(fern.getByText('Fern & Fable Goods has no code WINTER99.')).toBeVisible();
  await code.fill('winter10');
  await fern.getByRole('button', { name: 'Apply' }).click();
  await expect(fern.getByTestId('code-message')).toContainText(/WINTER10 takes \$\d+\.\d\d off\./);
  await expect(fern.getByText('Code WINTER10', { exact: true })).toBeVisible();
  await expect(page.getByTestId('cart-total')).not.toHaveText(before);
  const total = (await page.getByTestId('cart-total').textContent())!;

  // one payment of the discounted total
  await page.getByRole('button', { name: `Pay ${total}` }).click();
  await expect(page.getByRole('button', { name: /^Pay / })).toContainText(total.replace('$', ''));
  await fillShipTo(page);
  await page.getByLabel('Card number').fill('4242 4242 4242 4242');
  await page.getByLabel('Expiry date (MM/YY)').fill('12/34');
  await page.getByLabel('Security code (CVC)').fill('123');
  await page.getByRole('button', { name: /^Pay / }).click();
  await expect(page.getByRole('heading', { name: 'Thank you, your order is confirmed' })).toBeVisible({ timeout: 20_000 });

  // her order from Fern & Fable shows the code and the date
  await page
    .getByRole('listitem')
    .filter({ hasText: 'Fern & Fable Goods' })
    .getByRole('link', { name: /See order NS-/ })
    .click();
  const summary = page.getByRole('complementary', { name: 'Order summary' });
  await expect(summary.getByText('Code WINTER10', { exact: true })).toBeVisible();
  await expect(summary.getByText(neededBy)).toBeVisible();

  // the shop sees the date beside the ship-by date in its business view
  await page.context().clearCookies();
  await signIn(page, demo.fern);
  await page.goto('/workroom/business');
  await expect(page.getByText(`needed by ${neededBy}`).first()).toBeVisible();
});
