// Order messages and reviews (issue 16): who may read and write a thread, the e-mail with its link,
// unread counts, photos through the upload checks, rate limits; reviews only of lines shipped long
// enough, one per line, one shop reply, an admin's hide in the audit log, and the rating summary.

import sharp from 'sharp';
import request, { type Agent } from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { MESSAGE_MAX_CHARS } from '../../shared/schemas/message.ts';
import { REVIEW_AFTER_SHIPPED_DAYS } from '../../shared/schemas/review.ts';
import { eventually, makeTestApp, type TestApp } from '../factories/app.ts';
import { DEMO_PASSWORD } from '../factories/sweep.ts';

const DAY = 86_400_000;
const RATE = 6;
let clock = Date.now();
let t: TestApp;
let dana: Agent;
let fern: Agent;
let comet: Agent;
let admin: Agent;
let sam: Agent;
let order: { id: string; number: string };
let shipped: { orderId: string; shippedAt: number; otto: string };

const png = (w = 60, h = 40) =>
  sharp({ create: { width: w, height: h, channels: 3, background: '#c0504d' } })
    .png()
    .toBuffer();
const one = <T>(q: string, ...a: unknown[]) => t.sqlite.prepare(q).get(...a) as T;
const count = (table: string) => one<{ n: number }>(`select count(*) as n from ${table}`).n;

beforeAll(async () => {
  t = await makeTestApp({ seed: true, now: () => clock, app: { rateLimits: { messagesPerMinute: RATE } } });
  const signIn = (n: string) => t.signIn(`${n}@namesake.test`, DEMO_PASSWORD);
  [dana, fern, comet, admin] = await Promise.all([signIn('dana'), signIn('fern'), signIn('comet'), signIn('admin')]);
  const other = await t.makeUser('shopper', { name: 'Sam Other' });
  sam = await t.signIn(other.email);
  order = one("select o.id, o.number from orders o join user u on u.id = o.buyer_id where u.email = 'dana@namesake.test' and o.shipped_at is null order by o.paid_at desc limit 1");
  const s = one<{ id: string; shipped_at: number }>('select id, shipped_at from orders where shipped_at is not null order by shipped_at limit 1');
  // the demo's pumpkin bag, shipped and not reviewed yet
  const otto = one<{ id: string }>(
    "select l.id from order_lines l left join reviews r on r.line_id = l.id where l.order_id = ? and r.id is null and l.listing_title = 'Harvest pumpkin drawstring bag with ribbon bow'",
    s.id,
  );
  shipped = { orderId: s.id, shippedAt: s.shipped_at, otto: otto.id };
}, 120_000);
afterAll(async () => t?.close());

describe('order messages', () => {
  test('when someone other than the shopper, the shop or an admin asks for a thread, then it is 404 (guest 401) and nothing is written', async () => {
    const url = `/api/orders/${order.id}/messages`;
    const before = count('order_messages');
    for (const a of [sam, comet]) {
      expect((await a.get(url)).status).toBe(404);
      expect((await a.post(url).send({ body: 'Let me in' })).status).toBe(404);
      expect((await a.post(`${url}/read`)).status).toBe(404);
    }
    expect((await request(t.app).get(url)).status).toBe(401);
    expect((await request(t.app).get('/api/messages/unread')).status).toBe(401);
    expect(count('order_messages')).toBe(before);
    for (const [a, side] of [
      [dana, 'shopper'],
      [fern, 'shop'],
      [admin, 'admin'],
    ] as const) {
      const res = await a.get(url);
      expect(res.status).toBe(200);
      expect(res.body.viewerSide).toBe(side);
    }
  });

  test('when the shopper asks and the shop answers with a photo, then each is mailed a link to the thread and the unread counts follow', async () => {
    const url = `/api/orders/${order.id}/messages`;
    expect((await fern.get('/api/messages/unread')).body.count).toBe(0);
    const asked = await dana.post(url).send({ body: 'Could the name be in purple?\n<b>thanks</b>' });
    expect(asked.status).toBe(201);
    expect(asked.body.message).toMatchObject({ side: 'shopper', body: 'Could the name be in purple?\n<b>thanks</b>', mine: true, photo: null });
    const toShop = await eventually(async () => (await t.mailTo('fern@namesake.test')).find((m) => m.subject === `New message about order ${order.number}`));
    expect(toShop.text).toContain(`http://localhost:3000/workroom/orders/${order.id}#messages`);
    expect(toShop.html).toContain('&#60;b&#62;thanks&#60;/b&#62;');
    expect((await fern.get('/api/messages/unread')).body).toEqual({ count: 1, asShopper: 0, asShop: 1 });
    expect((await fern.get(url)).body.unread).toBe(1);
    expect((await dana.get('/api/messages/unread')).body.count).toBe(0);
    // an admin reading changes nobody's count
    await admin.post(`${url}/read`);
    expect((await fern.get('/api/messages/unread')).body.count).toBe(1);
    expect((await fern.post(`${url}/read`)).body.marked).toBe(1);
    expect((await fern.get('/api/messages/unread')).body.count).toBe(0);
    expect((await fern.get(url)).body.unread).toBe(0);

    const answered = await fern
      .post(url)
      .field('body', 'Yes: we have a violet smooth vinyl. Here is a swatch.')
      .attach('file', await png(), { filename: 'swatch.png', contentType: 'image/png' });
    expect(answered.status).toBe(201);
    const photo = answered.body.message.photo as { url: string; thumbnailUrl: string };
    expect(photo.url).toMatch(/^\/api\/orders\/.+\/photo$/);
    const toShopper = await eventually(async () => (await t.mailTo('dana@namesake.test')).find((m) => m.subject === `New message about order ${order.number}`));
    expect(toShopper.text).toContain(`http://localhost:3000/orders/${order.id}#messages`);
    expect((await dana.get('/api/messages/unread')).body.count).toBe(1);
    const thread = await dana.get(url);
    expect(thread.body.messages.map((m: { side: string; authorName: string }) => [m.side, m.authorName])).toEqual([
      ['shopper', 'Dana Whitlock'],
      ['shop', 'Fern & Fable Goods'],
    ]);

    // the photo: re-encoded, for the thread's readers only, never under the public /uploads
    const img = await dana.get(photo.url);
    expect(img.status).toBe(200);
    expect(img.headers['content-type']).toMatch(/^image\/(webp|jpeg)$/);
    expect(img.headers['x-content-type-options']).toBe('nosniff');
    expect((await dana.get(photo.thumbnailUrl)).status).toBe(200);
    expect((await sam.get(photo.url)).status).toBe(404);
    expect((await comet.get(photo.url)).status).toBe(404);
    const stored = one<{ photo_path: string }>('select photo_path from order_messages where id = ?', answered.body.message.id).photo_path;
    expect((await request(t.app).get(`/uploads/${stored}`)).status).toBe(404);
  });

  test('when a message is empty, too long or carries a file that is not an image, then it is refused and nothing is kept', async () => {
    const url = `/api/orders/${order.id}/messages`;
    const before = count('order_messages');
    expect((await dana.post(url).send({ body: '   ' })).status).toBe(400);
    const long = await dana.post(url).send({ body: 'x'.repeat(MESSAGE_MAX_CHARS + 1) });
    expect(long.status).toBe(400);
    expect(long.body.error.fields.body).toMatch(/at most 2,000/);
    const gif = Buffer.from('R0lGODlhAQABAIAAAAAAAP///yH5BAEAAAAALAAAAAABAAEAAAIBRAA7', 'base64');
    const bad = await dana.post(url).field('body', 'see this').attach('file', gif, { filename: 'a.png', contentType: 'image/png' });
    expect(bad.status).toBe(415);
    expect(count('order_messages')).toBe(before);
  });

  test(`when one account posts more than ${RATE} messages in a minute, then the next is refused with 429 and not stored`, async () => {
    const url = `/api/orders/${order.id}/messages`;
    let refused: request.Response | null = null;
    let posted = 0;
    for (let i = 0; i <= RATE && !refused; i++) {
      const before = count('order_messages');
      const res = await admin.post(url).send({ body: `Note ${i}` });
      if (res.status === 429) {
        refused = res;
        expect(count('order_messages')).toBe(before);
      } else {
        expect(res.status).toBe(201);
        posted++;
      }
    }
    expect(refused?.body.error.code).toBe('rate_limited');
    expect(posted).toBe(RATE);
  });
});

describe('reviews', () => {
  test('when the demo is seeded, then the listing and shop pages show average and count of visible reviews, newest first', async () => {
    const fox = one<{ slug: string }>("select slug from listings where live_title = 'Autumn fox tote with a name'").slug;
    const page = await request(t.app).get(`/api/reviews/listings/${fox}`);
    expect(page.status).toBe(200);
    // Noor 5, Rosa 4 → 4.5 over 2
    expect(page.body.summary).toEqual({ count: 2, average: 4.5 });
    expect(page.body.items.map((r: { rating: number }) => r.rating)).toEqual([4, 5]);
    expect(page.body.items[1].reply.body).toBe('Thank you! Happy reading, Noor.');
    expect(page.body.items[0].authorName).toBe('Dana W.');
    expect((await request(t.app).get(`/api/listings/${fox}`)).body.rating).toEqual({ count: 2, average: 4.5 });
    const shop = await request(t.app).get('/api/reviews/shops/fern-and-fable-goods?limit=2');
    // 5, 4, 4 → 13 / 3 = 4.33…, shown to one decimal: 4.3; two a page
    expect(shop.body).toMatchObject({ total: 3, page: 1, limit: 2, summary: { count: 3, average: 4.3 } });
    expect(shop.body.items).toHaveLength(2);
    expect((await request(t.app).get('/api/shops/fern-and-fable-goods')).body.rating).toEqual({ count: 3, average: 4.3 });
    expect((await request(t.app).get('/api/reviews/listings/no-such-listing')).status).toBe(404);
  });

  test(`when a line has been shipped less than ${REVIEW_AFTER_SHIPPED_DAYS} days, then it cannot be reviewed; from then on its shopper alone reviews it once, with a photo`, async () => {
    const url = `/api/orders/${shipped.orderId}/lines/${shipped.otto}/review`;
    const from = shipped.shippedAt + REVIEW_AFTER_SHIPPED_DAYS * DAY;
    const saved = clock;
    try {
      clock = from - 1;
      const early = await dana.post(url).send({ rating: 5, body: 'Early' });
      expect(early.status).toBe(409);
      expect(early.body.error.code).toBe('too_soon');
      expect((await dana.get(`/api/orders/${shipped.orderId}/reviews`)).body.lines.find((l: { lineId: string }) => l.lineId === shipped.otto)).toMatchObject({
        canReview: false,
        reviewableFrom: from,
      });
      clock = from;
      expect((await fern.post(url).send({ rating: 5, body: 'My own shop' })).status).toBe(403);
      expect((await sam.post(url).send({ rating: 1, body: 'Never bought it' })).status).toBe(404);
      expect((await dana.post(url).send({ rating: 6, body: 'Too many stars' })).status).toBe(400);
      const ok = await dana
        .post(url)
        .field('rating', '3')
        .field('body', 'The bow came loose after a week.')
        .attach('file', await png(), { filename: 'bag.png', contentType: 'image/png' });
      expect(ok.status).toBe(201);
      expect(ok.body.review.photo.url).toMatch(/^\/uploads\/[a-f0-9]{32}\.webp$/);
      expect((await request(t.app).get(ok.body.review.photo.url)).status).toBe(200);
      expect((await dana.post(url).send({ rating: 4, body: 'Again' })).status).toBe(409);
      const pumpkin = one<{ slug: string }>("select slug from listings where live_title = 'Harvest pumpkin drawstring bag with ribbon bow'").slug;
      expect((await request(t.app).get(`/api/reviews/listings/${pumpkin}`)).body.summary).toEqual({ count: 1, average: 3 });
    } finally {
      clock = saved;
    }
    // a line not shipped yet
    const waiting = one<{ id: string }>('select id from order_lines where order_id = ? limit 1', order.id);
    expect((await dana.post(`/api/orders/${order.id}/lines/${waiting.id}/review`).send({ rating: 5, body: 'Not yet' })).body.error.code).toBe('not_shipped');
  });

  test('when the shop replies, then only its own shop may, and only once', async () => {
    const ezra = one<{ id: string }>("select id from reviews where body like 'Lovely colours%'").id;
    expect((await comet.post(`/api/reviews/${ezra}/reply`).send({ reply: 'Not my shop' })).status).toBe(404);
    expect((await dana.post(`/api/reviews/${ezra}/reply`).send({ reply: 'Me' })).status).toBe(403);
    const ok = await fern.post(`/api/reviews/${ezra}/reply`).send({ reply: 'Thank you, we will place it higher next time.' });
    expect(ok.status).toBe(200);
    expect(ok.body.review.reply.body).toBe('Thank you, we will place it higher next time.');
    expect((await fern.post(`/api/reviews/${ezra}/reply`).send({ reply: 'Second thoughts' })).status).toBe(409);
    expect(one<{ reply: string }>('select reply from reviews where id = ?', ezra).reply).toBe('Thank you, we will place it higher next time.');
  });

  test('when an admin hides a review with a reason, then it leaves the pages and the average, and the audit log records who and why', async () => {
    const rosa = one<{ id: string; listing_id: string }>("select id, listing_id from reviews where body like 'Good size%'");
    const fox = one<{ slug: string }>('select slug from listings where id = ?', rosa.listing_id).slug;
    expect((await fern.post(`/api/reviews/${rosa.id}/hide`).send({ reason: 'I dislike it' })).status).toBe(403);
    expect((await admin.post(`/api/reviews/${rosa.id}/hide`).send({ reason: '' })).status).toBe(400);
    const hidden = await admin.post(`/api/reviews/${rosa.id}/hide`).send({ reason: 'Names a child’s school' });
    expect(hidden.status).toBe(200);
    const page = await request(t.app).get(`/api/reviews/listings/${fox}`);
    expect(page.body.summary).toEqual({ count: 1, average: 5 });
    expect(page.body.items.map((r: { id: string }) => r.id)).not.toContain(rosa.id);
    const audit = await admin.get('/api/moderation/audit');
    expect(audit.body.items[0]).toMatchObject({ action: 'review.hide', subject: { type: 'review', id: rosa.id }, reason: 'Names a child’s school', actor: { email: 'admin@namesake.test' } });
    expect((await admin.post(`/api/reviews/${rosa.id}/hide`).send({ reason: 'again' })).status).toBe(409);
  });

  test('when someone other than its shopper, shop or an admin asks for an order’s reviews, then it is 404', async () => {
    const url = `/api/orders/${shipped.orderId}/reviews`;
    expect((await sam.get(url)).status).toBe(404);
    expect((await comet.get(url)).status).toBe(404);
    expect((await request(t.app).get(url)).status).toBe(401);
    for (const a of [dana, fern, admin]) expect((await a.get(url)).status).toBe(200);
  });
});
