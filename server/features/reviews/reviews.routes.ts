import { Router } from 'express';
import { orderIdParams } from '../../../shared/schemas/order.ts';
import type { PageQuery } from '../../../shared/schemas/pagination.ts';
import { hideReviewSchema, lineReviewParams, postReviewSchema, replySchema, reviewIdParams, reviewsQuerySchema, slugParams } from '../../../shared/schemas/review.ts';
import type { AppDeps } from '../../deps.ts';
import { perAccountLimit } from '../../http/account-rate-limit.ts';
import { currentUser, requireRole, requireUser, shopOfRequester } from '../../http/auth-guards.ts';
import { validate } from '../../http/validate.ts';
import { createStorage, IMAGE_LIMITS, singleFile } from '../../integrations/storage.ts';
import * as svc from './reviews.service.ts';

/** Room for a review's text in a multipart body (its characters can take up to 4 bytes each). */
const TEXT_FIELD_BYTES = 8 * 1024;

/**
 * /api/orders/:id/reviews and /api/orders/:id/lines/:lineId/review — an order's lines and their
 * reviews (its shopper, its shop, admins; anyone else 404) — and /api/reviews: the public pages of
 * a listing's or shop's reviews, the shop's reply, an admin's hiding. A review's photo goes through
 * the upload checks in the worker pool and is public like a listing photo (served by /uploads).
 */
export function reviewsRouters(deps: AppDeps): { orders: Router; reviews: Router } {
  const storage = createStorage(deps.env.uploadsDir, { process: (bytes) => deps.pool.run({ kind: 'image', bytes }) });
  const limit = perAccountLimit(deps.rateLimits.messagesPerMinute, 'reviews and replies', deps.limitStore('reviews'));
  const viewer = (req: Parameters<typeof currentUser>[0]) => ({ user: currentUser(req), shopId: shopOfRequester(deps.db, req)?.id ?? null });

  const o = Router();
  o.get('/:id/reviews', requireUser, validate({ params: orderIdParams }), (req, res) => {
    res.json(svc.orderReviews(deps.db, String(req.params.id), viewer(req), deps.now()));
  });
  o.post(
    '/:id/lines/:lineId/review',
    requireUser,
    validate({ params: lineReviewParams }),
    // who may review, and whether the line may be reviewed yet, before a byte of the upload is read
    (req, _res, next) => (svc.assertCanReview(deps.db, String(req.params.id), String(req.params.lineId), viewer(req), deps.now()), next()),
    limit,
    singleFile(IMAGE_LIMITS.maxBytes, { fieldSize: TEXT_FIELD_BYTES }),
    async (req, res) => {
      const input = postReviewSchema.parse(req.body ?? {});
      const photo = req.file ? await storage.saveImage(req.file.buffer) : null;
      res.status(201).json({ review: svc.create(deps, String(req.params.id), String(req.params.lineId), viewer(req), input, photo) });
    },
  );

  const r = Router();
  r.get('/listings/:slug', validate({ params: slugParams, query: reviewsQuerySchema }), (req, res) => {
    res.json(svc.listingReviews(deps.db, String(req.params.slug), res.locals.query as PageQuery));
  });
  r.get('/shops/:slug', validate({ params: slugParams, query: reviewsQuerySchema }), (req, res) => {
    res.json(svc.shopReviews(deps.db, String(req.params.slug), res.locals.query as PageQuery));
  });
  r.post('/:id/reply', requireRole('seller'), validate({ params: reviewIdParams }), limit, validate({ body: replySchema }), (req, res) => {
    res.json({ review: svc.reply(deps, String(req.params.id), viewer(req), (req.body as { reply: string }).reply) });
  });
  r.post('/:id/hide', requireRole('admin'), validate({ params: reviewIdParams, body: hideReviewSchema }), (req, res) => {
    res.json({ review: svc.hide(deps, String(req.params.id), currentUser(req), (req.body as { reason: string }).reason) });
  });
  return { orders: o, reviews: r };
}
