// Orders as the API shows them (shopper pages, the seller's refund answer).

import { parseShipTo } from '../../../shared/schemas/checkout.ts';
import type { LineState, OrderDetail, OrderEvent, OrderSummary } from '../../../shared/schemas/order.ts';
import { type Page, type PageQuery, pageOffset, toPage } from '../../../shared/schemas/pagination.ts';
import type { Db } from '../../db/client.ts';
import { type OrderLineRow, type OrderRow, ordersRepo } from './orders.repo.ts';

type ShopRow = ReturnType<typeof ordersRepo.shopsByIds>[number];

function summary(o: OrderRow, shop: ShopRow | undefined, lines: OrderLineRow[]): OrderSummary {
  return {
    id: o.id,
    number: o.number,
    shop: { id: o.shopId, name: shop?.name ?? 'A shop', slug: shop?.slug ?? '' },
    currency: o.currency,
    totalMinor: o.totalMinor,
    itemCount: lines.reduce((a, l) => a + l.quantity, 0),
    states: lines.map((l) => l.state as LineState),
    paidAt: o.paidAt,
    shippedAt: o.shippedAt,
  };
}

/** One page of the shopper's orders, newest first. */
export function listOrders(db: Db, buyerId: string, q: PageQuery): Page<OrderSummary> {
  const os = ordersRepo.forBuyer(db, buyerId, q.limit, pageOffset(q));
  const lines = ordersRepo.lines(
    db,
    os.map((o) => o.id),
  );
  const shops = new Map(ordersRepo.shopsByIds(db, [...new Set(os.map((o) => o.shopId))]).map((s) => [s.id, s]));
  const items = os.map((o) =>
    summary(
      o,
      shops.get(o.shopId),
      lines.filter((l) => l.orderId === o.id),
    ),
  );
  return toPage(items, ordersRepo.countForBuyer(db, buyerId), q);
}

export function orderDetail(db: Db, o: OrderRow): OrderDetail {
  const lines = ordersRepo.lines(db, [o.id]);
  const shop = ordersRepo.shopsByIds(db, [o.shopId])[0];
  const events = ordersRepo.events(
    db,
    lines.map((l) => l.id),
  );
  const actor = (id: string | null): OrderEvent['actor'] => (id === null ? null : id === o.buyerId ? 'you' : id === shop?.ownerId ? 'shop' : 'namesake');
  const refunded = ordersRepo.refundsOf(db, o.id).reduce((a, r) => a + r.amountMinor, 0);
  return {
    ...summary(o, shop, lines),
    subtotalMinor: o.subtotalMinor,
    shippingMinor: o.shippingMinor,
    discountMinor: o.discountMinor,
    discountCode: o.discountCode,
    neededBy: o.neededBy,
    refundedMinor: refunded,
    carrier: o.carrier,
    trackingNumber: o.trackingNumber,
    shipTo: parseShipTo(o.shipTo),
    lines: lines.map((l) => ({
      id: l.id,
      listingId: l.listingId,
      listingTitle: l.listingTitle,
      quantity: l.quantity,
      unitPriceMinor: l.unitPriceMinor,
      totalMinor: l.totalMinor,
      refundedMinor: l.refundedMinor,
      state: l.state as LineState,
      version: l.version,
      snapshot: l.snapshot,
      history: events
        .filter((e) => e.lineId === l.id)
        .map((e) => ({ id: e.id, fromState: e.fromState as LineState | null, toState: e.toState as LineState, message: e.message, at: e.createdAt, actor: actor(e.actorId) })),
    })),
  };
}
