import { Router } from 'express';
import { orderIdParams, refundSchema } from '../../../shared/schemas/order.ts';
import type { AppDeps } from '../../deps.ts';
import { currentUser, requireUser } from '../../http/auth-guards.ts';
import { validate } from '../../http/validate.ts';
import { refundOrder } from './refunds.service.ts';

/** POST /api/orders/:id/refunds — the order's shop or an admin. */
export function refundsRouter(deps: AppDeps): Router {
  const r = Router();
  r.post('/:id/refunds', requireUser, validate({ params: orderIdParams, body: refundSchema }), async (req, res) => {
    res.status(201).json(await refundOrder(deps, currentUser(req), String(req.params.id), req.body));
  });
  return r;
}
