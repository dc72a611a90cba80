// Refunds: the shop (its own orders) or an admin gives money back for one line or the rest of the
// order. The platform refunds the shopper from the charge and takes the shop's share back from its
// payout ("separate charges and transfers": the platform bears refunds and returns its fee on the
// refunded part; shared/money.ts shopShareOfRefunds).
//
// Serialised per order: before the provider is asked, a refund intent is claimed in one synchronous
// SQLite transaction against what is left to refund (paid − every pending or succeeded intent), with
// an Idempotency-Key per (order, line or "remainder"). So two requests at once can never give back
// more than was paid, and the same request twice sends the same key: the provider makes one refund
// and both answers carry it. A refusal from the provider releases the claim (the intent is marked
// failed, the next attempt gets a new key); no answer keeps it, and sending the same refund again
// finishes it. The local write after the provider's yes is made once, by the request or by the
// charge.refunded webhook, whichever comes first (matched by the intent id in the refund's metadata).
import crypto from 'node:crypto';
import type Stripe from 'stripe';
import { shopShareOfRefunds } from '../../../shared/money.ts';
import { canMoveLine, type LineState, type RefundInput, type RefundResult } from '../../../shared/schemas/order.ts';
import type { Db } from '../../db/client.ts';
import type { AppDeps } from '../../deps.ts';
import { AppError, conflict, forbidden, notFound } from '../../http/app-error.ts';
import type { SessionUser } from '../../http/auth-guards.ts';
import { isDefiniteFailure, paymentsClient, providerMessage } from '../../integrations/payments.ts';
// refunds work on orders and pay out through payments' payouts (one-way), through their public modules
import { assertMove, type OrderLineRow, type OrderRow, orderDetail, ordersRepo, refundMail, transitionAll } from '../orders/index.ts';
import { settleOrder } from '../payouts/index.ts';
import { type RefundIntentRow, refundsRepo } from './refunds.repo.ts';

export type RefundDeps = Pick<AppDeps, 'db' | 'now' | 'env' | 'mailer'> & {
  /** For tests: runs after the provider refunded and before our own write (to make that write fail). */
  beforeLocalWrite?: () => void;
};

const REMAINDER = 'remainder';

/** Claims the refund (or finds the same one under way); throws 409 when nothing is left to give back. */
function claim(deps: RefundDeps, actor: SessionUser, order: OrderRow, lineId: string | null, reason: string | null): RefundIntentRow {
  const at = deps.now();
  return deps.db.transaction(
    (tx) => {
      const t = tx as unknown as Db;
      const scope = lineId ? `line:${lineId}` : REMAINDER;
      const intents = refundsRepo.intentsOf(t, order.id);
      const live = intents.filter((i) => i.state !== 'failed');
      const same = live.find((i) => i.scope === scope);
      if (same?.state === 'pending') return same; // the same refund, under way or left unconfirmed: send it again
      const line = lineId ? ordersRepo.lines(t, [order.id]).find((l) => l.id === lineId) : undefined;
      if (same || line?.state === 'refunded') throw conflict(line ? 'This item has been refunded already.' : 'Everything on this order has been refunded already.');
      // refused before any money moves when the table does not let this actor refund the line
      if (line) assertMove(line.state as LineState, 'refunded', actor.role === 'admin' ? 'admin' : 'shop');
      // refunds recorded before intents existed count too
      const recorded = ordersRepo.refundsOf(t, order.id).reduce((a, r) => a + r.amountMinor, 0);
      const viaIntents = live.filter((i) => i.state === 'succeeded').reduce((a, i) => a + i.amountMinor, 0);
      const left = order.totalMinor - live.reduce((a, i) => a + i.amountMinor, 0) - Math.max(0, recorded - viaIntents);
      const amount = line ? Math.min(line.totalMinor - line.refundedMinor, left) : left;
      if (amount <= 0) {
        const underWay = live.some((i) => i.state === 'pending');
        throw conflict(underWay ? 'A refund of this order is under way and covers this; nothing more to give back.' : 'Everything on this order has been refunded already.');
      }
      const attempt = intents.filter((i) => i.scope === scope).length; // earlier attempts refused by the provider
      const row = {
        id: crypto.randomUUID(),
        orderId: order.id,
        lineId,
        scope,
        idempotencyKey: `refund-${order.id}-${lineId ? `line-${lineId}` : REMAINDER}${attempt ? `-${attempt + 1}` : ''}`,
        amountMinor: amount,
        state: 'pending',
        actorId: actor.id,
        reason,
        createdAt: at,
        updatedAt: at,
      };
      refundsRepo.insertIntent(t, row);
      return refundsRepo.intent(t, row.id)!;
    },
    { behavior: 'immediate' },
  );
}

export async function refundOrder(deps: RefundDeps, actor: SessionUser, orderId: string, input: RefundInput): Promise<RefundResult> {
  const { db } = deps;
  const order = ordersRepo.find(db, orderId);
  if (!order) throw notFound('We could not find that order.');
  const shop = refundsRepo.shop(db, order.shopId)!;
  const allowed = actor.role === 'admin' || (actor.role === 'seller' && shop.ownerId === actor.id);
  if (!allowed) {
    if (order.buyerId === actor.id) throw forbidden('Refunds are made by the shop or by Namesake. Write to the shop to ask for one.');
    throw notFound('We could not find that order.');
  }
  const checkout = ordersRepo.checkout(db, order.checkoutId);
  if (!checkout || checkout.state !== 'paid' || !checkout.paymentIntentId) throw conflict('This order has no payment to refund yet.');
  if (input.lineId && !ordersRepo.lines(db, [order.id]).some((l) => l.id === input.lineId)) throw notFound('That item is not part of this order.');

  const intent = claim(deps, actor, order, input.lineId ?? null, input.reason ?? null);
  let refund: Stripe.Refund;
  try {
    refund = await paymentsClient(deps.env).refunds.create(
      {
        payment_intent: checkout.paymentIntentId,
        amount: intent.amountMinor,
        reason: 'requested_by_customer',
        metadata: { orderId: order.id, refundIntentId: intent.id, ...(intent.lineId ? { lineId: intent.lineId } : {}) },
      },
      { idempotencyKey: intent.idempotencyKey },
    );
  } catch (e) {
    console.error('refunds: provider call failed', e);
    if (isDefiniteFailure(e)) {
      refundsRepo.markFailed(db, intent.id, providerMessage(e), deps.now());
      throw new AppError(502, 'payment_provider', `The payment provider refused the refund: ${providerMessage(e)} Nothing was refunded; you can try again.`);
    }
    throw new AppError(
      502,
      'payment_provider',
      'We could not confirm the refund with the payment provider. It is kept as started: send the same refund again to finish it; it will never be made twice.',
    );
  }
  deps.beforeLocalWrite?.();
  await recordProviderRefund(deps, intent.id, { id: refund.id, amount: refund.amount });
  return { refundId: refund.id, amountMinor: intent.amountMinor, order: orderDetail(db, ordersRepo.find(db, order.id)!) };
}

/**
 * Records a refund the provider made for one of our intents, once: the refund row, the ledger (the
 * refund, and the platform's fee on the refunded part returned), the lines, the audit row; then the
 * shopper's e-mail and the shop's payout brought to what is due. Returns false when it was recorded
 * already (or the refund does not match the intent, or `orderIds` does not hold its order).
 */
export async function recordProviderRefund(
  deps: Pick<RefundDeps, 'db' | 'now' | 'env' | 'mailer'>,
  intentId: string,
  refund: { id: string; amount: number },
  orderIds?: Set<string>,
): Promise<boolean> {
  const { db } = deps;
  const at = deps.now();
  const done = db.transaction(
    (tx) => {
      const t = tx as unknown as Db;
      const intent = refundsRepo.intent(t, intentId);
      if (!intent || (orderIds && !orderIds.has(intent.orderId))) return null;
      if (intent.state !== 'pending') {
        if (intent.state === 'failed') console.error(`refunds: the provider made refund ${refund.id} for intent ${intent.id}, which was released as failed; check it by hand`);
        return null;
      }
      if (refund.amount !== intent.amountMinor) {
        console.error(`refunds: refund ${refund.id} is ${refund.amount}, intent ${intent.id} claimed ${intent.amountMinor}; not recorded`);
        return null;
      }
      const order = ordersRepo.find(t, intent.orderId)!;
      const before = ordersRepo.refundsOf(t, order.id).reduce((a, r) => a + r.amountMinor, 0);
      const shopShare = shopShareOfRefunds(order, before + intent.amountMinor) - shopShareOfRefunds(order, before);
      const feeReturned = intent.amountMinor - shopShare;
      refundsRepo.markSucceeded(t, intent.id, refund.id, at);
      ordersRepo.insertRefund(t, {
        id: crypto.randomUUID(),
        orderId: order.id,
        lineId: intent.lineId,
        amountMinor: intent.amountMinor,
        providerRefundId: refund.id,
        actorId: intent.actorId,
        reason: intent.reason,
        createdAt: at,
      });
      ordersRepo.insertLedger(t, {
        id: crypto.randomUUID(),
        shopId: order.shopId,
        orderId: order.id,
        kind: 'refund',
        amountMinor: -intent.amountMinor,
        currency: order.currency,
        providerRef: refund.id,
        memo: intent.lineId ? 'refund of one item' : 'refund of the order',
        createdAt: at,
      });
      if (feeReturned > 0)
        ordersRepo.insertLedger(t, {
          id: crypto.randomUUID(),
          shopId: order.shopId,
          orderId: order.id,
          kind: 'platform_fee',
          amountMinor: -feeReturned,
          currency: order.currency,
          providerRef: refund.id,
          memo: 'fee returned on the refunded part',
          createdAt: at,
        });
      const lines = ordersRepo.lines(t, [order.id]);
      // the remainder covers every line not refunded and not claimed by a line refund of its own
      const claimedLines = new Set(
        refundsRepo
          .intentsOf(t, order.id)
          .filter((i) => i.state === 'pending' && i.lineId)
          .map((i) => i.lineId),
      );
      // the app records the move the provider's refund makes (on behalf of the shop or admin who
      // asked); a line the table can't move to refunded (refunded or cancelled already) is left as it is
      const refundable = (l: OrderLineRow) => canMoveLine(l.state as LineState, 'refunded', 'system');
      const targets: OrderLineRow[] = intent.lineId ? lines.filter((l) => l.id === intent.lineId && refundable(l)) : lines.filter((l) => refundable(l) && !claimedLines.has(l.id));
      transitionAll(
        t,
        targets.map((l) => ({ line: l, to: 'refunded' as const, actor: 'system' as const, actorId: intent.actorId, at, message: intent.reason ?? 'Refunded.', set: { refundedMinor: l.totalMinor } })),
      );
      refundsRepo.insertAudit(t, { id: crypto.randomUUID(), actorId: intent.actorId, action: 'order.refund', subjectType: 'order', subjectId: order.id, reason: intent.reason, createdAt: at });
      return { intent, order, what: intent.lineId ? (lines.find((l) => l.id === intent.lineId)?.listingTitle ?? null) : null };
    },
    { behavior: 'immediate' },
  );
  if (!done) return false;

  const { intent, order } = done;
  const buyer = ordersRepo.userEmail(db, order.buyerId);
  const shop = refundsRepo.shop(db, order.shopId);
  if (buyer) {
    await deps.mailer
      .send(
        refundMail(
          buyer,
          {
            number: order.number,
            shopName: shop?.name ?? 'The shop',
            currency: order.currency,
            amountMinor: intent.amountMinor,
            what: done.what ? `“${done.what}”` : 'your whole order',
            reason: intent.reason,
            orderId: order.id,
          },
          deps.env.baseUrl,
        ),
      )
      .catch((e: unknown) => console.error('refunds: e-mail failed', e));
  }
  // the shop's share comes back from its payout now, or the next payout is made smaller
  await settleOrder(deps, order.id).catch((e: unknown) => console.error('refunds: payout not brought up to date yet; the next payout will', e));
  return true;
}
