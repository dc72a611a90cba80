// Helpers for the catalogue tests: a seller's materials, a two-layer motif and a listing, made
// through the real API routes (so every helper also exercises the routes it relies on).
import type { Agent } from 'supertest';
import type { ListingInput } from '../../shared/schemas/listing.ts';
import type { TestApp } from '../factories/app.ts';

export const TWO_LAYER_SVG = `<svg xmlns="http://www.w3.org/2000/svg" width="60mm" height="40mm" viewBox="0 0 60 40">
  <g id="base" fill="#2f7d6d"><rect x="0" y="0" width="60" height="40" rx="4"/></g>
  <g id="star" fill="#e0a526"><path d="M30 5 L36 20 L52 20 L39 29 L44 38 L30 31 L16 38 L21 29 L8 20 L24 20 Z"/></g>
</svg>`;

export async function makeMaterial(agent: Agent, body: Record<string, unknown> = {}) {
  const res = await agent.post('/api/materials').send({ kind: 'smooth', colourName: 'Ink navy', colourHex: '#1F2A44', rollWidthMm: 305, stockMm: 5000, ...body });
  if (res.status !== 201) throw new Error(`material: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.material as { id: string; kind: string; pressProfile: { clamshell: { tempC: number; timeS: number } } };
}

export async function makeMotif(agent: Agent, svg = TWO_LAYER_SVG, name = 'Star badge') {
  const res = await agent.post('/api/motifs').field('name', name).attach('file', Buffer.from(svg), { filename: 'star.svg', contentType: 'image/svg+xml' });
  if (res.status !== 201) throw new Error(`motif: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.motif as { id: string; layers: { id: string }[] };
}

/** A valid listing body for the seller, with a name field and the two-layer motif. */
export async function listingBody(agent: Agent, over: Partial<ListingInput> = {}): Promise<ListingInput> {
  const navy = await makeMaterial(agent);
  const gold = await makeMaterial(agent, { kind: 'glitter', colourName: 'Gold glitter', colourHex: '#d4a53a' });
  const motif = await makeMotif(agent);
  return {
    title: 'Star name tote',
    description: 'A tote with a star and a name.',
    blank: { kind: 'tote' },
    basePriceMinor: 2000,
    extraLayerPriceMinor: 300,
    occasions: ['birthday'],
    personalisation: {
      textFields: [{ id: 'name', label: 'Name', maxLength: 12, fontIds: ['baloo-bold', 'dancing-script-bold'], defaultLetterHeightMm: 40, required: true, colourChoices: [navy.id, gold.id] }],
      motifChoices: [
        {
          motifId: motif.id,
          label: 'Star',
          layers: [
            { layerId: 'base', mode: 'fixed', materialId: navy.id },
            { layerId: 'star', mode: 'shopper', colourChoices: [gold.id] },
          ],
        },
      ],
      motifRequired: false,
      outline: null,
    },
    ...over,
  };
}

export async function createListing(agent: Agent, over: Partial<ListingInput> = {}) {
  const res = await agent.post('/api/seller/listings').send(await listingBody(agent, over));
  if (res.status !== 201) throw new Error(`listing: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.listing as { id: string; slug: string; state: string };
}

/** The revision the moderation desk shows for a listing waiting for review. */
export async function shownRevision(admin: Agent, id: string): Promise<number> {
  const res = await admin.get(`/api/moderation/listings/${id}`);
  if (res.status !== 200) throw new Error(`review: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.listing.revision as number;
}

/** Approves (or rejects, with a reason) the revision the desk shows, as a moderator does. */
export async function decide(admin: Agent, id: string, reason?: string) {
  const revision = await shownRevision(admin, id);
  return reason === undefined ? admin.post(`/api/moderation/listings/${id}/approve`).send({ revision }) : admin.post(`/api/moderation/listings/${id}/reject`).send({ revision, reason });
}

/** Creates, submits and approves a listing: it is live afterwards. */
export async function liveListing(t: TestApp, agent: Agent, admin: Agent, over: Partial<ListingInput> = {}) {
  const l = await createListing(agent, over);
  const s = await agent.post(`/api/seller/listings/${l.id}/submit`).send({});
  if (s.status !== 200) throw new Error(`submit: ${s.status}`);
  const a = await decide(admin, l.id);
  if (a.status !== 200) throw new Error(`approve: ${a.status} ${JSON.stringify(a.body)}`);
  void t;
  return l;
}
