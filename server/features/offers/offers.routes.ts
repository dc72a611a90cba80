import { Router } from 'express';
import { z } from 'zod';
import { deliveryQuery, discountCodeSchema, discountIdParams, orderByDateSchema, shippingDaysSchema } from '../../../shared/schemas/offers.ts';
import type { AppDeps } from '../../deps.ts';
import { ownShop, requireRole } from '../../http/auth-guards.ts';
import { validate } from '../../http/validate.ts';
import * as service from './offers.service.ts';

/** /api/seller/offers — the seller's codes, shipping estimate and order-by dates; scoped by the seller's own shop. */
export function sellerOffersRouter(deps: AppDeps): Router {
  const r = Router();
  r.use(requireRole('seller'));
  r.get('/discounts', (req, res) => {
    res.json(service.discountsView(deps, ownShop(deps.db, req)));
  });
  r.post('/discounts', validate({ body: discountCodeSchema }), (req, res) => {
    res.status(201).json(service.createCode(deps, ownShop(deps.db, req), req.body));
  });
  r.put('/discounts/:id', validate({ params: discountIdParams, body: discountCodeSchema }), (req, res) => {
    res.json(service.updateCode(deps, ownShop(deps.db, req), String(req.params.id), req.body));
  });
  r.delete('/discounts/:id', validate({ params: discountIdParams }), (req, res) => {
    res.json(service.deleteCode(deps, ownShop(deps.db, req), String(req.params.id)));
  });
  r.get('/delivery', (req, res) => {
    const shop = ownShop(deps.db, req);
    res.json({ shippingDays: shop.shippingDays, processingDays: shop.processingDays, orderBy: service.orderByDatesOf(deps, shop.id) });
  });
  r.put('/shipping-days', validate({ body: shippingDaysSchema }), (req, res) => {
    res.json(service.setShippingDays(deps, ownShop(deps.db, req), req.body.shippingDays));
  });
  r.post('/order-by-dates', validate({ body: orderByDateSchema }), (req, res) => {
    res.status(201).json({ orderBy: service.addOrderByDate(deps, ownShop(deps.db, req), req.body) });
  });
  r.delete('/order-by-dates/:id', validate({ params: discountIdParams }), (req, res) => {
    res.json({ orderBy: service.deleteOrderByDate(deps, ownShop(deps.db, req), String(req.params.id)) });
  });
  return r;
}

const slugParams = z.object({ slug: z.string().min(1).max(120) });

/** /api/offers — public: a listing's delivery dates, needed-by check and order-by banners. */
export function publicOffersRouter(deps: AppDeps): Router {
  const r = Router();
  r.get('/listings/:slug/delivery', validate({ params: slugParams, query: deliveryQuery }), (req, res) => {
    const q = res.locals.query as { neededBy?: string | null };
    res.json(service.listingDelivery(deps, String(req.params.slug), q.neededBy ?? null));
  });
  return r;
}
