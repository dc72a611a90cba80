// Journey 4 (DEVELOPERS.md, "Journeys"), admin side, on a shop made for this test (so no other spec's data moves):
// approve a new shop, approve one listing and reject another with a reason the seller receives by
// e-mail, then suspend the shop (its listings leave search at once) and restore it.
import { type APIRequestContext, type Browser, expect, test } from '@playwright/test';
import { DEMO_PASSWORD, demo, signIn, waitForMail } from './fixtures.ts';

/** The server's JSON answer (after checking the status); the assertions check its shape. */
async function ok(res: Awaited<ReturnType<APIRequestContext['get']>>): Promise<any> {
  expect(res.ok(), `${res.url()} → ${res.status()} ${await res.text()}`).toBe(true);
  return res.json();
}

/** A fresh seller with a shop (in review), one material and two listings sent for review. */
async function freshSeller(browser: Browser, tag: string) {
  const context = await browser.newContext();
  const req = context.request;
  const email = `maker-${tag}@namesake.test`;
  await ok(await req.post('/api/auth/sign-up/email', { data: { name: 'Priya Maker', email, password: DEMO_PASSWORD } }));
  const { shop } = await ok(await req.post('/api/shops', { data: { name: `Priya Print ${tag}` } }));
  const { material } = await ok(await req.post('/api/materials', { data: { kind: 'smooth', colourName: 'Pine green', colourHex: '#2f7d6d', rollWidthMm: 305, stockMm: 5000 } }));
  const fonts: { id: string }[] = await ok(await req.get('/api/fonts'));
  const listing = async (title: string) => {
    const body = {
      title,
      description: 'A drawstring bag with a name.',
      blank: { kind: 'drawstring_bag' },
      basePriceMinor: 1800,
      personalisation: { textFields: [{ id: 'name', label: 'Name', fontIds: [fonts[0]!.id], colourChoices: [material.id] }] },
    };
    const { listing: l } = await ok(await req.post('/api/seller/listings', { data: body }));
    await ok(await req.post(`/api/seller/listings/${l.id}/submit`));
    return l as { id: string };
  };
  return { context, email, shop: shop as { id: string; name: string; slug: string }, listing };
}

const searchIds = async (req: APIRequestContext, q: string) => ((await ok(await req.get(`/api/listings?q=${encodeURIComponent(q)}`))).items as { id: string }[]).map((i) => i.id);

test('when an admin approves, rejects with a reason, suspends and restores, then the seller is told and search follows at once', async ({ page, browser }) => {
  const tag = Date.now().toString(36);
  const seller = await freshSeller(browser, tag);
  const goodTitle = `Theo drawstring bag ${tag}`;
  const badTitle = `Kai drawstring bag ${tag}`;
  const good = await seller.listing(goodTitle);
  const bad = await seller.listing(badTitle);
  const since = Date.now();

  await signIn(page, demo.admin);
  await page.goto('/moderation');

  // the new shop waits in its queue; approving it needs no reason
  const shopCard = page.getByRole('region', { name: /New shops/ }).getByRole('listitem', { name: `Shop ${seller.shop.name}` });
  await expect(shopCard).toBeVisible();
  await shopCard.getByRole('button', { name: `Approve shop ${seller.shop.name}` }).click();
  await expect(page.getByText(`${seller.shop.name} is approved.`)).toBeVisible();

  // approve the first listing from its review page
  await page.getByRole('link', { name: `Review ${goodTitle}` }).click();
  await expect(page.getByRole('article', { name: 'Listing as shoppers see it' }).getByRole('heading', { name: goodTitle })).toBeVisible();
  await page.getByRole('button', { name: 'Approve listing' }).click();
  await expect(page.getByText(`“${goodTitle}” is approved and on sale.`)).toBeVisible();
  expect(await searchIds(page.request, goodTitle)).toContain(good.id);

  // reject the second: a reason is required, and the seller gets it by e-mail
  await page.getByRole('link', { name: `Review ${badTitle}` }).click();
  await page.getByRole('button', { name: 'Send back for changes…' }).click();
  await page.getByRole('button', { name: 'Send back for changes', exact: true }).click();
  await expect(page.getByText('Give the seller a reason (at least 3 characters).')).toBeVisible();
  // a common reason fills the field in the words the seller will read
  await page.getByRole('button', { name: 'Photo', exact: true }).click();
  const reason = 'Add a clear photo of the finished item on its blank, so shoppers see what arrives.';
  await expect(page.getByLabel('Reason for the seller')).toHaveValue(reason);
  await page.getByRole('button', { name: 'Send back for changes', exact: true }).click();
  await expect(page.getByText(`“${badTitle}” is sent back to the seller.`)).toBeVisible();
  const mail = await waitForMail(seller.email, /Changes needed/, since);
  expect(mail.text).toContain(reason);
  expect(mail.text).toContain(badTitle);
  expect(await searchIds(page.request, badTitle)).not.toContain(bad.id);
  const rejected = await ok(await seller.context.request.get(`/api/seller/listings/${bad.id}`));
  expect(rejected.listing.state).toBe('rejected');
  expect(rejected.listing.rejectionReason).toBe(reason);

  // suspend the shop: its live listing leaves search at once
  await page.goto('/moderation');
  const allShops = page.getByRole('region', { name: 'All shops' });
  await allShops.getByRole('searchbox', { name: 'Find a shop' }).fill(seller.shop.name);
  await allShops.getByRole('searchbox', { name: 'Find a shop' }).press('Enter');
  const known = allShops.getByRole('listitem', { name: `Shop ${seller.shop.name}` });
  await known.getByRole('button', { name: `Suspend shop ${seller.shop.name}` }).click();
  await known.getByLabel(`Why is ${seller.shop.name} suspended?`).fill('Listings copy another maker’s artwork; we are checking.');
  await known.getByRole('button', { name: 'Suspend shop' }).click();
  await expect(page.getByText(`${seller.shop.name} is suspended.`)).toBeVisible();
  expect(await searchIds(page.request, goodTitle)).not.toContain(good.id);
  await waitForMail(seller.email, /suspended/, since);

  // restore it: the listing is back
  await known.getByRole('button', { name: `Restore shop ${seller.shop.name}` }).click();
  await expect(page.getByText(`${seller.shop.name} is restored.`)).toBeVisible();
  expect(await searchIds(page.request, goodTitle)).toContain(good.id);

  // every decision is in the audit log, with who and why
  const deskNav = page.getByRole('navigation', { name: 'Moderation desk pages' });
  await deskNav.getByRole('link', { name: 'Audit log', exact: true }).click();
  await expect(deskNav.getByRole('link', { name: 'Audit log', exact: true })).toHaveAttribute('aria-current', 'page');
  const log = page.getByRole('table', { name: 'Audit log of moderator actions' });
  await expect(log.getByRole('row').filter({ hasText: 'Sent back listing' }).filter({ hasText: badTitle })).toContainText(reason);
  await expect(log.getByRole('row').filter({ hasText: 'Suspended shop' }).filter({ hasText: seller.shop.name })).toContainText('admin@namesake.test');
  await expect(log.getByRole('row').filter({ hasText: 'Restored shop' }).filter({ hasText: seller.shop.name })).toBeVisible();
  // filtered to one kind of action, with the subject a link to its page
  await page.getByLabel('Action').selectOption('shop.suspend');
  await expect(page).toHaveURL(/action=shop\.suspend/);
  await expect(log.getByRole('row').filter({ hasText: 'Restored shop' })).toHaveCount(0);
  const suspended = log.getByRole('row').filter({ hasText: 'Suspended shop' }).filter({ hasText: seller.shop.name });
  await expect(suspended.getByRole('link', { name: seller.shop.name })).toHaveAttribute('href', /^\/shops\//);

  await seller.context.close();
});

test('when the seller edits a listing the admin has open, then Approve shows why it was refused and the new version is approved instead; a shop rename waits on the desk as before → after', async ({
  page,
  browser,
}) => {
  const tag = `${Date.now().toString(36)}r`;
  const seller = await freshSeller(browser, tag);
  const title = `Leon tote ${tag}`;
  const l = await seller.listing(title);
  await signIn(page, demo.admin);
  await ok(await page.request.post(`/api/moderation/shops/${seller.shop.id}/approve`, { data: {} }));

  const shown = page.getByRole('article', { name: 'Listing as shoppers see it' });
  await page.goto(`/moderation/listings/${l.id}`);
  await expect(shown.getByRole('heading', { name: title })).toBeVisible();
  // meanwhile the seller changes the title
  const cur = await ok(await seller.context.request.get(`/api/seller/listings/${l.id}`));
  await ok(await seller.context.request.put(`/api/seller/listings/${l.id}`, { data: { ...cur.listing.draft, title: `${title} for sale elsewhere` } }));

  await page.getByRole('button', { name: 'Approve listing' }).click();
  await expect(page.getByRole('alert').filter({ hasText: 'The seller changed this listing after you opened it; review the new version.' })).toBeVisible();
  expect(await searchIds(page.request, tag)).not.toContain(l.id);
  await page.getByRole('button', { name: 'Show the new version' }).click();
  await expect(shown.getByRole('heading', { name: `${title} for sale elsewhere` })).toBeVisible();
  await page.getByRole('button', { name: 'Approve listing' }).click();
  await expect(page.getByText(`“${title} for sale elsewhere” is approved and on sale.`)).toBeVisible();
  expect((await ok(await page.request.get(`/api/listings/${(cur.listing as { slug: string }).slug}`))).content.title).toBe(`${title} for sale elsewhere`);

  // the live shop is renamed: the public page keeps the old name until the desk approves the change
  const newName = `Priya Prints Studio ${tag}`;
  await ok(await seller.context.request.patch('/api/shop', { data: { name: newName } }));
  expect((await ok(await page.request.get(`/api/shops/${seller.shop.slug}`))).shop.name).toBe(seller.shop.name);
  await page.goto('/moderation');
  const card = page.getByRole('listitem', { name: `Changes to shop ${seller.shop.name}` });
  await expect(card).toContainText(seller.shop.name);
  await expect(card).toContainText(newName);
  await card.getByRole('button', { name: `Approve change to ${seller.shop.name}` }).click();
  await expect(page.getByText(`The new details of ${seller.shop.name} are public.`)).toBeVisible();
  expect((await ok(await page.request.get(`/api/shops/${seller.shop.slug}`))).shop.name).toBe(newName);

  await seller.context.close();
});
