import request, { type Agent } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cToF } from '../../shared/units.ts';
import { makeTestApp, type TestApp } from '../factories/app.ts';
import { createListing, makeMaterial } from './listings.fixtures.ts';

let t: TestApp;
let a: Agent;
let b: Agent;
beforeAll(async () => {
  t = await makeTestApp();
  [a, b] = await Promise.all([t.signIn((await t.makeSeller()).email), t.signIn((await t.makeSeller()).email)]);
});
afterAll(async () => t.close());

describe('materials', () => {
  // The press defaults (DEVELOPERS.md, "Pressing"; from memory / common practice): reproduced exactly
  it.each([
    ['smooth', { handheld: { tempC: 157, timeS: 30 }, clamshell: { tempC: 155, timeS: 10 }, tackS: 2, peel: 'hot', topOnly: false, coolS: 0 }],
    ['glitter', { handheld: { tempC: 160, timeS: 30 }, clamshell: { tempC: 160, timeS: 15 }, tackS: 5, peel: 'hot or cold', topOnly: true, coolS: 0 }],
    ['flock', { handheld: { tempC: 160, timeS: 30 }, clamshell: { tempC: 160, timeS: 15 }, tackS: 5, peel: 'hot', topOnly: true, coolS: 0 }],
    ['metallic', { handheld: { tempC: 150, timeS: 25 }, clamshell: { tempC: 150, timeS: 10 }, tackS: 2, peel: 'cold', topOnly: true, coolS: 30 }],
    ['patterned', { handheld: { tempC: 155, timeS: 30 }, clamshell: { tempC: 155, timeS: 10 }, tackS: 2, peel: 'warm', topOnly: true, coolS: 10 }],
  ])('when a %s material is added without a press profile, then the default row for its kind is filled in (°C stored)', async (kind, profile) => {
    const m = await makeMaterial(a, { kind });
    expect(m.pressProfile).toEqual(profile);
  });

  it('when 160 °C is stored, then it is 320 °F exactly (NIST SP 811 B.9)', async () => {
    const m = await makeMaterial(a, { kind: 'glitter' });
    expect(cToF(m.pressProfile.clamshell.tempC)).toBe(320);
  });

  it('when the seller edits the press profile and stock, then the change is kept and low stock is flagged', async () => {
    const m = await makeMaterial(a, { rollWidthMm: 381 });
    const profile = { ...m.pressProfile, clamshell: { tempC: 150, timeS: 12 } };
    const res = await a.patch(`/api/materials/${m.id}`).send({ pressProfile: profile, stockMm: 500 });
    expect(res.status).toBe(200);
    expect(res.body.material.pressProfile.clamshell).toEqual({ tempC: 150, timeS: 12 });
    expect(res.body.material).toMatchObject({ stockMm: 500, lowStock: true, rollWidthMm: 381 });
  });

  it('when the input is bad, then 400 with a message per field', async () => {
    const res = await a.post('/api/materials').send({ kind: 'vinyl', colourName: '', colourHex: 'navy', rollWidthMm: -1, stockMm: 'lots' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['colourHex', 'colourName', 'kind', 'rollWidthMm', 'stockMm']);
  });

  it("when seller B uses seller A's material id on every route, then 404 and A's material is unchanged", async () => {
    const m = await makeMaterial(a, { colourName: 'Secret teal' });
    for (const res of await Promise.all([b.get(`/api/materials/${m.id}`), b.patch(`/api/materials/${m.id}`).send({ colourName: 'Stolen' }), b.delete(`/api/materials/${m.id}`)]))
      expect(res.status).toBe(404);
    expect((await b.get('/api/materials')).body.items.map((x: { id: string }) => x.id)).not.toContain(m.id);
    expect((await a.get(`/api/materials/${m.id}`)).body.material.colourName).toBe('Secret teal');
  });

  it('when a material is used by a listing, then delete is refused (archive instead); an unused one is deleted', async () => {
    await createListing(a);
    const listed = await a.get('/api/seller/listings');
    const usedId = listed.body.items[0].draft.personalisation.textFields[0].colourChoices[0];
    expect((await a.delete(`/api/materials/${usedId}`)).status).toBe(409);
    const spare = await makeMaterial(a, { colourName: 'Spare' });
    expect((await a.delete(`/api/materials/${spare.id}`)).status).toBe(200);
    expect((await a.get(`/api/materials/${spare.id}`)).status).toBe(404);
  });

  it('when a guest or a shopper asks, then 401 / 403', async () => {
    expect((await request(t.app).get('/api/materials')).status).toBe(401);
    const shopper = await t.signIn((await t.makeUser('shopper')).email);
    expect((await shopper.get('/api/materials')).status).toBe(403);
  });
});
