// Demo catalogue (the invented demo scenario): materials, layered motifs, photos and listings
// for Fern & Fable Goods and Little Comet Print Co. (live), and Harbour Thread (waiting in review).
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import sharp from 'sharp';
import type { AppDeps } from '../deps.ts';
import type { SeedContext } from './seed-context.ts';
import { seedRepo } from './seed.repo.ts';
import { createStorage } from '../integrations/storage.ts';
import { parseMotifSvg, renderMotifSvg } from '../../shared/engine/motif.ts';
import { defaultPressProfile, type MaterialKind } from '../../shared/engine/press-defaults.ts';
import { listingInputSchema, liveColumns, type ListingInput } from '../../shared/schemas/listing.ts';

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
type Spec = { state: 'live' | 'in_review'; content: (m: Ref, motif: Ref) => ListingInput; photoOf: string };

const nameField = (m: Ref, colours: string[], opts: Partial<{ id: string; label: string; fonts: string[]; height: number; max: number; required: boolean }> = {}) => ({
  id: opts.id ?? 'name',
  label: opts.label ?? 'Name',
  maxLength: opts.max ?? 12,
  fontIds: opts.fonts ?? ['baloo-bold', 'dancing-script-bold', 'bitter-bold'],
  defaultLetterHeightMm: opts.height ?? 50,
  required: opts.required ?? true,
  colourChoices: colours.map(m),
});

const LISTINGS: Record<string, Spec[]> = {
  'fern-and-fable-goods': [
    {
      state: 'live', photoOf: 'fox',
      content: (m, motif) => ({
        title: 'Autumn fox tote with a name',
        description: 'A sturdy cotton tote with a **fox holding an acorn** and the name of your choice above it.\n\nShown with the name *Mira*. Pressed in smooth vinyl that flexes with the bag.',
        descriptionFormat: 'markdown',
        blank: { kind: 'tote' },
        basePriceMinor: 2400, extraLayerPriceMinor: 300, occasions: ['autumn-harvest', 'back-to-school'],
        personalisation: {
          textFields: [nameField(m, ['navy', 'orange', 'green', 'gold'])],
          motifChoices: [{ motifId: motif('fox'), label: 'Fox with acorn', layers: [
            { layerId: 'body', mode: 'shopper', colourChoices: [m('orange'), m('brown')] },
            { layerId: 'face', mode: 'fixed', materialId: m('white') },
            { layerId: 'acorn', mode: 'fixed', materialId: m('brown') },
          ] }],
          motifRequired: true, outline: null,
        },
        blankCostMinor: 450, minutesPerLayer: 6,
      }),
    },
    {
      state: 'live', photoOf: 'snowman',
      content: (m, motif) => ({
        title: 'Winter lights drawstring bag with snowman',
        description: 'A drawstring bag for mittens and winter treats.\nThe snowman wears a red hat and scarf; the name sits underneath.\nShown with the name Theo.',
        blank: { kind: 'drawstring_bag' },
        basePriceMinor: 1900, extraLayerPriceMinor: 250, occasions: ['winter-lights'],
        personalisation: {
          textFields: [nameField(m, ['navy', 'red', 'silver', 'gold'], { fonts: ['baloo-bold', 'bebas-neue'], height: 40 })],
          motifChoices: [{ motifId: motif('snowman'), label: 'Snowman', layers: [
            { layerId: 'snow', mode: 'fixed', materialId: m('white') },
            { layerId: 'hat-and-scarf', mode: 'shopper', colourChoices: [m('red'), m('green'), m('navy')] },
          ] }],
          motifRequired: false, outline: null,
        },
        blankCostMinor: 300, minutesPerLayer: 5,
      }),
    },
    {
      state: 'live', photoOf: 'balloon',
      content: (m, motif) => ({
        title: 'Spring picnic tote with hot-air balloon',
        description: 'Float off to the park: a hot-air balloon with striped envelope, and a name or a short word.\nShown with the name Anouk.',
        blank: { kind: 'tote' },
        basePriceMinor: 2600, extraLayerPriceMinor: 300, occasions: ['spring-picnic', 'birthday'],
        personalisation: {
          textFields: [nameField(m, ['navy', 'green', 'orange'], { fonts: ['dancing-script-bold', 'patrick-hand', 'baloo-bold'], height: 45 })],
          motifChoices: [{ motifId: motif('balloon'), label: 'Hot-air balloon', layers: [
            { layerId: 'envelope', mode: 'shopper', colourChoices: [m('green'), m('navy'), m('red')] },
            { layerId: 'stripes', mode: 'fixed', materialId: m('gold') },
            { layerId: 'basket', mode: 'fixed', materialId: m('brown') },
          ] }],
          motifRequired: true, outline: null,
        },
        blankCostMinor: 450, minutesPerLayer: 6,
      }),
    },
    {
      state: 'live', photoOf: 'pumpkin',
      content: (m, motif) => ({
        title: 'Harvest pumpkin drawstring bag with ribbon bow',
        description: 'A little bag for the autumn harvest walk, finished with a sewn ribbon bow.\nShown with the name Kai.',
        blank: { kind: 'drawstring_bag' },
        basePriceMinor: 2100, extraLayerPriceMinor: 250, occasions: ['autumn-harvest'], hasSmallDecorations: true,
        personalisation: {
          textFields: [nameField(m, ['orange', 'brown', 'navy', 'pine'], { fonts: ['baloo-bold', 'bangers'], height: 40 })],
          motifChoices: [{ motifId: motif('pumpkin'), label: 'Pumpkin', layers: [
            { layerId: 'pumpkin', mode: 'fixed', materialId: m('orange') },
            { layerId: 'stem', mode: 'shopper', colourChoices: [m('pine'), m('green')] },
          ] }],
          motifRequired: true, outline: null,
        },
        blankCostMinor: 320, minutesPerLayer: 5,
      }),
    },
  ],
  'little-comet-print-co': [
    {
      state: 'live', photoOf: 'rocket',
      content: (m, motif) => ({
        title: "Rocket name tee for kids",
        description: 'Blast off on a birthday or the first day of school: a rocket with a bright flame and a name in big letters.\nShown with the name Leon.',
        blank: { kind: 'kids_tee' },
        basePriceMinor: 2200, extraLayerPriceMinor: 250, occasions: ['birthday', 'back-to-school'],
        personalisation: {
          textFields: [nameField(m, ['navy', 'sea', 'gold', 'stars'], { fonts: ['baloo-bold', 'bangers', 'bebas-neue'], height: 45, max: 14 })],
          motifChoices: [{ motifId: motif('rocket'), label: 'Rocket with flame', layers: [
            { layerId: 'flame', mode: 'shopper', colourChoices: [m('yellow'), m('gold')] },
            { layerId: 'hull', mode: 'shopper', colourChoices: [m('navy'), m('sea'), m('teal')] },
            { layerId: 'window', mode: 'fixed', materialId: m('white') },
          ] }],
          motifRequired: true, outline: null,
        },
        blankCostMinor: 550, minutesPerLayer: 6,
      }),
    },
    {
      state: 'live', photoOf: 'whale',
      content: (m, motif) => ({
        title: 'Whale zip pouch with a name',
        description: 'A zip pouch for pencils or picnic snacks, with a spouting whale and a name.\nShown with the name Priya.',
        blank: { kind: 'pouch' },
        basePriceMinor: 1500, extraLayerPriceMinor: 200, occasions: ['spring-picnic', 'back-to-school'],
        personalisation: {
          textFields: [nameField(m, ['navy', 'sea', 'copper'], { fonts: ['patrick-hand', 'baloo-bold'], height: 25, max: 10 })],
          motifChoices: [{ motifId: motif('whale'), label: 'Whale', layers: [
            { layerId: 'whale', mode: 'shopper', colourChoices: [m('sea'), m('navy'), m('teal')] },
            { layerId: 'belly', mode: 'fixed', materialId: m('white') },
            { layerId: 'spout', mode: 'fixed', materialId: m('sky') },
          ] }],
          motifRequired: false, outline: null,
        },
        blankCostMinor: 280, minutesPerLayer: 4,
      }),
    },
    {
      state: 'live', photoOf: 'balloon',
      content: (m, motif) => ({
        title: 'Winter lights balloon tee with outline',
        description: 'A hot-air balloon over a name, with a glitter outline that catches the winter lights.\nShown with the name Zoë: the fonts draw accented letters.',
        blank: { kind: 'kids_tee' },
        basePriceMinor: 2500, extraLayerPriceMinor: 250, occasions: ['winter-lights', 'birthday'],
        personalisation: {
          textFields: [nameField(m, ['navy', 'teal'], { fonts: ['dancing-script-bold', 'baloo-bold'], height: 40 })],
          motifChoices: [{ motifId: motif('balloon'), label: 'Hot-air balloon', layers: [
            { layerId: 'envelope', mode: 'shopper', colourChoices: [m('teal'), m('sea')] },
            { layerId: 'stripes', mode: 'fixed', materialId: m('yellow') },
            { layerId: 'basket', mode: 'fixed', materialId: m('navy') },
          ] }],
          motifRequired: true, outline: { offsetMm: 3, colourChoices: [m('gold'), m('white')] },
        },
        blankCostMinor: 550, minutesPerLayer: 6,
      }),
    },
  ],
  'harbour-thread': [
    {
      state: 'in_review', photoOf: 'whale',
      content: (m, motif) => ({
        title: 'Seaside whale tote',
        description: 'A tote for beach days with a whale and a name. Shown with the name Bartholomew.',
        blank: { kind: 'tote' },
        basePriceMinor: 2300, extraLayerPriceMinor: 250, occasions: ['spring-picnic'],
        personalisation: {
          textFields: [nameField(m, ['navy', 'sea'], { max: 14, height: 35 })],
          motifChoices: [{ motifId: motif('whale'), label: 'Whale', layers: [
            { layerId: 'whale', mode: 'shopper', colourChoices: [m('navy'), m('sea')] },
            { layerId: 'belly', mode: 'fixed', materialId: m('white') },
          ] }],
          motifRequired: true, outline: null,
        },
      }),
    },
    {
      state: 'in_review', photoOf: 'whale',
      content: (m) => ({
        title: 'Harbour name pouch',
        description: 'A plain zip pouch with a name in sail white.',
        blank: { kind: 'pouch' },
        basePriceMinor: 1400, occasions: ['back-to-school'],
        personalisation: { textFields: [nameField(m, ['white', 'sea'], { height: 25, max: 10 })], motifChoices: [], motifRequired: false, outline: null },
      }),
    },
  ],
};

/** A listing photo: the motif's clean SVG drawn on the paper-cream background, made with sharp. */
async function photoFor(svg: string): Promise<Buffer> {
  const art = await sharp(Buffer.from(svg), { density: 300 }).resize(560, 560, { fit: 'inside' }).png().toBuffer();
  return sharp({ create: { width: 800, height: 800, channels: 3, background: '#fbf7f0' } }).composite([{ input: art, gravity: 'centre' }]).png().toBuffer();
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
      seedRepo.insertMaterial(db, { id, shopId, kind, colourName, colourHex, rollWidthMm, stockMm, lowStockMm: 1000, pricePerMetreMinor: kind === 'smooth' ? 450 : 800, pressProfile: defaultPressProfile(kind), createdAt: base });
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
      seedRepo.insertUpload(db, { id: uploadId, ownerId: owner, shopId, kind: 'photo', path: img.fileName, thumbPath: img.thumbName, mime: img.mime, width: img.width, height: img.height, bytes: img.bytes, createdAt: base });
    }
    const ref = (map: Record<string, string>, what: string) => (k: string) => {
      if (!map[k]) throw new Error(`demo ${what} ${k} missing in ${shopSlug}`);
      return map[k];
    };
    for (const spec of LISTINGS[shopSlug] ?? []) {
      const input = spec.content(ref(matIds, 'material'), ref(motifIds, 'motif'));
      const content = listingInputSchema.parse({ ...input, photoIds: [photoIds[spec.photoOf]] });
      const at = base - (n++) * 3_600_000; // an hour apart, so "newest" has an order
      const slug = `${content.title.toLowerCase().normalize('NFKD').replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '')}`;
      const live = spec.state === 'live';
      const thumbPath = live ? thumbs[spec.photoOf] : null;
      seedRepo.insertListing(db, {
        id: crypto.randomUUID(), shopId, slug, state: spec.state, draft: content,
        live: live ? content : null,
        ...(live ? { ...liveColumns(content), liveThumbPath: thumbPath, publishedAt: at } : {}),
        createdAt: at, updatedAt: at,
      });
    }
  }
}
