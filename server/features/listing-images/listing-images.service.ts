// A listing's picture for shared links and search results: its design for the default name on its
// blank (the one drawing of it, src/components/design/design-on-blank.tsx, through the server-render
// entry), rendered by sharp to PNG or WebP and kept on disk under the hash of what was drawn, so a
// listing that did not change is never drawn twice and a changed one gets a new file.
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import type { SsrEntry } from '../../../shared/ssr-contract.ts';
import type { AppDeps } from '../../deps.ts';
import { listingPage } from '../catalog/index.ts';
import { composeCached, type PreviewCache } from '../ssr/index.ts';

export const LISTING_IMAGE = { width: 1200, height: 630, background: '#fbf7f0' } as const;
/** The two sizes drawn: the social card (shared links, search results) and the browse card (4:3, as the grid shows it). */
export const LISTING_IMAGE_SIZES = { social: { width: 1200, height: 630, margin: 20 }, card: { width: 480, height: 360, margin: 12 } } as const;
export type ListingImageSize = keyof typeof LISTING_IMAGE_SIZES;
export const LISTING_IMAGE_FORMATS = ['png', 'webp'] as const;
export type ListingImageFormat = (typeof LISTING_IMAGE_FORMATS)[number];
/** bump when the picture's layout below changes, so cached files are made again */
const LAYOUT_VERSION = 1;

export type ListingImage = { file: string; hash: string };

/** The picture as SVG: the design on its blank, from the listing's live copy. */
export async function listingImageSvg(deps: AppDeps, entry: SsrEntry, cache: PreviewCache, slug: string): Promise<string> {
  const listing = JSON.parse(JSON.stringify(listingPage(deps.db, slug, 'live', undefined))) as ReturnType<typeof listingPage>;
  const input = entry.previewInput(listing);
  const pieces = input ? await composeCached(deps, cache, input) : [];
  return entry.designSvg(listing, pieces);
}

/** Renders the SVG centred on a paper-coloured card of LISTING_IMAGE's size. */
export async function rasterise(svg: string, format: ListingImageFormat, size: ListingImageSize = 'social'): Promise<Buffer> {
  const { width, height, margin } = LISTING_IMAGE_SIZES[size];
  const drawing = await sharp(Buffer.from(svg), { density: 288, limitInputPixels: 40_000_000 })
    .resize({ width: width - 2 * margin, height: height - 2 * margin, fit: 'inside' })
    .png()
    .toBuffer();
  const card = sharp({ create: { width, height, channels: 4, background: LISTING_IMAGE.background } }).composite([{ input: drawing, gravity: 'centre' }]);
  return format === 'png' ? card.png({ compressionLevel: 9 }).toBuffer() : card.webp({ quality: 90 }).toBuffer();
}

const inFlight = new Map<string, Promise<ListingImage>>();

/** The picture's file, made on first ask and reused while what it draws stays the same. */
export async function listingImage(deps: AppDeps, entry: SsrEntry, cache: PreviewCache, slug: string, format: ListingImageFormat, size: ListingImageSize = 'social'): Promise<ListingImage> {
  const svg = await listingImageSvg(deps, entry, cache, slug);
  const hash = crypto.createHash('sha256').update(`${LAYOUT_VERSION}\n${format}\n${size}\n${svg}`).digest('hex').slice(0, 32);
  const dir = path.join(deps.env.dataDir, 'listing-images');
  const file = path.join(dir, `${hash}.${format}`);
  if (fs.existsSync(file)) return { file, hash };
  let making = inFlight.get(file);
  if (!making) {
    making = (async () => {
      const bytes = await rasterise(svg, format, size);
      await fs.promises.mkdir(dir, { recursive: true });
      const tmp = `${file}.${process.pid}.${crypto.randomBytes(4).toString('hex')}.tmp`;
      await fs.promises.writeFile(tmp, bytes);
      await fs.promises.rename(tmp, file);
      return { file, hash };
    })().finally(() => inFlight.delete(file));
    inFlight.set(file, making);
  }
  return making;
}
