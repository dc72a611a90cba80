// Upload sweep across every route that takes a file (photo, logo, shop logo, motif, order message, review): wrong magic
// bytes, oversize, pixel flood, and for SVG script/foreignObject/entities/entity expansion — each
// refused with a clear message, nothing written to disk or to the database (OWASP ASVS 5.2.1
// size, 5.2.2 magic bytes, 5.2.6 pixel flood, 1.3.4 SVG script, 1.5.1 external entities).
import crypto from 'node:crypto';
import fs from 'node:fs';
import sharp from 'sharp';
import type { Agent } from 'supertest';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { makeTestApp, type TestApp } from '../factories/app.ts';
import { pngHeader } from '../factories/images.ts';
import { dbFingerprint } from '../factories/sweep.ts';
import { createListing } from './listings.fixtures.ts';

let t: TestApp;
let seller: Agent;
let shopper: Agent;
/** an order of the shopper's in the seller's shop, with one line shipped long enough ago to review */
let order: { id: string; lineId: string };
beforeAll(async () => {
  t = await makeTestApp();
  const s = await t.makeSeller();
  seller = await t.signIn(s.email);
  const buyer = await t.makeUser('shopper');
  shopper = await t.signIn(buyer.email);
  order = shippedOrder(t, s.shopId, buyer.id, (await createListing(seller)).id);
}, 60_000);

/** The rows of a paid, shipped order, written directly (the checkout's own tests make real ones). */
function shippedOrder(app: TestApp, shopId: string, buyerId: string, listingId: string) {
  const at = Date.now() - 30 * 86_400_000;
  const ids = { checkout: crypto.randomUUID(), order: crypto.randomUUID(), line: crypto.randomUUID() };
  const run = (q: string, ...a: unknown[]) => app.sqlite.prepare(q).run(...a);
  run("insert into checkouts (id, user_id, cart_id, state, currency, total_minor, priced, created_at) values (?, ?, 'cart', 'paid', 'USD', 2000, '{}', ?)", ids.checkout, buyerId, at);
  run(
    "insert into orders (id, number, checkout_id, shop_id, buyer_id, currency, subtotal_minor, shipping_minor, platform_fee_minor, total_minor, paid_at, shipped_at, created_at) values (?, 'NS-9001', ?, ?, ?, 'USD', 2000, 0, 160, 2000, ?, ?, ?)",
    ids.order,
    ids.checkout,
    shopId,
    buyerId,
    at,
    at + 86_400_000,
    at,
  );
  run(
    "insert into order_lines (id, order_id, listing_id, listing_title, quantity, unit_price_minor, total_minor, state, snapshot, created_at, updated_at) values (?, ?, ?, 'Tote', 1, 2000, 2000, 'shipped', '{}', ?, ?)",
    ids.line,
    ids.order,
    listingId,
    at,
    at,
  );
  return { id: ids.order, lineId: ids.line };
}
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
  {
    route: 'POST /api/orders/:id/messages (photo)',
    send: (f) => seller.post(`/api/orders/${order.id}/messages`).field('body', 'A swatch').attach('file', f, { filename: 'swatch.png', contentType: 'image/png' }),
    bad: IMAGE_BAD,
  },
  {
    route: 'POST /api/orders/:id/lines/:lineId/review (photo)',
    send: (f) => shopper.post(`/api/orders/${order.id}/lines/${order.lineId}/review`).field('rating', '5').field('body', 'Lovely').attach('file', f, { filename: 'bag.png', contentType: 'image/png' }),
    bad: IMAGE_BAD,
  },
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
    for (const r of ROUTES.filter((x) => x.bad === IMAGE_BAD)) expect((await r.send(await png())).status, r.route).toBeLessThan(300);
  });
});
