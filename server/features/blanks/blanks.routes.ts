import { Router } from 'express';
import { blankIdParams, blankStockInputSchema, blankTypeInputSchema } from '../../../shared/schemas/blanks.ts';
import type { AppDeps } from '../../deps.ts';
import { ownShop, requireRole } from '../../http/auth-guards.ts';
import { validate } from '../../http/validate.ts';
import * as svc from './blanks.service.ts';

/** /api/seller/blanks: the signed-in seller's blank types and stock. Every query is scoped by their shop. */
export function blanksRouter(deps: AppDeps): Router {
  const r = Router();
  r.use(requireRole('seller'));
  r.get('/', (req, res) => {
    res.json({ blankTypes: svc.listTypes(deps.db, ownShop(deps.db, req).id) });
  });
  r.post('/', validate({ body: blankTypeInputSchema }), (req, res) => {
    res.status(201).json({ blankType: svc.createType(deps, ownShop(deps.db, req).id, req.body) });
  });
  r.put('/:id', validate({ params: blankIdParams, body: blankTypeInputSchema }), (req, res) => {
    res.json({ blankType: svc.updateType(deps, ownShop(deps.db, req).id, req.params.id as string, req.body) });
  });
  r.put('/:id/stock', validate({ params: blankIdParams, body: blankStockInputSchema }), (req, res) => {
    res.json({ blankType: svc.setStock(deps, ownShop(deps.db, req).id, req.params.id as string, req.body) });
  });
  return r;
}
