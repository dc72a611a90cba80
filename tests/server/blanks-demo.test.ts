// The demo blanks on a freshly seeded database: Little Comet's tees 2T–10 in three colours, Fern's
// totes in natural and navy, some pairs sold out, one listing whose default colours trip the
// contrast warning, and a long name too small at 4T on the rocket tee but not at size 10.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getFontRegistry } from '../../server/integrations/fonts.ts';
import { contrastWarnings } from '../../shared/engine/contrast.ts';
import { listingDesign } from '../../shared/engine/listing-design.ts';
import { fitBySize } from '../../shared/engine/size-fit.ts';
import { blankChoiceOf } from '../../shared/schemas/blanks.ts';
import type { ListingPage } from '../../shared/schemas/catalog.ts';
import { choicesSchema, layersForChoices } from '../../shared/schemas/listing.ts';
import { makeTestApp, type TestApp } from '../factories/app.ts';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp({ seed: true });
}, 120_000);
afterAll(async () => t?.close());

const page = async (slug: string) => (await request(t.app).get(`/api/listings/${slug}`).expect(200)).body as ListingPage;

describe('demo blanks', () => {
  it('when the rocket tee is opened, then it offers sizes 2T–10 in three colours with some sold out, grey first, and Bartholomew is too small at 4T but fits at 10', async () => {
    const p = await page('rocket-name-tee-for-kids');
    const offer = p.blankOffer!;
    expect(offer.sizes.map((s) => s.label)).toEqual(['2T', '3T', '4T', '5', '6', '8', '10']);
    expect(offer.colours.map((c) => c.name)).toEqual(['Heather grey', 'White', 'Mint green']);
    expect(offer.colours.find((c) => c.id === offer.defaultColourId)!.name).toBe('Heather grey');
    expect(offer.soldOut.length).toBeGreaterThanOrEqual(2);

    const size = (l: string) => offer.sizes.find((s) => s.label === l)!.id;
    const choices = choicesSchema.parse({
      texts: { name: { text: 'Bartholomew', fontId: 'baloo-bold', letterHeightMm: 45 } },
      motifId: p.content.personalisation.motifChoices[0]!.motifId,
      sizeId: size('4T'),
      colourId: offer.defaultColourId,
    });
    const input = listingDesign(p.content, choices, { material: (id) => p.materials.find((m) => m.id === id), motif: (id) => p.motifs.find((m) => m.id === id) }, blankChoiceOf(offer, choices)).input!;
    const fits = fitBySize(getFontRegistry(), input, offer.sizes);
    expect(fits.find((f) => f.label === '4T')!.tooSmall).toEqual(['name']);
    expect(fits.find((f) => f.label === '10')!.tooSmall).toEqual([]);

    // on grey with its default colours nothing warns (the flame's yellow is marked intended); gold glitter on grey does
    const grey = offer.colours.find((c) => c.name === 'Heather grey')!;
    const vinyls = (c: typeof choices) => layersForChoices(p.content, c).map((id) => p.materials.find((m) => m.id === id)!);
    const blank = { id: grey.id, name: grey.name, hex: grey.hex, noun: 'tee' };
    expect(contrastWarnings(vinyls(choices), blank, offer.intendedPairs)).toEqual([]);
    const gold = p.materials.find((m) => m.colourName === 'Gold glitter')!;
    const ws = contrastWarnings(vinyls({ ...choices, textColours: { name: gold.id } }), blank, offer.intendedPairs);
    expect(ws.map((w) => w.vinylName)).toEqual(['Gold glitter']);
  });

  it("when Fern's fox tote is opened, then it comes in natural and navy, and its cream face on the natural tote trips the contrast warning", async () => {
    const p = await page('autumn-fox-tote-with-a-name');
    const offer = p.blankOffer!;
    expect(offer.colours.map((c) => c.name)).toEqual(['Natural', 'Navy']);
    const natural = offer.colours.find((c) => c.id === offer.defaultColourId)!;
    const choices = choicesSchema.parse({ motifId: p.content.personalisation.motifChoices[0]!.motifId, texts: { name: { text: 'Mira', fontId: 'baloo-bold', letterHeightMm: 50 } } });
    const vinyls = layersForChoices(p.content, choices).map((id) => p.materials.find((m) => m.id === id)!);
    const ws = contrastWarnings(vinyls, { id: natural.id, name: natural.name, hex: natural.hex, noun: 'tote' }, offer.intendedPairs);
    expect(ws.map((w) => w.vinylName)).toContain('Cream white');
  });
});
