import type { Router } from 'express';
import type { AppDeps } from '../deps.ts';
import { accountRouter } from './account/index.ts';
import { adminMailRouter } from './admin/index.ts';
import { blanksRouter } from './blanks/index.ts';
import { businessRouter } from './business/index.ts';
import { cartRouter } from './cart/index.ts';
import { catalogRouter, catalogSearchRouter } from './catalog/index.ts';
import { checkoutRouter } from './checkout/index.ts';
import { engineRouter } from './engine/index.ts';
import { listingsRouter } from './listings/index.ts';
import { materialsRouter } from './materials/index.ts';
import { messagesRouters } from './messages/index.ts';
import { moderationRouter } from './moderation/index.ts';
import { publicOffersRouter, sellerOffersRouter } from './offers/index.ts';
import { ordersRouter } from './orders/index.ts';
import { paymentsWebhookRouter } from './payments/index.ts';
import { refundsRouter } from './refunds/index.ts';
import { reviewsRouters } from './reviews/index.ts';
import { shopsRouter } from './shops/index.ts';
import { uploadsApiRouter } from './uploads/index.ts';
import { proofEditRouter, workroomRouter } from './workroom/index.ts';

type Mounted = { path: string; router: Router };

/**
 * Every feature's router, in one list so app.ts stays short; each comes from its feature's public
 * module (server/features/<feature>/index.ts). `raw` routers mount before the JSON
 * body parser (for signed webhooks that must see the raw bytes); `json` ones after it.
 */
export function featureRouters(deps: AppDeps): { raw: Mounted[]; json: Mounted[] } {
  const uploads = uploadsApiRouter(deps);
  const messages = messagesRouters(deps);
  const reviews = reviewsRouters(deps);
  return {
    raw: [
      { path: '/api/payments/webhook', router: paymentsWebhookRouter(deps) },
      // the public search needs neither a body nor a session: it runs before both (see catalog.routes.ts)
      { path: '/api/listings', router: catalogSearchRouter(deps) },
    ],
    json: [
      { path: '/api', router: accountRouter(deps) },
      { path: '/api/admin/mail', router: adminMailRouter(deps) },
      { path: '/api/shop', router: shopsRouter(deps) },
      { path: '/api/materials', router: materialsRouter(deps) },
      { path: '/api/seller/listings', router: listingsRouter(deps) },
      { path: '/api/seller/blanks', router: blanksRouter(deps) },
      { path: '/api/uploads', router: uploads.uploads },
      { path: '/api/motifs', router: uploads.motifs },
      { path: '/api/moderation', router: moderationRouter(deps) },
      { path: '/api/cart', router: cartRouter(deps) },
      { path: '/api/checkout', router: checkoutRouter(deps) },
      { path: '/api/orders', router: ordersRouter(deps) },
      { path: '/api/orders', router: refundsRouter(deps) },
      { path: '/api/orders', router: messages.thread },
      { path: '/api/messages', router: messages.unread },
      { path: '/api/orders', router: reviews.orders },
      { path: '/api/reviews', router: reviews.reviews },
      { path: '/api/workroom', router: workroomRouter(deps) },
      { path: '/api/business', router: businessRouter(deps) },
      { path: '/api/seller/offers', router: sellerOffersRouter(deps) },
      { path: '/api/offers', router: publicOffersRouter(deps) },
      { path: '/api/order-lines', router: proofEditRouter(deps) },
      { path: '/api', router: engineRouter({ pool: deps.pool, store: deps.limitStore }) },
      { path: '/api', router: catalogRouter(deps) },
      // uploaded photos: our own random names only, nosniff, never script
      { path: '/uploads', router: uploads.files },
    ],
  };
}
