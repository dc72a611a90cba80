// Cut-sheet membership as a line state (`planned`): a line on a built, uncut sheet is not offered
// again, building with it answers 409 naming the batch, and discarding the batch releases it.
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { cutSheets, lineEvents, orderLines } from '../../server/db/schema.ts';
import type { WorkLine } from '../../shared/schemas/workroom.ts';
import { makeTestApp, type TestApp } from '../factories/app.ts';

let t: TestApp;
let fern: Awaited<ReturnType<TestApp['signIn']>>;

beforeAll(async () => {
  t = await makeTestApp({ seed: true });
  fern = await t.signIn('fern@namesake.test', 'namesake-demo');
}, 60_000);
afterAll(async () => t?.close());

const listed = async (state: string): Promise<WorkLine[]> => (await fern.get('/api/workroom/lines').query({ state, limit: 100 })).body.items;
const stateOf = (id: string) => t.db.select().from(orderLines).where(eq(orderLines.id, id)).get()!.state;
const sheetsOfBatch = (batchId: string) => t.db.select().from(cutSheets).where(eq(cutSheets.batchId, batchId)).all();

describe('when approved lines are built onto cut sheets', () => {
  test('then they become planned, leave the approved list, a second build answers 409 naming the batch, and discarding releases them', async () => {
    const [a, b] = await listed('approved');
    expect(a && b).toBeTruthy();
    const built = await fern.post('/api/workroom/cut-sheets').send({ lineIds: [a!.id, b!.id] });
    expect(built.status).toBe(201);
    const batchId = built.body.batchId as string;
    expect(stateOf(a!.id)).toBe('planned');
    expect(stateOf(b!.id)).toBe('planned');
    expect((await listed('approved')).map((l) => l.id)).not.toContain(a!.id);
    expect((await listed('planned')).map((l) => l.id)).toEqual(expect.arrayContaining([a!.id, b!.id]));
    const planEvent = t.db.select().from(lineEvents).where(eq(lineEvents.lineId, a!.id)).all().at(-1)!;
    expect([planEvent.fromState, planEvent.toState]).toEqual(['approved', 'planned']);

    // building again with one of them: refused, naming the order and the batch, nothing made
    const sheetsBefore = t.db.select().from(cutSheets).all().length;
    const again = await fern.post('/api/workroom/cut-sheets').send({ lineIds: [a!.id] });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('already_planned');
    expect(again.body.error.message).toContain(a!.orderNumber);
    expect(again.body.error.message).toContain(batchId.slice(0, 8));
    expect(again.body.error.fields).toEqual({ [`lineIds.${a!.id}`]: batchId });
    expect(t.db.select().from(cutSheets).all().length).toBe(sheetsBefore);

    // discard: sheets gone, both lines approved again and offered again
    const discarded = await fern.post(`/api/workroom/batches/${batchId}/discard`);
    expect(discarded.status).toBe(200);
    expect(new Set(discarded.body.linesReleased)).toEqual(new Set([a!.id, b!.id]));
    expect(sheetsOfBatch(batchId)).toHaveLength(0);
    expect(stateOf(a!.id)).toBe('approved');
    expect((await listed('approved')).map((l) => l.id)).toEqual(expect.arrayContaining([a!.id, b!.id]));
    expect((await fern.post(`/api/workroom/batches/${batchId}/discard`)).status).toBe(404);

    // and they can be built again
    const rebuilt = await fern.post('/api/workroom/cut-sheets').send({ lineIds: [a!.id, b!.id] });
    expect(rebuilt.status).toBe(201);
    expect(stateOf(a!.id)).toBe('planned');
  });

  test('then a batch with a cut sheet cannot be discarded, and its lines move planned → cut when it is cut', async () => {
    const [c] = await listed('approved');
    const built = await fern.post('/api/workroom/cut-sheets').send({ lineIds: [c!.id] });
    expect(built.status).toBe(201);
    const cut = await fern.post(`/api/workroom/cut-sheets/${built.body.sheets[0].id}/cut`);
    expect(cut.status).toBe(200);
    const refused = await fern.post(`/api/workroom/batches/${built.body.batchId}/discard`);
    expect(refused.status).toBe(409);
    expect(sheetsOfBatch(built.body.batchId).length).toBe(built.body.sheets.length);
    await fern.post(`/api/workroom/batches/${built.body.batchId}/cut`);
    expect(stateOf(c!.id)).toBe('cut');
  });

  test('then two builds racing with the same line make one batch, and the other answers 409 naming it', async () => {
    const [d] = await listed('approved');
    const [r1, r2] = await Promise.all([fern.post('/api/workroom/cut-sheets').send({ lineIds: [d!.id] }), fern.post('/api/workroom/cut-sheets').send({ lineIds: [d!.id] })]);
    const ok = [r1, r2].filter((r) => r.status === 201);
    const no = [r1, r2].filter((r) => r.status === 409);
    expect(ok).toHaveLength(1);
    expect(no).toHaveLength(1);
    expect(no[0]!.body.error.message).toContain(ok[0]!.body.batchId.slice(0, 8));
    const batches = new Set(
      t.db
        .select()
        .from(cutSheets)
        .all()
        .filter((s) => s.pieces.some((p) => p.lineId === d!.id))
        .map((s) => s.batchId),
    );
    expect(batches).toEqual(new Set([ok[0]!.body.batchId]));
  });
});

describe('when a press card and a proof are made from a line whose layers do or do not overlap', () => {
  const rect = (x: number, y: number, w: number, h: number) => `M${x} ${y}H${x + w}V${y + h}H${x}Z`;
  test('then overlapping glitter under smooth is named on the proof before cutting, and separate layers are pressed in one step', async () => {
    const [line] = await listed('awaiting_proof');
    const mats = (await fern.get('/api/materials').query({ limit: 100 })).body.items as Array<{ id: string; kind: string; colourName: string }>;
    const glitter = mats.find((m) => m.kind === 'glitter')!;
    const smooth = mats.find((m) => m.kind === 'smooth')!;
    const row = t.db.select().from(orderLines).where(eq(orderLines.id, line!.id)).get()!;
    const withPieces = (pieces: Array<{ d: string; materialId: string }>) =>
      t.db
        .update(orderLines)
        .set({ snapshot: { ...row.snapshot, geometry: { ...row.snapshot.geometry, pieces: pieces.map((p) => ({ ...p, colourHex: '#000000' })) } }, version: row.version + pieces.length })
        .where(eq(orderLines.id, line!.id))
        .run();
    try {
      // glitter first (bottom), smooth over it where the two squares share 10 × 10 mm
      withPieces([
        { d: rect(0, 0, 20, 20), materialId: glitter.id },
        { d: rect(10, 10, 20, 20), materialId: smooth.id },
      ]);
      const proof = (await fern.get(`/api/workroom/lines/${line!.id}/proof`)).body.proof;
      const w = proof.warnings.find((x: { code: string }) => x.code === 'top_only_covered');
      expect(w.message).toContain(`${glitter.colourName} glitter must stay on top`);
      const covered = (await fern.get(`/api/workroom/lines/${line!.id}/press-card`)).body.card;
      expect(covered.groups).toEqual([[glitter.id], [smooth.id]]);

      // the same two squares 20 mm apart: one step, no order warning
      withPieces([
        { d: rect(0, 0, 20, 20), materialId: glitter.id },
        { d: rect(40, 0, 20, 20), materialId: smooth.id },
        { d: rect(40, 30, 5, 5), materialId: smooth.id },
      ]);
      const apart = (await fern.get(`/api/workroom/lines/${line!.id}/press-card`)).body.card;
      expect(apart.groups).toEqual([[glitter.id, smooth.id]]);
      expect(apart.steps.map((s: { kind: string }) => s.kind)).toEqual(['pre_press', 'place', 'final_press']);
      const proof2 = (await fern.get(`/api/workroom/lines/${line!.id}/proof`)).body.proof;
      expect(proof2.warnings.map((x: { code: string }) => x.code)).not.toContain('top_only_covered');
    } finally {
      t.db.update(orderLines).set({ snapshot: row.snapshot, version: row.version }).where(eq(orderLines.id, line!.id)).run();
    }
  });
});
