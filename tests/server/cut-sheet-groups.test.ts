// Order groups on cut sheets through the API, on the seeded demo (a fresh database for this file).
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import type { WorkLine, WorkSheet } from '../../shared/schemas/workroom.ts';
import { makeTestApp, type TestApp } from '../factories/app.ts';

let t: TestApp;
let fern: Awaited<ReturnType<TestApp['signIn']>>;

beforeAll(async () => {
  t = await makeTestApp({ seed: true });
  fern = await t.signIn('fern@namesake.test', 'namesake-demo');
}, 60_000);
afterAll(async () => t?.close());
const svgOf = async (url: string) => {
  const r = await fern.get(url);
  expect(r.status).toBe(200);
  return String(r.text ?? r.body);
};

describe('order groups', () => {
  test('when a batch keeps each order together, then every sheet has a labelled weeding border per order, its cost in length, and an SVG whose labels are a separate non-cut group', async () => {
    const approved = (await fern.get('/api/workroom/lines').query({ state: 'approved', limit: 100 })).body.items as WorkLine[];
    const orders = [...new Set(approved.map((l) => l.orderNumber))];
    expect(orders.length).toBeGreaterThanOrEqual(2);
    const res = await fern.post('/api/workroom/cut-sheets').send({ lineIds: approved.map((l) => l.id), grouping: 'order' });
    expect(res.status).toBe(201);
    const sheets = res.body.sheets as WorkSheet[];
    for (const s of sheets) {
      expect(s.grouping).toBe('order');
      // one border per order on the sheet, labelled with its order number
      const onSheet = new Set(s.pieces.map((p) => p.orderNumber.split('·')[0]));
      expect(new Set(s.groups.map((g) => g.label))).toEqual(onSheet);
      expect(typeof s.extraLengthMm).toBe('number');
      const svg = await svgOf(s.svgUrl);
      const [cutPart, after] = svg.split('</g>');
      // borders are cuts, in the cut group; labels are text, after it, in their own group
      expect((cutPart!.match(/data-group="/g) ?? []).length).toBe(s.groups.length);
      expect(cutPart).not.toContain('<text');
      expect(after).toContain('<g id="order-labels" data-cut="no"');
      for (const g of s.groups) expect(after).toContain(`>${g.label}</text>`);
      // and the cutter's copy can leave them out
      const bare = await svgOf(`${s.svgUrl}?labels=0`);
      expect(bare).not.toContain('<text');
      expect((bare.match(/data-group="/g) ?? []).length).toBe(s.groups.length);
    }
  });

  test('when the layout choice is not one we offer, then the build is refused with a clear message', async () => {
    const res = await fern.post('/api/workroom/cut-sheets').send({ lineIds: ['x'], grouping: 'shuffle' });
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body.error)).toMatch(/tightest/);
  });
});

describe('placement template', () => {
  test('when a seller asks for a line’s template, then a PDF comes back; another shop’s seller gets 404; a bad paper is refused', async () => {
    const line = ((await fern.get('/api/workroom/lines').query({ limit: 1 })).body.items as WorkLine[])[0]!;
    const res = await fern.get(`/api/workroom/lines/${line.id}/template`).query({ paper: 'Letter' }).buffer(true);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(Buffer.from(res.body).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const comet = await t.signIn('comet@namesake.test', 'namesake-demo');
    expect((await comet.get(`/api/workroom/lines/${line.id}/template`)).status).toBe(404);
    expect((await fern.get(`/api/workroom/lines/${line.id}/template`).query({ paper: 'A3' })).status).toBe(400);
  });
});
