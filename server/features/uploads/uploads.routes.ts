import { Router } from 'express';
import { z } from 'zod';
import { MOTIF_LIMITS } from '../../../shared/engine/motif.ts';
import type { AppDeps } from '../../deps.ts';
import { perAccountLimit } from '../../http/account-rate-limit.ts';
import { badRequest } from '../../http/app-error.ts';
import { currentUser, ownShop, requireRole, shopOfRequester } from '../../http/auth-guards.ts';
import { validate } from '../../http/validate.ts';
import { createStorage, IMAGE_LIMITS, singleFile, uploadsRouter } from '../../integrations/storage.ts';
import * as svc from './uploads.service.ts';

const idParams = z.object({ id: z.string().min(1).max(64) });
const photoKind = z.object({ kind: z.enum(['photo', 'logo']).default('photo') });
const motifName = z.object({ name: z.string({ error: 'Name the motif.' }).trim().min(1, 'Name the motif.').max(60, 'Use at most 60 characters.') });

/** Photo uploads (/api/uploads) and motif uploads (/api/motifs): multipart, one `file` per request. */
export function uploadsApiRouter(deps: AppDeps): { uploads: Router; motifs: Router; files: Router } {
  // images are checked and re-encoded in the worker pool, never on the request thread
  const storage = createStorage(deps.env.uploadsDir, { process: (bytes) => deps.pool.run({ kind: 'image', bytes }) });
  // one limiter for photos and motifs alike: an account's uploads per minute
  const uploadLimit = perAccountLimit(deps.rateLimits.uploadsPerMinute, 'uploads', deps.limitStore('uploads'));

  const up = Router();
  up.use(requireRole('seller'));
  // the shop is checked before multer reads a byte, so a user without a shop uploads nothing
  up.post(
    '/',
    (req, _res, next) => (ownShop(deps.db, req), next()),
    uploadLimit,
    singleFile(IMAGE_LIMITS.maxBytes),
    async (req, res) => {
      const { kind } = photoKind.parse(req.body ?? {});
      if (!req.file) throw badRequest('Choose an image file.', { file: 'Choose an image file.' });
      res.status(201).json({ upload: await svc.savePhoto({ ...deps, storage }, currentUser(req), ownShop(deps.db, req).id, kind, req.file.buffer) });
    },
  );
  up.get('/', (req, res) => {
    res.json({ uploads: svc.listPhotos(deps.db, ownShop(deps.db, req).id) });
  });
  up.delete('/:id', validate({ params: idParams }), (req, res) => {
    res.json(svc.removePhoto({ ...deps, storage }, ownShop(deps.db, req).id, req.params.id as string));
  });

  const motifs = Router();
  // public (with its own visibility rule): shoppers see motifs offered by listings on sale
  motifs.get('/:id/svg', validate({ params: idParams }), (req, res) => {
    const shopId = shopOfRequester(deps.db, req)?.id ?? null;
    const svg = svc.motifSvg(deps.db, req.params.id as string, { role: req.user?.role, shopId });
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Content-Security-Policy', "default-src 'none'; style-src 'unsafe-inline'; sandbox");
    res.type('image/svg+xml').send(svg);
  });
  motifs.use(requireRole('seller'));
  motifs.post(
    '/',
    (req, _res, next) => (ownShop(deps.db, req), next()),
    uploadLimit,
    singleFile(MOTIF_LIMITS.maxBytes),
    async (req, res) => {
      const { name } = motifName.parse(req.body ?? {});
      if (!req.file) throw badRequest('Choose an SVG file.', { file: 'Choose an SVG file.' });
      res.status(201).json(await svc.saveMotif(deps, ownShop(deps.db, req).id, name, req.file.buffer));
    },
  );
  motifs.get('/', (req, res) => {
    res.json({ motifs: svc.listOwnMotifs(deps.db, ownShop(deps.db, req).id) });
  });
  motifs.get('/:id', validate({ params: idParams }), (req, res) => {
    res.json({ motif: svc.getOwnMotif(deps.db, ownShop(deps.db, req).id, req.params.id as string) });
  });
  motifs.delete('/:id', validate({ params: idParams }), (req, res) => {
    res.json(svc.removeMotif(deps.db, ownShop(deps.db, req).id, req.params.id as string));
  });

  return { uploads: up, motifs, files: uploadsRouter(storage.dir) };
}
