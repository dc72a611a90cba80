// Demo blanks (the invented demo scenario): Little Comet's tee in sizes 2T–10 and three colours,
// Fern & Fable's tote in natural and navy, with stock per size × colour — a few pairs sold out, a
// few low — and the listings that sell them. Sizes, print areas and garment measurements are our
// demo figures, not a supplier's chart. The Autumn fox tote's cream face layer on the natural tote
// trips the contrast warning on purpose; the Spring picnic tote marks its glitter on natural as
// intended, and the rocket's yellow flame on heather grey too (tone on tone).
import { type ListingBlankOffer, type SellerBlankType, stockKey } from '../../shared/schemas/blanks.ts';
import type { ListingContent } from '../../shared/schemas/listing.ts';
import type { AppDeps } from '../deps.ts';
import { createType, setStock } from '../features/blanks/index.ts';
import { seedRepo } from './seed.repo.ts';
import type { SeedContext } from './seed-context.ts';

// label, print width × height, top offset (mm), price difference (cents), chest laid flat, length (mm)
const TEE_SIZES: Array<[string, number, number, number, number, number, number]> = [
  ['2T', 140, 160, 40, 0, 280, 380],
  ['3T', 150, 170, 42, 0, 295, 405],
  ['4T', 160, 180, 45, 0, 310, 430],
  ['5', 170, 190, 48, 100, 325, 455],
  ['6', 180, 200, 50, 100, 340, 480],
  ['8', 200, 220, 55, 200, 370, 530],
  ['10', 220, 240, 60, 300, 400, 570],
];

type Demo = {
  shop: string;
  type: { name: string; shape: 'kids_tee' | 'tote'; sizes: typeof TEE_SIZES; colours: Array<[string, string]> };
  /** count per "size:colour" (by label and name); any pair not named gets `otherwise` */
  stock: Record<string, number>;
  otherwise: number;
  listings: Array<{ title: string; defaultColour: string; intended?: Array<[materialName: string, colourName: string]>; minLetterHeightMm?: number }>;
};

const DEMO: Demo[] = [
  {
    shop: 'little-comet-print-co',
    type: {
      name: 'Tee',
      shape: 'kids_tee',
      sizes: TEE_SIZES,
      colours: [
        ['Heather grey', '#8d8f91'],
        ['White', '#ffffff'],
        ['Mint green', '#bfe3d0'],
      ],
    },
    stock: { '2T:Mint green': 0, '10:White': 0, '6:Mint green': 0, '4T:White': 2, '3T:Heather grey': 1 },
    otherwise: 8,
    listings: [
      // names on this tee stay at least 20 mm tall, so a long name needs a larger size
      { title: 'Rocket name tee for kids', defaultColour: 'Heather grey', intended: [['Sunny yellow', 'Heather grey']], minLetterHeightMm: 20 },
      { title: 'Winter lights balloon tee with outline', defaultColour: 'White' },
    ],
  },
  {
    shop: 'fern-and-fable-goods',
    type: {
      name: 'Tote',
      shape: 'tote',
      sizes: [['One size', 250, 250, 50, 0, 380, 410]],
      colours: [
        ['Natural', '#efe6d4'],
        ['Navy', '#1f2a44'],
      ],
    },
    stock: { 'One size:Navy': 3 },
    otherwise: 15,
    listings: [
      { title: 'Autumn fox tote with a name', defaultColour: 'Natural' },
      { title: 'Spring picnic tote with hot-air balloon', defaultColour: 'Natural', intended: [['Marigold glitter', 'Natural']] },
    ],
  },
];

export function seedBlanks(deps: AppDeps, ctx: SeedContext): void {
  const { db } = deps;
  for (const d of DEMO) {
    const shopId = ctx.shopIds[d.shop];
    if (!shopId) throw new Error(`demo blanks: shop ${d.shop} missing`);
    const type: SellerBlankType = createType(deps, shopId, {
      name: d.type.name,
      shape: d.type.shape,
      sizes: d.type.sizes.map(([label, widthMm, heightMm, topOffsetMm, priceDiffMinor, chestMm, lengthMm]) => ({ label, widthMm, heightMm, topOffsetMm, priceDiffMinor, chestMm, lengthMm })),
      colours: d.type.colours.map(([name, hex]) => ({ name, hex, photoId: null })),
    });
    const byLabel = (k: string) => {
      const [label, name] = k.split(':') as [string, string];
      return stockKey(type.sizes.find((s) => s.label === label)!.id, type.colours.find((c) => c.name === name)!.id);
    };
    const named = new Map(Object.entries(d.stock).map(([k, n]) => [byLabel(k), n]));
    setStock(deps, shopId, type.id, {
      rows: type.sizes.flatMap((s) => type.colours.map((c) => ({ sizeId: s.id, colourId: c.id, quantity: named.get(stockKey(s.id, c.id)) ?? d.otherwise, lowStock: 2 }))),
    });
    const materials = seedRepo.materialsOf(db, shopId);
    const live = seedRepo.liveListingsOf(db, shopId);
    for (const l of d.listings) {
      const row = live.find((x) => x.live?.title === l.title);
      if (!row?.live) throw new Error(`demo blanks: listing ${l.title} missing`);
      const colourId = (name: string) => type.colours.find((c) => c.name === name)!.id;
      const blankOffer: ListingBlankOffer = {
        blankTypeId: type.id,
        sizeIds: type.sizes.map((s) => s.id),
        colourIds: type.colours.map((c) => c.id),
        defaultColourId: colourId(l.defaultColour),
        intendedPairs: (l.intended ?? []).map(([m, c]) => ({ materialId: materials.find((x) => x.colourName === m)!.id, colourId: colourId(c) })),
      };
      const content: ListingContent = {
        ...row.live,
        blankOffer,
        personalisation: {
          ...row.live.personalisation,
          textFields: row.live.personalisation.textFields.map((f) => (l.minLetterHeightMm ? { ...f, minLetterHeightMm: l.minLetterHeightMm } : f)),
        },
      };
      seedRepo.setListingContent(db, row.id, content);
    }
  }
}
