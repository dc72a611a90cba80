import request, { type Agent } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../factories/app.ts';
import { at } from '../support/at.ts';
import { createListing, decide, listingBody, liveListing, makeMaterial } from './listings.fixtures.ts';

let t: TestApp;
let a: Agent; // seller A
let b: Agent; // seller B
let admin: Agent;
beforeAll(async () => {
  t = await makeTestApp();
  const sa = await t.makeSeller({ name: 'Shop A' });
  const sb = await t.makeSeller({ name: 'Shop B' });
  const ad = await t.makeUser('admin');
  [a, b, admin] = await Promise.all([t.signIn(sa.email), t.signIn(sb.email), t.signIn(ad.email)]);
});
afterAll(async () => t.close());

describe('seller listings: ownership', () => {
  it("when seller B uses seller A's listing id on every route, then 404 each time and A's listing is unchanged", async () => {
    const l = await createListing(a);
    const body = await listingBody(b); // valid for B: only the id is foreign
    const calls = [
      b.get(`/api/seller/listings/${l.id}`),
      b.put(`/api/seller/listings/${l.id}`).send(body),
      b.post(`/api/seller/listings/${l.id}/submit`).send({}),
      b.post(`/api/seller/listings/${l.id}/pause`).send({}),
      b.post(`/api/seller/listings/${l.id}/unpause`).send({}),
      b.delete(`/api/seller/listings/${l.id}`),
    ];
    for (const res of await Promise.all(calls)) expect(res.status).toBe(404);
    const mine = await a.get(`/api/seller/listings/${l.id}`);
    expect(mine.status).toBe(200);
    expect(mine.body.listing.state).toBe('draft');
    expect(mine.body.listing.draft.title).toBe('Star name tote');
    expect((await b.get('/api/seller/listings')).body.items.map((x: { id: string }) => x.id)).not.toContain(l.id);
  });

  it("when seller B names seller A's material or motif in a listing, then 400 naming the field", async () => {
    const aBody = await listingBody(a);
    const res = await b.post('/api/seller/listings').send(aBody);
    expect(res.status).toBe(400);
    expect(res.body.error.fields['personalisation.textFields.0.colourChoices.0']).toMatch(/your shop/);
    expect(res.body.error.fields['personalisation.motifChoices.0.motifId']).toMatch(/your shop/);
  });

  it('when a guest or a shopper calls the seller API, then 401 / 403', async () => {
    expect((await request(t.app).get('/api/seller/listings')).status).toBe(401);
    const shopper = await t.signIn((await t.makeUser('shopper')).email);
    expect((await shopper.get('/api/seller/listings')).status).toBe(403);
  });
});

describe('listing editor input', () => {
  it("when the blank gives only its kind, then the default print area is filled in (kids' tee 20 × 20 cm, 5 cm below the collar; from memory)", async () => {
    const l = await createListing(a, { blank: { kind: 'kids_tee' } });
    const got = (await a.get(`/api/seller/listings/${l.id}`)).body.listing.draft.blank;
    expect(got).toMatchObject({ kind: 'kids_tee', widthMm: 200, heightMm: 200, topOffsetMm: 50 });
  });

  it('when the input is bad, then 400 with a message per field and nothing is stored', async () => {
    const before = (await a.get('/api/seller/listings')).body.total;
    const body = await listingBody(a, { title: '', basePriceMinor: -5, photoIds: Array.from({ length: 9 }, (_, i) => `p${i}`), occasions: ['halloween' as never] });
    const res = await a.post('/api/seller/listings').send(body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['title', 'basePriceMinor', 'photoIds', 'occasions.0']));
    expect((await a.get('/api/seller/listings')).body.total).toBe(before);
  });

  it("when a text field's default font is not one of its fonts, then 400 on defaultFontId", async () => {
    const body = await listingBody(a);
    at(body.personalisation.textFields!, 0).defaultFontId = 'bangers';
    const res = await a.post('/api/seller/listings').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.fields['personalisation.textFields.0.defaultFontId']).toBeTruthy();
  });

  it('when a motif layer id is not in the motif, then 400 on that layer', async () => {
    const body = await listingBody(a);
    at(at(body.personalisation.motifChoices!, 0).layers, 1).layerId = 'moon';
    const res = await a.post('/api/seller/listings').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.fields['personalisation.motifChoices.0.layers.1.layerId']).toMatch(/no such layer/);
  });

  it('when a material is archived, then a listing cannot use it', async () => {
    const m = await makeMaterial(a, { colourName: 'Old stock' });
    await a.patch(`/api/materials/${m.id}`).send({ archived: true });
    const body = await listingBody(a);
    at(body.personalisation.textFields!, 0).colourChoices = [m.id];
    const res = await a.post('/api/seller/listings').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.fields['personalisation.textFields.0.colourChoices.0']).toMatch(/archived/);
  });
});

describe('listing states', () => {
  it('draft → in_review → (approved) live → paused → live; a live listing cannot be deleted', async () => {
    const l = await createListing(a);
    expect(l.state).toBe('draft');
    expect((await a.post(`/api/seller/listings/${l.id}/pause`).send({})).status).toBe(409);
    const sub = await a.post(`/api/seller/listings/${l.id}/submit`).send({});
    expect(sub.body.listing.state).toBe('in_review');
    await decide(admin, l.id);
    expect((await a.get(`/api/seller/listings/${l.id}`)).body.listing.state).toBe('live');
    expect((await a.post(`/api/seller/listings/${l.id}/pause`).send({})).body.listing.state).toBe('paused');
    expect((await request(t.app).get(`/api/listings/${l.slug}`)).status).toBe(404);
    expect((await a.post(`/api/seller/listings/${l.id}/unpause`).send({})).body.listing.state).toBe('live');
    expect((await request(t.app).get(`/api/listings/${l.slug}`)).status).toBe(200);
    expect((await a.delete(`/api/seller/listings/${l.id}`)).status).toBe(409);
  });

  it('when a draft is deleted, then it is gone', async () => {
    const l = await createListing(a);
    expect((await a.delete(`/api/seller/listings/${l.id}`)).status).toBe(200);
    expect((await a.get(`/api/seller/listings/${l.id}`)).status).toBe(404);
  });

  it('when a live listing is edited, then the approved copy stays on sale and the edit waits for review', async () => {
    const l = await liveListing(t, a, admin, { title: 'Original title here' });
    const body = await listingBody(a, { title: 'Edited title here', basePriceMinor: 9900 });
    const put = await a.put(`/api/seller/listings/${l.id}`).send(body);
    expect(put.status).toBe(200);
    expect(put.body.listing).toMatchObject({ state: 'live', pendingReview: true });
    const pub = await request(t.app).get(`/api/listings/${l.slug}`);
    expect(pub.body.content.title).toBe('Original title here');
    expect(pub.body.priceMinor).toBe(2000);
    const queued = await admin.get(`/api/moderation/listings/${l.id}`);
    expect(queued.body.listing).toMatchObject({ kind: 'edit', title: 'Edited title here' });
    await decide(admin, l.id);
    const after = await request(t.app).get(`/api/listings/${l.slug}`);
    expect(after.body.content.title).toBe('Edited title here');
    expect(after.body.priceMinor).toBe(9900);
  });

  it('when a rejected listing is edited, then it is a draft again and can be resubmitted', async () => {
    const l = await createListing(a);
    await a.post(`/api/seller/listings/${l.id}/submit`).send({});
    await decide(admin, l.id, 'Photo missing.');
    const got = (await a.get(`/api/seller/listings/${l.id}`)).body.listing;
    expect(got).toMatchObject({ state: 'rejected', rejectionReason: 'Photo missing.' });
    const put = await a.put(`/api/seller/listings/${l.id}`).send(await listingBody(a));
    expect(put.body.listing).toMatchObject({ state: 'draft', rejectionReason: null });
    expect((await a.post(`/api/seller/listings/${l.id}/submit`).send({})).body.listing.state).toBe('in_review');
  });
});
