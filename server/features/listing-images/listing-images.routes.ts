import { Router } from 'express';
import { z } from 'zod';
import type { SsrEntry } from '../../../shared/ssr-contract.ts';
import type { AppDeps } from '../../deps.ts';
import { notFound } from '../../http/app-error.ts';
import type { PreviewCache } from '../ssr/index.ts';
import { LISTING_IMAGE_FORMATS, type ListingImageFormat, listingImage } from './listing-images.service.ts';

const fileParams = z.object({
  file: z
    .string()
    .max(130)
    .regex(/^[a-z0-9-]{1,120}(\.card)?\.(png|webp)$/),
});

/**
 * GET /listing-images/:slug.png (or .webp; `:slug.card.webp` the browse card's 480 × 360): a live listing's design on its blank. The answer may
 * be cached for an hour and revalidated by its ETag, the hash of what it draws.
 */
export function listingImagesRouter(deps: AppDeps, entry: (() => Promise<SsrEntry | null>) | undefined): Router {
  const r = Router();
  const cache: PreviewCache = new Map();
  r.get('/:file', async (req, res) => {
    const parsed = fileParams.safeParse(req.params);
    const e = entry ? await entry() : null;
    if (!parsed.success || !e) throw notFound('No such picture.');
    const dot = parsed.data.file.lastIndexOf('.');
    const card = parsed.data.file.slice(0, dot).endsWith('.card');
    const slug = parsed.data.file.slice(0, dot).replace(/\.card$/, '');
    const format = parsed.data.file.slice(dot + 1) as ListingImageFormat;
    if (!LISTING_IMAGE_FORMATS.includes(format)) throw notFound('No such picture.');
    const img = await listingImage(deps, e, cache, slug, format, card ? 'card' : 'social');
    res.setHeader('Cache-Control', 'public, max-age=3600');
    res.setHeader('ETag', `"${img.hash}"`);
    if (req.fresh) return void res.status(304).end();
    res.type(format).sendFile(img.file);
  });
  return r;
}
