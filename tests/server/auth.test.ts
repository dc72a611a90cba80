import http from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eventually, makeTestApp, type TestApp } from '../factories/app.ts';
import { at } from '../support/at.ts';

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

  it('when a guest asks /api/me, then 200 with no user (a guest is not an error)', async () => {
    const res = await request(t.app).get('/api/me');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ user: null, shop: null });
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
    expect((await request(t.app).get('/api/me').set('Cookie', cookie)).body.user?.email).toBe('dana@namesake.test');
    const out = await request(t.app).post('/api/auth/sign-out').set('Cookie', cookie).send({});
    expect(out.status).toBe(200);
    const after = await request(t.app).get('/api/me').set('Cookie', cookie);
    expect(after.status).toBe(200);
    expect(after.body.user).toBeNull();
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
      const r = await request(t.app)
        .post('/api/auth/sign-in/email')
        .send({ email: u.email, password: `wrong-guess-${i}` });
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
    const res = await request(t.app)
      .post('/api/auth/sign-up/email')
      .send({ name: 'Long', email: 'long-pass@namesake.test', password: 'p1'.repeat(64) });
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
    const mail = at(
      await eventually(async () => {
        const m = await t.mailTo(u.email);
        return m.length ? m : null;
      }),
      0,
    );
    expect(mail.subject).toMatch(/Reset your Namesake password/);
    const link = /https?:\/\/\S+reset-password\/[^\s"<]+/.exec(mail.text)?.[0];
    expect(link).toBeTruthy();
    // the link goes through better-auth, which redirects to our page with the token
    const url = new URL(link!);
    const follow = await request(t.app).get(url.pathname + url.search);
    expect(follow.status).toBe(302);
    const token = new URL(follow.headers.location ?? '', 'http://localhost').searchParams.get('token');
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

describe('one path per auth endpoint (limits cannot be side-stepped)', () => {
  // each of these names /api/auth/sign-in/email for a URL parser (WHATWG URL, used by better-auth)
  // or for a case-insensitive router; none is in the plain form, so each is refused before any
  // password is checked
  const VARIANTS = [
    '/api/auth/x/../sign-in/email',
    '/api/auth/./sign-in/email',
    '/api/auth/sign-in/./email',
    '/api/auth//sign-in/email',
    '/api/auth/sign-in//email',
    '/api/auth/sign-in/email/',
    '/api/auth/Sign-In/email',
    '/API/AUTH/sign-in/email',
    '/api/auth/x/%2e%2e/sign-in/email',
    '/api/auth/x/%2E%2E/sign-in/email',
    '/api/auth/x/.%2e/sign-in/email',
    '/api/auth/%2e%2e/auth/sign-in/email',
    '/api/auth/sign-in%2Femail',
    '/api/auth/sign-in%2femail',
    '/api/auth/%73ign-in/email',
    '/api/auth/x\\..\\sign-in/email',
    '/api/auth/sign-in/email%',
  ];

  // sent byte for byte (an HTTP client library would resolve `\` and `..` itself before sending)
  let server: http.Server;
  beforeAll(async () => {
    server = t.app.listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
  });
  afterAll(async () => new Promise((r) => server.close(r)));
  const rawPost = (path: string, body: object) =>
    new Promise<{ status: number; setCookie: unknown; body: { error?: { code: string } } }>((resolve, reject) => {
      const data = JSON.stringify(body);
      const req = http.request(
        { host: '127.0.0.1', port: (server.address() as AddressInfo).port, path, method: 'POST', headers: { 'content-type': 'application/json', 'content-length': Buffer.byteLength(data) } },
        (res) => {
          let text = '';
          res.on('data', (c) => (text += c));
          res.on('end', () => resolve({ status: res.statusCode ?? 0, setCookie: res.headers['set-cookie'], body: JSON.parse(text || '{}') }));
        },
      );
      req.on('error', reject);
      req.end(data);
    });

  it.each(VARIANTS)('when %s is used after five failures, then the right password is still refused and no session is made', async (path) => {
    const u = await t.makeUser('shopper');
    for (let i = 0; i < 5; i++)
      expect(
        (
          await request(t.app)
            .post('/api/auth/sign-in/email')
            .send({ email: u.email, password: `wrong-${i}-guess` })
        ).status,
      ).toBe(401);
    const res = await rawPost(path, { email: u.email, password: u.password });
    expect([400, 404, 429]).toContain(res.status);
    expect(res.setCookie).toBeUndefined();
    expect(res.body.error?.code).toBeTruthy();
  });

  it.each(VARIANTS)('when %s is used for guesses, then no guess reaches the password check', async (path) => {
    const u = await t.makeUser('shopper');
    const statuses: number[] = [];
    for (let i = 0; i < 7; i++) statuses.push((await rawPost(path, { email: u.email, password: i === 6 ? u.password : `wrong-${i}-guess` })).status);
    expect(statuses).toEqual(Array(7).fill(400));
    // and the variants did not use up the account's own five tries
    expect((await request(t.app).post('/api/auth/sign-in/email').send({ email: u.email, password: u.password })).status).toBe(200);
  });

  it('when the plain path is used, then it works, and a reset link with a mixed-case token keeps its token', async () => {
    const u = await t.makeUser('shopper');
    expect((await request(t.app).post('/api/auth/sign-in/email').send({ email: u.email, password: u.password })).status).toBe(200);
    // a token in the path is case-sensitive, so it is the one part not lower-cased: an unknown token is
    // better-auth's redirect with an error, not our refusal
    const res = await request(t.app).get('/api/auth/reset-password/AbCdEf123?callbackURL=%2Freset-password');
    expect(res.status).toBe(302);
    expect(res.headers.location).toMatch(/error=INVALID_TOKEN/);
  });
});

describe('every way to set a password follows the sign-up rules', () => {
  it('when change-password gets a common, short, overlong or unchanged password, then 400 on newPassword and the old password still works', async () => {
    const u = await t.makeUser('shopper');
    const agent = await t.signIn(u.email);
    for (const newPassword of ['password1', 'short', 'p'.repeat(129), u.password]) {
      const res = await agent.post('/api/auth/change-password').send({ currentPassword: u.password, newPassword });
      expect(res.status, newPassword).toBe(400);
      expect(res.body.error.fields.newPassword).toBeTruthy();
    }
    expect((await request(t.app).post('/api/auth/sign-in/email').send({ email: u.email, password: 'password1' })).status).toBe(401);
    const ok = await agent.post('/api/auth/change-password').send({ currentPassword: u.password, newPassword: 'a-fresh-long-phrase' });
    expect(ok.status).toBe(200);
    expect((await request(t.app).post('/api/auth/sign-in/email').send({ email: u.email, password: 'a-fresh-long-phrase' })).status).toBe(200);
  });

  it('when a guest calls change-password, then 401', async () => {
    const res = await request(t.app).post('/api/auth/change-password').send({ currentPassword: 'whatever-it-is', newPassword: 'a-fresh-long-phrase' });
    expect(res.status).toBe(401);
  });

  it('when a password is set from the server (auth.api) with a common one, then the hook refuses it too', async () => {
    await expect(t.deps.auth.api.signUpEmail({ body: { email: 'hook-check@namesake.test', password: 'password1', name: 'Hook' } })).rejects.toMatchObject({ status: 'BAD_REQUEST' });
    const u = await t.makeUser('shopper');
    const agent = await t.signIn(u.email);
    const cookie = (await agent.get('/api/me')).request.getHeader('cookie') as string | undefined;
    // straight into better-auth's handler, past our HTTP guard
    const res = await t.deps.auth.handler(
      new Request('http://localhost:3000/api/auth/change-password', {
        method: 'POST',
        headers: { 'content-type': 'application/json', cookie: cookie ?? '', origin: 'http://localhost:3000' },
        body: JSON.stringify({ currentPassword: u.password, newPassword: 'iloveyou' }),
      }),
    );
    expect(res.status).toBe(400);
    expect(((await res.json()) as { code: string }).code).toBe('WEAK_PASSWORD');
  });

  it("when an admin sets a user's password, then the same rules apply", async () => {
    const u = await t.makeUser('shopper');
    const admin = await t.signIn('admin@namesake.test', 'namesake-demo');
    const weak = await admin.post('/api/auth/admin/set-user-password').send({ userId: u.id, newPassword: 'password1' });
    expect(weak.status).toBe(400);
    expect(weak.body.error.fields.newPassword).toMatch(/common/);
    expect((await admin.post('/api/auth/admin/set-user-password').send({ userId: u.id, newPassword: 'an-admin-chosen-pass' })).status).toBe(200);
  });
});

describe('nobody changes a role through the account endpoints', () => {
  const roleOf = (id: string) => (t.sqlite.prepare('select role from user where id = ?').get(id) as { role: string }).role;

  it('when update-user carries role admin (or a ban flag), then 400 naming it and the role is unchanged; a name alone is saved', async () => {
    const u = await t.makeUser('seller');
    const agent = await t.signIn(u.email);
    for (const body of [{ role: 'admin' }, { name: 'Mira', role: 'admin' }, { banned: false }, { email: 'other@namesake.test' }]) {
      const res = await agent.post('/api/auth/update-user').send(body);
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.error.fields)).toEqual(Object.keys(body).filter((k) => k !== 'name'));
    }
    expect(roleOf(u.id)).toBe('seller');
    expect((await agent.get('/api/me')).body.user.name).not.toBe('Mira');
    expect((await agent.post('/api/auth/update-user').send({ name: 'Mira' })).status).toBe(200);
    expect((await agent.get('/api/me')).body.user).toMatchObject({ name: 'Mira', role: 'seller' });
  });

  it('when sign-up carries role admin, then the account is not an admin', async () => {
    const email = `climber-${Date.now()}@namesake.test`;
    const res = await request(t.app).post('/api/auth/sign-up/email').send({ name: 'Climber', email, password: 'a-long-enough-pass', role: 'admin' });
    const row = t.sqlite.prepare('select role from user where email = ?').get(email) as { role: string } | undefined;
    expect(row?.role ?? 'no account').not.toBe('admin');
    expect([200, 400]).toContain(res.status);
  });

  it.each([
    ['/api/auth/admin/set-role', (id: string) => ({ userId: id, role: 'admin' })],
    ['/api/auth/admin/create-user', () => ({ email: `made-${Date.now()}@namesake.test`, name: 'Made', password: 'a-long-enough-pass', role: 'admin' })],
    ['/api/auth/admin/set-user-password', (id: string) => ({ userId: id, newPassword: 'a-long-enough-pass' })],
    ['/api/auth/admin/update-user', (id: string) => ({ userId: id, data: { role: 'admin' } })],
    ['/api/auth/admin/impersonate-user', (id: string) => ({ userId: id })],
  ])("when a seller calls the admin plugin's %s, then 403 and their role is unchanged", async (path, body) => {
    const u = await t.makeUser('seller');
    const agent = await t.signIn(u.email);
    const res = await agent.post(path).send(body(u.id));
    expect(res.status).toBe(403);
    expect(roleOf(u.id)).toBe('seller');
  });
});

describe('session lifetime: sliding, with an absolute cap of 30 days', () => {
  const DAY = 24 * 60 * 60 * 1000;
  let clock = Date.now();
  let c: TestApp;
  beforeAll(async () => {
    c = await makeTestApp({ now: () => clock });
  });
  afterAll(async () => c.close());

  it('when a session is used for 29 days it holds; past 30 days from sign-in it is refused and deleted', async () => {
    clock = Date.now();
    const u = await c.makeUser('shopper');
    const agent = await c.signIn(u.email);
    const sessions = () => (c.sqlite.prepare('select count(*) as n from session where user_id = ?').get(u.id) as { n: number }).n;
    const before = sessions(); // sign-up's own session and this sign-in's
    clock = Date.now() + 29 * DAY;
    expect((await agent.get('/api/me')).body.user?.email).toBe(u.email);
    clock = Date.now() + 30 * DAY + 60_000;
    expect((await agent.get('/api/me')).body.user).toBeNull(); // a guest again
    expect(sessions()).toBe(before - 1);
    // gone for good, also back at today's clock, and for better-auth's own account endpoints
    clock = Date.now();
    expect((await agent.get('/api/me')).body.user).toBeNull(); // a guest again
    expect((await agent.post('/api/auth/change-password').send({ currentPassword: u.password, newPassword: 'a-fresh-long-phrase' })).status).toBe(401);
  });

  it("when the session row is older than 30 days, then better-auth's own endpoints refuse it too", async () => {
    clock = Date.now();
    const u = await c.makeUser('shopper');
    const agent = await c.signIn(u.email);
    c.sqlite.prepare('update session set created_at = ? where user_id = ?').run(Date.now() - 31 * DAY, u.id);
    const res = await agent.post('/api/auth/change-password').send({ currentPassword: u.password, newPassword: 'a-fresh-long-phrase' });
    expect(res.status).toBe(401);
    expect((await c.app.locals.deps.auth.api.signInEmail({ body: { email: u.email, password: u.password } })).user.id).toBe(u.id); // the password is unchanged
  });
});
