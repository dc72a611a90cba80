// The workroom API on the seeded demo (a fresh database for this file): Fern & Fable Goods has
// paid lines from dana@; Little Comet Print Co. has none of them. Each test uses its own lines.

import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { cutSheets, ledger, lineVersions, materials, orderLines, orders } from '../../server/db/schema.ts';
import type { ShipTo } from '../../shared/schemas/checkout.ts';
import type { MarkCutResult, Proof, WorkLine, WorkSheet } from '../../shared/schemas/workroom.ts';
import { eventually, makeTestApp, type TestApp } from '../factories/app.ts';

const DEMO = 'namesake-demo';
let t: TestApp;
let fern: Awaited<ReturnType<TestApp['signIn']>>;
let comet: Awaited<ReturnType<TestApp['signIn']>>;
let dana: Awaited<ReturnType<TestApp['signIn']>>;

beforeAll(async () => {
  t = await makeTestApp({ seed: true });
  fern = await t.signIn('fern@namesake.test', DEMO);
  comet = await t.signIn('comet@namesake.test', DEMO);
  dana = await t.signIn('dana@namesake.test', DEMO);
}, 60_000);
afterAll(async () => t?.close());

/** every line of Fern's (in one state), page after page */
async function lines(state?: string): Promise<WorkLine[]> {
  const out: WorkLine[] = [];
  for (let page = 1; ; page++) {
    const res = await fern.get('/api/workroom/lines').query({ page, limit: 100, ...(state ? { state } : {}) });
    expect(res.status).toBe(200);
    out.push(...(res.body.items as WorkLine[]));
    if (out.length >= res.body.total || res.body.items.length === 0) return out;
  }
}
const byText = async (text: string, state?: string) => {
  const l = (await lines(state)).find((x) => x.text === text);
  if (!l) throw new Error(`no line ${text}`);
  return l;
};
const stockOf = (id: string) => t.db.select().from(materials).where(eq(materials.id, id)).get()!.stockMm;

describe('demo data', () => {
  test("when the demo is seeded, then Fern has a Saturday's run: ≥ 40 approved lines over ≥ 4 materials, some awaiting proof, with 8 % fees", async () => {
    const all = await lines();
    const approved = all.filter((l) => l.state === 'approved');
    expect(approved.length).toBeGreaterThanOrEqual(40);
    expect(all.some((l) => l.state === 'awaiting_proof')).toBe(true);
    expect(new Set(approved.flatMap((l) => l.materials.map((m) => m.id))).size).toBeGreaterThanOrEqual(4);
    // every material kind the shop stocks is in the run (the cut sheets and the press run see them all)
    expect(new Set(approved.flatMap((l) => l.materials.map((m) => m.kind)))).toEqual(new Set(['smooth', 'glitter', 'flock', 'metallic']));
    // real geometry from the engine: every line has pieces with path data
    const row = t.db.select().from(orderLines).where(eq(orderLines.id, all[0]!.id)).get()!;
    expect(row.snapshot.geometry.pieces.length).toBeGreaterThan(0);
    for (const o of t.db.select().from(orders).all()) {
      // fee = round(total × 800 / 10000), and the ledger's fee + transfer add up to the charge
      expect(o.platformFeeMinor).toBe(Math.round((o.totalMinor * 800) / 10_000));
      const rows = t.db.select().from(ledger).where(eq(ledger.orderId, o.id)).all();
      const sum = (k: string) => rows.filter((r) => r.kind === k).reduce((a, r) => a + r.amountMinor, 0);
      expect(sum('charge')).toBe(o.totalMinor);
      expect(sum('platform_fee') + sum('transfer')).toBe(o.totalMinor);
    }
  });
});

describe('access', () => {
  test("when another shop's seller names Fern's lines, then every route answers 404 and nothing is made", async () => {
    const approved = await lines('approved');
    const ids = approved.map((l) => l.id);
    const before = t.db.select().from(cutSheets).all().length;
    const built = await comet.post('/api/workroom/cut-sheets').send({ lineIds: ids });
    expect(built.status).toBe(404);
    expect(JSON.stringify(built.body)).not.toMatch(/NS-|Fern|Theo|Kai/);
    expect(t.db.select().from(cutSheets).all().length).toBe(before);
    expect((await comet.get(`/api/workroom/lines/${ids[0]}/proof`)).status).toBe(404);
    expect((await comet.post(`/api/workroom/lines/${ids[0]}/approve`)).status).toBe(404);
    expect((await comet.get(`/api/workroom/orders/${approved[0]!.orderId}`)).status).toBe(404);
    expect((await comet.post(`/api/workroom/orders/${approved[0]!.orderId}/ship`).send({ carrier: 'UPS', trackingNumber: '1Z999' })).status).toBe(404);
    // comet's own list holds none of them
    const theirs = await comet.get('/api/workroom/lines');
    expect(theirs.body.items.map((l: WorkLine) => l.id)).not.toContain(ids[0]);
    // a sheet of Fern's, asked for by Comet
    const mine = await fern.post('/api/workroom/cut-sheets').send({ lineIds: [ids[0]] });
    expect(mine.status).toBe(201);
    const sheet = mine.body.sheets[0] as WorkSheet;
    expect((await comet.get(sheet.svgUrl)).status).toBe(404);
    expect((await comet.post(`/api/workroom/cut-sheets/${sheet.id}/cut`)).status).toBe(404);
    expect((await comet.post(`/api/workroom/batches/${mine.body.batchId}/worksheet`).send({ paper: 'A4' })).status).toBe(404);
    expect((await comet.post(`/api/workroom/batches/${mine.body.batchId}/discard`)).status).toBe(404);
    // Fern's own discard puts the line back to approved for the tests below
    expect((await fern.post(`/api/workroom/batches/${mine.body.batchId}/discard`)).status).toBe(200);
    // an own id mixed with one that is not Fern's: still 404, nothing made
    const count = t.db.select().from(cutSheets).all().length;
    expect((await fern.post('/api/workroom/cut-sheets').send({ lineIds: [ids[1], 'someone-elses-line'] })).status).toBe(404);
    expect(t.db.select().from(cutSheets).all().length).toBe(count);
  });

  test('when a shopper or a guest calls the workroom, then 403 / 401', async () => {
    expect((await dana.get('/api/workroom/summary')).status).toBe(403);
    expect((await (await import('supertest')).default(t.app).get('/api/workroom/summary')).status).toBe(401);
  });
});

describe('proofs and states', () => {
  test('when a proof is shown, then the text comes letter by letter with code points and the engine warnings', async () => {
    const zoe = (await lines('awaiting_proof')).find((l) => l.text.normalize('NFC') === 'Zoë')!;
    const res = await fern.get(`/api/workroom/lines/${zoe.id}/proof`);
    expect(res.status).toBe(200);
    const p = res.body.proof as Proof;
    // "Zoe" + U+0308 COMBINING DIAERESIS (Unicode 15, ch. 2.11 combining characters): four code points, not three
    expect(p.texts[0]!.chars.map((c) => c.codePoints[0])).toEqual(['U+005A', 'U+006F', 'U+0065', 'U+0308']);
    expect(p.texts[0]!.chars[3]!.name).toBe('combining diaeresis');
    expect(p.warnings.map((w) => w.code)).toContain('combining_marks');
    const mira = (await lines('awaiting_proof')).find((l) => l.text === 'mIRA')!;
    const pm = (await fern.get(`/api/workroom/lines/${mira.id}/proof`)).body.proof as Proof;
    expect(pm.warnings.map((w) => w.code)).toContain('mixed_case');
    expect(pm.snapshot.geometry.pieces.length).toBeGreaterThan(0);
    expect(pm.blank.printArea.widthMm).toBe(pm.snapshot.blank.widthMm);
  });

  test('when lines are moved out of order, then 409 and the state stays', async () => {
    const approved = await byText('Leon', 'approved');
    // each refusal names the order and the state the line is in
    const again = await fern.post(`/api/workroom/lines/${approved.id}/approve`);
    expect(again.status).toBe(409);
    expect(again.body.error.message).toBe(`Only proofs waiting for a check can be approved: ${approved.orderNumber} (approved).`);
    const pressed = await fern.post(`/api/workroom/lines/${approved.id}/pressed`);
    expect(pressed.status).toBe(409);
    expect(pressed.body.error.message).toBe(`Only cut items can be marked pressed: ${approved.orderNumber} (approved).`);
    const change = await fern.post(`/api/workroom/lines/${approved.id}/request-change`).send({ message: 'Is the spelling right?' });
    expect(change.status).toBe(409);
    expect(change.body.error.message).toBe(`Only proofs waiting for a check can be sent back for a change: ${approved.orderNumber} (approved).`);
    const waiting = (await lines('awaiting_proof'))[0]!;
    const cut = await fern.post('/api/workroom/cut-sheets').send({ lineIds: [waiting.id] });
    expect(cut.status).toBe(409);
    expect(cut.body.error.code).toBe('wrong_state');
    const ship = await fern.post(`/api/workroom/orders/${approved.orderId}/ship`).send({ carrier: 'UPS', trackingNumber: '1Z999AA1' });
    expect(ship.status).toBe(409);
    expect(t.db.select().from(orderLines).where(eq(orderLines.id, approved.id)).get()!.state).toBe('approved');
    const bad = await fern.post(`/api/workroom/lines/${waiting.id}/request-change`).send({ message: '' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.message).toBeTruthy();
  });

  test('when a change is requested, then the shopper is e-mailed a link, edits, and the line comes back with every version kept', async () => {
    const line = (await lines('awaiting_proof')).find((l) => l.text === 'mIRA')!;
    const req = await fern.post(`/api/workroom/lines/${line.id}/request-change`).send({ message: 'Is it Mira? The capitals look mixed up.' });
    expect(req.status).toBe(200);
    expect(req.body.line.state).toBe('changes_requested');
    const mail = await eventually(async () => (await t.mailTo('dana@namesake.test')).find((m) => /check your personalisation/.test(m.subject)));
    expect(mail.text).toContain('Is it Mira? The capitals look mixed up.');
    expect(mail.text).toContain(`/orders/${line.orderId}`);

    // someone else can't see or edit it
    const stranger = await t.makeUser('shopper');
    const other = await t.signIn(stranger.email);
    expect((await other.get(`/api/order-lines/${line.id}/personalisation`)).status).toBe(404);

    const form = await dana.get(`/api/order-lines/${line.id}/personalisation`);
    expect(form.status).toBe(200);
    expect(form.body.editable).toBe(true);
    expect(form.body.changeRequest).toContain('Is it Mira?');
    const choices = form.body.choices;
    // the listing's own rule: at most 12 characters
    const tooLong = await dana.put(`/api/order-lines/${line.id}/personalisation`).send({ choices: { ...choices, texts: { name: { ...choices.texts.name, text: 'Bartholomew-Jones' } } } });
    expect(tooLong.status).toBe(400);
    expect(tooLong.body.error.fields['choices.texts.name.text']).toMatch(/12/);

    const saved = await dana.put(`/api/order-lines/${line.id}/personalisation`).send({ choices: { ...choices, texts: { name: { ...choices.texts.name, text: 'Mira' } } } });
    expect(saved.status).toBe(200);
    const row = t.db.select().from(orderLines).where(eq(orderLines.id, line.id)).get()!;
    expect(row.state).toBe('awaiting_proof');
    expect(row.version).toBe(2);
    const versions = t.db
      .select()
      .from(lineVersions)
      .where(eq(lineVersions.lineId, line.id))
      .all()
      .sort((a, b) => a.version - b.version);
    expect(versions.map((v) => v.snapshot.choices.texts.name!.text)).toEqual(['mIRA', 'Mira']);
    // the geometry was composed again by the engine: the name's outline changed
    const v1 = versions[0]!.snapshot;
    const v2 = versions[1]!.snapshot;
    expect(v2.geometry.pieces.map((p) => p.d)).not.toEqual(v1.geometry.pieces.map((p) => p.d));
    expect(v2.unitPriceMinor).toBe(v1.unitPriceMinor);
    // a second edit is refused now that it waits for the shop again
    expect((await dana.put(`/api/order-lines/${line.id}/personalisation`).send({ choices })).status).toBe(409);
    const proof = (await fern.get(`/api/workroom/lines/${line.id}/proof`)).body.proof as Proof;
    expect(proof.versions.map((v) => v.version)).toEqual([1, 2]);
    expect(proof.warnings.map((w) => w.code)).not.toContain('mixed_case');
    // the order's timeline names who did what
    const order = (await fern.get(`/api/workroom/orders/${line.orderId}`)).body.order;
    const mine = order.timeline.filter((e: { lineId: string }) => e.lineId === line.id);
    expect(mine.map((e: { toState: string }) => e.toState)).toEqual(['awaiting_proof', 'changes_requested', 'awaiting_proof']);
    expect(mine[1].actorName).toBe('Fern Okafor');
    expect(mine[2].actorName).toBe('Dana Whitlock');
  });

  test('when several proofs are approved at once, then all move (or none when one is not waiting)', async () => {
    const waiting = (await lines('awaiting_proof')).filter((l) => l.text !== 'Mira');
    const approvedOne = (await lines('approved'))[0]!;
    const mixed = await fern.post('/api/workroom/proofs/approve').send({ lineIds: [...waiting.map((l) => l.id), approvedOne.id] });
    expect(mixed.status).toBe(409);
    for (const l of waiting) expect(t.db.select().from(orderLines).where(eq(orderLines.id, l.id)).get()!.state).toBe('awaiting_proof');
    const ok = await fern.post('/api/workroom/proofs/approve').send({ lineIds: waiting.map((l) => l.id) });
    expect(ok.status).toBe(200);
    expect(ok.body.lines.every((l: WorkLine) => l.state === 'approved')).toBe(true);
  });
});

describe('cut sheets, stock, pressing and shipping', () => {
  test('when sheets are built and cut, then stock drops by length + 25 mm per sheet and lines move to cut', async () => {
    const chosen = (await lines('approved')).filter((l) => ['Anouk', 'Priya'].includes(l.text));
    expect(chosen.length).toBe(2);
    const res = await fern.post('/api/workroom/cut-sheets').send({ lineIds: chosen.map((l) => l.id) });
    expect(res.status).toBe(201);
    const sheets = res.body.sheets as WorkSheet[];
    // one sheet per material the two lines use
    expect(new Set(sheets.map((s) => s.material.id)).size).toBe(sheets.length);
    expect(new Set(sheets.map((s) => s.material.id))).toEqual(new Set(chosen.flatMap((l) => l.materials.map((m) => m.id))));
    for (const s of sheets) {
      expect(s.utilisation).toBeGreaterThan(0);
      expect(s.utilisation).toBeLessThanOrEqual(1);
      for (const p of s.pieces) {
        expect(p.xMm).toBeGreaterThanOrEqual(6 - 1e-9); // 6 mm margin (from memory, no published source)
        expect(p.xMm + p.widthMm).toBeLessThanOrEqual(s.rollWidthMm - 6 + 1e-9);
      }
    }
    const svg = await fern.get(sheets[0]!.svgUrl);
    expect(svg.status).toBe(200);
    expect(svg.headers['content-type']).toMatch(/^image\/svg\+xml/);
    // real units: width in mm equal to the roll (W3C CSS Values: absolute lengths)
    expect(String(svg.text ?? svg.body)).toContain(`width="${sheets[0]!.rollWidthMm}mm"`);

    const before = new Map(sheets.map((s) => [s.material.id, stockOf(s.material.id)]));
    // one sheet first: lines stay approved while their other sheets wait
    const one = await fern.post(`/api/workroom/cut-sheets/${sheets[0]!.id}/cut`);
    expect(one.status).toBe(200);
    expect(stockOf(sheets[0]!.material.id)).toBeCloseTo(before.get(sheets[0]!.material.id)! - (sheets[0]!.lengthMm + 25), 6);
    if (sheets.length > 1) expect((one.body as MarkCutResult).linesCut).toEqual([]);
    const all = await fern.post(`/api/workroom/batches/${res.body.batchId}/cut`);
    expect(all.status).toBe(200);
    for (const s of sheets) expect(stockOf(s.material.id)).toBeCloseTo(before.get(s.material.id)! - (s.lengthMm + 25), 6);
    expect(new Set((all.body as MarkCutResult).linesCut)).toEqual(new Set(chosen.map((l) => l.id)));
    expect((await fern.post(`/api/workroom/batches/${res.body.batchId}/cut`)).status).toBe(409);
    const stock = (await fern.get('/api/workroom/stock')).body;
    const used = stock.sheets.items.find((x: { id: string }) => x.id === sheets[0]!.id);
    expect(used.consumedMm).toBeCloseTo(sheets[0]!.lengthMm + 25, 6);
  });

  test('when a roll is shorter than the sheet, then stock stops at 0 and the cut warns "short"; under the mark warns "low"', async () => {
    const line = await byText('Bartholomew', 'approved');
    const res = await fern.post('/api/workroom/cut-sheets').send({ lineIds: [line.id] });
    const sheets = res.body.sheets as WorkSheet[];
    const [a, b] = sheets;
    t.db.update(materials).set({ stockMm: 10, lowStockMm: 1000 }).where(eq(materials.id, a!.material.id)).run();
    t.db
      .update(materials)
      .set({ stockMm: a!.material.id === b!.material.id ? 10 : b!.lengthMm + 25 + 500, lowStockMm: 1000 })
      .where(eq(materials.id, b!.material.id))
      .run();
    const cut = (await fern.post(`/api/workroom/batches/${res.body.batchId}/cut`)).body as MarkCutResult;
    expect(stockOf(a!.material.id)).toBe(0);
    expect(cut.warnings.find((w) => w.materialId === a!.material.id)?.level).toBe('short');
    expect(cut.warnings.find((w) => w.materialId === b!.material.id)?.level).toBe('low');
    expect(stockOf(b!.material.id)).toBeCloseTo(500, 6);
  });

  test('when an order has a parcel address, then the seller and the shopper both see it on the order', async () => {
    const theo = await byText('Theo', 'approved');
    const shipTo = { name: 'Dana Field', line1: '12 Acorn Lane', line2: null, city: 'Harbourtown', postalCode: 'HT1 2AB', state: null, country: 'GB' };
    const before = t.db.select().from(orders).where(eq(orders.id, theo.orderId)).get()!.shipTo;
    t.db.update(orders).set({ shipTo }).where(eq(orders.id, theo.orderId)).run();
    try {
      expect((await fern.get(`/api/workroom/orders/${theo.orderId}`)).body.order.shipTo).toEqual(shipTo);
      expect((await dana.get(`/api/orders/${theo.orderId}`)).body.shipTo).toEqual(shipTo);
      // a malformed stored value is shown as "no address", never passed through
      // (written around the column's type on purpose: rows from before the schema, or edited by hand)
      t.db
        .update(orders)
        .set({ shipTo: { line1: '<script>' } as unknown as ShipTo })
        .where(eq(orders.id, theo.orderId))
        .run();
      expect((await fern.get(`/api/workroom/orders/${theo.orderId}`)).body.order.shipTo).toBeNull();
    } finally {
      t.db.update(orders).set({ shipTo: before }).where(eq(orders.id, theo.orderId)).run();
    }
  });

  test('when every item is pressed and tracking is entered, then the lines ship and the shopper is e-mailed the tracking number', async () => {
    const theo = await byText('Theo', 'approved');
    const order = (await fern.get(`/api/workroom/orders/${theo.orderId}`)).body.order;
    const ids = order.lines.map((l: WorkLine) => l.id);
    const built = await fern.post('/api/workroom/cut-sheets').send({ lineIds: ids });
    await fern.post(`/api/workroom/batches/${built.body.batchId}/cut`);
    const card = await fern.get(`/api/workroom/lines/${theo.id}/press-card`);
    expect(card.status).toBe(200);
    expect(card.body.card.pressType).toBe('clamshell'); // Fern's press type in the demo
    expect(card.body.card.layers.length).toBe(theo.materials.length);
    expect((await fern.post(`/api/workroom/orders/${theo.orderId}/ship`).send({ carrier: 'UPS', trackingNumber: '1Z999AA10123456784' })).status).toBe(409);
    expect((await fern.post('/api/workroom/pressed').send({ lineIds: ids })).status).toBe(200);
    const badTracking = await fern.post(`/api/workroom/orders/${theo.orderId}/ship`).send({ carrier: 'UPS', trackingNumber: '<b>' });
    expect(badTracking.status).toBe(400);
    const shipped = await fern.post(`/api/workroom/orders/${theo.orderId}/ship`).send({ carrier: 'UPS', trackingNumber: '1Z999AA10123456784' });
    expect(shipped.status).toBe(200);
    expect(shipped.body.order.lines.every((l: WorkLine) => l.state === 'shipped')).toBe(true);
    const mail = await eventually(async () => (await t.mailTo('dana@namesake.test')).find((m) => m.subject.includes(order.number) && /shipped/.test(m.subject)));
    expect(mail.text).toContain('1Z999AA10123456784');
    expect(mail.text).toContain('UPS');
    const mine = await dana.get(`/api/orders/${theo.orderId}`);
    expect(mine.body.trackingNumber).toBe('1Z999AA10123456784');
    expect(mine.body.carrier).toBe('UPS');
  });

  test('when the work sheet is asked for, then a job reports progress and ends with a PDF', async () => {
    const line = (await lines('approved'))[0]!;
    const built = await fern.post('/api/workroom/cut-sheets').send({ lineIds: [line.id] });
    const start = await fern.post(`/api/workroom/batches/${built.body.batchId}/worksheet`).send({ paper: 'Letter' });
    expect(start.status).toBe(202);
    const job = await eventually(async () => {
      const j = (await fern.get(`/api/workroom/worksheets/${start.body.job.id}`)).body.job;
      return j.state === 'done' ? j : null;
    }, 20_000);
    expect(job.progress).toBe(1);
    const file = await fern.get(job.downloadUrl).buffer(true);
    expect(file.headers['content-type']).toBe('application/pdf');
    expect(Buffer.from(file.body).subarray(0, 5).toString()).toBe('%PDF-');
    expect((await comet.get(job.downloadUrl)).status).toBe(404);
  });
});
