import { Router } from 'express';
import { createMaterialSchema, type MaterialsQuery, materialIdParams, materialsQuerySchema, PRESS_DEFAULTS, updateMaterialSchema } from '../../../shared/schemas/material.ts';
import type { AppDeps } from '../../deps.ts';
import { ownShop, requireRole } from '../../http/auth-guards.ts';
import { validate } from '../../http/validate.ts';
import * as svc from './materials.service.ts';

/** /api/materials: the signed-in seller's vinyl stock. Every query is scoped by their shop. */
export function materialsRouter(deps: AppDeps): Router {
  const r = Router();
  r.use(requireRole('seller'));
  r.get('/press-defaults', (_req, res) => {
    res.json({ pressDefaults: PRESS_DEFAULTS });
  });
  r.get('/', validate({ query: materialsQuerySchema }), (req, res) => {
    res.json(svc.list(deps.db, ownShop(deps.db, req).id, res.locals.query as MaterialsQuery));
  });
  r.post('/', validate({ body: createMaterialSchema }), (req, res) => {
    res.status(201).json({ material: svc.create(deps, ownShop(deps.db, req).id, req.body) });
  });
  r.get('/:id', validate({ params: materialIdParams }), (req, res) => {
    res.json({ material: svc.get(deps.db, ownShop(deps.db, req).id, req.params.id as string) });
  });
  r.patch('/:id', validate({ params: materialIdParams, body: updateMaterialSchema }), (req, res) => {
    res.json({ material: svc.update(deps.db, ownShop(deps.db, req).id, req.params.id as string, req.body) });
  });
  r.delete('/:id', validate({ params: materialIdParams }), (req, res) => {
    res.json(svc.remove(deps.db, ownShop(deps.db, req).id, req.params.id as string));
  });
  return r;
}
