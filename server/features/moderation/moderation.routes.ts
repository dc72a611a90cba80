import { Router } from 'express';
import {
  type AuditQuery,
  approveShopSchema,
  auditQuerySchema,
  decisionSchema,
  type ModerationShopsFilter,
  moderationIdParams,
  moderationShopsQuery,
  optionalReasonSchema,
  queueQuerySchema,
  reasonSchema,
  rejectDecisionSchema,
} from '../../../shared/schemas/catalog.ts';
import type { PageQuery } from '../../../shared/schemas/pagination.ts';
import type { AppDeps } from '../../deps.ts';
import { currentUser, requireRole } from '../../http/auth-guards.ts';
import { validate } from '../../http/validate.ts';
import * as svc from './moderation.service.ts';

/** /api/moderation: the moderation desk, admins only (403 for everyone else, 401 for guests). */
export function moderationRouter(deps: AppDeps): Router {
  const r = Router();
  r.use(requireRole('admin'));
  const id = (req: { params: Record<string, unknown> }) => String(req.params.id);
  r.get('/queue/listings', validate({ query: queueQuerySchema }), (_req, res) => {
    res.json(svc.listingQueue(deps.db, res.locals.query as PageQuery));
  });
  r.get('/queue/listings/:id', validate({ params: moderationIdParams }), (req, res) => {
    res.json({ listing: svc.listingQueueItem(deps.db, id(req)) });
  });
  r.get('/queue/shop-changes', validate({ query: queueQuerySchema }), (_req, res) => {
    res.json(svc.shopChangeQueue(deps.db, res.locals.query as PageQuery));
  });
  r.get('/queue/shops', validate({ query: queueQuerySchema }), (_req, res) => {
    res.json(svc.shopQueue(deps.db, res.locals.query as PageQuery));
  });
  r.get('/shops', validate({ query: moderationShopsQuery }), (_req, res) => {
    res.json(svc.shops(deps.db, res.locals.query as ModerationShopsFilter));
  });
  r.get('/listings/:id', validate({ params: moderationIdParams }), (req, res) => {
    res.setHeader('Cache-Control', 'private, no-store');
    res.json(svc.listingForReview(deps.db, currentUser(req), id(req)));
  });
  // a decision names the revision the moderator was shown: 409 if the seller changed it since
  r.post('/listings/:id/approve', validate({ params: moderationIdParams, body: decisionSchema }), async (req, res) => {
    res.json({ listing: await svc.approveListing(deps, currentUser(req), id(req), req.body.revision) });
  });
  r.post('/listings/:id/reject', validate({ params: moderationIdParams, body: rejectDecisionSchema }), async (req, res) => {
    res.json({ listing: await svc.rejectListing(deps, currentUser(req), id(req), req.body.revision, req.body.reason) });
  });
  r.post('/shops/:id/approve-change', validate({ params: moderationIdParams, body: decisionSchema }), async (req, res) => {
    res.json({ shop: await svc.approveShopChange(deps, currentUser(req), id(req), req.body.revision) });
  });
  r.post('/shops/:id/reject-change', validate({ params: moderationIdParams, body: rejectDecisionSchema }), async (req, res) => {
    res.json({ shop: await svc.rejectShopChange(deps, currentUser(req), id(req), req.body.revision, req.body.reason) });
  });
  for (const move of ['approve', 'restore'] as const)
    r.post(`/shops/:id/${move}`, validate({ params: moderationIdParams, body: move === 'approve' ? approveShopSchema : optionalReasonSchema }), async (req, res) => {
      res.json({ shop: await svc.moveShop(deps, currentUser(req), id(req), move, req.body.reason ?? null, req.body.revision) });
    });
  for (const move of ['reject', 'suspend'] as const)
    r.post(`/shops/:id/${move}`, validate({ params: moderationIdParams, body: reasonSchema }), async (req, res) => {
      res.json({ shop: await svc.moveShop(deps, currentUser(req), id(req), move, req.body.reason) });
    });
  r.get('/audit', validate({ query: auditQuerySchema }), (_req, res) => {
    res.json(svc.auditLog(deps.db, res.locals.query as AuditQuery));
  });
  return r;
}
