// CSRF sweep: every state-changing route of the live app, sent with the victim's session cookie
// from another site (Origin https://evil.example, Sec-Fetch-Site: cross-site — the headers a
// browser adds to a cross-site form post or fetch, Fetch Metadata, W3C), is refused with 403 and
// changes nothing. The signed payment webhook is the one exception (it carries no cookie).

import request from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { makeTestApp, type TestApp } from '../factories/app.ts';
import { DEMO_PASSWORD, dbFingerprint, listRoutes, sessionCookie } from '../factories/sweep.ts';

let t: TestApp;
let cookies: { admin: string; seller: string; shopper: string };
beforeAll(async () => {
  t = await makeTestApp({ seed: true });
  cookies = {
    admin: await sessionCookie(t, 'admin@namesake.test', DEMO_PASSWORD),
    seller: await sessionCookie(t, 'fern@namesake.test', DEMO_PASSWORD),
    shopper: await sessionCookie(t, 'dana@namesake.test', DEMO_PASSWORD),
  };
}, 60_000);
afterAll(async () => t?.close());

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);
/** better-auth endpoints behind the catch-all that change an account */
const AUTH_WRITES = [
  '/api/auth/sign-out',
  '/api/auth/update-user',
  '/api/auth/change-password',
  '/api/auth/change-email',
  '/api/auth/revoke-sessions',
  '/api/auth/delete-user',
  '/api/auth/admin/set-role',
  '/api/auth/admin/ban-user',
];
const victimOf = (path: string) =>
  /^\/api\/(moderation|admin|auth\/admin)/.test(path) ? cookies.admin : /^\/api\/(shop|materials|seller|uploads|motifs|workroom|business)\b/.test(path) ? cookies.seller : cookies.shopper;
const concrete = (path: string) => path.replace(/:(\w+)/g, 'x-$1');

function writes(): Array<{ method: string; path: string }> {
  const out: Array<{ method: string; path: string }> = [];
  for (const r of listRoutes(t.app)) {
    if (!r.path.startsWith('/api')) continue;
    if (r.method === 'ALL') out.push(...AUTH_WRITES.map((path) => ({ method: 'POST', path })));
    else if (!SAFE.has(r.method)) out.push({ method: r.method, path: concrete(r.path) });
  }
  return out;
}

const send = (method: string, path: string, cookie: string, headers: Record<string, string>) => {
  let r = request(t.app)[method.toLowerCase() as 'post'](path).set('Cookie', cookie);
  for (const [k, v] of Object.entries(headers)) r = r.set(k, v);
  return r.send({ name: 'CSRF', reason: 'CSRF reason', lineIds: ['x'], quantity: 2, role: 'admin' });
};

describe('CSRF (OWASP ASVS 3.5.1 / 3.5.3: cross-origin state changes refused)', () => {
  test('when any state-changing route is called from another site with the victim’s cookie, then 403 and nothing changes', async () => {
    const routes = writes();
    expect(routes.length).toBeGreaterThan(40);
    const variants: Array<[string, Record<string, string>]> = [
      ['evil origin + cross-site', { Origin: 'https://evil.example', 'Sec-Fetch-Site': 'cross-site' }],
      ['evil origin only (an older browser)', { Origin: 'https://evil.example' }],
      ['cross-site only (no Origin)', { 'Sec-Fetch-Site': 'cross-site' }],
      ['opaque origin (sandboxed frame)', { Origin: 'null' }],
      ['a look-alike origin', { Origin: 'http://localhost:3000.evil.example' }],
      ['a malformed origin', { Origin: 'not a url' }],
    ];
    const problems: string[] = [];
    let calls = 0;
    for (const { method, path } of routes) {
      for (const [label, headers] of variants) {
        const before = dbFingerprint(t.sqlite);
        const res = await send(method, path, victimOf(path), headers);
        calls++;
        const webhook = path.startsWith('/api/payments/webhook');
        if (webhook) {
          // excepted: no cookie matters there; an unsigned call fails its signature check instead
          if (res.status !== 400) problems.push(`${method} ${path} (${label}) → ${res.status}, expected the signature check's 400`);
        } else if (res.status !== 403 || res.body?.error?.code !== 'forbidden') {
          problems.push(`${method} ${path} (${label}) → ${res.status} ${JSON.stringify(res.body).slice(0, 100)}`);
        }
        if (dbFingerprint(t.sqlite) !== before) problems.push(`${method} ${path} (${label}) changed the database`);
      }
    }
    expect(problems).toEqual([]);
    console.log(`csrf sweep: ${routes.length} state-changing routes × ${variants.length} cross-origin variants = ${calls} calls, all refused (webhook excepted: signature checked)`);
  }, 120_000);

  test('when the same request comes from our own origin, then it is not refused as cross-site (the check is not just "refuse everything")', async () => {
    const res = await request(t.app).post('/api/auth/update-user').set('Cookie', cookies.shopper).set('Origin', 'http://localhost:3000').set('Sec-Fetch-Site', 'same-origin').send({ name: 'Dana R.' });
    expect(res.status).toBe(200);
    const cart = await request(t.app)
      .post('/api/cart/lines')
      .set('Origin', 'http://localhost:3000')
      .send({ listingId: 'nope', choices: { texts: {} } });
    expect(cart.status).not.toBe(403);
  });
});
