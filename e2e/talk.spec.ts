// Issue 16, the parts of the "must show" journey about talking: a parent asks the shop a question
// on her order, the shop answers with a photo, and she reads the answer from the e-mail's link;
// later, on an order shipped days ago, she reviews an item with a photo and finds it on the listing.
import sharp from 'sharp';
import { apiGet } from './api-helpers.ts';
import { demo, expect, signIn, test, waitForMail } from './fixtures.ts';

const photo = async (colour: string) => ({
  name: 'photo.png',
  mimeType: 'image/png',
  buffer: await sharp({ create: { width: 320, height: 240, channels: 3, background: colour } })
    .png()
    .toBuffer(),
});
/** The absolute link in a mail's text that ends in #messages, as a path to open. */
const threadLink = (text: string) => {
  const m = /(https?:\/\/\S+#messages)/.exec(text);
  expect(m, 'the e-mail links to the thread').toBeTruthy();
  const u = new URL(m![1]!);
  return `${u.pathname}${u.hash}`;
};

test('a parent asks the shop a question on her order and reads the reply from the e-mail link', async ({ browser }) => {
  const parent = await (await browser.newContext()).newPage();
  const shop = await (await browser.newContext()).newPage();
  await signIn(parent, demo.shopper);

  // her newest order from Fern & Fable Goods (other specs may have bought from other shops since)
  await parent.goto('/orders');
  await parent
    .getByRole('listitem')
    .filter({ hasText: 'Fern & Fable Goods' })
    .getByRole('link', { name: /NS-\d+/ })
    .first()
    .click();
  await expect(parent.getByRole('heading', { level: 1 })).toContainText('Fern & Fable Goods');
  await expect(parent.getByRole('heading', { level: 1 })).toContainText('Your order from');
  const asked = Date.now();
  const box = parent.getByRole('region', { name: /^Messages with / });
  await box.getByLabel('Your message').fill('Could the name be in purple? It is for a birthday on the 20th.');
  await box.getByRole('button', { name: 'Send message' }).click();
  await expect(box.getByTestId('message')).toContainText(['Could the name be in purple?']);

  // the shop is told by e-mail, with a link to the thread in its workroom
  const toShop = await waitForMail(demo.fern, /^New message about order NS-\d+$/, asked);
  await signIn(shop, demo.fern);
  await expect(shop.getByTestId('unread-badge')).toContainText('1');
  await shop.goto(threadLink(toShop.text));
  const shopBox = shop.getByRole('region', { name: /^Messages with / });
  await expect(shopBox.getByTestId('message')).toContainText(['Could the name be in purple?']);
  await expect(shop.getByTestId('unread-badge')).toHaveCount(0);
  await shopBox.getByLabel('Your message').fill('Yes! We have a violet smooth vinyl; here is a swatch next to the tote.');
  await shopBox.getByLabel('Add a photo (optional)').setInputFiles(await photo('#7a4fa0'));
  const answered = Date.now();
  await shopBox.getByRole('button', { name: 'Send message' }).click();
  await expect(shopBox.getByTestId('message')).toHaveCount(2);

  // the parent gets the e-mail, sees the count in the header, and opens the link
  const toParent = await waitForMail(demo.shopper, /^New message about order NS-\d+$/, answered);
  expect(toParent.text).toContain('violet smooth vinyl');
  await parent.goto('/');
  await expect(parent.getByTestId('unread-badge')).toContainText('1');
  await parent.goto(threadLink(toParent.text));
  const thread = parent.getByRole('region', { name: /^Messages with / });
  await expect(thread.getByTestId('message').nth(1)).toContainText('violet smooth vinyl');
  const swatch = thread.getByRole('img', { name: /^Sent by Fern & Fable Goods/ });
  await expect(swatch).toBeVisible();
  expect(await swatch.evaluate((i: HTMLImageElement) => i.naturalWidth)).toBeGreaterThan(0);
  // reading it cleared the count
  await parent.goto('/orders');
  await expect(parent.getByTestId('unread-badge')).toHaveCount(0);
});

test('after shipping, she reviews an item with a photo and the review shows on the listing', async ({ page }) => {
  await signIn(page, demo.shopper);
  // the order shipped days ago, with the pumpkin bag still to review
  const { items } = await apiGet<{ items: Array<{ id: string }> }>(page, '/api/orders?limit=100');
  let orderId: string | null = null;
  for (const o of items) {
    const r = await apiGet<{ lines: Array<{ listingTitle: string; canReview: boolean }> }>(page, `/api/orders/${o.id}/reviews`);
    if (r.lines.some((l) => l.canReview && l.listingTitle === 'Harvest pumpkin drawstring bag with ribbon bow')) orderId = o.id;
  }
  expect(orderId, 'the demo has a shipped pumpkin bag to review').toBeTruthy();
  await page.goto(`/orders/${orderId}`);
  const form = page.getByRole('form', { name: 'Review Harvest pumpkin drawstring bag with ribbon bow' });
  await form.getByRole('button', { name: 'Post review' }).click();
  await expect(form.getByText('Choose 1 to 5 stars.')).toBeVisible();
  await form.getByLabel('5 stars').check();
  await form.getByLabel('Your review').fill('Otto wore the bag to the harvest fair. The bow is sewn on firmly.');
  await form.getByLabel('Add a photo (optional)').setInputFiles(await photo('#e07a26'));
  await form.getByRole('button', { name: 'Post review' }).click();
  await expect(page.getByText('Thank you! Your review is on the listing now.')).toBeVisible();

  // the listing: the summary near the title, the review first with its photo
  await page.goto('/search?q=pumpkin');
  await page
    .getByRole('link', { name: /Harvest pumpkin drawstring bag with ribbon bow/ })
    .first()
    .click();
  await expect(page.getByTestId('rating-summary').first()).toContainText('5.0 out of 5');
  const reviews = page.getByRole('region', { name: 'Reviews' });
  const first = reviews.getByTestId('review').first();
  await expect(first).toContainText('Otto wore the bag to the harvest fair.');
  await expect(first.getByRole('img', { name: '5 out of 5 stars' })).toBeVisible();
  const shared = first.getByRole('img', { name: 'Shared by Dana W. with the review' });
  await expect(shared).toBeVisible();
  expect(await shared.evaluate((i: HTMLImageElement) => i.naturalWidth)).toBeGreaterThan(0);
});
