// A list longer than a page: a fresh seller with 52 materials (pages of 50) moves through the
// shared pager; the page number sits in the URL, so a reload and the back button keep it.

import { apiPost, signUpApi, uniqueEmail } from './api-helpers.ts';
import { expect, test } from './fixtures.ts';

test('a seller pages through her materials; the page survives a reload and the back button', async ({ page }) => {
  test.setTimeout(90_000);
  await page.goto('/');
  await signUpApi(page, uniqueEmail('pager'), 'Ines Pager');
  await apiPost(page, '/api/shops', { name: `Pager Prints ${Date.now().toString(36)}` });
  for (let i = 0; i < 52; i++) {
    await apiPost(page, '/api/materials', { kind: 'smooth', colourName: `Roll ${String(i).padStart(2, '0')}`, colourHex: '#2f7d6d', rollWidthMm: 305, stockMm: 5000 });
  }

  await page.goto('/workroom/materials');
  const pager = page.getByRole('navigation', { name: 'Material pages' });
  await expect(pager).toContainText('Page 1 of 2');
  await expect(pager).toContainText('1–50 of 52 materials');
  await expect(page.getByText('Roll 49', { exact: true }).first()).toBeAttached();
  await expect(page.getByText('Roll 51', { exact: true })).toHaveCount(0);
  await expect(pager.getByRole('button', { name: 'Previous page' })).toHaveAttribute('aria-disabled', 'true');

  await pager.getByRole('button', { name: 'Next page' }).click();
  await expect(page).toHaveURL(/[?&]page=2\b/);
  await expect(pager).toContainText('Page 2 of 2');
  await expect(pager).toContainText('51–52 of 52 materials');
  await expect(page.getByText('Roll 51', { exact: true }).first()).toBeAttached();
  await expect(page.getByText('Roll 00', { exact: true })).toHaveCount(0);
  await expect(pager.getByRole('button', { name: 'Next page' })).toHaveAttribute('aria-disabled', 'true');

  await page.reload();
  await expect(page.getByRole('navigation', { name: 'Material pages' })).toContainText('Page 2 of 2');
  await expect(page.getByText('Roll 51', { exact: true }).first()).toBeAttached();

  await page.goBack();
  await expect(page).not.toHaveURL(/page=2/);
  await expect(page.getByRole('navigation', { name: 'Material pages' })).toContainText('Page 1 of 2');
  await expect(page.getByText('Roll 00', { exact: true }).first()).toBeAttached();
});
