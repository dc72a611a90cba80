import { Router } from 'express';
import { orderIdParams, ordersQuerySchema } from '../../../shared/schemas/order.ts';
import type { PageQuery } from '../../../shared/schemas/pagination.ts';
import type { AppDeps } from '../../deps.ts';
import { currentUser, requireUser } from '../../http/auth-guards.ts';
import { validate } from '../../http/validate.ts';
import { shopperOrder, shopperOrders } from './orders.service.ts';

/** /api/orders — the signed-in shopper's own orders. */
export function ordersRouter(deps: AppDeps): Router {
  const r = Router();
  r.get('/', requireUser, validate({ query: ordersQuerySchema }), (req, res) => {
    res.json(shopperOrders(deps.db, currentUser(req).id, res.locals.query as PageQuery));
  });
  r.get('/:id', requireUser, validate({ params: orderIdParams }), (req, res) => {
    res.json(shopperOrder(deps.db, currentUser(req).id, String(req.params.id)));
  });
  return r;
}
