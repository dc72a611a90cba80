import request, { type Agent } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eventually, makeTestApp, type TestApp } from '../factories/app.ts';
import { createListing, decide, liveListing, shownRevision } from './listings.fixtures.ts';

let t: TestApp;
let seller: Awaited<ReturnType<TestApp['makeSeller']>>;
let a: Agent;
let admin: Agent;
let adminUser: { id: string; email: string };
beforeAll(async () => {
  t = await makeTestApp();
  seller = await t.makeSeller({ name: 'Comet Corner' });
  adminUser = await t.makeUser('admin');
  [a, admin] = await Promise.all([t.signIn(seller.email), t.signIn(adminUser.email)]);
});
afterAll(async () => t.close());

const search = (q: string) => request(t.app).get('/api/listings').query({ q });

describe('who may use the desk', () => {
  it('when a shopper or a seller calls any moderation route, then 403; a guest 401', async () => {
    const shopper = await t.signIn((await t.makeUser('shopper')).email);
    const l = await createListing(a);
    for (const agent of [shopper, a]) {
      expect((await agent.get('/api/moderation/queue/listings')).status).toBe(403);
      expect((await agent.get('/api/moderation/queue/shops')).status).toBe(403);
      expect((await agent.get(`/api/moderation/queue/listings/${l.id}`)).status).toBe(403);
      expect((await agent.get('/api/moderation/audit')).status).toBe(403);
      expect((await agent.post(`/api/moderation/listings/${l.id}/approve`).send({})).status).toBe(403);
      expect((await agent.post(`/api/moderation/listings/${l.id}/reject`).send({ reason: 'nope nope' })).status).toBe(403);
      expect((await agent.post(`/api/moderation/shops/${seller.shopId}/suspend`).send({ reason: 'nope nope' })).status).toBe(403);
      expect((await agent.post(`/api/moderation/shops/${seller.shopId}/approve`).send({})).status).toBe(403);
    }
    expect((await request(t.app).get('/api/moderation/queue/listings')).status).toBe(401);
    expect((await a.get(`/api/seller/listings/${l.id}`)).body.listing.state).toBe('draft');
  });
});

describe('listing review', () => {
  it('when a listing is submitted, then it is in the queue and invisible to shoppers and search until approved', async () => {
    const l = await createListing(a, { title: 'Quokka picnic tote' });
    expect((await admin.get('/api/moderation/queue/listings?limit=100')).body.items.map((x: { id: string }) => x.id)).not.toContain(l.id); // a draft is not in review
    expect((await admin.get(`/api/moderation/queue/listings/${l.id}`)).status).toBe(404);
    await a.post(`/api/seller/listings/${l.id}/submit`).send({});
    const queued = (await admin.get('/api/moderation/queue/listings?limit=100')).body.items.find((x: { id: string }) => x.id === l.id);
    expect(queued).toMatchObject({ kind: 'new', state: 'in_review', shop: { name: 'Comet Corner' } });
    // the review page opens it by id with the same content
    expect((await admin.get(`/api/moderation/queue/listings/${l.id}`)).body.listing).toEqual(queued);
    // the admin sees it rendered as a shopper would; shoppers get nothing
    expect((await admin.get(queued.previewUrl)).body.content.title).toBe('Quokka picnic tote');
    expect((await request(t.app).get(queued.previewUrl)).status).toBe(404);
    expect((await request(t.app).get(`/api/listings/${l.slug}`)).status).toBe(404);
    expect((await search('quokka')).body.total).toBe(0);

    const ok = await decide(admin, l.id);
    expect(ok.body.listing.state).toBe('live');
    expect((await request(t.app).get(`/api/listings/${l.slug}`)).status).toBe(200);
    expect((await search('quokka')).body.items.map((x: { id: string }) => x.id)).toEqual([l.id]);
    const mail = await eventually(async () => (await t.mailTo(seller.email)).find((m) => /Approved/.test(m.subject)));
    expect(mail.text).toContain('Quokka picnic tote');
  });

  it('when a listing is rejected with a reason, then the seller gets the reason by e-mail (HTML escaped) and it stays hidden', async () => {
    const l = await createListing(a, { title: 'Wombat school pouch' });
    await a.post(`/api/seller/listings/${l.id}/submit`).send({});
    const reason = 'The photo shows another <b>brand</b>; please use your own photo.';
    const res = await decide(admin, l.id, reason);
    expect(res.body.listing).toMatchObject({ state: 'rejected', rejectionReason: reason });
    const mail = await eventually(async () => (await t.mailTo(seller.email)).find((m) => /Wombat/.test(m.subject)));
    expect(mail.text).toContain(reason);
    expect(mail.html).toContain('&#60;b&#62;brand&#60;/b&#62;');
    expect(mail.html).not.toContain('<b>brand</b>');
    expect((await search('wombat')).body.total).toBe(0);
  });

  it('when a reject has no reason, then 400 on reason; approving something not in review is 409', async () => {
    const l = await createListing(a);
    await a.post(`/api/seller/listings/${l.id}/submit`).send({});
    const res = await admin.post(`/api/moderation/listings/${l.id}/reject`).send({ revision: await shownRevision(admin, l.id), reason: ' ' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.reason).toBeTruthy();
    const draft = await createListing(a);
    expect((await admin.post(`/api/moderation/listings/${draft.id}/approve`).send({ revision: 1 })).status).toBe(409);
    expect((await admin.post('/api/moderation/listings/no-such-id/approve').send({ revision: 1 })).status).toBe(404);
  });

  it('when an edit to a live listing is rejected, then the approved copy stays on sale', async () => {
    const l = await liveListing(t, a, admin, { title: 'Platypus harvest tote' });
    const body = (await a.get(`/api/seller/listings/${l.id}`)).body.listing.draft;
    await a.put(`/api/seller/listings/${l.id}`).send({ ...body, title: 'Platypus tote with a typo' });
    await decide(admin, l.id, 'Title has a typo.');
    const got = (await a.get(`/api/seller/listings/${l.id}`)).body.listing;
    expect(got).toMatchObject({ state: 'live', pendingReview: false, rejectionReason: 'Title has a typo.' });
    expect((await request(t.app).get(`/api/listings/${l.slug}`)).body.content.title).toBe('Platypus harvest tote');
  });
});

describe('shops', () => {
  it('when a shop is suspended, then its listings vanish from the catalogue and search at once; restore brings them back', async () => {
    const other = await t.makeSeller({ name: 'Narwhal Prints' });
    const o = await t.signIn(other.email);
    const l = await liveListing(t, o, admin, { title: 'Narwhal birthday tee' });
    expect((await search('narwhal')).body.total).toBe(1);
    const s = await admin.post(`/api/moderation/shops/${other.shopId}/suspend`).send({ reason: 'Copied artwork reported.' });
    expect(s.body.shop.state).toBe('suspended');
    expect((await search('narwhal')).body.total).toBe(0);
    expect((await request(t.app).get('/api/listings')).body.items.map((x: { id: string }) => x.id)).not.toContain(l.id);
    expect((await request(t.app).get(`/api/listings/${l.slug}`)).status).toBe(404);
    const mail = await eventually(async () => (await t.mailTo(other.email)).find((m) => /suspended/.test(m.subject)));
    expect(mail.text).toContain('Copied artwork reported.');
    await admin.post(`/api/moderation/shops/${other.shopId}/restore`).send({});
    expect((await search('narwhal')).body.total).toBe(1);
  });

  it('when a new shop is in review, then it is in the queue; approval makes it live, rejection needs a reason', async () => {
    const s1 = await t.makeSeller({ name: 'Kelp & Co', state: 'in_review' });
    const s2 = await t.makeSeller({ name: 'Gull Goods', state: 'in_review' });
    const q = (await admin.get('/api/moderation/queue/shops?limit=100')).body.items.map((x: { id: string }) => x.id);
    expect(q).toEqual(expect.arrayContaining([s1.shopId, s2.shopId]));
    expect((await admin.post(`/api/moderation/shops/${s1.shopId}/approve`).send({})).body.shop.state).toBe('live');
    expect((await admin.post(`/api/moderation/shops/${s2.shopId}/reject`).send({})).status).toBe(400);
    expect((await admin.post(`/api/moderation/shops/${s2.shopId}/reject`).send({ reason: 'Not a craft business.' })).body.shop.state).toBe('rejected');
    expect((await admin.post(`/api/moderation/shops/${s2.shopId}/restore`).send({})).status).toBe(409);
    const after = (await admin.get('/api/moderation/queue/shops?limit=100')).body.items.map((x: { id: string }) => x.id);
    expect(after).not.toContain(s1.shopId);
    expect(after).not.toContain(s2.shopId);
  });

  it('when a listing is approved while its shop is still in review, then it stays hidden until the shop is live', async () => {
    const s = await t.makeSeller({ name: 'Heron House', state: 'in_review' });
    const ag = await t.signIn(s.email);
    const l = await liveListing(t, ag, admin, { title: 'Heron spring tote' });
    expect((await search('heron')).body.total).toBe(0);
    await admin.post(`/api/moderation/shops/${s.shopId}/approve`).send({});
    expect((await search('heron')).body.items[0].id).toBe(l.id);
  });
});

describe('shop directory', () => {
  const find = (agent: Agent, query: Record<string, string | number>) => agent.get('/api/moderation/shops').query(query);
  const names = (res: request.Response) => res.body.items.map((x: { name: string }) => x.name);

  it('when anyone but an admin asks for the shop list, then 403; a guest 401', async () => {
    const shopper = await t.signIn((await t.makeUser('shopper')).email);
    expect((await find(shopper, {})).status).toBe(403);
    expect((await find(a, {})).status).toBe(403);
    expect((await request(t.app).get('/api/moderation/shops')).status).toBe(401);
  });

  it('when the admin searches, then shops in every state match by name, address or owner e-mail, and the state filter narrows them', async () => {
    const live = await t.makeSeller({ name: 'Wren Lane Studio' });
    const review = await t.makeSeller({ name: 'Wren & Willow', state: 'in_review' });
    const gone = await t.makeSeller({ name: 'Wrenfield Bags' });
    await admin.post(`/api/moderation/shops/${gone.shopId}/suspend`).send({ reason: 'Chargebacks under review.' }).expect(200);

    const all = await find(admin, { q: '  WREN ' });
    expect(all.status).toBe(200);
    expect(names(all)).toEqual(['Wren & Willow', 'Wren Lane Studio', 'Wrenfield Bags']); // by name, case-insensitive
    expect(all.body).toMatchObject({ total: 3, page: 1 });
    expect(all.body.items.find((x: { id: string }) => x.id === gone.shopId)).toMatchObject({ state: 'suspended', stateReason: 'Chargebacks under review.', owner: { email: gone.email } });

    expect(names(await find(admin, { q: 'wren', state: 'suspended' }))).toEqual(['Wrenfield Bags']);
    expect(names(await find(admin, { q: 'wren', state: 'in_review' }))).toEqual(['Wren & Willow']);
    expect((await find(admin, { q: review.email })).body.items.map((x: { id: string }) => x.id)).toEqual([review.shopId]);
    const slug = (await find(admin, { q: 'wren lane' })).body.items[0].slug as string;
    expect((await find(admin, { q: slug })).body.items.map((x: { id: string }) => x.id)).toEqual([live.shopId]);
    // LIKE wildcards are searched for literally, not as patterns
    expect((await find(admin, { q: 'wren%studio' })).body.total).toBe(0);
    expect((await find(admin, { q: 'w_en' })).body.total).toBe(0);

    // the suspended shop can be restored from the list, and the list follows
    await admin.post(`/api/moderation/shops/${gone.shopId}/restore`).send({}).expect(200);
    expect((await find(admin, { q: 'wren', state: 'suspended' })).body.total).toBe(0);
  });

  it('when there are more shops than a page, then pages of 20 follow each other without gaps or repeats', async () => {
    for (let i = 0; i < 23; i++) await t.makeSeller({ name: `Pipit Print ${String(i).padStart(2, '0')}` });
    const p1 = await find(admin, { q: 'pipit print' });
    const p2 = await find(admin, { q: 'pipit print', page: 2 });
    expect(p1.body).toMatchObject({ total: 23, page: 1, limit: 20 });
    expect(p1.body.items).toHaveLength(20);
    expect(p2.body.items).toHaveLength(3);
    expect([...names(p1), ...names(p2)]).toEqual(Array.from({ length: 23 }, (_, i) => `Pipit Print ${String(i).padStart(2, '0')}`));
  });

  it('when the query is malformed, then 400 with a message on the field', async () => {
    const bad = await find(admin, { state: 'deleted' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.state).toBeTruthy();
    expect((await find(admin, { page: 0 })).body.error.fields.page).toBe('Pages start at 1.');
    expect((await find(admin, { q: 'x'.repeat(101) })).body.error.fields.q).toBeTruthy();
  });
});

describe('audit log', () => {
  it('when moderators act, then each action is logged with who, what, when and why, newest first', async () => {
    const l = await createListing(a, { title: 'Audit trail tote' });
    await a.post(`/api/seller/listings/${l.id}/submit`).send({});
    const before = Date.now();
    await decide(admin, l.id, 'Needs a clearer photo.');
    const res = await admin.get('/api/moderation/audit');
    expect(res.status).toBe(200);
    const top = res.body.items[0];
    expect(top).toMatchObject({
      action: 'listing.reject',
      reason: 'Needs a clearer photo.',
      actor: { id: adminUser.id, email: adminUser.email },
      subject: { type: 'listing', id: l.id, label: 'Audit trail tote' },
    });
    expect(top.at).toBeGreaterThanOrEqual(before);
    expect(res.body.total).toBeGreaterThanOrEqual(res.body.items.length);
    const actions = res.body.items.map((i: { action: string }) => i.action);
    expect(actions).toEqual(expect.arrayContaining(['listing.approve', 'shop.suspend', 'shop.restore', 'shop.approve', 'shop.reject']));
  });
});

describe('moderation decides on the revision it showed', () => {
  const STALE = 'The seller changed this listing after you opened it; review the new version.';
  const edit = async (id: string, title: string) => {
    const body = (await a.get(`/api/seller/listings/${id}`)).body.listing.draft;
    const res = await a.put(`/api/seller/listings/${id}`).send({ ...body, title });
    expect(res.status).toBe(200);
    return res.body.listing as { revision: number; state: string; pendingReview: boolean };
  };

  it('when the seller edits a listing in review after the admin opened it, then approving the opened revision is 409 and nothing goes live', async () => {
    const l = await createListing(a, { title: 'Otter autumn tote' });
    await a.post(`/api/seller/listings/${l.id}/submit`).send({});
    const shown = (await admin.get(`/api/moderation/listings/${l.id}`)).body;
    expect(shown.page.content.title).toBe('Otter autumn tote');
    const saved = await edit(l.id, 'Otter tote with a rude word');
    expect(saved.revision).toBe(shown.listing.revision + 1);
    expect(saved.state).toBe('in_review'); // still in the queue, now with the new revision

    const res = await admin.post(`/api/moderation/listings/${l.id}/approve`).send({ revision: shown.listing.revision });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: 'stale_revision', message: STALE });
    expect((await request(t.app).get(`/api/listings/${l.slug}`)).status).toBe(404);
    const rejectOld = await admin.post(`/api/moderation/listings/${l.id}/reject`).send({ revision: shown.listing.revision, reason: 'Photo is blurry.' });
    expect(rejectOld.status).toBe(409);
    expect(rejectOld.body.error.message).toBe(STALE);

    // the queue and the review page show the new revision; rejecting that one works
    const queued = (await admin.get('/api/moderation/queue/listings?limit=100')).body.items.find((x: { id: string }) => x.id === l.id);
    expect(queued).toMatchObject({ revision: saved.revision, title: 'Otter tote with a rude word', state: 'in_review' });
    const now = await admin.post(`/api/moderation/listings/${l.id}/reject`).send({ revision: saved.revision, reason: 'Please drop the rude word.' });
    expect(now.status).toBe(200);
    expect(now.body.listing.state).toBe('rejected');
  });

  it('when a live listing is edited twice while the admin reviews the first edit, then it goes back to the queue and only the shown text is published', async () => {
    const l = await liveListing(t, a, admin, { title: 'Badger school pouch' });
    await edit(l.id, 'Badger school pouch, now in green');
    const first = (await admin.get(`/api/moderation/listings/${l.id}`)).body;
    expect(first.listing).toMatchObject({ kind: 'edit', pendingReview: true });
    expect(first.page.content.title).toBe('Badger school pouch, now in green');

    const second = await edit(l.id, 'Badger pouch: buy elsewhere cheaper');
    expect(second).toMatchObject({ state: 'live', pendingReview: true, revision: first.listing.revision + 1 });
    expect((await admin.post(`/api/moderation/listings/${l.id}/approve`).send({ revision: first.listing.revision })).status).toBe(409);
    // the approved copy stays on sale meanwhile
    expect((await request(t.app).get(`/api/listings/${l.slug}`)).body.content.title).toBe('Badger school pouch');

    // the admin reloads: the review page shows the second edit; approving it publishes exactly that text
    const again = (await admin.get(`/api/moderation/listings/${l.id}`)).body;
    expect(again.listing.revision).toBe(second.revision);
    expect(again.page.content.title).toBe('Badger pouch: buy elsewhere cheaper');
    const ok = await admin.post(`/api/moderation/listings/${l.id}/approve`).send({ revision: again.listing.revision });
    expect(ok.status).toBe(200);
    const pub = (await request(t.app).get(`/api/listings/${l.slug}`)).body;
    expect(pub.content.title).toBe(again.page.content.title);
    expect(pub.content.description).toBe(again.page.content.description);
    expect(pub.priceMinor).toBe(again.page.priceMinor);

    // an edit after approval is a new review round again
    const third = await edit(l.id, 'Badger pouch, third edit');
    expect(third).toMatchObject({ pendingReview: true, revision: second.revision + 1 });
    expect((await admin.get('/api/moderation/queue/listings?limit=100')).body.items.map((x: { id: string }) => x.id)).toContain(l.id);
  });

  it('when an approve names no revision, then 400 on revision', async () => {
    const l = await createListing(a);
    await a.post(`/api/seller/listings/${l.id}/submit`).send({});
    const res = await admin.post(`/api/moderation/listings/${l.id}/approve`).send({});
    expect(res.status).toBe(400);
    expect(res.body.error.fields.revision).toMatch(/revision/);
  });

  it('when an admin who keeps a shop reviews their own listing, then 403; another admin decides', async () => {
    const adminSeller = await t.makeUser('admin');
    const own = await t.signIn(adminSeller.email);
    expect((await own.post('/api/shops').send({ name: 'Moderator Makes' })).status).toBe(201);
    const shopId = (await own.get('/api/shop')).body.shop.id as string;
    await admin.post(`/api/moderation/shops/${shopId}/approve`).send({}).expect(200);
    const l = await createListing(own, { title: 'Self-approved tote' });
    await own.post(`/api/seller/listings/${l.id}/submit`).send({});
    const revision = await shownRevision(own, l.id);
    const res = await own.post(`/api/moderation/listings/${l.id}/approve`).send({ revision });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toMatch(/another admin/);
    expect((await own.post(`/api/moderation/shops/${shopId}/suspend`).send({ reason: 'Suspend myself' })).status).toBe(403);
    expect((await admin.post(`/api/moderation/listings/${l.id}/approve`).send({ revision })).status).toBe(200);
  });
});

describe('shop name and description changes', () => {
  type Change = { id: string; revision: number; before: { name: string; description: string }; after: { name: string; description: string }; changed: string[] };
  const changeOf = async (shopId: string) => ((await admin.get('/api/moderation/queue/shop-changes?limit=100')).body.items as Change[]).find((c) => c.id === shopId);

  it('when a live shop is renamed, then the old name stays public until an admin approves the change shown to them', async () => {
    const s = await t.makeSeller({ name: 'Puffin Press' });
    const sa = await t.signIn(s.email);
    const slug = (await sa.get('/api/shop')).body.shop.slug as string;
    const saved = await sa.patch('/api/shop').send({ name: 'Puffin Press & Co', description: 'Totes for little puffins.', processingDays: 4 });
    expect(saved.status).toBe(200);
    // the other settings apply at once; name and description wait
    expect(saved.body.shop).toMatchObject({ name: 'Puffin Press', description: '', processingDays: 4, pendingChange: { name: 'Puffin Press & Co', description: 'Totes for little puffins.' } });
    expect((await request(t.app).get(`/api/shops/${slug}`)).body.shop).toMatchObject({ name: 'Puffin Press', description: '' });

    const change = (await changeOf(s.shopId))!;
    expect(change).toMatchObject({ before: { name: 'Puffin Press', description: '' }, after: { name: 'Puffin Press & Co', description: 'Totes for little puffins.' } });
    expect(change.changed.sort()).toEqual(['description', 'name']);

    // saving unrelated settings does not restart the review
    await sa.patch('/api/shop').send({ name: 'Puffin Press & Co', description: 'Totes for little puffins.', shippingMinor: 350 }).expect(200);
    expect((await changeOf(s.shopId))!.revision).toBe(change.revision);

    // the seller cannot approve their own change
    expect((await sa.post(`/api/moderation/shops/${s.shopId}/approve-change`).send({ revision: change.revision })).status).toBe(403);
    expect((await request(t.app).post(`/api/moderation/shops/${s.shopId}/approve-change`).send({ revision: change.revision })).status).toBe(401);

    const ok = await admin.post(`/api/moderation/shops/${s.shopId}/approve-change`).send({ revision: change.revision });
    expect(ok.status).toBe(200);
    expect((await request(t.app).get(`/api/shops/${slug}`)).body.shop).toMatchObject({ name: 'Puffin Press & Co', description: 'Totes for little puffins.' });
    expect((await sa.get('/api/shop')).body.shop).toMatchObject({ name: 'Puffin Press & Co', pendingChange: null });
    expect(await changeOf(s.shopId)).toBeUndefined();
    const mail = await eventually(async () => (await t.mailTo(s.email)).find((m) => /details are approved/.test(m.subject)));
    expect(mail.text).toContain('Puffin Press & Co');
    const audit = (await admin.get('/api/moderation/audit')).body.items[0];
    expect(audit).toMatchObject({ action: 'shop.change.approve', subject: { type: 'shop', id: s.shopId } });
  });

  it('when the seller changes the name again after the admin opened it, then the stale approve is 409 and the public name is unchanged', async () => {
    const s = await t.makeSeller({ name: 'Tern Threads' });
    const sa = await t.signIn(s.email);
    await sa.patch('/api/shop').send({ name: 'Tern Threads Kids' }).expect(200);
    const opened = (await changeOf(s.shopId))!;
    await sa.patch('/api/shop').send({ name: 'Cheap Copies Outlet' }).expect(200);
    const res = await admin.post(`/api/moderation/shops/${s.shopId}/approve-change`).send({ revision: opened.revision });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/changed the shop details after you opened them/);
    expect((await sa.get('/api/shop')).body.shop.name).toBe('Tern Threads');
    const now = (await changeOf(s.shopId))!;
    expect(now).toMatchObject({ revision: opened.revision + 1, after: { name: 'Cheap Copies Outlet' } });
  });

  it('when a change is rejected, then the old name and description stay, and the seller gets the reason', async () => {
    const s = await t.makeSeller({ name: 'Lark Linen' });
    const sa = await t.signIn(s.email);
    await sa.patch('/api/shop').send({ description: 'Visit my other shop for lower prices.' }).expect(200);
    const change = (await changeOf(s.shopId))!;
    expect(change.changed).toEqual(['description']);
    expect((await admin.post(`/api/moderation/shops/${s.shopId}/reject-change`).send({ revision: change.revision })).status).toBe(400); // a reason is needed
    const res = await admin.post(`/api/moderation/shops/${s.shopId}/reject-change`).send({ revision: change.revision, reason: 'No links to other shops, please.' });
    expect(res.status).toBe(200);
    expect((await sa.get('/api/shop')).body.shop).toMatchObject({ name: 'Lark Linen', description: '', pendingChange: null, changeRejectionReason: 'No links to other shops, please.' });
    const mail = await eventually(async () => (await t.mailTo(s.email)).find((m) => /not approved/.test(m.subject)));
    expect(mail.text).toContain('No links to other shops, please.');
    expect((await admin.post(`/api/moderation/shops/${s.shopId}/approve-change`).send({ revision: change.revision })).status).toBe(409);
  });

  it('when a shop still in review is renamed after the admin opened the queue, then approving the shown revision is 409; the new one is approved', async () => {
    const s = await t.makeSeller({ name: 'Egret Goods', state: 'in_review' });
    const sa = await t.signIn(s.email);
    const shown = ((await admin.get('/api/moderation/queue/shops?limit=100')).body.items as { id: string; name: string; revision: number }[]).find((x) => x.id === s.shopId)!;
    expect(shown.name).toBe('Egret Goods');
    // the whole shop is reviewed before it goes live, so the name applies at once, with a new revision
    const res = await sa.patch('/api/shop').send({ name: 'Egret Knock-offs' });
    expect(res.body.shop).toMatchObject({ name: 'Egret Knock-offs', pendingChange: null });
    expect(await changeOf(s.shopId)).toBeUndefined();
    const stale = await admin.post(`/api/moderation/shops/${s.shopId}/approve`).send({ revision: shown.revision });
    expect(stale.status).toBe(409);
    expect(stale.body.error.message).toMatch(/review the new version/);
    expect((await sa.get('/api/shop')).body.shop.state).toBe('in_review');
    const now = ((await admin.get('/api/moderation/queue/shops?limit=100')).body.items as { id: string; name: string; revision: number }[]).find((x) => x.id === s.shopId)!;
    expect(now).toMatchObject({ name: 'Egret Knock-offs', revision: shown.revision + 1 });
    expect((await admin.post(`/api/moderation/shops/${s.shopId}/approve`).send({ revision: now.revision })).body.shop.state).toBe('live');
  });
});
