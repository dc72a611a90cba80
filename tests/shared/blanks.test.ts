import { describe, expect, it } from 'vitest';
import { defaultBlank } from '../../shared/engine/blanks.ts';
import type { ComposeInput } from '../../shared/engine/compose.ts';
import { contrastRatio, contrastWarnings, relativeLuminance } from '../../shared/engine/contrast.ts';
import { sizeFitWarning } from '../../shared/engine/fit.ts';
import { fitBySize, largerSizeThatFits } from '../../shared/engine/size-fit.ts';
import { layoutText } from '../../shared/engine/text-layout.ts';
import { blankChoiceLabel, blankDefaults, blankTypeInputSchema, type ResolvedBlankOffer } from '../../shared/schemas/blanks.ts';
import { checkChoices, choicesSchema, type PricedContent, priceForChoices } from '../../shared/schemas/listing.ts';
import { testRegistry } from './engine/font-fixture.ts';

// WCAG 2.2, "contrast ratio": (L1 + 0.05) / (L2 + 0.05), ranging from 1:1 to 21:1 —
// https://www.w3.org/TR/WCAG22/#dfn-contrast-ratio ; relative luminance 0 for darkest black, 1 for
// lightest white — https://www.w3.org/TR/WCAG22/#dfn-relative-luminance
describe('contrast of vinyl on blank (WCAG 2.2)', () => {
  it('when black is on white, then the ratio is 21:1 and the luminances are 0 and 1, as WCAG 2.2 defines them', () => {
    expect(relativeLuminance('#000000')).toBe(0);
    expect(relativeLuminance('#ffffff')).toBeCloseTo(1, 12);
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 10);
    expect(contrastRatio('#ffffff', '#000000')).toBeCloseTo(21, 10);
  });
  it('when a colour is on itself, then the ratio is 1:1 (WCAG 2.2 definition)', () => {
    for (const c of ['#000000', '#ffffff', '#efe6d4', '#2f7d6d', '#b8b8b8']) expect(contrastRatio(c, c)).toBe(1);
  });
  it('when pure red, green and blue are measured, then their luminances are the WCAG 2.2 coefficients 0.2126, 0.7152 and 0.0722', () => {
    expect(relativeLuminance('#ff0000')).toBeCloseTo(0.2126, 10);
    expect(relativeLuminance('#00ff00')).toBeCloseTo(0.7152, 10);
    expect(relativeLuminance('#0000ff')).toBeCloseTo(0.0722, 10);
  });
  it('when a pale vinyl sits on a pale blank, then a warning names the pair; a pair marked intended is silent', () => {
    const vinyls = [
      { id: 'cream', colourName: 'Cream white', colourHex: '#f7f3ea' },
      { id: 'navy', colourName: 'Ink navy', colourHex: '#1f2a44' },
      { id: 'cream', colourName: 'Cream white', colourHex: '#f7f3ea' },
    ];
    const natural = { id: 'natural', name: 'Natural', hex: '#efe6d4', noun: 'tote' };
    const ws = contrastWarnings(vinyls, natural);
    expect(ws.map((w) => w.materialId)).toEqual(['cream']);
    expect(ws[0]!.ratio).toBeLessThan(3);
    expect(ws[0]!.message).toContain('Cream white on a natural tote');
    expect(contrastWarnings(vinyls, natural, [{ materialId: 'cream', colourId: 'natural' }])).toEqual([]);
    // the same pair intended on another colour does not silence this one
    expect(contrastWarnings(vinyls, natural, [{ materialId: 'cream', colourId: 'navy' }])).toHaveLength(1);
  });
});

const offer: ResolvedBlankOffer = {
  blankTypeId: 't',
  name: 'Tee',
  shape: 'kids_tee',
  sizes: [
    { id: 's2', label: '2T', widthMm: 140, heightMm: 160, topOffsetMm: 40, priceDiffMinor: 0, chestMm: 280, lengthMm: 380 },
    { id: 's4', label: '4T', widthMm: 160, heightMm: 180, topOffsetMm: 45, priceDiffMinor: 0, chestMm: 310, lengthMm: 430 },
    { id: 's8', label: '8', widthMm: 200, heightMm: 220, topOffsetMm: 55, priceDiffMinor: 200, chestMm: 370, lengthMm: 530 },
    { id: 's10', label: '10', widthMm: 220, heightMm: 240, topOffsetMm: 60, priceDiffMinor: 300, chestMm: 400, lengthMm: 570 },
  ],
  colours: [
    { id: 'grey', name: 'Heather grey', hex: '#8d8f91', photoId: null, photoUrl: null },
    { id: 'white', name: 'White', hex: '#ffffff', photoId: null, photoUrl: null },
  ],
  defaultColourId: 'grey',
  intendedPairs: [],
  soldOut: ['s10:white'],
};

const content: PricedContent = {
  basePriceMinor: 2200,
  extraLayerPriceMinor: 250,
  personalisation: {
    textFields: [{ id: 'name', label: 'Name', maxLength: 14, fontIds: ['baloo-bold'], defaultFontId: 'baloo-bold', defaultLetterHeightMm: 45, required: true, colourChoices: ['navy', 'gold'] }],
    motifChoices: [],
    motifRequired: false,
    outline: null,
  },
};
const choices = (over: Partial<Parameters<typeof choicesSchema.parse>[0]> = {}) =>
  choicesSchema.parse({ texts: { name: { text: 'Mira', fontId: 'baloo-bold', letterHeightMm: 45 } }, textColours: { name: 'gold' }, ...over });

describe('price and choice of a size', () => {
  it('when a size with a price difference is chosen, then the price is base + layers + that difference', () => {
    expect(priceForChoices(content, choices({ sizeId: 's4' }), offer)).toBe(2200);
    expect(priceForChoices(content, choices({ sizeId: 's8' }), offer)).toBe(2400);
    expect(priceForChoices(content, choices({ sizeId: 's10' }), offer)).toBe(2500);
    // a size id the offer does not have adds nothing (checkChoices refuses it)
    expect(priceForChoices(content, choices({ sizeId: 'nope' }), offer)).toBe(2200);
  });
  it('when the size or colour is missing, unknown or sold out, then the choice is refused with a message on its field', () => {
    expect(checkChoices(content, choices({ colourId: 'grey' }), offer).sizeId).toBe('Pick a size.');
    expect(checkChoices(content, choices({ sizeId: 's4' }), offer).colourId).toBe('Pick a tee colour.');
    expect(checkChoices(content, choices({ sizeId: 'x', colourId: 'grey' }), offer).sizeId).toBe('Pick one of the sizes offered.');
    expect(checkChoices(content, choices({ sizeId: 's10', colourId: 'white' }), offer).sizeId).toMatch(/sold out/);
    expect(checkChoices(content, choices({ sizeId: 's10', colourId: 'grey' }), offer)).toEqual({});
    // a listing without an offer ignores the size and colour
    expect(checkChoices(content, choices(), null)).toEqual({});
  });
  it('when nothing is picked, then only a one-size blank gets its size, and the colour is the shop default', () => {
    expect(blankDefaults(offer, {})).toEqual({ sizeId: null, colourId: 'grey' });
    expect(blankDefaults({ ...offer, sizes: [offer.sizes[0]!] }, {})).toEqual({ sizeId: 's2', colourId: 'grey' });
    expect(blankDefaults(offer, { sizeId: 's8', colourId: 'white' })).toEqual({ sizeId: 's8', colourId: 'white' });
    expect(blankDefaults(null, {})).toEqual({ sizeId: null, colourId: null });
  });
  it('when a line names its blank, then it reads "4T · Heather grey"', () => {
    expect(blankChoiceLabel({ sizeLabel: '4T', colourName: 'Heather grey' })).toBe('4T · Heather grey');
    expect(blankChoiceLabel({})).toBeNull();
  });
  it('when a seller gives two sizes the same label, then the form schema says so on the second', () => {
    const r = blankTypeInputSchema.safeParse({
      name: 'Tee',
      shape: 'kids_tee',
      sizes: [offer.sizes[0], { ...offer.sizes[1], label: '2t' }],
      colours: [{ name: 'White', hex: '#FFFFFF' }],
    });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0]!.path).toEqual(['sizes', 1, 'label']);
  });
});

describe('fit per size', () => {
  const reg = testRegistry();
  const input: ComposeInput = {
    blank: defaultBlank('kids_tee')!,
    fields: [{ kind: 'text', id: 'name', fontId: 'baloo-bold', letterHeightMm: 45, minLetterHeightMm: 20, materialKind: 'smooth', colour: '#1b2440' }],
    choices: { name: { text: 'Bartholomew', letterHeightMm: 45 } },
  };
  it('when "Bartholomew" fits size 10 but not 2T, then the fit says so and names the smallest larger size that fits', () => {
    const fits = fitBySize(reg, input, offer.sizes);
    const at = (id: string) => fits.find((f) => f.id === id)!;
    expect(at('s2').tooSmall).toEqual(['name']);
    expect(at('s4').tooSmall).toEqual(['name']);
    expect(at('s10').tooSmall).toEqual([]);
    // the letter height at each size is what the width allows: the layout's width at 1 mm × size width
    const perMm = layoutText(reg, { text: 'Bartholomew', fontId: 'baloo-bold', letterHeightMm: 10 }).widthMm / 10;
    expect(at('s10').letterHeights.name).toBeCloseTo(220 / perMm, 0);
    expect(at('s2').letterHeights.name).toBeLessThan(20);
    const larger = largerSizeThatFits(fits, 's4', 'name');
    expect(larger?.label).toBe('8');
    const w = sizeFitWarning({
      text: 'Bartholomew',
      sizeLabel: '4T',
      letterHeightMm: at('s4').letterHeights.name!,
      minLetterHeightMm: 20,
      larger: { label: larger!.label, letterHeightMm: larger!.letterHeights.name! },
    });
    expect(w.message).toMatch(/^At size 4T, “Bartholomew” comes out at 1\d\.\d mm letters, below the 20 mm this item needs\. Choose size 8 or larger/);
  });
  it('when a short name fits every size, then no size is too small', () => {
    const fits = fitBySize(reg, { ...input, choices: { name: { text: 'Kai', letterHeightMm: 45 } } }, offer.sizes);
    expect(fits.every((f) => f.tooSmall.length === 0)).toBe(true);
    expect(fits.every((f) => f.letterHeights.name === 45)).toBe(true);
  });
});
