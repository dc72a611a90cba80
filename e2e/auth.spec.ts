import { expect, type Page, test } from '@playwright/test';

// Demo accounts seeded by the server in demo mode (the invented demo scenario; README.md lists them).
const DEMO_PASSWORD = 'namesake-demo';
const accounts = {
  shopper: 'dana@namesake.test',
  seller: 'fern@namesake.test',
  seller2: 'comet@namesake.test',
  admin: 'admin@namesake.test',
} as const;

const mainNav = (page: Page) => page.getByRole('navigation', { name: 'Main' });

async function signInThroughForm(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  // The header switches to the signed-in navigation once /api/me answers with the account.
  await expect(mainNav(page).getByRole('button', { name: 'Sign out' })).toBeVisible();
}

async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto('/sign-in');
  await signInThroughForm(page, email, password);
}

async function expectNav(page: Page, visible: string[], absent: string[]) {
  const nav = mainNav(page);
  for (const name of visible) await expect(nav.getByRole('link', { name, exact: true })).toBeVisible();
  for (const name of absent) await expect(nav.getByRole('link', { name, exact: true })).toHaveCount(0);
}

test.describe('navigation per role', () => {
  test('when a guest opens the home page, then the header offers Browse, Cart and Sign in only', async ({ page }) => {
    await page.goto('/');
    await expect(page.getByRole('link', { name: 'Namesake, home' })).toBeVisible();
    await expectNav(page, ['Browse', 'Cart', 'Sign in'], ['Orders', 'Open a shop', 'Workroom', 'Moderation desk', 'Mail']);
    await expect(mainNav(page).getByRole('button', { name: 'Sign out' })).toHaveCount(0);
  });

  test('when the shopper signs in, then she sees Orders and Open a shop but no seller or admin pages', async ({ page }) => {
    await signIn(page, accounts.shopper);
    await expectNav(page, ['Browse', 'Cart', 'Orders', 'Open a shop'], ['Workroom', 'Moderation desk', 'Mail', 'Sign in']);
  });

  for (const email of [accounts.seller, accounts.seller2]) {
    test(`when seller ${email} signs in, then the workroom is in the navigation and the moderation desk is not`, async ({ page }) => {
      await signIn(page, email);
      await expectNav(page, ['Browse', 'Cart', 'My purchases', 'Workroom'], ['Orders', 'Open a shop', 'Moderation desk', 'Mail', 'Sign in']);
    });
  }

  test('when the admin signs in, then the moderation desk and mail are in the navigation', async ({ page }) => {
    await signIn(page, accounts.admin);
    await expectNav(page, ['Browse', 'Cart', 'Orders', 'Moderation desk', 'Mail'], ['Workroom', 'Open a shop', 'Sign in']);
  });

  test('when a shopper opens the workroom or the moderation desk, then a polite 403 page shows instead', async ({ page }) => {
    await signIn(page, accounts.shopper);
    await page.goto('/workroom');
    await expect(page.getByText('403 · Not for this account')).toBeVisible();
    await expect(page.getByRole('main').getByRole('link', { name: 'Open a shop' })).toBeVisible();
    await page.goto('/moderation');
    await expect(page.getByRole('heading', { name: /kept for the moderation team/ })).toBeVisible();
  });
});

test('when a guest opens the workroom, then sign-in comes first and fern lands back in her workroom', async ({ page }) => {
  await page.goto('/workroom');
  await expect(page).toHaveURL(/\/sign-in\?next=%2Fworkroom$/);
  await signInThroughForm(page, accounts.seller);
  await expect(page).toHaveURL(/\/workroom$/);
  await expect(page.getByRole('heading', { level: 1, name: 'Fern & Fable Goods' })).toBeVisible();
});

test('when the sign-in page is in demo mode, then it lists the demo accounts and their password', async ({ page }) => {
  await page.goto('/sign-in');
  const demo = page.getByRole('region', { name: 'Demo accounts' });
  await expect(demo).toContainText(DEMO_PASSWORD);
  await expect(demo).toContainText(accounts.shopper);
  await expect(demo).toContainText(accounts.admin);
});

test('when the password is wrong, then the form says so and keeps the typed e-mail', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(accounts.shopper);
  await page.getByLabel('Password', { exact: true }).fill('not-the-password');
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await expect(page.getByRole('status', { name: 'Notifications' })).toContainText(/match an account|too many/i);
  await expect(page.getByLabel('E-mail')).toHaveValue(accounts.shopper);
  await expect(page).toHaveURL(/\/sign-in/);
});

test.describe('sign-up field errors', () => {
  test('when every field is empty, then each field gets its own message, linked to it', async ({ page }) => {
    await page.goto('/sign-up');
    await page.getByRole('button', { name: 'Create account' }).click();
    const name = page.getByLabel('Your name');
    const email = page.getByLabel('E-mail');
    const password = page.getByLabel('Password', { exact: true });
    await expect(name).toHaveAttribute('aria-invalid', 'true');
    await expect(name).toHaveAccessibleDescription(/Enter your name\./);
    await expect(email).toHaveAccessibleDescription(/Enter your e-mail address\./);
    await expect(password).toHaveAccessibleDescription(/Use at least 8 characters\./);
    await expect(page).toHaveURL(/\/sign-up$/);
  });

  test('when the e-mail is malformed and the password short, then those fields say why and the typed text stays', async ({ page }) => {
    await page.goto('/sign-up');
    await page.getByLabel('Your name').fill('Anouk');
    await page.getByLabel('E-mail').fill('anouk-at-example');
    await page.getByLabel('Password', { exact: true }).fill('short');
    await page.getByRole('button', { name: 'Create account' }).click();
    await expect(page.getByLabel('E-mail')).toHaveAccessibleDescription(/Enter a valid e-mail address/);
    await expect(page.getByLabel('Password', { exact: true })).toHaveAccessibleDescription(/Use at least 8 characters\./);
    await expect(page.getByLabel('Your name')).not.toHaveAttribute('aria-invalid', 'true');
    await expect(page.getByLabel('Your name')).toHaveValue('Anouk');
    await expect(page.getByLabel('E-mail')).toHaveValue('anouk-at-example');
  });

  test('when the e-mail already has an account, then the page says so and keeps what was typed', async ({ page }) => {
    await page.goto('/sign-up');
    await page.getByLabel('Your name').fill('Dana again');
    await page.getByLabel('E-mail').fill(accounts.shopper);
    await page.getByLabel('Password', { exact: true }).fill('a long fresh passphrase');
    await page.getByRole('button', { name: 'Create account' }).click();
    await expect(page.getByText(/already/i).first()).toBeVisible();
    await expect(page.getByLabel('Your name')).toHaveValue('Dana again');
    await expect(page).toHaveURL(/\/sign-up$/);
  });
});

test('when a visitor signs up, then they are signed in as a shopper', async ({ page }) => {
  const email = `kai-${Date.now()}-${Math.floor(Math.random() * 1e6)}@namesake.test`;
  await page.goto('/sign-up');
  await page.getByLabel('Your name').fill('Kai');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill('kites over the harbour');
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(mainNav(page).getByRole('button', { name: 'Sign out' })).toBeVisible();
  await expectNav(page, ['Orders', 'Open a shop'], ['Workroom', 'Sign in']);
});

test('when the shopper signs out, then the header is back to guest and her pages ask for sign-in again', async ({ page }) => {
  await signIn(page, accounts.shopper);
  await mainNav(page).getByRole('button', { name: 'Sign out' }).click();
  await expectNav(page, ['Browse', 'Cart', 'Sign in'], ['Orders', 'Open a shop']);
  await page.goto('/orders');
  await expect(page).toHaveURL(/\/sign-in\?next=%2Forders$/);
  // A reload asks the server again: the old session cookie no longer counts.
  await page.reload();
  await expect(mainNav(page).getByRole('link', { name: 'Sign in', exact: true })).toBeVisible();
});

test('when the page is 375 px wide, then the navigation folds behind a Menu button', async ({ page }) => {
  await signIn(page, accounts.admin);
  await page.setViewportSize({ width: 375, height: 800 });
  const menu = page.getByRole('button', { name: 'Menu' });
  await expect(menu).toHaveAttribute('aria-expanded', 'false');
  await expect(mainNav(page)).toBeHidden();
  await menu.click();
  await expect(mainNav(page).getByRole('link', { name: 'Mail', exact: true })).toBeVisible();
  const width = await page.evaluate(() => document.documentElement.scrollWidth);
  expect(width).toBeLessThanOrEqual(375);
});

test('when an address does not exist, then a 404 page offers a way home', async ({ page }) => {
  await page.goto('/no-such-page');
  await expect(page.getByText('404 · Page not found')).toBeVisible();
  await expect(page.getByRole('main').getByRole('link', { name: 'Go to the home page' })).toBeVisible();
});

test('when a shopper forgets her password, then the reset mail reaches the admin mail viewer and its link sets a new one', async ({ page }) => {
  const email = `priya-${Date.now()}-${Math.floor(Math.random() * 1e6)}@namesake.test`;
  await page.goto('/sign-up');
  await page.getByLabel('Your name').fill('Priya');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill('first long passphrase');
  await page.getByRole('button', { name: 'Create account' }).click();
  await mainNav(page).getByRole('button', { name: 'Sign out' }).click();
  await expect(mainNav(page).getByRole('link', { name: 'Sign in', exact: true })).toBeVisible();

  await page.goto('/forgot-password');
  await page.getByLabel('E-mail').fill(email);
  await page.getByRole('button', { name: 'Send reset link' }).click();
  await expect(page.getByRole('heading', { name: 'Check your inbox' })).toBeVisible();

  await signIn(page, accounts.admin);
  await page.goto('/moderation/mail');
  const message = page.getByRole('list', { name: 'Captured messages' }).getByRole('link', { name: new RegExp(email.replace(/[.+]/g, '\\$&')) });
  await expect(async () => {
    await page.getByRole('button', { name: 'Check for new mail' }).click();
    await expect(message.first()).toBeVisible({ timeout: 1000 });
  }).toPass({ timeout: 15_000 });
  await message.first().click();
  await expect(page.getByRole('article').getByRole('heading', { level: 2 })).toBeVisible();
  const plain = page.getByRole('button', { name: 'Plain text' });
  if (await plain.count()) await plain.click();
  const body = await page.getByRole('article').locator('pre').innerText();
  const link = body.match(/https?:\/\/[^\s<>"')]*reset-password[^\s<>"')]*/)?.[0];
  expect(link, 'the reset mail carries a reset link').toBeTruthy();
  await mainNav(page).getByRole('button', { name: 'Sign out' }).click();
  await expect(mainNav(page).getByRole('link', { name: 'Sign in', exact: true })).toBeVisible();

  // Follow the link on this test server, whatever host the mail was written for.
  const url = new URL(link!);
  await page.goto(url.pathname + url.search);
  await expect(page.getByRole('heading', { name: 'Choose a new password' })).toBeVisible();
  await page.getByLabel('New password').fill('second long passphrase');
  await page.getByRole('button', { name: 'Save new password' }).click();
  await expect(page.getByRole('heading', { name: 'Your new password is saved' })).toBeVisible();

  await signIn(page, email, 'second long passphrase');
  await expectNav(page, ['Orders'], ['Sign in']);
});

test('when a new shopper opens a shop, then she becomes a seller and her workroom shows the shop in review', async ({ page }) => {
  const stamp = `${Date.now()}${Math.floor(Math.random() * 1e4)}`;
  await page.goto('/sign-up');
  await page.getByLabel('Your name').fill('Zoë');
  await page.getByLabel('E-mail').fill(`zoe-${stamp}@namesake.test`);
  await page.getByLabel('Password', { exact: true }).fill('whales under the pier');
  await page.getByRole('button', { name: 'Create account' }).click();
  await mainNav(page).getByRole('link', { name: 'Open a shop', exact: true }).click();
  await page.getByRole('button', { name: 'Open my shop' }).click();
  await expect(page.getByLabel('Shop name')).toHaveAccessibleDescription(/Enter a shop name\.|at least 2 characters/);
  await page.getByLabel('Shop name').fill(`Harbour Kites ${stamp}`);
  await page.getByRole('button', { name: 'Open my shop' }).click();
  await expect(page).toHaveURL(/\/workroom$/);
  await expect(page.getByRole('heading', { level: 1, name: `Harbour Kites ${stamp}` })).toBeVisible();
  await expect(page.getByText('Shop state: In review')).toBeVisible();
  await expectNav(page, ['Workroom'], ['Open a shop']);
});
