// Routes mounted in a bare express() app with the real error handler (server/app.ts does not
// mount the engine router yet; the lead mounts it at /api).

import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { engineRouter } from '../../server/features/engine/engine.routes.ts';
import { errorHandler } from '../../server/http/error-handler.ts';
import { fitText } from '../../shared/engine/fit.ts';
import { FONT_CATALOG } from '../../shared/engine/font-catalog.ts';
import { createFontRegistry } from '../../shared/engine/fonts.ts';
import { layoutText } from '../../shared/engine/text-layout.ts';
import { fontListSchema, layoutTextResponseSchema } from '../../shared/schemas/engine.ts';
import { fontBytes, testRegistry } from '../shared/engine/font-fixture.ts';
import { hbAdvanceMm, hbFont } from '../shared/engine/harfbuzz-reference.ts';

function app(opts?: Parameters<typeof engineRouter>[0]) {
  const a = express();
  a.use(express.json());
  a.use('/api', engineRouter(opts));
  a.use(errorHandler);
  return a;
}
const binary = (res: NodeJS.ReadableStream & { setEncoding(e: string): void; on: (...a: never[]) => void }, cb: (e: Error | null, b: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data' as never, ((c: Buffer) => chunks.push(c)) as never);
  res.on('end' as never, (() => cb(null, Buffer.concat(chunks))) as never);
};

describe('engine routes', () => {
  const a = app();

  it('when listing fonts, then each has id, family, kind, licence, characters, min height and a file URL', async () => {
    const res = await request(a).get('/api/fonts').expect(200);
    const fonts = fontListSchema.parse(res.body);
    expect(fonts.map((f) => f.id)).toEqual(FONT_CATALOG.map((f) => f.id));
    for (const f of fonts) {
      expect(f.characters).toContain('Ł');
      expect(f.fileUrl).toMatch(new RegExp(`^/api/fonts/${f.id}/file\\?v=[0-9a-f]{16}$`));
    }
  });

  it('when fetching a font file, then it is the exact TTF the engine uses, as font/ttf with a long cache', async () => {
    const res = await request(a)
      .get('/api/fonts/bitter-bold/file')
      .buffer(true)
      .parse(binary as never)
      .expect(200);
    expect(res.headers['content-type']).toMatch(/^font\/ttf/);
    expect(res.headers['cache-control']).toContain('max-age=31536000');
    expect(Buffer.compare(res.body as Buffer, Buffer.from(fontBytes('bitter-bold')))).toBe(0);
    await request(a).get('/api/fonts/nope/file').expect(400);
  });

  it('when the browser builds its registry from the served bytes, then its layout path equals the server response', async () => {
    const list = (await request(a).get('/api/fonts').expect(200)).body as { id: string; fileUrl: string }[];
    const sources = [];
    for (const f of list) {
      const bin = await request(a)
        .get(f.fileUrl)
        .buffer(true)
        .parse(binary as never)
        .expect(200);
      const entry = FONT_CATALOG.find((c) => c.id === f.id)!;
      sources.push({ ...entry, bytes: new Uint8Array(bin.body as Buffer) });
    }
    const clientReg = createFontRegistry(sources);
    for (const f of list) {
      const server = await request(a).post('/api/layout/text').send({ text: 'Anouk Zoë', fontId: f.id, letterHeightMm: 47.5 }).expect(200);
      expect(layoutText(clientReg, { text: 'Anouk Zoë', fontId: f.id, letterHeightMm: 47.5 }).path).toBe(server.body.path);
    }
  });

  // Reference: HarfBuzz (harfbuzzjs); these strings appear in no other test.
  it('when laying out text over HTTP, then the width agrees with HarfBuzz for unseen strings', async () => {
    for (const [text, fontId] of [
      ['Wilhelmina', 'bangers'],
      ['Ødegård', 'bitter-bold'],
      ['Yvette Tåsen', 'dancing-script-bold'],
      ['Piotr Żak', 'patrick-hand'],
    ] as const) {
      const res = await request(a).post('/api/layout/text').send({ text, fontId, letterHeightMm: 25 }).expect(200);
      const body = layoutTextResponseSchema.parse(res.body);
      const cap = createFontRegistry([{ ...FONT_CATALOG.find((c) => c.id === fontId)!, bytes: fontBytes(fontId) }]).require(fontId).capHeightUnits;
      expect(Math.abs(body.advanceMm - hbAdvanceMm(hbFont(fontBytes(fontId)), text, 25, cap))).toBeLessThan(0.01);
      expect(body.glyphs.map((g) => g.char).join('')).toBe(text);
    }
  });

  it('when text is too long, the font unknown or the height out of range, then 400 with field messages', async () => {
    const long = await request(a)
      .post('/api/layout/text')
      .send({ text: 'x'.repeat(61), fontId: 'bangers', letterHeightMm: 20 })
      .expect(400);
    expect(long.body.error.fields.text).toMatch(/60/);
    const font = await request(a).post('/api/layout/text').send({ text: 'Mira', fontId: 'comic', letterHeightMm: 20 }).expect(400);
    expect(font.body.error.fields.fontId).toBeTruthy();
    const low = await request(a).post('/api/layout/text').send({ text: 'Mira', fontId: 'bangers', letterHeightMm: 4 }).expect(400);
    expect(low.body.error.fields.letterHeightMm).toMatch(/5 and 300/);
    const high = await request(a).post('/api/layout/text').send({ text: 'Mira', fontId: 'bangers', letterHeightMm: 301 }).expect(400);
    expect(high.body.error.fields.letterHeightMm).toBeTruthy();
  });

  it('when the text needs attention, then warnings name the problem (missing characters, mixed case, spaces)', async () => {
    const res = await request(a).post('/api/layout/text').send({ text: ' mIRA 美', fontId: 'bangers', letterHeightMm: 20 }).expect(200);
    const codes = res.body.warnings.map((w: { code: string }) => w.code);
    expect(codes).toEqual(expect.arrayContaining(['extra_spaces', 'mixed_case', 'missing_characters']));
    expect(res.body.missing).toEqual(['美']);
  });

  it('when the text needs attention, then the API words each warning exactly as the engine does for the personaliser', async () => {
    // small script letters, a character the font lacks, odd capitals and a doubled space
    const input = { text: 'mIRA  ☃', fontId: 'dancing-script-bold', letterHeightMm: 8 };
    const res = await request(a).post('/api/layout/text').send(input).expect(200);
    // with room to spare the fit keeps the chosen height, so its warnings are those of the same layout
    const fitted = fitText(testRegistry(), input, { maxWidthMm: 10_000, maxHeightMm: 10_000 });
    expect(fitted.letterHeightMm).toBe(8);
    expect(res.body.warnings.map((w: { code: string }) => w.code)).toEqual(['extra_spaces', 'mixed_case', 'below_min_letter_height', 'missing_characters']);
    expect(res.body.warnings).toEqual(fitted.warnings);
    expect(res.body.warnings.at(-1).message).toContain('U+2603');
  });

  it('when a client sends too many layout requests, then it gets 429 in the error shape', async () => {
    const limited = app({ layoutPerMinute: 3 });
    for (let i = 0; i < 3; i++) await request(limited).post('/api/layout/text').send({ text: 'Kai', fontId: 'bangers', letterHeightMm: 20 }).expect(200);
    const res = await request(limited).post('/api/layout/text').send({ text: 'Kai', fontId: 'bangers', letterHeightMm: 20 }).expect(429);
    expect(res.body.error.code).toBe('rate_limited');
  });
});
