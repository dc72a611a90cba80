import fs from 'node:fs';
import path from 'node:path';
import { sql } from 'drizzle-orm';
import sharp from 'sharp';
import request, { type Agent } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../factories/app.ts';
import { pngHeader } from '../factories/images.ts';
import { liveListing, TWO_LAYER_SVG } from './listings.fixtures.ts';

let t: TestApp;
let a: Agent;
let b: Agent;
let admin: Agent;
beforeAll(async () => {
  t = await makeTestApp();
  const sa = await t.makeSeller();
  const sb = await t.makeSeller();
  [a, b, admin] = await Promise.all([t.signIn(sa.email), t.signIn(sb.email), t.signIn((await t.makeUser('admin')).email)]);
});
afterAll(async () => t.close());

const filesOnDisk = () => (fs.existsSync(t.env.uploadsDir) ? fs.readdirSync(t.env.uploadsDir).sort() : []);
const uploadRows = () => t.db.get<{ n: number }>(sql`select count(*) as n from uploads`)!.n;
const motifRows = () => t.db.get<{ n: number }>(sql`select count(*) as n from motifs`)!.n;

const png = (w = 640, h = 480) =>
  sharp({ create: { width: w, height: h, channels: 3, background: '#2f7d6d' } })
    .png()
    .toBuffer();

describe('photo uploads', () => {
  it('when a real PNG is uploaded, then a re-encoded WebP and a WebP thumbnail are stored under random names and served with nosniff', async () => {
    const res = await a.post('/api/uploads').attach('file', await png(), { filename: '../../etc/passwd my photo.png', contentType: 'image/png' });
    expect(res.status).toBe(201);
    const { url, thumbnailUrl, width, height } = res.body.upload;
    expect(url).toMatch(/^\/uploads\/[a-f0-9]{32}\.webp$/);
    expect(thumbnailUrl).toMatch(/^\/uploads\/[a-f0-9]{32}-t\.webp$/);
    expect([width, height]).toEqual([640, 480]);
    expect(filesOnDisk().join(' ')).not.toMatch(/passwd|photo/);
    const served = await request(t.app).get(url).buffer(true);
    expect(served.status).toBe(200);
    expect(served.headers['content-type']).toBe('image/webp');
    expect(served.headers['x-content-type-options']).toBe('nosniff');
    expect((await sharp(served.body).metadata()).format).toBe('webp');
    const thumb = await sharp((await request(t.app).get(thumbnailUrl).buffer(true)).body).metadata();
    expect(Math.max(thumb.width!, thumb.height!)).toBe(480);
  });

  it('when a JPEG is uploaded, then it is kept as JPEG (served image/jpeg)', async () => {
    const jpg = await sharp({ create: { width: 300, height: 200, channels: 3, background: '#e0a526' } })
      .jpeg()
      .toBuffer();
    const res = await a.post('/api/uploads').attach('file', jpg, { filename: 'x.jpg', contentType: 'image/jpeg' });
    expect(res.status).toBe(201);
    expect(res.body.upload.url).toMatch(/\.jpg$/);
    expect((await request(t.app).get(res.body.upload.url)).headers['content-type']).toBe('image/jpeg');
  });

  describe('refused files never reach the disk (OWASP ASVS 5.2.1, 5.2.2, 5.2.6)', () => {
    it.each([
      ['a .png that is really HTML', async () => Buffer.from('<html><body><script>alert(1)</script></body></html>'), 415, 'unsupported_file'],
      ['an SVG named .png', async () => Buffer.from(TWO_LAYER_SVG), 415, 'unsupported_file'],
      ['a 20 MB file', async () => Buffer.concat([await png(), Buffer.alloc(20 * 1024 * 1024)]), 413, 'file_too_large'],
      ['a 30,000 × 30,000 PNG (pixel flood)', async () => pngHeader(30_000, 30_000), 413, 'image_too_large'],
      ['a truncated PNG', async () => (await png()).subarray(0, 60), 415, 'unsupported_file'],
    ])('when it is %s, then refused with a clear message', async (_label, make, status, code) => {
      const before = filesOnDisk();
      const rows = uploadRows();
      const res = await a.post('/api/uploads').attach('file', await make(), { filename: 'photo.png', contentType: 'image/png' });
      expect(res.status).toBe(status);
      expect(res.body.error.code).toBe(code);
      expect(res.body.error.message.length).toBeGreaterThan(10);
      expect(filesOnDisk()).toEqual(before);
      expect(uploadRows()).toBe(rows);
    });
  });

  it('when no file is sent, then 400 naming the field', async () => {
    const res = await a.post('/api/uploads').field('kind', 'photo');
    expect(res.status).toBe(400);
    expect(res.body.error.fields.file).toBeTruthy();
  });

  it('when a shopper (no shop) uploads, then 403 and nothing is written', async () => {
    const before = filesOnDisk();
    const shopper = await t.signIn((await t.makeUser('shopper')).email);
    const res = await shopper.post('/api/uploads').attach('file', await png(), { filename: 'a.png', contentType: 'image/png' });
    expect(res.status).toBe(403);
    expect(filesOnDisk()).toEqual(before);
  });

  it("when seller B deletes seller A's upload, then 404; A can delete it and its files are removed", async () => {
    const up = (await a.post('/api/uploads').attach('file', await png(), { filename: 'a.png', contentType: 'image/png' })).body.upload;
    expect((await b.delete(`/api/uploads/${up.id}`)).status).toBe(404);
    expect((await b.get('/api/uploads')).body.uploads.map((u: { id: string }) => u.id)).not.toContain(up.id);
    expect((await a.delete(`/api/uploads/${up.id}`)).status).toBe(200);
    expect((await request(t.app).get(up.url)).status).toBe(404);
  });

  it('when a path outside our names is asked for, then 404', async () => {
    expect((await request(t.app).get('/uploads/..%2Fnamesake.db')).status).toBe(404);
    expect((await request(t.app).get('/uploads/namesake.db')).status).toBe(404);
  });
});

describe('motif uploads', () => {
  const upload = (agent: Agent, svg: string, name = 'Star') => agent.post('/api/motifs').field('name', name).attach('file', Buffer.from(svg), { filename: 'm.svg', contentType: 'image/svg+xml' });

  it('when a layered SVG is uploaded, then its layers are stored as geometry and the served SVG is our own', async () => {
    const res = await upload(a, TWO_LAYER_SVG);
    expect(res.status).toBe(201);
    expect(res.body.motif.layers.map((l: { id: string }) => l.id)).toEqual(['base', 'star']);
    // 60 × 40 mm declared in the file (W3C CSS Values: absolute units)
    expect(res.body.motif.widthMm).toBeCloseTo(60, 6);
    expect(res.body.motif.heightMm).toBeCloseTo(40, 6);
    const svg = await a.get(res.body.motif.svgUrl);
    expect(svg.status).toBe(200);
    expect(svg.headers['content-type']).toMatch(/^image\/svg\+xml/);
    expect(svg.headers['x-content-type-options']).toBe('nosniff');
    const text = svg.text || String(svg.body);
    expect(text).toMatch(/^<svg xmlns="http:\/\/www.w3.org\/2000\/svg"/);
    expect(text.match(/<path /g)?.length).toBe(2);
  });

  const bad: [string, string][] = [
    ['a script', `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><script>alert(1)</script><rect width="10" height="10"/></svg>`],
    ['an onload handler', `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10" onload="alert(1)"><rect width="10" height="10"/></svg>`],
    ['an event handler on a shape', `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><rect width="10" height="10" onclick="alert(1)"/></svg>`],
    [
      'a foreignObject',
      `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><foreignObject width="10" height="10"><div xmlns="http://www.w3.org/1999/xhtml">hi</div></foreignObject><rect width="10" height="10"/></svg>`,
    ],
    [
      'an external entity',
      `<?xml version="1.0"?><!DOCTYPE svg [<!ENTITY x SYSTEM "file:///etc/passwd">]><svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><text>&x;</text><rect width="10" height="10"/></svg>`,
    ],
    [
      'an external image link',
      `<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" viewBox="0 0 10 10"><image xlink:href="http://evil.test/x.png"/><rect width="10" height="10"/></svg>`,
    ],
    ['not SVG at all', `<html><body>hi</body></html>`],
  ];
  it.each(bad)('when the SVG has %s, then it is refused with a clear message and nothing is stored (ASVS 1.3.4, 1.5.1)', async (_label, svg) => {
    const rows = motifRows();
    const res = await upload(a, svg);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toMatch(/^motif_/);
    expect(res.body.error.message.length).toBeGreaterThan(10);
    expect(motifRows()).toBe(rows);
  });

  it('when an SVG is over the size cap, then 413', async () => {
    const res = await upload(a, `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 10 10"><!--${'x'.repeat(600 * 1024)}--><rect width="10" height="10"/></svg>`);
    expect(res.status).toBe(413);
  });

  it("when seller B asks for seller A's motif by id, then 404 on every route; guests cannot see an unpublished motif", async () => {
    const m = (await upload(a, TWO_LAYER_SVG)).body.motif;
    expect((await b.get(`/api/motifs/${m.id}`)).status).toBe(404);
    expect((await b.delete(`/api/motifs/${m.id}`)).status).toBe(404);
    expect((await b.get(`/api/motifs/${m.id}/svg`)).status).toBe(404);
    expect((await request(t.app).get(`/api/motifs/${m.id}/svg`)).status).toBe(404);
    expect((await b.get('/api/motifs')).body.motifs.map((x: { id: string }) => x.id)).not.toContain(m.id);
    expect((await admin.get(`/api/motifs/${m.id}/svg`)).status).toBe(200);
    expect((await a.get(`/api/motifs/${m.id}`)).body.motif.geometry.layers).toHaveLength(2);
  });

  it('when a motif is offered by a live listing, then anyone can fetch its SVG, and it cannot be deleted', async () => {
    const l = await liveListing(t, a, admin);
    const page = await request(t.app).get(`/api/listings/${l.slug}`);
    const motifId = page.body.motifs[0].id;
    expect((await request(t.app).get(`/api/motifs/${motifId}/svg`)).status).toBe(200);
    expect((await a.delete(`/api/motifs/${motifId}`)).status).toBe(409);
  });
});

describe('uploads dir', () => {
  it('holds only our random names', () => {
    for (const f of filesOnDisk()) expect(f).toMatch(/^[a-f0-9]{32}(-t)?\.(webp|jpg)$/);
    expect(path.basename(t.env.uploadsDir)).toBe('uploads');
  });
});
