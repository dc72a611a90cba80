// Orders are made from a paid checkout: one order per shop, lines waiting for the proof check.
import crypto from 'node:crypto';
import { shipByDate as businessShipBy } from '../../../shared/business/working-days.ts';
import { splitForShop } from '../../../shared/money.ts';
import type { LineSnapshot } from '../../../shared/schemas/cart.ts';
import { FIRST_LINE_STATE } from '../../../shared/schemas/order.ts';
import type { PageQuery } from '../../../shared/schemas/pagination.ts';
import type { Db } from '../../db/client.ts';
import { notFound } from '../../http/app-error.ts';
import { recordFirstState } from './line-state.ts';
import { listOrders, orderDetail } from './order-view.ts';
import { type OrderRow, ordersRepo } from './orders.repo.ts';

export type PricedShop = {
  shopId: string;
  shopName: string;
  shippingMinor: number;
  subtotalMinor: number;
  totalMinor: number;
  /** the shop's code: subtotalMinor is before it, each line's totalMinor after its share */
  discount?: { code: string; discountMinor: number } | null;
  neededBy?: string | null;
  lines: Array<{ listingId: string; title: string; quantity: number; unitPriceMinor: number; totalMinor: number; discountMinor?: number; snapshot: LineSnapshot }>;
};

/**
 * The date a shop should ship by: `days` of its working days (weekdays it works, less its days
 * off) after the day of payment — shared/business/working-days.ts (date-fns), in the shops' time zone.
 */
export function shipByDate(paidAt: number, days: number, workingDays: number[], daysOff: string[], timeZone = 'UTC'): string {
  return businessShipBy(paidAt, days, { workingDays: workingDays.length ? workingDays : [1, 2, 3, 4, 5], daysOff }, timeZone);
}

/**
 * Creates the orders of one paid checkout. Runs inside the webhook's transaction (the caller's
 * `db` is the transaction), so the orders and the processed event id commit together or not at all.
 */
export function createOrdersForCheckout(
  db: Db,
  args: { checkoutId: string; buyerId: string; currency: string; shops: PricedShop[]; paidAt: number; feeBps: number; paymentIntentId: string | null; timeZone?: string },
): OrderRow[] {
  const shopRows = new Map(
    ordersRepo
      .shopsByIds(
        db,
        args.shops.map((s) => s.shopId),
      )
      .map((s) => [s.id, s]),
  );
  const made: OrderRow[] = [];
  for (const s of args.shops) {
    const shop = shopRows.get(s.shopId);
    // the platform's fee is taken on what the shopper pays: the lines after the shop's code
    const discountMinor = s.discount?.discountMinor ?? 0;
    const split = splitForShop(s.subtotalMinor - discountMinor, s.shippingMinor, args.feeBps);
    const orderId = crypto.randomUUID();
    ordersRepo.insertOrder(db, {
      id: orderId,
      number: ordersRepo.nextNumber(db),
      checkoutId: args.checkoutId,
      shopId: s.shopId,
      buyerId: args.buyerId,
      currency: args.currency,
      subtotalMinor: s.subtotalMinor,
      shippingMinor: s.shippingMinor,
      platformFeeMinor: split.feeMinor,
      totalMinor: split.shopTotalMinor,
      discountMinor,
      discountCode: discountMinor > 0 ? (s.discount?.code ?? null) : null,
      neededBy: s.neededBy ?? null,
      shipByDate: shop ? shipByDate(args.paidAt, shop.processingDays, shop.workingDays, shop.daysOff, args.timeZone) : null,
      paidAt: args.paidAt,
      createdAt: args.paidAt,
    });
    for (const l of s.lines) {
      const lineId = crypto.randomUUID();
      ordersRepo.insertLine(db, {
        id: lineId,
        orderId,
        listingId: l.listingId,
        listingTitle: l.title,
        quantity: l.quantity,
        unitPriceMinor: l.unitPriceMinor,
        totalMinor: l.totalMinor,
        discountMinor: l.discountMinor ?? 0,
        state: FIRST_LINE_STATE,
        snapshot: l.snapshot,
        version: 1,
        createdAt: args.paidAt,
        updatedAt: args.paidAt,
      });
      ordersRepo.insertVersion(db, { id: crypto.randomUUID(), lineId, version: 1, snapshot: l.snapshot, authorId: args.buyerId, createdAt: args.paidAt });
      recordFirstState(db, { id: lineId, state: FIRST_LINE_STATE }, null, args.paidAt, 'Paid. The shop will check the personalisation before cutting.');
    }
    ordersRepo.insertLedger(db, {
      id: crypto.randomUUID(),
      shopId: s.shopId,
      orderId,
      kind: 'charge',
      amountMinor: split.shopTotalMinor,
      currency: args.currency,
      providerRef: args.paymentIntentId,
      memo: 'shopper paid (lines + shipping)',
      createdAt: args.paidAt,
    });
    made.push(ordersRepo.find(db, orderId)!);
  }
  return made;
}

export const shopperOrders = (db: Db, buyerId: string, q: PageQuery) => listOrders(db, buyerId, q);

/** A shopper sees only their own orders; anyone else's is "not found" (no hint that it exists). */
export function shopperOrder(db: Db, buyerId: string, orderId: string) {
  const o = ordersRepo.find(db, orderId);
  if (!o || o.buyerId !== buyerId) throw notFound('We could not find that order.');
  return orderDetail(db, o);
}
