// The one section navigation of the seller's pages and of the moderation desk: every link leads to
// its page, that page (and only it) is marked aria-current="page", and at 375 px the row scrolls
// inside itself while the page never scrolls sideways.
import type { Page } from '@playwright/test';
import { demo, expect, signIn, test } from './fixtures.ts';

const sellerNav = (page: Page) => page.getByRole('navigation', { name: 'Seller pages' });
const deskNav = (page: Page) => page.getByRole('navigation', { name: 'Moderation desk pages' });

async function expectCurrent(page: Page, nav: ReturnType<typeof sellerNav>, name: string) {
  await expect(nav.getByRole('link', { name, exact: true })).toHaveAttribute('aria-current', 'page');
  await expect(nav.locator('[aria-current="page"]')).toHaveCount(1);
}

async function expectNoSideScroll(page: Page, where: string) {
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(overflow, `${where}: the page scrolls sideways by ${overflow}px`).toBeLessThanOrEqual(1);
}

// link, the page it leads to, the page's heading
const SELLER_PAGES: Array<[string, string, string]> = [
  ['Cut sheets', '/workroom/cut-sheets', 'Cut sheets'],
  ['Press', '/workroom/press', 'Press cards'],
  ['Stock', '/workroom/stock', 'Stock'],
  ['Listings', '/workroom/listings', 'Listings'],
  ['Materials', '/workroom/materials', 'Materials'],
  ['Codes and dates', '/workroom/offers', 'Codes and dates'],
  ['Shop', '/workroom/shop', 'Shop settings'],
  ['Business', '/workroom/business', 'Your business'],
  ['Payouts', '/workroom/business/payouts', 'Payouts'],
  ['Orders', '/workroom', 'Fern & Fable Goods'],
];

test('every seller page shows the one seller navigation with the current page marked', async ({ page }) => {
  await signIn(page, demo.fern);
  await page.goto('/workroom');
  await expectCurrent(page, sellerNav(page), 'Orders');
  for (const [link, path, heading] of SELLER_PAGES) {
    await sellerNav(page).getByRole('link', { name: link, exact: true }).click();
    await expect(page).toHaveURL(new RegExp(`${path}$`));
    await expect(page.getByRole('heading', { level: 1, name: heading })).toBeVisible();
    await expectCurrent(page, sellerNav(page), link);
  }
  // pages inside a section mark their section
  await page.goto('/workroom/business');
  await page.getByRole('link', { name: 'Calendar and rate' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Calendar and rate' })).toBeVisible();
  await expectCurrent(page, sellerNav(page), 'Business');
  await page.goto('/workroom/listings/new');
  await expectCurrent(page, sellerNav(page), 'Listings');
  await page.goto('/workroom');
  await page
    .getByTestId('work-line')
    .first()
    .getByRole('link', { name: /^NS-\d+$/ })
    .click();
  await expect(page).toHaveURL(/\/workroom\/orders\//);
  await expectCurrent(page, sellerNav(page), 'Orders');
  await page.goBack();
  await page
    .getByTestId('work-line')
    .first()
    .getByRole('link', { name: /Check proof|Open/ })
    .click();
  await expect(page).toHaveURL(/\/workroom\/lines\//);
  await expectCurrent(page, sellerNav(page), 'Orders');
});

test('at 375 px the seller navigation scrolls in its row, shows the current page and the page does not scroll sideways', async ({ page }) => {
  await signIn(page, demo.fern);
  await page.setViewportSize({ width: 375, height: 800 });
  for (const [link, path] of SELLER_PAGES) {
    await page.goto(path);
    const current = sellerNav(page).getByRole('link', { name: link, exact: true });
    await expect(current).toHaveAttribute('aria-current', 'page');
    await expect(current).toBeInViewport({ ratio: 1 });
    await expectNoSideScroll(page, link);
  }
  // the workroom's order lines are cards at this width, each with its own checkbox
  await page.goto('/workroom');
  const line = page.getByTestId('work-line').first();
  await expect(line).toBeVisible();
  expect(await line.evaluate((el) => el.tagName)).toBe('LI');
  await line.getByRole('checkbox').check();
  await expect(page.getByText(/shown on this page, 1 selected/)).toBeVisible();
});

test('the moderation desk has its own section navigation', async ({ page }) => {
  await signIn(page, demo.admin);
  await page.goto('/moderation');
  await expectCurrent(page, deskNav(page), 'Queue');
  await deskNav(page).getByRole('link', { name: 'Shops', exact: true }).click();
  await expect(page).toHaveURL(/\/moderation#shops$/);
  await expect(page.getByRole('heading', { name: /New shops/ })).toBeInViewport();
  await expectCurrent(page, deskNav(page), 'Shops');
  await deskNav(page).getByRole('link', { name: 'Audit log', exact: true }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Audit log' })).toBeVisible();
  await expectCurrent(page, deskNav(page), 'Audit log');
  await deskNav(page).getByRole('link', { name: 'Mail', exact: true }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Mail' })).toBeVisible();
  await expectCurrent(page, deskNav(page), 'Mail');
  await deskNav(page).getByRole('link', { name: 'Queue', exact: true }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Waiting for review' })).toBeVisible();
  await expectCurrent(page, deskNav(page), 'Queue');
  await page.setViewportSize({ width: 375, height: 800 });
  for (const url of ['/moderation', '/moderation/audit', '/moderation/mail']) {
    await page.goto(url);
    await expect(deskNav(page).locator('[aria-current="page"]')).toBeInViewport({ ratio: 1 });
    await expectNoSideScroll(page, url);
  }
});
