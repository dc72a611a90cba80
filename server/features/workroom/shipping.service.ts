// Shipping: an order leaves once every item still to make is pressed; its lines move to `shipped`
// (through orders' transition()) and the shopper gets the tracking by e-mail.

import { canMoveLine, isFinishedLine, type LineState } from '../../../shared/schemas/order.ts';
import type { WorkOrder } from '../../../shared/schemas/workroom.ts';
import type { Db } from '../../db/client.ts';
import { AppError, notFound } from '../../http/app-error.ts';
import { transitionAll } from '../orders/index.ts';
import { lineSnapshot, lineText, lineTitle, orderView, type WorkroomDeps } from './lines.service.ts';
import { workroomRepo as repo } from './workroom.repo.ts';
import { shippedMail } from './workroom-mails.ts';

export async function ship(deps: WorkroomDeps, shopId: string, actorId: string, orderId: string, input: { carrier: string; trackingNumber: string }): Promise<WorkOrder> {
  const { db } = deps;
  const order = repo.order(db, shopId, orderId);
  if (!order) throw notFound('We could not find that order in your shop.');
  const lines = repo.linesOfOrder(db, order.id).filter((l) => !isFinishedLine(l.state));
  if (!lines.length) throw new AppError(409, 'nothing_to_ship', 'Every item of this order is shipped, cancelled or refunded already.');
  const notPressed = lines.filter((l) => !canMoveLine(l.state as LineState, 'shipped', 'shop'));
  if (notPressed.length) {
    throw new AppError(409, 'wrong_state', `Press every item before shipping: ${notPressed.map((l) => `${l.listingTitle} is ${l.state.replace(/_/g, ' ')}`).join('; ')}.`);
  }
  const at = deps.now();
  db.transaction((tx) => {
    const t = tx as unknown as Db;
    repo.setOrder(t, order.id, { carrier: input.carrier, trackingNumber: input.trackingNumber, shippedAt: at });
    transitionAll(
      t,
      lines.map((l) => ({ line: l, to: 'shipped' as const, actor: 'shop' as const, actorId, at, message: `Shipped with ${input.carrier}, tracking ${input.trackingNumber}.` })),
    );
  });
  const buyer = repo.users(db, [order.buyerId])[0];
  const shop = repo.shop(db, shopId);
  if (buyer) {
    const items = lines.map((l) => `${l.quantity} × ${lineTitle(l)}${lineText(lineSnapshot(l)) ? ` — ${lineText(lineSnapshot(l))}` : ''}`);
    await deps.mailer
      .send(
        shippedMail(buyer, { shopName: shop?.name ?? 'The shop', orderNumber: order.number, orderId: order.id, carrier: input.carrier, trackingNumber: input.trackingNumber, items }, deps.env.baseUrl),
      )
      .catch((e: unknown) => console.error('workroom: shipped e-mail failed', e));
  }
  return orderView(db, shopId, order.id);
}
