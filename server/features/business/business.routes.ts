import { Router } from 'express';
import { businessSettingsSchema, dueQuerySchema, type LedgerQuery, ledgerQuerySchema, orderIdParams, priceCheckSchema } from '../../../shared/schemas/business.ts';
import type { AppDeps } from '../../deps.ts';
import { ownShop, requireRole } from '../../http/auth-guards.ts';
import { validate } from '../../http/validate.ts';
import * as service from './business.service.ts';

/** The seller's business view: /api/business. Everything is scoped by the seller's own shop. */
export function businessRouter(deps: AppDeps): Router {
  const r = Router();
  r.use(requireRole('seller'));
  r.get('/settings', (req, res) => {
    res.json({ settings: service.settings(deps, ownShop(deps.db, req)) });
  });
  r.patch('/settings', validate({ body: businessSettingsSchema }), (req, res) => {
    res.json({ settings: service.updateSettings(deps, ownShop(deps.db, req), req.body) });
  });
  r.get('/due', validate({ query: dueQuerySchema }), (req, res) => {
    const q = res.locals.query as { today?: string };
    res.json(service.due(deps, ownShop(deps.db, req), q.today));
  });
  r.get('/costs', (req, res) => {
    res.json(service.costs(deps, ownShop(deps.db, req)));
  });
  r.get('/orders/:orderId/costs', validate({ params: orderIdParams }), (req, res) => {
    const view = service.costs(deps, ownShop(deps.db, req), String(req.params.orderId));
    res.json({ order: view.orders[0] });
  });
  r.post('/price-check', validate({ body: priceCheckSchema }), async (req, res) => {
    res.json(await service.priceCheck(deps, ownShop(deps.db, req), req.body));
  });
  r.get('/ledger', validate({ query: ledgerQuerySchema }), (req, res) => {
    res.json(service.ledgerView(deps, ownShop(deps.db, req), res.locals.query as LedgerQuery));
  });
  r.get('/ledger.csv', validate({ query: ledgerQuerySchema }), (req, res) => {
    const q = res.locals.query as LedgerQuery;
    const name = `namesake-ledger${q.from ? `-from-${q.from}` : ''}${q.to ? `-to-${q.to}` : ''}.csv`;
    res.type('text/csv; charset=utf-8').setHeader('Content-Disposition', `attachment; filename="${name}"`);
    res.send(service.ledgerCsvOf(deps, ownShop(deps.db, req), q));
  });
  r.get('/charts', (req, res) => {
    res.json(service.charts(deps, ownShop(deps.db, req)));
  });
  return r;
}
