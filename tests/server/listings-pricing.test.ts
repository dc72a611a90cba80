import { describe, expect, it } from 'vitest';
import { checkChoices, choicesSchema, includedLayers, layersForChoices, listingInputSchema, priceForChoices } from '../../shared/schemas/listing.ts';

const content = listingInputSchema.parse({
  title: 'Rocket tee',
  blank: { kind: 'kids_tee' },
  basePriceMinor: 2200,
  extraLayerPriceMinor: 250,
  personalisation: {
    textFields: [
      { id: 'name', label: 'Name', fontIds: ['baloo-bold', 'bangers'], colourChoices: ['navy', 'gold'] },
      { id: 'age', label: 'Age', maxLength: 2, fontIds: ['baloo-bold'], required: false, colourChoices: ['navy'] },
    ],
    motifChoices: [
      {
        motifId: 'rocket',
        label: 'Rocket',
        layers: [
          { layerId: 'hull', mode: 'shopper', colourChoices: ['navy', 'teal'] },
          { layerId: 'flame', mode: 'fixed', materialId: 'yellow' },
        ],
      },
    ],
    outline: { colourChoices: ['white'] },
  },
});
const choices = (c: unknown) => choicesSchema.parse(c);
const name = (text: string, fontId = 'baloo-bold') => ({ text, fontId, letterHeightMm: 40 });

describe('priceForChoices: base + extra layer price × (layers past those of the cheapest design)', () => {
  it('when only a name is chosen (plus the outline the listing always cuts), then two layers, both in the base price', () => {
    const c = choices({ texts: { name: name('Mira') } });
    expect(layersForChoices(content, c)).toEqual(['white', 'navy']);
    // the outline is never the shopper's choice to add: the cheapest design has it too
    expect(includedLayers(content)).toBe(2);
    expect(priceForChoices(content, c)).toBe(2200);
  });

  it('when a motif is added with a hull in a new colour, then each distinct material is a layer', () => {
    const c = choices({ texts: { name: name('Theo') }, textColours: { name: 'gold' }, motifId: 'rocket', motifColours: { hull: 'teal' } });
    expect(layersForChoices(content, c)).toEqual(['white', 'teal', 'yellow', 'gold']);
    expect(priceForChoices(content, c)).toBe(2200 + 2 * 250);
  });

  it('when two pieces share a material, then they are one layer (cut and pressed together)', () => {
    const c = choices({ texts: { name: name('Kai'), age: name('5') }, motifId: 'rocket', motifColours: { hull: 'navy' } });
    expect(layersForChoices(content, c)).toEqual(['white', 'navy', 'yellow']);
    expect(priceForChoices(content, c)).toBe(2200 + 250);
  });

  it('when nothing adds a layer beyond one, then the base price', () => {
    const noOutline = { ...content, personalisation: { ...content.personalisation, outline: null } };
    expect(priceForChoices(noOutline, choices({ texts: { name: name('Leon') } }))).toBe(2200);
  });
});

describe('checkChoices', () => {
  it('when the choices fit the listing, then no messages', () => {
    expect(checkChoices(content, choices({ texts: { name: name('Zoë') }, motifId: 'rocket', motifColours: { hull: 'teal' }, outlineMaterialId: 'white' }))).toEqual({});
  });

  it('when fields are missing, too long, or name things not offered, then each is named', () => {
    const errs = checkChoices(
      content,
      choices({
        texts: { name: name('Bartholomew-the-Great', 'pacifico'), age: name('123'), extra: name('x') },
        textColours: { name: 'pink' },
        motifId: 'whale',
        outlineMaterialId: 'black',
      }),
    );
    expect(Object.keys(errs).sort()).toEqual(['motifId', 'outlineMaterialId', 'texts.age.text', 'texts.extra', 'texts.name.fontId', 'texts.name.text', 'textColours.name'].sort());
  });

  it('when a required name is blank or spaces, then it is asked for', () => {
    expect(checkChoices(content, choices({ texts: { name: name('   ') } }))['texts.name.text']).toMatch(/Enter/);
  });
});
