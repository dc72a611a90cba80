// Journeys 2 and 3 (DEVELOPERS.md) in the workroom of Fern & Fable Goods. The spec makes its own
// order (a fresh shopper buys one fox tote) so it changes no other spec's rows: Fern asks for a
// change, the shopper edits the name on the order page, Fern approves the new proof, builds the
// cut sheets, downloads the SVG and the work sheet PDF, marks the sheets cut and the item pressed,
// enters the tracking number, and the shopper's shipped e-mail is read from the mail fake's store.
import type { Browser, Page } from '@playwright/test';
import { fillShipTo } from './api-helpers.ts';
import { demo, expect, expectSignedIn, signIn, test, waitForMail } from './fixtures.ts';

const PASSWORD = 'workroom-journey-9';

async function newShopper(browser: Browser): Promise<{ page: Page; email: string }> {
  const page = await browser.newPage();
  const email = `workroom-${Date.now()}@namesake.test`;
  await page.goto('/sign-up');
  await page.getByLabel('Your name').fill('Robin Harrow');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(PASSWORD);
  await page.getByRole('button', { name: 'Create account' }).click();
  await expectSignedIn(page);
  return { page, email };
}

async function buyFoxTote(page: Page, name: string): Promise<string> {
  await page.goto('/search?occasion=autumn-harvest');
  await page
    .getByRole('link', { name: /Autumn fox tote with a name/ })
    .first()
    .click();
  const form = page.getByRole('form', { name: 'Personalise this item' });
  await form.getByLabel('Name', { exact: true }).fill(name);
  await form.getByRole('button', { name: /Add to cart/ }).click();
  await expect(page.getByText(new RegExp(`Added to your cart with “${name}”`))).toBeVisible();
  await page.goto('/cart');
  const total = (await page.getByTestId('cart-total').textContent())!;
  await page.getByRole('button', { name: `Pay ${total}` }).click();
  await fillShipTo(page);
  await page.getByLabel('Card number').fill('4242 4242 4242 4242');
  await page.getByLabel('Expiry date (MM/YY)').fill('12/34');
  await page.getByLabel('Security code (CVC)').fill('123');
  await page.getByRole('button', { name: /^Pay / }).click();
  await expect(page.getByRole('heading', { name: 'Thank you, your order is confirmed' })).toBeVisible({ timeout: 20_000 });
  return (await page
    .getByText(/^NS-\d+$/)
    .first()
    .textContent())!;
}

test('a seller checks a proof, asks for a change, cuts, presses and ships; the shopper hears about it', async ({ page, browser }) => {
  test.setTimeout(120_000);
  const since = Date.now();
  const shopper = await newShopper(browser);
  const number = await buyFoxTote(shopper.page, 'mIRA');

  // Fern: the new line waits for its proof
  await signIn(page, demo.fern);
  await page.goto('/workroom?state=awaiting_proof');
  const row = page.getByTestId('work-line').filter({ hasText: number });
  await expect(row).toBeVisible();
  await row.getByRole('link', { name: 'Check proof' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'mIRA' })).toBeVisible();
  await expect(page.getByRole('img', { name: /Proof of mIRA on the Tote bag, to scale/ })).toBeVisible();
  await expect(page.getByTestId('letters-name').locator('li')).toHaveCount(4);
  await expect(page.getByTestId('proof-warnings')).toContainText('mixes capitals');

  // ask for a change → the shopper's e-mail links to their order page
  await page.getByLabel('Message to the shopper').fill('Did you mean Mira? The capitals look mixed up.');
  await page.getByRole('button', { name: 'Ask for a change' }).click();
  await expect(page.getByText('Waiting for the shopper to edit.')).toBeVisible();
  const ask = await waitForMail(shopper.email, /check your personalisation/, since);
  const link = /https?:\/\/[^\s]+\/orders\/[\w-]+/.exec(ask.text)![0];

  // the shopper edits the name on the order page
  await shopper.page.goto(new URL(link).pathname);
  const edit = shopper.page.getByRole('form', { name: /Edit the personalisation/ });
  await expect(edit.getByTestId('change-request')).toHaveText('Did you mean Mira? The capitals look mixed up.');
  await edit.getByLabel('Name', { exact: true }).fill('Mira');
  await edit.getByRole('button', { name: 'Send the corrected personalisation' }).click();
  await expect(shopper.page.getByText('Thank you! The shop will check the new proof.')).toBeVisible();

  // the proof comes back with version 2; Fern approves it
  await page.reload();
  await expect(page.getByRole('heading', { level: 1, name: 'Mira' })).toBeVisible();
  await expect(page.getByTestId('proof-versions')).toContainText('Version 2: Mira');
  await expect(page.getByTestId('proof-versions')).toContainText('Version 1: mIRA');
  await page.getByRole('button', { name: 'Approve the proof' }).click();
  await expect(page.getByText('approved', { exact: true })).toBeVisible();

  // cut sheets for this line only
  await page.goto('/workroom/cut-sheets');
  await page.getByRole('button', { name: 'Select none' }).click();
  await page.locator('label').filter({ hasText: number }).getByRole('checkbox').check();
  await page.getByRole('button', { name: /Build cut sheets for 1 line/ }).click();
  await expect(page).toHaveURL(/batch=/);
  const sheets = page.getByTestId('cut-sheet');
  await expect(sheets.first()).toBeVisible();
  expect(await sheets.count()).toBeGreaterThanOrEqual(2); // the fox tote uses several materials

  const [svgDownload] = await Promise.all([page.waitForEvent('download'), sheets.first().getByRole('link', { name: 'Download SVG' }).click()]);
  const svg = await (await svgDownload.createReadStream()).toArray();
  const svgText = Buffer.concat(svg).toString('utf8');
  expect(svgText).toMatch(/<svg[^>]+width="\d+(\.\d+)?mm"/);
  expect(svgDownload.suggestedFilename()).toMatch(/\.svg$/);

  await page.getByLabel(/Letter/).check();
  await page.getByRole('button', { name: 'Build the work sheet' }).click();
  const pdfLink = page.getByRole('link', { name: /Download the PDF/ });
  await expect(pdfLink).toBeVisible({ timeout: 30_000 });
  const [pdfDownload] = await Promise.all([page.waitForEvent('download'), pdfLink.click()]);
  const pdf = Buffer.concat(await (await pdfDownload.createReadStream()).toArray());
  expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');

  await page.getByRole('button', { name: /Mark all \d+ sheets cut/ }).click();
  // a step that takes vinyl off the stock asks first
  await expect(page.getByText(/comes off your stock/)).toBeVisible();
  await page.getByRole('button', { name: 'Yes, mark them cut' }).click();
  await expect(page.getByRole('link', { name: /go to the press cards/ })).toBeVisible();

  // press card, then pressed
  await page.goto('/workroom/press');
  const card = page.getByTestId('press-card').filter({ hasText: number });
  await expect(card).toContainText('Clamshell press');
  await expect(card).toContainText('Pre-press');
  await card.getByRole('button', { name: 'Mark pressed' }).click();
  await expect(card).toHaveCount(0);

  // shipping: carrier and tracking number (the pressed lines: one page, whatever else the shop has)
  await page.goto('/workroom?state=pressed');
  await page.getByTestId('work-line').filter({ hasText: number }).getByRole('link', { name: number }).click();
  await page.getByLabel('Carrier').fill('UPS');
  await page.getByLabel('Tracking number').fill('1Z999AA10123456784');
  await page.getByRole('button', { name: 'Mark shipped' }).click();
  await expect(page.getByTestId('tracking')).toContainText('1Z999AA10123456784');

  const shipped = await waitForMail(shopper.email, new RegExp(`${number} .*has shipped`), since);
  expect(shipped.text).toContain('1Z999AA10123456784');
  expect(shipped.text).toContain('UPS');

  // the shopper's order page shows the tracking number
  await shopper.page.goto(new URL(link).pathname);
  await expect(shopper.page.getByText('1Z999AA10123456784', { exact: true })).toBeVisible();
  await shopper.page.close();
});
