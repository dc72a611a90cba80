// Sign-in brute force across many accounts from one address (OWASP ASVS 6.3.1): the per-account
// limit (tests/server/auth.test.ts) does not stop an attacker who tries one password on many
// accounts, so better-auth's per-IP limit must: with it switched on (AUTH_IP_RATE_LIMIT=true, as
// in production), the 31st sign-in from one IP within a minute gets 429, whatever the account.

import request from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { makeTestApp, type TestApp } from '../factories/app.ts';

let t: TestApp;
let real: Array<{ email: string; password: string }>;
beforeAll(async () => {
  t = await makeTestApp({ env: { AUTH_IP_RATE_LIMIT: 'true' } });
  real = [];
  for (let i = 0; i < 6; i++) real.push(await t.makeUser('shopper'));
}, 60_000);
afterAll(async () => t?.close());

const signIn = (email: string, password: string, ip?: string) => {
  const r = request(t.app).post('/api/auth/sign-in/email');
  // the app trusts X-Forwarded-For from a proxy on loopback only (server/app.ts) — as supertest is
  return (ip ? r.set('X-Forwarded-For', ip) : r).send({ email, password });
};

describe('sign-in brute force across accounts (ASVS 6.3.1)', () => {
  test('when one address tries a password on 40 accounts, then after 30 tries in a minute every further try is 429, even with a right password', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 40; i++) {
      const email = i % 2 === 0 ? real[i % real.length]!.email : `nobody-${i}@namesake.test`;
      statuses.push((await signIn(email, 'Summer2024!guess', '203.0.113.7')).status);
    }
    // better-auth's rule for /sign-in/email in server/auth.ts: 30 per 60 s per IP
    expect(statuses.slice(0, 30).every((s) => s === 401)).toBe(true);
    expect(statuses.slice(30).every((s) => s === 429)).toBe(true);
    // real[1] had no failed tries, so its 429 comes from the IP limit, not the per-account one
    const right = await signIn(real[1]!.email, real[1]!.password, '203.0.113.7');
    expect(right.status).toBe(429);
    expect(right.body.error.code).toBe('too_many_attempts');
    expect(right.body.error.message).toMatch(/wait/i);
    expect(right.headers['set-cookie']).toBeUndefined();
    // another address is not affected, and the real password works there
    expect((await signIn(real[1]!.email, real[1]!.password, '198.51.100.9')).status).toBe(200);
    console.log(`brute-force sweep: 40 sign-ins over ${real.length} real + 20 unknown accounts from one IP → ${statuses.filter((s) => s === 429).length} limited (429)`);
  }, 60_000);
});
