// The browser lays names out itself; its outlines must be the server's, byte for byte. This runs
// the personaliser's own loader (src/features/personaliser/lib/font-registry.ts) over the font
// files the server serves, with fontkit's *browser* build (what Vite bundles), and compares with
// POST /api/layout/text for the same input.
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { at } from '../support/at.ts';

// @ts-expect-error -- fontkit's browser build ships no types of its own (the package's types cover it)
vi.mock('fontkit', async () => await import('../../node_modules/fontkit/dist/browser-module.mjs'));

const { makeTestApp } = await import('../factories/app.ts');
const { loadClientRegistry } = await import('../../src/features/personaliser/lib/font-registry.ts');
const { layoutText } = await import('../../shared/engine/text-layout.ts');
const { fontListSchema } = await import('../../shared/schemas/engine.ts');

let t: Awaited<ReturnType<typeof makeTestApp>>;
let server: http.Server;
let base = '';

beforeAll(async () => {
  t = await makeTestApp();
  server = http.createServer(t.app);
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await new Promise((r) => server.close(r));
  await t.close();
});

const cases: Array<{ text: string; fontId: string; letterHeightMm: number }> = [
  { text: 'Zoë', fontId: 'baloo-bold', letterHeightMm: 50 },
  { text: 'Bartholomew', fontId: 'dancing-script-bold', letterHeightMm: 37.125 },
  { text: 'Łukasz Ørjan', fontId: 'bitter-bold', letterHeightMm: 22 },
  { text: 'Anouk', fontId: 'bebas-neue', letterHeightMm: 60 },
  { text: 'Priya', fontId: 'patrick-hand', letterHeightMm: 18.5 },
  { text: 'Theo & Kai', fontId: 'bangers', letterHeightMm: 40 },
  { text: 'Mira 美咲', fontId: 'baloo-bold', letterHeightMm: 30 },
];

describe('client layout = server layout', () => {
  it('when the browser build of the engine lays out a name from the served font bytes, then its path, size and missing characters equal POST /api/layout/text', async () => {
    // the engine really runs on fontkit's browser build here
    // @ts-expect-error -- untyped browser build, see above
    const browserBuild = await import('../../node_modules/fontkit/dist/browser-module.mjs');
    expect((await import('fontkit')).create).toBe(browserBuild.create);
    const fonts = fontListSchema.parse((await request(t.app).get('/api/fonts').expect(200)).body);
    let fetched = 0;
    const fetchBytes = async (url: string) => {
      fetched += 1;
      return new Uint8Array(await (await fetch(base + url)).arrayBuffer());
    };
    const { registry } = await loadClientRegistry(
      fonts,
      fonts.map((f) => f.id),
      fetchBytes,
    );
    for (const c of cases) {
      const server = (await request(t.app).post('/api/layout/text').send(c).expect(200)).body;
      const client = layoutText(registry, c, { cache: false });
      expect(client.path, `${c.text} in ${c.fontId}`).toBe(server.path);
      expect(client.path.length).toBeGreaterThan(100);
      expect(client.widthMm).toBe(server.widthMm);
      expect(client.heightMm).toBe(server.heightMm);
      expect(client.missing).toEqual(server.missing);
    }
    // the CJK name is not in these display fonts: both sides name the same characters
    expect(layoutText(registry, at(cases, 6)).missing).toEqual(['美', '咲']);
    // each font file is fetched once, however many registries ask for it
    await loadClientRegistry(
      fonts,
      fonts.map((f) => f.id),
      fetchBytes,
    );
    expect(fetched).toBe(fonts.length);
  });

  it('when the font list says which characters a font draws, then it matches the cmap the client parsed', async () => {
    const fonts = fontListSchema.parse((await request(t.app).get('/api/fonts').expect(200)).body);
    const { registry } = await loadClientRegistry(fonts, ['baloo-bold'], async (url) => new Uint8Array(await (await fetch(base + url)).arrayBuffer()));
    expect(registry.require('baloo-bold').characters).toBe(fonts.find((f) => f.id === 'baloo-bold')!.characters);
  });
});
