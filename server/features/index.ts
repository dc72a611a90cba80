import type { Router } from 'express';
import type { AppDeps } from '../app.ts';
import { shopsRouter } from './shops/shops.routes.ts';
import { materialsRouter } from './materials/materials.routes.ts';
import { listingsRouter } from './listings/listings.routes.ts';
import { uploadsApiRouter } from './uploads/uploads.routes.ts';
import { moderationRouter } from './moderation/moderation.routes.ts';
import { catalogRouter, catalogSearchRouter } from './catalog/catalog.routes.ts';
import { cartRouter } from './cart/cart.routes.ts';
import { checkoutRouter } from './checkout/checkout.routes.ts';
import { ordersRouter } from './orders/orders.routes.ts';
import { refundsRouter } from './refunds/refunds.routes.ts';
import { paymentsWebhookRouter } from './payments/payments.routes.ts';
import { engineRouter } from './engine/engine.routes.ts';
import { proofEditRouter, workroomRouter } from './workroom/workroom.routes.ts';
import { businessRouter } from './business/business.routes.ts';

type Mounted = { path: string; router: Router };

/**
 * Every feature's router, in one list so app.ts stays short. `raw` routers mount before the JSON
 * body parser (for signed webhooks that must see the raw bytes); `json` ones after it.
 */
export function featureRouters(deps: AppDeps): { raw: Mounted[]; json: Mounted[] } {
  const uploads = uploadsApiRouter(deps);
  return {
    raw: [
      { path: '/api/payments/webhook', router: paymentsWebhookRouter(deps) },
      // the public search needs neither a body nor a session: it runs before both (see catalog.routes.ts)
      { path: '/api/listings', router: catalogSearchRouter(deps) },
    ],
    json: [
      { path: '/api/shop', router: shopsRouter(deps) },
      { path: '/api/materials', router: materialsRouter(deps) },
      { path: '/api/seller/listings', router: listingsRouter(deps) },
      { path: '/api/uploads', router: uploads.uploads },
      { path: '/api/motifs', router: uploads.motifs },
      { path: '/api/moderation', router: moderationRouter(deps) },
      { path: '/api/cart', router: cartRouter(deps) },
      { path: '/api/checkout', router: checkoutRouter(deps) },
      { path: '/api/orders', router: ordersRouter(deps) },
      { path: '/api/orders', router: refundsRouter(deps) },
      { path: '/api/workroom', router: workroomRouter(deps) },
      { path: '/api/business', router: businessRouter(deps) },
      { path: '/api/order-lines', router: proofEditRouter(deps) },
      { path: '/api', router: engineRouter({ pool: deps.pool }) },
      { path: '/api', router: catalogRouter(deps) },
      // uploaded photos: our own random names only, nosniff, never script
      { path: '/uploads', router: uploads.files },
    ],
  };
}
