import { Router } from 'express';
import { shopSettingsSchema } from '../../../shared/schemas/shop.ts';
import type { AppDeps } from '../../deps.ts';
import { perAccountLimit } from '../../http/account-rate-limit.ts';
import { badRequest } from '../../http/app-error.ts';
import { currentUser, ownShop, requireRole } from '../../http/auth-guards.ts';
import { validate } from '../../http/validate.ts';
import { createStorage, IMAGE_LIMITS, singleFile } from '../../integrations/storage.ts';
import { replaceLogo, toOwnShop, updateSettings } from './shops.service.ts';

/** The seller's own shop: /api/shop. (The public page is the catalogue's GET /api/shops/:slug.) */
export function shopsRouter(deps: AppDeps): Router {
  const r = Router();
  // the logo is checked and re-encoded in the worker pool, like every uploaded image
  const storage = createStorage(deps.env.uploadsDir, { process: (bytes) => deps.pool.run({ kind: 'image', bytes }) });
  r.use(requireRole('seller'));
  r.get('/', (req, res) => {
    res.json({ shop: toOwnShop(ownShop(deps.db, req)) });
  });
  r.patch('/', validate({ body: shopSettingsSchema }), (req, res) => {
    res.json({ shop: updateSettings(deps, ownShop(deps.db, req), req.body) });
  });
  r.post(
    '/logo',
    (req, _res, next) => (ownShop(deps.db, req), next()),
    perAccountLimit(deps.rateLimits.uploadsPerMinute, 'uploads', deps.limitStore('shop-uploads')),
    singleFile(IMAGE_LIMITS.maxBytes),
    async (req, res) => {
      if (!req.file) throw badRequest('Choose an image file.', { file: 'Choose an image file.' });
      res.json({ shop: await replaceLogo({ ...deps, storage }, currentUser(req), ownShop(deps.db, req), req.file.buffer) });
    },
  );
  return r;
}
