import { Router } from 'express';
import { addCartLineSchema, cartLineParams, updateCartLineSchema } from '../../../shared/schemas/cart.ts';
import type { AppDeps } from '../../deps.ts';
import { perAccountLimit } from '../../http/account-rate-limit.ts';
import { validate } from '../../http/validate.ts';
import { cartRepo } from './cart.repo.ts';
import { addLine, cartView, removeLine, setQuantity } from './cart.service.ts';
import { cartOfRequest } from './cart-cookie.ts';

/** /api/cart — guests and signed-in shoppers alike. */
export function cartRouter(deps: AppDeps): Router {
  const r = Router();
  r.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  r.get('/', (req, res) => {
    res.json(cartView(deps.db, cartOfRequest(deps, req, res, { create: false })));
  });
  r.post('/lines', perAccountLimit(deps.rateLimits.cartAddsPerMinute, 'items added to the cart', deps.limitStore('cart-adds')), validate({ body: addCartLineSchema }), async (req, res) => {
    const cart = cartOfRequest(deps, req, res, { create: true })!;
    await addLine(deps, cart, req.body);
    res.status(201).json(cartView(deps.db, cartRepo.find(deps.db, cart.id) ?? null));
  });
  r.patch('/lines/:lineId', validate({ params: cartLineParams, body: updateCartLineSchema }), (req, res) => {
    const cart = cartOfRequest(deps, req, res, { create: false });
    setQuantity(deps, cart, String(req.params.lineId), req.body.quantity);
    res.json(cartView(deps.db, cartRepo.find(deps.db, cart!.id) ?? null));
  });
  r.delete('/lines/:lineId', validate({ params: cartLineParams }), (req, res) => {
    const cart = cartOfRequest(deps, req, res, { create: false });
    removeLine(deps, cart, String(req.params.lineId));
    res.json(cartView(deps.db, cartRepo.find(deps.db, cart!.id) ?? null));
  });
  return r;
}
