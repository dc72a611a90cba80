import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { makeTestApp, eventually, type TestApp } from '../factories/app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp({ seed: true });
});
afterAll(async () => t.close());

describe('health and me', () => {
  it('when the database answers, then /api/health says ok', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true });
  });

  it('when a guest asks /api/me, then 401 in the one error shape', async () => {
    const res = await request(t.app).get('/api/me');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthorized');
    expect(typeof res.body.error.message).toBe('string');
  });

  it.each([
    ['dana@namesake.test', 'shopper', null],
    ['fern@namesake.test', 'seller', 'fern-and-fable-goods'],
    ['comet@namesake.test', 'seller', 'little-comet-print-co'],
    ['admin@namesake.test', 'admin', null],
  ])('when %s signs in with the demo password, then /api/me says role %s', async (email, role, shopSlug) => {
    const agent = await t.signIn(email, 'namesake-demo');
    const me = await agent.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body.user).toMatchObject({ email, role });
    expect(me.body.shop?.slug ?? null).toBe(shopSlug);
  });
});

describe('sessions', () => {
  it('when signing in, then the cookie is HttpOnly and SameSite=Lax (OWASP ASVS 3.3.2, 3.3.4)', async () => {
    const res = await request(t.app).post('/api/auth/sign-in/email').send({ email: 'dana@namesake.test', password: 'namesake-demo' });
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
  });

  it('when signed out, then the old cookie no longer works (ASVS 7.4.1)', async () => {
    const login = await request(t.app).post('/api/auth/sign-in/email').send({ email: 'dana@namesake.test', password: 'namesake-demo' });
    const cookie = login.headers['set-cookie'] as unknown as string[];
    expect((await request(t.app).get('/api/me').set('Cookie', cookie)).status).toBe(200);
    const out = await request(t.app).post('/api/auth/sign-out').set('Cookie', cookie).send({});
    expect(out.status).toBe(200);
    expect((await request(t.app).get('/api/me').set('Cookie', cookie)).status).toBe(401);
  });

  it('when the e-mail is unknown or the password wrong, then the same message (ASVS 6.3.8)', async () => {
    const unknown = await request(t.app).post('/api/auth/sign-in/email').send({ email: 'nobody@namesake.test', password: 'whatever-it-is' });
    const wrong = await request(t.app).post('/api/auth/sign-in/email').send({ email: 'comet@namesake.test', password: 'whatever-it-is' });
    expect(unknown.status).toBe(401);
    expect(wrong.status).toBe(401);
    expect(unknown.body).toEqual(wrong.body);
    expect(wrong.body.error.message).toMatch(/do not match/);
  });
});

describe('brute force (ASVS 6.3.1)', () => {
  it('when ten wrong passwords come in a row, then later ones get 429, and after the window the real password works', async () => {
    const u = await t.makeUser('shopper');
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) {
      const r = await request(t.app).post('/api/auth/sign-in/email').send({ email: u.email, password: `wrong-guess-${i}` });
      statuses.push(r.status);
    }
    expect(statuses.slice(0, 5).every((s) => s === 401)).toBe(true);
    expect(statuses.slice(5).every((s) => s === 429)).toBe(true);
    const blocked = await request(t.app).post('/api/auth/sign-in/email').send({ email: u.email, password: u.password });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.message).toMatch(/minute/);
    // the lock is the one-minute window, not a permanent lock: the header says when it ends
    expect(Number(/t=(\d+)/.exec(String(blocked.headers['ratelimit']))?.[1] ?? 999)).toBeLessThanOrEqual(60);
  });
});

describe('roles', () => {
  it('when a shopper opens an admin page, then 403; a seller too; an admin gets it', async () => {
    const shopper = await t.signIn('dana@namesake.test', 'namesake-demo');
    const seller = await t.signIn('fern@namesake.test', 'namesake-demo');
    const admin = await t.signIn('admin@namesake.test', 'namesake-demo');
    expect((await shopper.get('/api/admin/mail')).status).toBe(403);
    expect((await seller.get('/api/admin/mail')).status).toBe(403);
    expect((await admin.get('/api/admin/mail')).status).toBe(200);
    expect((await request(t.app).get('/api/admin/mail')).status).toBe(401);
  });

  it('when a shopper opens a shop, then it waits in review with a unique slug and they become a seller', async () => {
    const a = await t.makeUser('shopper');
    const b = await t.makeUser('shopper');
    const agentA = await t.signIn(a.email);
    const agentB = await t.signIn(b.email);
    const resA = await agentA.post('/api/shops').send({ name: 'Fern & Fable Goods' });
    expect(resA.status).toBe(201);
    // the demo shop already holds the plain slug
    expect(resA.body.shop).toMatchObject({ name: 'Fern & Fable Goods', slug: 'fern-and-fable-goods-2', state: 'in_review' });
    const resB = await agentB.post('/api/shops').send({ name: 'Fern & Fable Goods' });
    expect(resB.body.shop.slug).toBe('fern-and-fable-goods-3');
    expect((await agentA.get('/api/me')).body.user.role).toBe('seller');
    const again = await agentA.post('/api/shops').send({ name: 'Another' });
    expect(again.status).toBe(409);
  });
});

describe('bad input gets a 400 with field messages', () => {
  it.each([
    ['empty fields', { name: '', email: '', password: '' }, ['name', 'email', 'password']],
    ['a malformed e-mail', { name: 'Mira', email: 'mira-at-home', password: 'long-enough-pass' }, ['email']],
    ['a 10 kB name', { name: 'x'.repeat(10_000), email: 'mira@namesake.test', password: 'long-enough-pass' }, ['name']],
    ['wrong JSON types', { name: 42, email: ['a'], password: true }, ['name', 'email', 'password']],
    ['a short password', { name: 'Mira', email: 'mira@namesake.test', password: 'short' }, ['password']],
    ['a 129-character password', { name: 'Mira', email: 'mira@namesake.test', password: 'p'.repeat(129) }, ['password']],
    ['a common password (ASVS 6.2.4)', { name: 'Mira', email: 'mira@namesake.test', password: 'iloveyou' }, ['password']],
  ])('when sign-up gets %s, then 400 naming the fields', async (_label, body, fields) => {
    const res = await request(t.app).post('/api/auth/sign-up/email').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(Object.keys(res.body.error.fields).sort()).toEqual([...fields].sort());
  });

  it('when a 128-character password is used, then sign-up works (ASVS 6.2.9)', async () => {
    const res = await request(t.app).post('/api/auth/sign-up/email').send({ name: 'Long', email: 'long-pass@namesake.test', password: 'p1'.repeat(64) });
    expect(res.status).toBe(200);
  });

  it('when the JSON is malformed, then 400 in the one shape', async () => {
    const res = await request(t.app).post('/api/shops').set('content-type', 'application/json').send('{"name": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_request');
  });

  it('when a shop name is empty, then 400 with a field message', async () => {
    const agent = await t.signIn('dana@namesake.test', 'namesake-demo');
    const res = await agent.post('/api/shops').send({ name: ' ' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.name).toBeTruthy();
  });
});

describe('password reset by e-mail', () => {
  it('when a reset is asked for, then the mail lands in the fake and its link sets a new password', async () => {
    const u = await t.makeUser('shopper');
    const ask = await request(t.app).post('/api/auth/request-password-reset').send({ email: u.email, redirectTo: '/reset-password' });
    expect(ask.status).toBe(200);
    const [mail] = await eventually(async () => {
      const m = await t.mailTo(u.email);
      return m.length ? m : null;
    });
    expect(mail.subject).toMatch(/Reset your Namesake password/);
    const link = /https?:\/\/\S+reset-password\/[^\s"<]+/.exec(mail.text)?.[0];
    expect(link).toBeTruthy();
    // the link goes through better-auth, which redirects to our page with the token
    const url = new URL(link!);
    const follow = await request(t.app).get(url.pathname + url.search);
    expect(follow.status).toBe(302);
    const token = new URL(follow.headers.location, 'http://localhost').searchParams.get('token');
    expect(token).toBeTruthy();
    const reset = await request(t.app).post('/api/auth/reset-password').send({ token, newPassword: 'a-brand-new-secret' });
    expect(reset.status).toBe(200);
    expect((await request(t.app).post('/api/auth/sign-in/email').send({ email: u.email, password: u.password })).status).toBe(401);
    expect((await request(t.app).post('/api/auth/sign-in/email').send({ email: u.email, password: 'a-brand-new-secret' })).status).toBe(200);
  });

  it('when the e-mail is unknown, then the same answer and no mail', async () => {
    const res = await request(t.app).post('/api/auth/request-password-reset').send({ email: 'ghost@namesake.test', redirectTo: '/reset-password' });
    expect(res.status).toBe(200);
    await new Promise((r) => setTimeout(r, 200));
    expect(await t.mailTo('ghost@namesake.test')).toHaveLength(0);
  });
});

describe('headers and cross-site requests', () => {
  it('when any page is served, then nosniff and a CSP that allows only our scripts', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toMatch(/script-src 'self'(;|$)/);
  });

  it('when a state-changing request comes from another origin, then 403', async () => {
    const agent = await t.signIn('dana@namesake.test', 'namesake-demo');
    const res = await agent.post('/api/shops').set('Origin', 'https://evil.example').send({ name: 'Sneaky' });
    expect(res.status).toBe(403);
  });

  it('when an unknown API route is asked for, then 404 in the one shape', async () => {
    const res = await request(t.app).get('/api/nope');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});
