import { Router } from 'express';
import { listingIdParams, listingInputSchema, type SellerListingsQuery, sellerListingsQuerySchema } from '../../../shared/schemas/listing.ts';
import type { AppDeps } from '../../deps.ts';
import { ownShop, requireRole } from '../../http/auth-guards.ts';
import { validate } from '../../http/validate.ts';
import * as svc from './listings.service.ts';

/** /api/seller/listings: the signed-in seller's own listings. Every lookup is scoped by their shop. */
export function listingsRouter(deps: AppDeps): Router {
  const r = Router();
  r.use(requireRole('seller'));
  const id = (p: unknown) => String(p);
  r.get('/', validate({ query: sellerListingsQuerySchema }), (req, res) => {
    res.json(svc.list(deps.db, ownShop(deps.db, req).id, res.locals.query as SellerListingsQuery));
  });
  r.post('/', validate({ body: listingInputSchema }), (req, res) => {
    res.status(201).json({ listing: svc.create(deps, ownShop(deps.db, req), req.body) });
  });
  r.get('/:id', validate({ params: listingIdParams }), (req, res) => {
    res.json({ listing: svc.get(deps.db, ownShop(deps.db, req).id, id(req.params.id)) });
  });
  // ownership is checked before the body, so another shop's id is a 404 whatever the body holds
  r.put(
    '/:id',
    validate({ params: listingIdParams }),
    (req, _res, next) => (svc.get(deps.db, ownShop(deps.db, req).id, id(req.params.id)), next()),
    validate({ body: listingInputSchema }),
    (req, res) => {
      res.json({ listing: svc.update(deps, ownShop(deps.db, req).id, id(req.params.id), req.body) });
    },
  );
  r.post('/:id/submit', validate({ params: listingIdParams }), (req, res) => {
    res.json({ listing: svc.submit(deps, ownShop(deps.db, req).id, id(req.params.id)) });
  });
  r.post('/:id/pause', validate({ params: listingIdParams }), (req, res) => {
    res.json({ listing: svc.setPaused(deps, ownShop(deps.db, req).id, id(req.params.id), true) });
  });
  r.post('/:id/unpause', validate({ params: listingIdParams }), (req, res) => {
    res.json({ listing: svc.setPaused(deps, ownShop(deps.db, req).id, id(req.params.id), false) });
  });
  r.delete('/:id', validate({ params: listingIdParams }), (req, res) => {
    res.json(svc.remove(deps, ownShop(deps.db, req).id, id(req.params.id)));
  });
  return r;
}
