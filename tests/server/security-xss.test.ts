// XSS, the server half: script payloads (OWASP XSS Filter Evasion Cheat Sheet) typed into every
// text one user writes and another reads — names, shop name/description/return policy, listing
// title/description (plain and Markdown), personalisation text, rejection reasons, change-request
// messages — come back escaped: every HTML field of the API (`…Html`, rendered Markdown) and every
// e-mail's HTML holds no live tag, handler or javascript: URL. JSON string fields are data (the
// client renders them as text); the browser half (journeys in a real browser) is in e2e/.

import request, { type Agent } from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { messageMail } from '../../server/features/messages/message-mails.ts';
import { confirmationMail, newOrderMail, refundMail } from '../../server/features/orders/order-mails.ts';
import { changeRequestMail, shippedMail } from '../../server/features/workroom/workroom-mails.ts';
import type { LineSnapshot } from '../../shared/schemas/cart.ts';
import { eventually, makeTestApp, type TestApp } from '../factories/app.ts';
import { DEMO_PASSWORD, unsafeHtml, XSS_PAYLOADS } from '../factories/sweep.ts';
import { createListing, decide } from './listings.fixtures.ts';

let t: TestApp;
let fern: Agent;
let dana: Agent;
let admin: Agent;
beforeAll(async () => {
  t = await makeTestApp({ seed: true });
  const signIn = (n: string) => t.signIn(`${n}@namesake.test`, DEMO_PASSWORD);
  [fern, dana, admin] = await Promise.all([signIn('fern'), signIn('dana'), signIn('admin')]);
}, 60_000);
afterAll(async () => t?.close());

const problems: string[] = [];
let tried = 0;
const fields = new Set<string>();
const typed = (...names: string[]) => {
  tried += names.length;
  for (const n of names) fields.add(n);
};
/** every `…Html` string anywhere in a JSON answer */
function htmlFields(v: unknown, at = '$'): Array<[string, string]> {
  if (Array.isArray(v)) return v.flatMap((x, i) => htmlFields(x, `${at}[${i}]`));
  if (v && typeof v === 'object') return Object.entries(v).flatMap(([k, x]) => (typeof x === 'string' && /html$/i.test(k) ? [[`${at}.${k}`, x] as [string, string]] : htmlFields(x, `${at}.${k}`)));
  return [];
}
function checkJson(label: string, body: unknown) {
  for (const [where, html] of htmlFields(body)) {
    const bad = unsafeHtml(html);
    if (bad) problems.push(`${label} ${where}: ${bad} in ${html.slice(0, 100)}`);
  }
}
function checkMail(label: string, html: string | undefined) {
  const bad = unsafeHtml(html ?? '');
  if (bad) problems.push(`${label}: ${bad}`);
}
const newMail = async (to: string, since: Set<string>, subject: RegExp) => eventually(async () => (await t.mailTo(to)).find((m) => !since.has(m.id) && subject.test(m.subject)));
const seen = async (to: string) => new Set((await t.mailTo(to)).map((m) => m.id));

describe('XSS payloads in user-typed text (server half)', () => {
  test('when payloads are typed by sellers, shoppers and moderators, then every HTML answer and e-mail another user gets has them escaped', async () => {
    const slug = (await fern.get('/api/shop')).body.shop.slug as string;
    const waiting = ((await fern.get('/api/workroom/lines?state=awaiting_proof&limit=100')).body.items as { id: string }[]).map((l) => l.id);

    const who0 = { email: 'x@namesake.test', name: 'Pat' };
    for (const [i, p] of XSS_PAYLOADS.entries()) {
      // shop name, description and return policy → the public shop page and listing page
      const shop = await fern.patch('/api/shop').send({ name: `Fern ${p}`.slice(0, 60), description: `About us ${p}`, returnPolicy: `Returns ${p}` });
      expect(shop.status, JSON.stringify(shop.body)).toBe(200);
      // a live shop's new name and description go public once a moderator approves them
      const change = (await admin.get('/api/moderation/queue/shop-changes')).body.items.find((c: { slug: string }) => c.slug === slug);
      await admin.post(`/api/moderation/shops/${change.id}/approve-change`).send({ revision: change.revision }).expect(200);
      typed('shop name', 'shop description', 'return policy');
      const page = await request(t.app).get(`/api/shops/${slug}`);
      expect(page.status).toBe(200);
      expect(page.body.shop.description).toContain(p); // kept as data, shown as text by the client
      checkJson('shop page', page.body);

      // the shopper's name → the mails the shop's actions send them
      await dana
        .post('/api/auth/update-user')
        .set('Origin', 'http://localhost:3000')
        .send({ name: `Dana ${p}` })
        .expect(200);
      typed('user name');

      // listing title + Markdown description, rejected with a reason → the seller's mail
      const format = i % 2 ? 'markdown' : 'plain';
      const rejected = await createListing(fern, { title: `Tote ${p}`, description: `Soft **cotton** ${p}`, descriptionFormat: format } as never);
      await fern.post(`/api/seller/listings/${rejected.id}/submit`).send({}).expect(200);
      let before = await seen('fern@namesake.test');
      expect((await decide(admin, rejected.id, `Please fix ${p}`)).status).toBe(200);
      typed('listing title', `listing description (${format})`, 'rejection reason');
      checkMail(`rejection mail (payload ${i})`, (await newMail('fern@namesake.test', before, /./)).html);
      const draftView = await fern.get(`/api/listings/${rejected.slug}?version=draft`);
      checkJson('draft listing page', draftView.body);

      // the same text, approved → the public listing page other shoppers read, and the approval mail
      const approved = await createListing(fern, {
        title: `Mug ${p}`,
        description: `# Hello\n\n${p}\n\n[site](javascript:alert(1)) <b onmouseover=alert(1)>x</b>`,
        descriptionFormat: 'markdown',
      } as never);
      await fern.post(`/api/seller/listings/${approved.id}/submit`).send({}).expect(200);
      before = await seen('fern@namesake.test');
      expect((await decide(admin, approved.id)).status).toBe(200);
      typed('listing title', 'listing description (markdown)');
      checkMail(`approval mail (payload ${i})`, (await newMail('fern@namesake.test', before, /./)).html);
      const live = await request(t.app).get(`/api/listings/${approved.slug}`);
      expect(live.status).toBe(200);
      expect(live.body.descriptionHtml).toBeTruthy();
      checkJson('listing page', live.body);
      checkJson('search', (await request(t.app).get('/api/listings')).body);

      // a change request on one of Dana's lines → her mail (her name, the shop name, the message)
      if (waiting[i]) {
        before = await seen('dana@namesake.test');
        const r = await fern.post(`/api/workroom/lines/${waiting[i]}/request-change`).send({ message: `Check this ${p}` });
        expect(r.status, JSON.stringify(r.body)).toBe(200);
        typed('change-request message');
        checkMail(`change-request mail (payload ${i})`, (await newMail('dana@namesake.test', before, /./)).html);
        // what Dana is shown for editing, and the seller's proof
        checkJson('personalisation edit', (await dana.get(`/api/order-lines/${waiting[i]}/personalisation`)).body);
        checkJson('proof', (await fern.get(`/api/workroom/lines/${waiting[i]}/proof`)).body);
      }

      // an order message each way → the other party's mail, and the thread both of them read
      const threadOrder = (await dana.get('/api/orders')).body.items[0].id as string;
      before = await seen('fern@namesake.test');
      expect((await dana.post(`/api/orders/${threadOrder}/messages`).send({ body: `Question ${p}` })).status).toBe(201);
      checkMail(`message mail to the shop (payload ${i})`, (await newMail('fern@namesake.test', before, /New message/)).html);
      before = await seen('dana@namesake.test');
      expect((await fern.post(`/api/orders/${threadOrder}/messages`).send({ body: `Answer ${p}` })).status).toBe(201);
      checkMail(`message mail to the shopper (payload ${i})`, (await newMail('dana@namesake.test', before, /New message/)).html);
      checkJson('order thread', (await fern.get(`/api/orders/${threadOrder}/messages`)).body);
      checkMail('message mail (template)', messageMail(who0, { fromName: `Shop ${p}`, orderNumber: 'NS-1', body: p, hasPhoto: true, link: 'http://localhost:3000/orders/o1#messages' }).html);
      typed('order message');

      // the order, shipping and refund mails, built by the same functions the checkout webhook,
      // the workroom and refunds call: payload in names, shop name, titles and personalisation text
      const snapshot = { summary: [{ label: `Name ${p}`, value: p }] } as unknown as LineSnapshot;
      const order = {
        number: 'NS-1001',
        shopName: `Shop ${p}`,
        currency: 'USD',
        subtotalMinor: 2400,
        shippingMinor: 450,
        totalMinor: 2850,
        lines: [{ title: `Tote ${p}`, quantity: 1, totalMinor: 2400, snapshot }],
      };
      const who = { email: 'x@namesake.test', name: `Pat ${p}` };
      checkMail('confirmation mail', confirmationMail(who, [order], 'http://localhost:3000').html);
      checkMail('new-order mail', newOrderMail(who, { ...order, feeMinor: 228, buyerName: `Buyer ${p}` }, 'http://localhost:3000').html);
      checkMail(
        'refund mail',
        refundMail(who, { number: 'NS-1001', shopName: `Shop ${p}`, currency: 'USD', amountMinor: 100, what: `Line ${p}`, reason: `Because ${p}`, orderId: 'o1' }, 'http://localhost:3000').html,
      );
      checkMail(
        'change-request mail (template)',
        changeRequestMail(who, { shopName: `Shop ${p}`, orderNumber: 'NS-1', orderId: 'o1', lineTitle: `Tote ${p}`, text: p, message: `Msg ${p}` }, 'http://localhost:3000').html,
      );
      checkMail(
        'shipped mail',
        shippedMail(who, { shopName: `Shop ${p}`, orderNumber: 'NS-1', orderId: 'o1', carrier: `UPS ${p}`, trackingNumber: p, items: [`Tote ${p}`] }, 'http://localhost:3000').html,
      );
      typed('personalisation label', 'personalisation text', 'buyer name', 'order line title', 'refund reason', 'carrier', 'tracking number');
    }

    // a review and the shop's reply → the listing's, the shop's and the order's review answers
    const all = XSS_PAYLOADS.join(' ');
    const shippedOrder = (t.sqlite.prepare('select id from orders where shipped_at is not null limit 1').get() as { id: string }).id;
    const open = ((await dana.get(`/api/orders/${shippedOrder}/reviews`)).body.lines as { lineId: string; canReview: boolean }[]).find((l) => l.canReview);
    expect(open, 'the demo leaves one shipped line to review').toBeTruthy();
    const review = await dana.post(`/api/orders/${shippedOrder}/lines/${open!.lineId}/review`).send({ rating: 4, body: `Lovely ${all}` });
    expect(review.status).toBe(201);
    expect((await fern.post(`/api/reviews/${review.body.review.id}/reply`).send({ reply: `Thanks ${all}` })).status).toBe(200);
    typed('review text', 'review reply');
    checkJson('listing reviews', (await request(t.app).get(`/api/reviews/listings/${review.body.review.listingSlug}`)).body);
    checkJson('shop reviews', (await request(t.app).get(`/api/reviews/shops/${slug}`)).body);
    checkJson('order reviews', (await fern.get(`/api/orders/${shippedOrder}/reviews`)).body);

    // the seller's workroom shows the shoppers' names and personalisation text as data only
    checkJson('workroom lines', (await fern.get('/api/workroom/lines')).body);
    // a password-reset mail greets the (payload) name
    const before = await seen('dana@namesake.test');
    await request(t.app).post('/api/auth/request-password-reset').send({ email: 'dana@namesake.test', redirectTo: '/reset-password' }).expect(200);
    checkMail('reset mail', (await newMail('dana@namesake.test', before, /password/i)).html);

    expect(problems).toEqual([]);
    console.log(`xss sweep: ${XSS_PAYLOADS.length} payloads × ${fields.size} user-typed fields → ${tried} payload×field pairs tried; every HTML answer and e-mail escaped them`);
  }, 180_000);
});
