// Upload sweep across every route that takes a file (photo, logo, shop logo, motif): wrong magic
// bytes, oversize, pixel flood, and for SVG script/foreignObject/entities/entity expansion — each
// refused with a clear message, nothing written to disk or to the database (OWASP ASVS 5.2.1
// size, 5.2.2 magic bytes, 5.2.6 pixel flood, 1.3.4 SVG script, 1.5.1 external entities).
import fs from 'node:fs';
import sharp from 'sharp';
import type { Agent } from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { makeTestApp, type TestApp } from '../factories/app.ts';
import { pngHeader } from '../factories/images.ts';
import { dbFingerprint } from '../factories/sweep.ts';

let t: TestApp;
let seller: Agent;
beforeAll(async () => {
  t = await makeTestApp();
  seller = await t.signIn((await t.makeSeller()).email);
}, 60_000);
afterAll(async () => t?.close());

const filesOnDisk = () => (fs.existsSync(t.env.uploadsDir) ? fs.readdirSync(t.env.uploadsDir, { recursive: true }).map(String).sort() : []);

const png = () =>
  sharp({ create: { width: 64, height: 48, channels: 3, background: '#2f7d6d' } })
    .png()
    .toBuffer();
const gif = Buffer.from('R0lGODlhAQABAIAAAAAAAP///yH5BAEAAAAALAAAAAABAAEAAAIBRAA7', 'base64');

type Bad = { label: string; file: () => Promise<Buffer> | Buffer; status: number; code: RegExp; message?: RegExp };
const IMAGE_BAD: Bad[] = [
  { label: 'HTML named .png', file: () => Buffer.from('<html><script>alert(1)</script></html>'), status: 415, code: /unsupported_file/ },
  { label: 'an SVG with script named .png', file: () => Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'), status: 415, code: /unsupported_file/ },
  { label: 'a GIF (not on the list)', file: () => gif, status: 415, code: /unsupported_file/ },
  {
    label: 'a PNG signature over random bytes',
    file: () => Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), Buffer.alloc(200, 7)]),
    status: 415,
    code: /unsupported_file/,
  },
  { label: 'a 9 MB file (over 8 MB)', file: async () => Buffer.concat([await png(), Buffer.alloc(9 * 1024 * 1024)]), status: 413, code: /file_too_large/, message: /8 MB/ },
  { label: 'a 30,000 × 30,000 PNG header (pixel flood)', file: () => pngHeader(30_000, 30_000), status: 413, code: /image_too_large/ },
  { label: 'a 100,000 × 1 PNG header (one long side, 0.1 MP: allowed by pixels, refused as unreadable)', file: () => pngHeader(100_000, 1), status: 415, code: /unsupported_file/ },
];
const SVG = (body: string, head = '') => `${head}<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10">${body}<rect width="10" height="10"/></svg>`;
const MOTIF_BAD: Bad[] = [
  { label: 'a script element', file: () => Buffer.from(SVG('<script>alert(1)</script>')), status: 422, code: /^motif_/ },
  { label: 'an onload handler', file: () => Buffer.from(SVG('<g onload="alert(1)"/>')), status: 422, code: /^motif_/ },
  { label: 'a javascript: link', file: () => Buffer.from(SVG('<a href="javascript:alert(1)"><rect width="1" height="1"/></a>')), status: 422, code: /^motif_/ },
  { label: 'a foreignObject', file: () => Buffer.from(SVG('<foreignObject><div xmlns="http://www.w3.org/1999/xhtml">x</div></foreignObject>')), status: 422, code: /^motif_/ },
  {
    label: 'an external entity (XXE)',
    file: () => Buffer.from(SVG('<text>&x;</text>', '<?xml version="1.0"?><!DOCTYPE svg [<!ENTITY x SYSTEM "file:///etc/passwd">]>')),
    status: 422,
    code: /^motif_/,
  },
  {
    label: 'nested entities (billion laughs)',
    file: () =>
      Buffer.from(
        SVG('<text>&c;</text>', `<?xml version="1.0"?><!DOCTYPE svg [<!ENTITY a "${'x'.repeat(100)}"><!ENTITY b "&a;&a;&a;&a;&a;&a;&a;&a;&a;&a;"><!ENTITY c "&b;&b;&b;&b;&b;&b;&b;&b;&b;&b;">]>`),
      ),
    status: 422,
    code: /^motif_/,
  },
  { label: 'a PNG', file: () => png(), status: 422, code: /^motif_/ },
  { label: 'a 600 kB file (over 512 kB)', file: () => Buffer.from(SVG(`<!--${'x'.repeat(600 * 1024)}-->`)), status: 413, code: /too_large/, message: /512 kB/ },
  { label: '6,000 elements (element flood, under the byte cap)', file: () => Buffer.from(SVG('<g/>'.repeat(6_000))), status: 400, code: /^motif_too_many_elements/, message: /5000 elements/ },
];

const ROUTES: Array<{ route: string; send: (file: Buffer) => ReturnType<Agent['post']>; bad: Bad[] }> = [
  { route: 'POST /api/uploads (photo)', send: (f) => seller.post('/api/uploads').field('kind', 'photo').attach('file', f, { filename: 'photo.png', contentType: 'image/png' }), bad: IMAGE_BAD },
  { route: 'POST /api/uploads (logo)', send: (f) => seller.post('/api/uploads').field('kind', 'logo').attach('file', f, { filename: 'logo.png', contentType: 'image/png' }), bad: IMAGE_BAD },
  { route: 'POST /api/shop/logo', send: (f) => seller.post('/api/shop/logo').attach('file', f, { filename: 'logo.png', contentType: 'image/png' }), bad: IMAGE_BAD },
  { route: 'POST /api/motifs', send: (f) => seller.post('/api/motifs').field('name', 'Sweep').attach('file', f, { filename: 'm.svg', contentType: 'image/svg+xml' }), bad: MOTIF_BAD },
];

describe('upload sweep', () => {
  test('when a bad file goes to any upload route, then it is refused with a clear message and nothing is written', async () => {
    const problems: string[] = [];
    let tried = 0;
    for (const r of ROUTES) {
      for (const b of r.bad) {
        const disk = filesOnDisk();
        const db = dbFingerprint(t.sqlite);
        const res = await r.send(await b.file());
        tried++;
        const tag = `${r.route} with ${b.label} → ${res.status}`;
        if (res.status !== b.status) problems.push(`${tag}, expected ${b.status} ${JSON.stringify(res.body).slice(0, 120)}`);
        if (!b.code.test(String(res.body?.error?.code))) problems.push(`${tag}: code ${res.body?.error?.code}`);
        if (!(String(res.body?.error?.message ?? '').length > 10)) problems.push(`${tag}: no clear message`);
        if (b.message && !b.message.test(String(res.body?.error?.message))) problems.push(`${tag}: message "${res.body?.error?.message}" does not name the limit`);
        if (JSON.stringify(filesOnDisk()) !== JSON.stringify(disk)) problems.push(`${tag}: wrote to disk`);
        if (dbFingerprint(t.sqlite) !== db) problems.push(`${tag}: wrote to the database`);
      }
    }
    expect(problems).toEqual([]);
    console.log(`upload sweep: ${ROUTES.length} upload routes, ${tried} bad files, all refused with nothing stored`);
  }, 120_000);

  test('when a good file goes to each image route, then it is accepted (the refusals above are not blanket)', async () => {
    for (const r of ROUTES.slice(0, 3)) expect((await r.send(await png())).status, r.route).toBeLessThan(300);
  });
});
