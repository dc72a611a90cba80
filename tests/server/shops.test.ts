import sharp from 'sharp';
import request, { type Agent } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../factories/app.ts';
import { createListing, liveListing } from './listings.fixtures.ts';

let t: TestApp;
let a: Agent;
let b: Agent;
let admin: Agent;
let shopA: { shopId: string };
beforeAll(async () => {
  t = await makeTestApp();
  const sa = await t.makeSeller({ name: 'Alder Goods' });
  shopA = sa;
  [a, b, admin] = await Promise.all([t.signIn(sa.email), t.signIn((await t.makeSeller({ name: 'Birch Goods' })).email), t.signIn((await t.makeUser('admin')).email)]);
});
afterAll(async () => t.close());

describe('shop settings', () => {
  it('when the seller reads and changes their shop, then only their own shop changes', async () => {
    const before = (await b.get('/api/shop')).body.shop;
    const res = await a.patch('/api/shop').send({ description: 'Bags for <b>Mira</b>', processingDays: 5, shippingMinor: 450, returnPolicy: 'Tell us within 14 days.', slug: 'alder-goods' });
    expect(res.status).toBe(200);
    // a live shop's description waits for moderation (tests/server/moderation.test.ts); the rest applies at once
    expect(res.body.shop).toMatchObject({ id: shopA.shopId, processingDays: 5, shippingMinor: 450, slug: 'alder-goods', description: '', pendingChange: { description: 'Bags for <b>Mira</b>' } });
    expect((await b.get('/api/shop')).body.shop).toEqual(before);
  });

  it('when another shop already has the slug, then 409 on slug', async () => {
    const res = await b.patch('/api/shop').send({ slug: 'alder-goods' });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.slug).toBeTruthy();
  });

  it('when the input is bad, then 400 with field messages', async () => {
    const res = await a.patch('/api/shop').send({ processingDays: 0, shippingMinor: 1.5, slug: '-Bad Slug-' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['processingDays', 'shippingMinor', 'slug']);
  });

  it("when seller B sets seller A's upload as a logo, then 400 (not theirs)", async () => {
    const img = await sharp({ create: { width: 200, height: 200, channels: 3, background: '#fbf7f0' } })
      .png()
      .toBuffer();
    const up = (await a.post('/api/uploads').field('kind', 'logo').attach('file', img, { filename: 'l.png', contentType: 'image/png' })).body.upload;
    const res = await b.patch('/api/shop').send({ logoId: up.id });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.logoId).toBeTruthy();
    const mine = await a.patch('/api/shop').send({ logoId: up.id });
    expect(mine.body.shop.logoUrl).toBe(up.thumbnailUrl);
  });

  it("when a logo is uploaded to /api/shop/logo, then it becomes the shop's logo and is served", async () => {
    const img = await sharp({ create: { width: 300, height: 300, channels: 4, background: '#2f7d6d' } })
      .png()
      .toBuffer();
    const res = await a.post('/api/shop/logo').attach('file', img, { filename: 'logo.png', contentType: 'image/png' });
    expect(res.status).toBe(200);
    expect(res.body.shop.logoUrl).toMatch(/^\/uploads\/[a-f0-9]{32}-t\.webp$/);
    expect((await request(t.app).get(res.body.shop.logoUrl)).status).toBe(200);
  });

  it('when a shopper or guest asks for /api/shop, then 403 / 401', async () => {
    expect((await request(t.app).get('/api/shop')).status).toBe(401);
    expect((await (await t.signIn((await t.makeUser('shopper')).email)).get('/api/shop')).status).toBe(403);
  });
});

describe('public shop page', () => {
  it('when a live shop is opened, then it shows its live listings only', async () => {
    const live = await liveListing(t, a, admin, { title: 'Alder live tote' });
    const draft = await createListing(a, { title: 'Alder draft tote' });
    const res = await request(t.app).get('/api/shops/alder-goods');
    expect(res.status).toBe(200);
    expect(res.body.shop).toMatchObject({ name: 'Alder Goods', processingDays: 5 });
    expect(res.body.shop.ownerId).toBeUndefined();
    const ids = res.body.listings.map((l: { id: string }) => l.id);
    expect(ids).toContain(live.id);
    expect(ids).not.toContain(draft.id);
  });

  it('when the shop is in review or suspended, then 404', async () => {
    const s = await t.makeSeller({ state: 'in_review' });
    const slug = (await (await t.signIn(s.email)).get('/api/shop')).body.shop.slug;
    expect((await request(t.app).get(`/api/shops/${slug}`)).status).toBe(404);
    await admin.post(`/api/moderation/shops/${shopA.shopId}/suspend`).send({ reason: 'Test suspension.' });
    expect((await request(t.app).get('/api/shops/alder-goods')).status).toBe(404);
    await admin.post(`/api/moderation/shops/${shopA.shopId}/restore`).send({});
    expect((await request(t.app).get('/api/shops/alder-goods')).status).toBe(200);
  });
});
