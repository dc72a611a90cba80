// Security headers on API answers, HTML pages, uploaded images and motif SVGs: a CSP, nosniff
// (OWASP ASVS 3.4.4), framing refused (CSP frame-ancestors or X-Frame-Options, ASVS 3.4.6), a
// Referrer-Policy (ASVS 3.4.5) and no X-Powered-By banner.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import request, { type Response } from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { createApp } from '../../server/app.ts';
import { makeTestApp, type TestApp } from '../factories/app.ts';
import { DEMO_PASSWORD } from '../factories/sweep.ts';

let t: TestApp;
let clientDir: string;
let withClient: ReturnType<typeof createApp>;
beforeAll(async () => {
  t = await makeTestApp({ seed: true });
  clientDir = fs.mkdtempSync(path.join(os.tmpdir(), 'namesake-client-'));
  fs.writeFileSync(path.join(clientDir, 'index.html'), '<!doctype html><html><head><title>Namesake</title></head><body><div id="root"></div></body></html>');
  fs.mkdirSync(path.join(clientDir, 'assets'));
  fs.writeFileSync(path.join(clientDir, 'assets', 'app.js'), 'console.log(1)');
  withClient = createApp({ db: t.db, env: t.env, mailer: t.deps.mailer, clientDir });
}, 60_000);
afterAll(async () => {
  fs.rmSync(clientDir, { recursive: true, force: true });
  await t?.close();
});

function check(res: Response, label: string) {
  const h = res.headers;
  const csp = String(h['content-security-policy'] ?? '');
  expect(csp, `${label}: CSP`).not.toBe('');
  expect(csp, `${label}: CSP has a default-src`).toMatch(/default-src '(self|none)'/);
  expect(csp, `${label}: no unsafe script`).not.toMatch(/script-src[^;]*'unsafe-(inline|eval)'/);
  expect(h['x-content-type-options'], `${label}: nosniff`).toBe('nosniff');
  const framing = /frame-ancestors '(self|none)'/.test(csp) || /^(DENY|SAMEORIGIN)$/i.test(String(h['x-frame-options'] ?? ''));
  expect(framing, `${label}: framing refused`).toBe(true);
  expect(h['referrer-policy'], `${label}: Referrer-Policy`).toMatch(/^(no-referrer|same-origin|strict-origin|strict-origin-when-cross-origin)$/);
  expect(h['x-powered-by'], `${label}: no X-Powered-By`).toBeUndefined();
}

describe('security headers', () => {
  test('when the API answers (data, errors, auth, fonts), then every security header is there', async () => {
    const app = request(t.app);
    const cases: Array<[string, Promise<Response>]> = [
      ['GET /api/health', app.get('/api/health')],
      ['GET /api/listings', app.get('/api/listings')],
      ['GET /api/me (guest)', app.get('/api/me')],
      ['unknown route (404)', app.get('/api/nope')],
      ['bad JSON (400)', app.post('/api/cart/lines').set('Content-Type', 'application/json').send('{bad')],
      ['cross-site POST (403)', app.post('/api/cart/lines').set('Origin', 'https://evil.example').send({})],
      ['better-auth', app.get('/api/auth/get-session')],
      ['font file', app.get('/api/fonts/baloo-bold/file')],
    ];
    for (const [label, p] of cases) check(await p, label);
  });

  test('when HTML pages and static assets are served, then every security header is there', async () => {
    for (const url of ['/', '/search', '/orders', '/workroom', '/assets/app.js']) {
      const res = await request(withClient).get(url);
      expect(res.status, url).toBe(200);
      check(res, url);
    }
    const html = await request(withClient).get('/');
    // only our own scripts run on a page (a stored script tag from a user could not execute)
    expect(html.headers['content-security-policy']).toMatch(/script-src 'self'(;|$)/);
    expect(html.headers['content-security-policy']).toMatch(/object-src 'none'/);
  });

  test('when an uploaded photo, a motif SVG and a cut sheet are served, then they cannot run script and are nosniff', async () => {
    const fern = await t.signIn('fern@namesake.test', DEMO_PASSWORD);
    const up = await fern.post('/api/uploads').attach(
      'file',
      await sharp({ create: { width: 20, height: 20, channels: 3, background: '#000' } })
        .png()
        .toBuffer(),
      { filename: 'a.png', contentType: 'image/png' },
    );
    expect(up.status).toBe(201);
    const photo = await request(t.app).get(up.body.upload.url);
    expect(photo.status).toBe(200);
    check(photo, 'uploaded photo');
    expect(photo.headers['content-security-policy']).toMatch(/sandbox/);

    const motifs = await fern.get('/api/motifs');
    const motif = await fern.get(`/api/motifs/${motifs.body.motifs[0].id}/svg`);
    expect(motif.status).toBe(200);
    check(motif, 'motif svg');
    expect(motif.headers['content-security-policy']).toMatch(/sandbox/);

    const lines = (await fern.get('/api/workroom/lines?state=approved')).body.items;
    const built = await fern.post('/api/workroom/cut-sheets').send({ lineIds: [lines[0].id] });
    const sheet = await fern.get(built.body.sheets[0].svgUrl);
    expect(sheet.status).toBe(200);
    check(sheet, 'cut sheet svg');
  });
});
