// The personaliser's mapping from a listing and the shopper's choices to compose() input
// (src/features/personaliser/lib/design.ts) must draw what the cart stores: the same pieces, path
// for path, as the server's snapshot from POST /api/cart/lines. Also: the price shown is the price
// charged, and saved choices the listing no longer offers fall back to its defaults.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { getFontRegistry } from '../../server/integrations/fonts.ts';
import { compose } from '../../shared/engine/compose.ts';
import type { Cart } from '../../shared/schemas/cart.ts';
import type { ListingPage } from '../../shared/schemas/catalog.ts';
import { type Choices, priceForChoices } from '../../shared/schemas/listing.ts';
import { designInput } from '../../src/features/personaliser/lib/design.ts';
import { defaultChoices, reconcile } from '../../src/features/personaliser/lib/saved-choices.ts';
import { makeTestApp, type TestApp } from '../factories/app.ts';
import { at } from '../support/at.ts';

let t: TestApp;
let listings: ListingPage[] = [];

beforeAll(async () => {
  t = await makeTestApp({ seed: true });
  const page = (await request(t.app).get('/api/listings').expect(200)).body as { items: { slug: string }[] };
  for (const i of page.items) listings.push((await request(t.app).get(`/api/listings/${i.slug}`).expect(200)).body as ListingPage);
  listings = listings.filter((l) => l.content.personalisation.textFields.length > 0);
}, 60_000);
afterAll(async () => t?.close());

function choicesFor(l: ListingPage, text: string, pick: 'first' | 'last'): Choices {
  const p = l.content.personalisation;
  const c = defaultChoices(p, l.blankOffer);
  const picked = <T>(xs: readonly T[]) => at(xs, pick === 'first' ? 0 : -1);
  for (const f of p.textFields) {
    c.texts[f.id] = { text: [...text].slice(0, f.maxLength).join(''), fontId: picked(f.fontIds), letterHeightMm: f.defaultLetterHeightMm };
    c.textColours[f.id] = picked(f.colourChoices);
  }
  const m = p.motifChoices.length ? picked(p.motifChoices) : undefined;
  c.motifId = m?.motifId ?? null;
  c.motifColours = {};
  for (const l2 of m?.layers ?? []) if (l2.mode === 'shopper' && l2.colourChoices?.length) c.motifColours[l2.layerId] = picked(l2.colourChoices);
  if (p.outline) c.outlineMaterialId = picked(p.outline.colourChoices);
  // a listing with sizes and colours: the first or last colour, and the first or last size in stock in it
  const offer = l.blankOffer;
  if (offer) {
    c.colourId = picked(offer.colours).id;
    c.sizeId = picked(offer.sizes.filter((s) => !offer.soldOut.includes(`${s.id}:${c.colourId}`))).id;
  }
  return c;
}

describe('personaliser design = cart snapshot', () => {
  it('when the seed has live listings with a name field, then there are some to check', () => {
    expect(listings.length).toBeGreaterThanOrEqual(3);
  });

  it('when a shopper adds any demo listing with a name, then the client-composed pieces and price equal the stored snapshot', async () => {
    const reg = getFontRegistry();
    let checked = 0;
    for (const l of listings) {
      for (const [text, pick] of [
        ['Zoë', 'first'],
        ['Bartholomew', 'last'],
      ] as const) {
        const choices = choicesFor(l, text, pick);
        const input = designInput(l, choices);
        expect(input).not.toBeNull();
        const item = compose(reg, input!);
        const res = await request(t.app).post('/api/cart/lines').send({ listingId: l.id, quantity: 1, choices });
        expect(res.status, `${l.slug}: ${JSON.stringify(res.body).slice(0, 300)}`).toBe(201);
        const cart = res.body as Cart;
        const line = cart.shops.flatMap((s) => s.lines).at(-1)!;
        expect(line.snapshot.geometry.pieces.map((p) => p.d)).toEqual(item.pieces.map((p) => p.path));
        expect(line.snapshot.geometry.pieces.map((p) => p.colourHex)).toEqual(item.pieces.map((p) => p.colour));
        expect(line.unitPriceMinor).toBe(priceForChoices(l.content, choices, l.blankOffer));
        checked += 1;
      }
    }
    expect(checked).toBe(listings.length * 2);
  });

  it('when nothing is typed and there is no motif, then there is nothing to compose', () => {
    const l = at(listings, 0);
    const c = defaultChoices(l.content.personalisation);
    c.motifId = null;
    expect(designInput(l, c)).toBeNull();
  });

  it('when saved choices name a font and colour the listing no longer offers, then they fall back to its defaults and the text is kept', () => {
    const l = at(listings, 0);
    const p = l.content.personalisation;
    const f = at(p.textFields, 0);
    const saved = defaultChoices(p);
    saved.texts[f.id] = { text: 'Priya', fontId: 'no-such-font', letterHeightMm: 9999 };
    saved.textColours[f.id] = 'gone-material';
    const r = reconcile(p, saved);
    expect(r.texts[f.id]).toEqual({ text: 'Priya', fontId: f.defaultFontId, letterHeightMm: f.defaultLetterHeightMm });
    expect(r.textColours[f.id]).toBe(at(f.colourChoices, 0));
  });
});
