// Who may see an order's thread and reviews: its shopper, its shop, and admins. Anyone else gets
// the same 404 as for an unknown id (no hint that the order exists).
import type { Db } from '../../db/client.ts';
import { notFound } from '../../http/app-error.ts';
import type { SessionUser } from '../../http/auth-guards.ts';
import { type OrderRow, ordersRepo } from './orders.repo.ts';

export type OrderParty = 'shopper' | 'shop' | 'admin';

/** The order and the side the viewer is on; 404 when the viewer is none of them. */
export function orderParty(db: Db, orderId: string, viewer: SessionUser, viewerShopId: string | null): { order: OrderRow; side: OrderParty } {
  const order = ordersRepo.find(db, orderId);
  if (order) {
    if (order.buyerId === viewer.id) return { order, side: 'shopper' };
    if (viewerShopId && order.shopId === viewerShopId) return { order, side: 'shop' };
    if (viewer.role === 'admin') return { order, side: 'admin' };
  }
  throw notFound('We could not find that order.');
}
