// Demo catalogue (the invented demo scenario): materials, layered motifs, photos and listings
// for Fern & Fable Goods and Little Comet Print Co. (live), and Harbour Thread (waiting in review).
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import sharp from 'sharp';
import { parseMotifSvg, renderMotifSvg } from '../../shared/engine/motif.ts';
import { defaultPressProfile, type MaterialKind } from '../../shared/engine/press-defaults.ts';
import { type BlankKind, type ListingInput, listingInputSchema, liveColumns } from '../../shared/schemas/listing.ts';
import type { AppDeps } from '../deps.ts';
import { createStorage, storedImageColumns } from '../integrations/storage.ts';
import { seedRepo } from './seed.repo.ts';
import type { SeedContext } from './seed-context.ts';

const MOTIF_DIR = path.join(path.dirname(fileURLToPath(import.meta.url)), 'demo-motifs');

type Mat = [key: string, kind: MaterialKind, colourName: string, hex: string, rollWidthMm: 305 | 381, stockMm: number];
const MATERIALS: Record<string, Mat[]> = {
  'fern-and-fable-goods': [
    ['white', 'smooth', 'Cream white', '#f7f3ea', 305, 9000],
    ['navy', 'smooth', 'Ink navy', '#1f2a44', 305, 7500],
    ['orange', 'smooth', 'Fox orange', '#d9692b', 305, 4200],
    ['brown', 'smooth', 'Acorn brown', '#7a4a23', 305, 3000],
    ['green', 'smooth', 'Thread green', '#2f7d6d', 381, 6000],
    ['red', 'smooth', 'Berry red', '#b3262e', 305, 2500],
    ['gold', 'glitter', 'Marigold glitter', '#e0a526', 305, 2000],
    ['pine', 'flock', 'Pine flock', '#2e4a36', 381, 1800],
    ['silver', 'metallic', 'Silver foil', '#c0c4c8', 305, 900],
  ],
  'little-comet-print-co': [
    ['white', 'smooth', 'Snow white', '#ffffff', 381, 12000],
    ['navy', 'smooth', 'Night navy', '#1b2440', 381, 8000],
    ['sea', 'smooth', 'Sea blue', '#2b5c8a', 305, 5000],
    ['sky', 'smooth', 'Sky blue', '#7fb8e0', 305, 4000],
    ['teal', 'smooth', 'Teal', '#2f7d6d', 305, 3500],
    ['yellow', 'smooth', 'Sunny yellow', '#f2c230', 305, 3000],
    ['gold', 'glitter', 'Gold glitter', '#d4a53a', 305, 1500],
    ['stars', 'patterned', 'Starry night print', '#27305a', 305, 1200],
    ['copper', 'metallic', 'Copper foil', '#b87333', 305, 800],
  ],
  'harbour-thread': [
    ['white', 'smooth', 'Sail white', '#fafafa', 305, 5000],
    ['navy', 'smooth', 'Harbour navy', '#1d2b4a', 305, 5000],
    ['sea', 'smooth', 'Sea glass', '#6fb3a8', 381, 3000],
  ],
};

const MOTIFS: Record<string, [key: string, file: string, name: string][]> = {
  'fern-and-fable-goods': [
    ['fox', 'fox-with-acorn.svg', 'Fox with acorn'],
    ['pumpkin', 'pumpkin.svg', 'Pumpkin'],
    ['balloon', 'hot-air-balloon.svg', 'Hot-air balloon'],
    ['snowman', 'snowman.svg', 'Snowman'],
  ],
  'little-comet-print-co': [
    ['rocket', 'rocket-with-flame.svg', 'Rocket with flame'],
    ['whale', 'whale.svg', 'Whale'],
    ['balloon', 'hot-air-balloon.svg', 'Hot-air balloon'],
  ],
  'harbour-thread': [['whale', 'whale.svg', 'Whale']],
};

type Ref = (key: string) => string;

/** A motif layer: a material key (the layer is always that colour) or a list of them (the shopper picks). */
type LayerSpec = [layerId: string, colours: string | string[]];
type NameOpts = Partial<{ fonts: string[]; height: number; max: number }>;

/**
 * One demo listing. `name`: the colours of its one name field (material keys), and where it differs
 * from the usual field; `motif`: the shop's motif (by key; its label is the motif's name); `photoOf`:
 * the motif whose picture is the listing photo (the listing's own motif unless named); `price`: base
 * and per extra layer; `costs`: blank cost and minutes per layer.
 */
type Spec = {
  state: 'live' | 'in_review';
  title: string;
  description: string;
  markdown?: true;
  blank: BlankKind;
  price: [base: number, extraLayer?: number];
  occasions: ListingInput['occasions'];
  smallDecorations?: true;
  name: [colours: string[], opts?: NameOpts];
  motif?: { key: string; required: boolean; layers: LayerSpec[] };
  outline?: { offsetMm: number; colours: string[] };
  costs?: [blankCost: number, minutesPerLayer: number];
  photoOf?: string;
};

const LISTINGS: Record<string, Spec[]> = {
  'fern-and-fable-goods': [
    {
      state: 'live',
      title: 'Autumn fox tote with a name',
      markdown: true,
      description: 'A sturdy cotton tote with a **fox holding an acorn** and the name of your choice below it.\n\nShown with the name *Mira*. Pressed in smooth vinyl that flexes with the bag.',
      blank: 'tote',
      price: [2400, 300],
      occasions: ['autumn-harvest', 'back-to-school'],
      costs: [450, 6],
      name: [['navy', 'orange', 'green', 'gold']],
      motif: {
        key: 'fox',
        required: true,
        layers: [
          ['body', ['orange', 'brown']],
          ['face', 'white'],
          ['acorn', 'brown'],
        ],
      },
    },
    {
      state: 'live',
      title: 'Winter lights drawstring bag with snowman',
      description: 'A drawstring bag for mittens and winter treats.\nThe snowman wears a red hat and scarf; the name sits underneath.\nShown with the name Theo.',
      blank: 'drawstring_bag',
      price: [1900, 250],
      occasions: ['winter-lights'],
      costs: [300, 5],
      name: [['navy', 'red', 'silver', 'gold'], { fonts: ['baloo-bold', 'bebas-neue'], height: 40 }],
      motif: {
        key: 'snowman',
        required: false,
        layers: [
          ['snow', 'white'],
          ['hat-and-scarf', ['red', 'green', 'navy']],
        ],
      },
    },
    {
      state: 'live',
      title: 'Spring picnic tote with hot-air balloon',
      description: 'Float off to the park: a hot-air balloon with striped envelope, and a name or a short word.\nShown with the name Anouk.',
      blank: 'tote',
      price: [2600, 300],
      occasions: ['spring-picnic', 'birthday'],
      costs: [450, 6],
      name: [['navy', 'green', 'orange'], { fonts: ['dancing-script-bold', 'patrick-hand', 'baloo-bold'], height: 45 }],
      motif: {
        key: 'balloon',
        required: true,
        layers: [
          ['envelope', ['green', 'navy', 'red']],
          ['stripes', 'gold'],
          ['basket', 'brown'],
        ],
      },
    },
    {
      state: 'live',
      title: 'Harvest pumpkin drawstring bag with ribbon bow',
      description: 'A little bag for the autumn harvest walk, finished with a sewn ribbon bow.\nShown with the name Kai.',
      blank: 'drawstring_bag',
      price: [2100, 250],
      occasions: ['autumn-harvest'],
      smallDecorations: true,
      costs: [320, 5],
      name: [['orange', 'brown', 'navy', 'pine'], { fonts: ['baloo-bold', 'bangers'], height: 40 }],
      motif: {
        key: 'pumpkin',
        required: true,
        layers: [
          ['pumpkin', 'orange'],
          ['stem', ['pine', 'green']],
        ],
      },
    },
  ],
  'little-comet-print-co': [
    {
      state: 'live',
      title: 'Rocket name tee for kids',
      description: 'Blast off on a birthday or the first day of school: a rocket with a bright flame and a name in big letters.\nShown with the name Leon.',
      blank: 'kids_tee',
      price: [2200, 250],
      occasions: ['birthday', 'back-to-school'],
      costs: [550, 6],
      name: [['navy', 'sea', 'gold', 'stars'], { fonts: ['baloo-bold', 'bangers', 'bebas-neue'], height: 45, max: 14 }],
      motif: {
        key: 'rocket',
        required: true,
        layers: [
          ['flame', ['yellow', 'gold']],
          ['hull', ['navy', 'sea', 'teal']],
          ['window', 'white'],
        ],
      },
    },
    {
      state: 'live',
      title: 'Whale zip pouch with a name',
      description: 'A zip pouch for pencils or picnic snacks, with a spouting whale and a name.\nShown with the name Priya.',
      blank: 'pouch',
      price: [1500, 200],
      occasions: ['spring-picnic', 'back-to-school'],
      costs: [280, 4],
      name: [['navy', 'sea', 'copper'], { fonts: ['patrick-hand', 'baloo-bold'], height: 25, max: 10 }],
      motif: {
        key: 'whale',
        required: false,
        layers: [
          ['whale', ['sea', 'navy', 'teal']],
          ['belly', 'white'],
          ['spout', 'sky'],
        ],
      },
    },
    {
      state: 'live',
      title: 'Winter lights balloon tee with outline',
      description: 'A hot-air balloon over a name, with a glitter outline that catches the winter lights.\nShown with the name Zoë: the fonts draw accented letters.',
      blank: 'kids_tee',
      price: [2500, 250],
      occasions: ['winter-lights', 'birthday'],
      costs: [550, 6],
      name: [['navy', 'teal'], { fonts: ['dancing-script-bold', 'baloo-bold'], height: 40 }],
      motif: {
        key: 'balloon',
        required: true,
        layers: [
          ['envelope', ['teal', 'sea']],
          ['stripes', 'yellow'],
          ['basket', 'navy'],
        ],
      },
      outline: { offsetMm: 3, colours: ['gold', 'white'] },
    },
  ],
  'harbour-thread': [
    {
      state: 'in_review',
      title: 'Seaside whale tote',
      description: 'A tote for beach days with a whale and a name. Shown with the name Bartholomew.',
      blank: 'tote',
      price: [2300, 250],
      occasions: ['spring-picnic'],
      name: [['navy', 'sea'], { max: 14, height: 35 }],
      motif: {
        key: 'whale',
        required: true,
        layers: [
          ['whale', ['navy', 'sea']],
          ['belly', 'white'],
        ],
      },
    },
    {
      state: 'in_review',
      title: 'Harbour name pouch',
      photoOf: 'whale',
      description: 'A plain zip pouch with a name in sail white.',
      blank: 'pouch',
      price: [1400],
      occasions: ['back-to-school'],
      name: [['white', 'sea'], { height: 25, max: 10 }],
    },
  ],
};

/** The one name field of a demo listing: the usual fonts, 50 mm and 12 characters unless `opts` says otherwise. */
const nameField = (m: Ref, colours: string[], opts: NameOpts = {}) => ({
  id: 'name',
  label: 'Name',
  maxLength: opts.max ?? 12,
  fontIds: opts.fonts ?? ['baloo-bold', 'dancing-script-bold', 'bitter-bold'],
  defaultLetterHeightMm: opts.height ?? 50,
  required: true,
  colourChoices: colours.map(m),
});

/** The listing a seller would have typed in for `spec`, with the shop's material and motif ids. */
function listingInput(spec: Spec, m: Ref, motif: Ref, motifName: Ref): ListingInput {
  const [basePriceMinor, extraLayerPriceMinor] = spec.price;
  const layer = ([layerId, colours]: LayerSpec) =>
    typeof colours === 'string' ? { layerId, mode: 'fixed' as const, materialId: m(colours) } : { layerId, mode: 'shopper' as const, colourChoices: colours.map(m) };
  return {
    title: spec.title,
    description: spec.description,
    ...(spec.markdown ? { descriptionFormat: 'markdown' as const } : {}),
    blank: { kind: spec.blank },
    basePriceMinor,
    ...(extraLayerPriceMinor === undefined ? {} : { extraLayerPriceMinor }),
    occasions: spec.occasions,
    ...(spec.smallDecorations ? { hasSmallDecorations: true } : {}),
    personalisation: {
      textFields: [nameField(m, ...spec.name)],
      motifChoices: spec.motif ? [{ motifId: motif(spec.motif.key), label: motifName(spec.motif.key), layers: spec.motif.layers.map(layer) }] : [],
      motifRequired: spec.motif?.required ?? false,
      outline: spec.outline ? { offsetMm: spec.outline.offsetMm, colourChoices: spec.outline.colours.map(m) } : null,
    },
    ...(spec.costs ? { blankCostMinor: spec.costs[0], minutesPerLayer: spec.costs[1] } : {}),
  };
}

/** A listing photo: the motif's clean SVG drawn on the paper-cream background, made with sharp. */
async function photoFor(svg: string): Promise<Buffer> {
  const art = await sharp(Buffer.from(svg), { density: 300 }).resize(560, 560, { fit: 'inside' }).png().toBuffer();
  return sharp({ create: { width: 800, height: 800, channels: 3, background: '#fbf7f0' } })
    .composite([{ input: art, gravity: 'centre' }])
    .png()
    .toBuffer();
}

export async function seedCatalog(deps: AppDeps, ctx: SeedContext): Promise<void> {
  const { db } = deps;
  const storage = createStorage(deps.env.uploadsDir);
  const base = deps.now();
  let n = 0;
  for (const [shopSlug, shopId] of Object.entries(ctx.shopIds)) {
    const owner = Object.entries(ctx.userIds).find(([email]) => email.startsWith(shopSlug === 'fern-and-fable-goods' ? 'fern@' : shopSlug === 'little-comet-print-co' ? 'comet@' : 'harbour@'))?.[1];
    if (!owner || !MATERIALS[shopSlug]) continue;
    const matIds: Record<string, string> = {};
    for (const [key, kind, colourName, colourHex, rollWidthMm, stockMm] of MATERIALS[shopSlug]) {
      const id = crypto.randomUUID();
      matIds[key] = id;
      seedRepo.insertMaterial(db, {
        id,
        shopId,
        kind,
        colourName,
        colourHex,
        rollWidthMm,
        stockMm,
        lowStockMm: 1000,
        pricePerMetreMinor: kind === 'smooth' ? 450 : 800,
        pressProfile: defaultPressProfile(kind),
        createdAt: base,
      });
    }
    const motifIds: Record<string, string> = {};
    const photoIds: Record<string, string> = {};
    const thumbs: Record<string, string> = {};
    for (const [key, file, name] of MOTIFS[shopSlug] ?? []) {
      const { dropped: _d, ...geometry } = parseMotifSvg(fs.readFileSync(path.join(MOTIF_DIR, file), 'utf8'));
      const id = crypto.randomUUID();
      motifIds[key] = id;
      seedRepo.insertMotif(db, { id, shopId, name, geometry, createdAt: base });
      const img = await storage.saveImage(await photoFor(renderMotifSvg({ ...geometry, dropped: [] })));
      const uploadId = crypto.randomUUID();
      photoIds[key] = uploadId;
      thumbs[key] = img.thumbName;
      seedRepo.insertUpload(db, {
        id: uploadId,
        ownerId: owner,
        shopId,
        kind: 'photo',
        ...storedImageColumns(img),
        createdAt: base,
      });
    }
    const ref = (map: Record<string, string>, what: string) => (k: string) => {
      if (!map[k]) throw new Error(`demo ${what} ${k} missing in ${shopSlug}`);
      return map[k];
    };
    const motifNames = Object.fromEntries((MOTIFS[shopSlug] ?? []).map(([key, , name]) => [key, name]));
    for (const spec of LISTINGS[shopSlug] ?? []) {
      const photoOf = spec.photoOf ?? spec.motif?.key ?? '(none)';
      const input = listingInput(spec, ref(matIds, 'material'), ref(motifIds, 'motif'), ref(motifNames, 'motif'));
      const content = listingInputSchema.parse({ ...input, photoIds: [ref(photoIds, 'photo')(photoOf)] });
      // an hour apart, so "newest" has an order; live ones were published weeks before the demo orders,
      // ones in review were sent in the last hours (after their shop opened)
      const at = base - n++ * 3_600_000 - (spec.state === 'live' ? 30 * 86_400_000 : 0);
      const slug = `${content.title
        .toLowerCase()
        .normalize('NFKD')
        .replace(/[^a-z0-9]+/g, '-')
        .replace(/^-|-$/g, '')}`;
      const live = spec.state === 'live';
      const thumbPath = live ? thumbs[photoOf] : null;
      seedRepo.insertListing(db, {
        id: crypto.randomUUID(),
        shopId,
        slug,
        state: spec.state,
        draft: content,
        live: live ? content : null,
        ...(live ? { ...liveColumns(content), liveThumbPath: thumbPath, publishedAt: at } : {}),
        createdAt: at,
        updatedAt: at,
      });
    }
  }
}
