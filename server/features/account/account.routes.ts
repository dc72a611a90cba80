import { Router } from 'express';
import { openShopSchema } from '../../../shared/schemas/auth.ts';
import type { AppDeps } from '../../deps.ts';
import { currentUser, requireUser } from '../../http/auth-guards.ts';
import { validate } from '../../http/validate.ts';
import { getMe, openShop } from './account.service.ts';

export function accountRouter(deps: AppDeps): Router {
  const r = Router();
  // a guest is a normal answer, not an error: 200 with no user (no failed request on public pages)
  r.get('/me', (req, res) => {
    res.setHeader('Cache-Control', 'private, no-store');
    res.json(req.user ? getMe(deps.db, currentUser(req)) : { user: null, shop: null });
  });
  r.post('/shops', requireUser, validate({ body: openShopSchema }), (req, res) => {
    const shop = openShop(deps, currentUser(req), req.body);
    res.status(201).json({ shop });
  });
  return r;
}
