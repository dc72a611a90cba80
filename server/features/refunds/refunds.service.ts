// Refunds: the shop (its own orders) or an admin gives money back for one line or the whole order.
// The platform refunds the shopper from the charge and reverses the shop's transfer for its part
// ("separate charges and transfers": the platform bears refunds; Stripe Connect docs).
import crypto from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { AppDeps } from '../../app.ts';
import type { Db } from '../../db/client.ts';
import { auditLog, shops } from '../../db/schema.ts';
import { AppError, conflict, forbidden, notFound } from '../../http/app-error.ts';
import type { SessionUser } from '../../http/auth-guards.ts';
import { paymentsClient } from '../../integrations/payments.ts';
import { roundDiv } from '../../../shared/money.ts';
import type { RefundInput, RefundResult } from '../../../shared/schemas/order.ts';
// refunds work on orders (one-way)
import { ordersRepo } from '../orders/orders.repo.ts';
import { orderDetail } from '../orders/order-view.ts';
import { refundMail } from '../orders/order-mails.ts';

export type RefundDeps = Pick<AppDeps, 'db' | 'now' | 'env' | 'mailer'>;

export async function refundOrder(deps: RefundDeps, actor: SessionUser, orderId: string, input: RefundInput): Promise<RefundResult> {
  const { db } = deps;
  const order = ordersRepo.find(db, orderId);
  if (!order) throw notFound('We could not find that order.');
  const shop = db.select().from(shops).where(eq(shops.id, order.shopId)).get()!;
  const allowed = actor.role === 'admin' || (actor.role === 'seller' && shop.ownerId === actor.id);
  if (!allowed) {
    if (order.buyerId === actor.id) throw forbidden('Refunds are made by the shop or by Namesake. Write to the shop to ask for one.');
    throw notFound('We could not find that order.');
  }
  const checkout = ordersRepo.checkout(db, order.checkoutId);
  if (!checkout || checkout.state !== 'paid' || !checkout.paymentIntentId) throw conflict('This order has no payment to refund yet.');

  const lines = ordersRepo.lines(db, [order.id]);
  const previous = ordersRepo.refundsOf(db, order.id);
  const refundedSoFar = previous.reduce((a, r) => a + r.amountMinor, 0);
  const line = input.lineId ? lines.find((l) => l.id === input.lineId) : undefined;
  if (input.lineId && !line) throw notFound('That item is not part of this order.');
  if (line && line.state === 'refunded') throw conflict('This item has been refunded already.');
  const amount = line ? line.totalMinor - line.refundedMinor : order.totalMinor - refundedSoFar;
  if (amount <= 0) throw conflict('Everything on this order has been refunded already.');

  // what goes back from the shop: its transfer for the refunded part (the fee share stays with us)
  const transferMinor = order.totalMinor - order.platformFeeMinor;
  const reversedSoFar = -ordersRepo.ledgerOf(db, order.id).filter((r) => r.kind === 'refund_reversal').reduce((a, r) => a + r.amountMinor, 0);
  const remainingTransfer = Math.max(0, transferMinor - reversedSoFar);
  const reversal = order.transferId ? Math.min(remainingTransfer, line ? roundDiv(amount * transferMinor, order.totalMinor) : remainingTransfer) : 0;

  const stripe = paymentsClient(deps.env);
  const key = `refund-${order.id}-${line?.id ?? 'all'}-${previous.length}`;
  let refund;
  try {
    refund = await stripe.refunds.create(
      { payment_intent: checkout.paymentIntentId, amount, reason: 'requested_by_customer', metadata: { orderId: order.id, ...(line ? { lineId: line.id } : {}) } },
      { idempotencyKey: key },
    );
    if (reversal > 0 && order.transferId) {
      await stripe.transfers.createReversal(order.transferId, { amount: reversal, metadata: { orderId: order.id, refundId: refund.id } }, { idempotencyKey: `reversal-${refund.id}` });
    }
  } catch (e) {
    console.error('refunds: provider call failed', e);
    throw new AppError(502, 'payment_provider', 'The refund did not go through at the payment provider. Nothing changed; please try again.');
  }

  const at = deps.now();
  const targets = line ? [line] : lines.filter((l) => l.state !== 'refunded');
  db.transaction((tx) => {
    const t = tx as unknown as Db;
    if (ordersRepo.refundByProviderId(t, refund.id)) return; // a double click: the first request recorded it
    ordersRepo.insertRefund(t, { id: crypto.randomUUID(), orderId: order.id, lineId: line?.id ?? null, amountMinor: amount, providerRefundId: refund.id, actorId: actor.id, reason: input.reason ?? null, createdAt: at });
    ordersRepo.insertLedger(t, { id: crypto.randomUUID(), shopId: order.shopId, orderId: order.id, kind: 'refund', amountMinor: -amount, currency: order.currency, providerRef: refund.id, memo: line ? `refund of one item` : 'refund of the order', createdAt: at });
    if (reversal > 0) ordersRepo.insertLedger(t, { id: crypto.randomUUID(), shopId: order.shopId, orderId: order.id, kind: 'refund_reversal', amountMinor: -reversal, currency: order.currency, providerRef: order.transferId, memo: 'taken back from the shop payout', createdAt: at });
    for (const l of targets) {
      ordersRepo.setLine(t, l.id, { state: 'refunded', refundedMinor: l.totalMinor, updatedAt: at });
      ordersRepo.insertEvent(t, { id: crypto.randomUUID(), lineId: l.id, actorId: actor.id, fromState: l.state, toState: 'refunded', message: input.reason ?? 'Refunded.', createdAt: at });
    }
    t.insert(auditLog).values({ id: crypto.randomUUID(), actorId: actor.id, action: 'order.refund', subjectType: 'order', subjectId: order.id, reason: input.reason ?? null, createdAt: at }).run();
  });

  const buyer = ordersRepo.userEmail(db, order.buyerId);
  if (buyer) {
    await deps.mailer
      .send(refundMail(buyer, { number: order.number, shopName: shop.name, currency: order.currency, amountMinor: amount, what: line ? `“${line.listingTitle}”` : 'your whole order', reason: input.reason ?? null, orderId: order.id }, deps.env.baseUrl))
      .catch((e: unknown) => console.error('refunds: e-mail failed', e));
  }
  return { refundId: refund.id, amountMinor: amount, order: orderDetail(db, ordersRepo.find(db, order.id)!) };
}
