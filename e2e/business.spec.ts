// The seller's business view in a real browser: what is due with marks, charts with table views,
// the payouts ledger with date filters and CSV export, the working calendar, the pricing helper.
import fs from 'node:fs';
import Papa from 'papaparse';
import { demo, expect, signIn, test } from './fixtures.ts';

test('a seller sees what is due, the charts as tables, and cost of goods', async ({ page }) => {
  await signIn(page, demo.fern);
  await page.goto('/workroom/business');
  await expect(page.getByRole('heading', { name: 'Your business' })).toBeVisible();
  const due = page.getByRole('region', { name: 'What is due' });
  await expect(due.getByRole('row')).not.toHaveCount(1);
  // every chart can be read as a table
  const sales = page.getByRole('region', { name: 'Sales and margin by week' });
  await sales.getByRole('button', { name: 'Show table' }).click();
  await expect(sales.getByRole('button', { name: 'Show chart' })).toHaveAttribute('aria-pressed', 'true');
  await expect(sales.getByRole('columnheader', { name: 'Margin' })).toBeVisible();
  const byListing = page.getByRole('region', { name: 'Orders by listing' });
  await byListing.getByRole('button', { name: 'Show table' }).click();
  await expect(byListing.getByRole('cell').first()).toBeVisible();
  const costs = page.getByRole('region', { name: 'Cost of goods and margin' });
  await expect(costs.getByRole('rowheader', { name: 'All orders' })).toBeVisible();
});

test('the payouts ledger filters by date and downloads the same rows as CSV', async ({ page }) => {
  await signIn(page, demo.fern);
  await page.goto('/workroom/business/payouts');
  const movements = page.getByRole('region', { name: /Movements/ });
  const rows = movements.locator('tbody tr');
  await expect(rows.first()).toBeVisible();
  const all = await rows.count();
  const firstDay = (await rows.first().locator('td').first().textContent())!.trim();
  await page.getByLabel('From').fill(firstDay);
  await page.getByLabel('To').fill(firstDay);
  await expect(async () => {
    const n = await rows.count();
    expect(n).toBeLessThanOrEqual(all);
    for (const d of await rows.locator('td:first-child').allTextContents()) expect(d.trim()).toBe(firstDay);
  }).toPass();
  const shown = await rows.count();
  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download CSV' }).click()]);
  const csv = fs.readFileSync((await download.path())!, 'utf8');
  const parsed = Papa.parse<string[]>(csv.trim()).data;
  expect(parsed[0]).toContain('amount');
  expect(parsed.length - 1).toBe(shown);
  await expect(page.getByRole('region', { name: 'Balance by month' }).getByRole('rowheader').first()).toBeVisible();
});

test('the working calendar saves and comes back, and the pricing helper shows a margin', async ({ page }) => {
  await signIn(page, demo.comet);
  await page.goto('/workroom/business/settings');
  const saturday = page.getByRole('checkbox', { name: 'Saturday' });
  const was = await saturday.isChecked();
  await saturday.setChecked(!was);
  await page.getByLabel('Add a day off').fill('2026-12-24');
  await page.getByRole('button', { name: 'Add day off' }).click();
  await expect(page.getByRole('list', { name: 'Days off' })).toContainText('2026-12-24');
  await page.getByRole('button', { name: 'Save business settings' }).click();
  await expect(page.getByText(/Business settings saved/)).toBeVisible();
  await page.reload();
  await expect(page.getByRole('checkbox', { name: 'Saturday' })).toBeChecked({ checked: !was });
  // put it back as it was
  await page.getByRole('checkbox', { name: 'Saturday' }).setChecked(was);
  await page.getByRole('button', { name: 'Remove day off 2026-12-24' }).click();
  await page.getByRole('button', { name: 'Save business settings' }).click();
  await expect(page.getByText(/Business settings saved/).first()).toBeVisible();

  await page.goto('/workroom/listings');
  await page.getByRole('link', { name: /edit/i }).first().click();
  const helper = page.getByRole('region', { name: 'Pricing helper' });
  await helper.scrollIntoViewIfNeeded();
  await expect(helper.getByRole('rowheader', { name: 'Margin' })).toBeVisible({ timeout: 15_000 });
  await helper.getByLabel('Sample name').fill('Kai');
  await expect(helper.getByRole('columnheader', { name: '“Kai”' })).toBeVisible();
});
