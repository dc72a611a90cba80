// What each shop is paid for an order: its transfer (lines + shipping − platform fee) less its share
// of what was refunded on the order (shared/money.ts payoutDue, the one formula). The payout moves
// towards that figure one provider call at a time:
//   - no transfer yet → a transfer of what is due now (a refund made before it simply makes it smaller,
//     a full refund cancels it);
//   - a transfer made and the shop holds more than is due (a refund came after it) → a reversal of the
//     difference.
// Each call is claimed on the order row first (kind, Idempotency-Key, amount) in one synchronous
// SQLite transaction, so two callers at once send the same request (the provider answers both with
// one result) and a crash leaves a claim that the next caller sends again, unchanged. A definite
// refusal from the provider releases the claim: the next payout (the webhook's retry, a refund, the
// next settle) starts afresh from what is due then, under a new key.
import crypto from 'node:crypto';
import type Stripe from 'stripe';
import { payoutDue } from '../../../shared/money.ts';
import type { Db } from '../../db/client.ts';
import type { AppDeps } from '../../deps.ts';
import { isDefiniteFailure, paymentsClient, providerMessage } from '../../integrations/payments.ts';
import { transferGroupOf } from '../checkout/index.ts';
// payouts read orders and the checkout's transfer group (one-way: neither imports payouts)
import { type OrderRow, ordersRepo } from '../orders/index.ts';
import { type PayoutStep, payoutsRepo } from './payouts.repo.ts';

export type PayoutDeps = Pick<AppDeps, 'db' | 'now' | 'env'>;

/** The shop's connected account, created on first need (Idempotency-Key per shop). */
async function shopAccount(deps: PayoutDeps, stripe: Stripe, shopId: string): Promise<string> {
  const shop = payoutsRepo.shop(deps.db, shopId)!;
  if (shop.paymentAccountId) return shop.paymentAccountId;
  const owner = payoutsRepo.shopOwner(deps.db, shopId);
  const acct = await stripe.accounts.create(
    { type: 'express', country: 'US', email: owner?.email, business_profile: { name: shop.name }, capabilities: { transfers: { requested: true } }, metadata: { shopId } },
    { idempotencyKey: `account-${shopId}` },
  );
  payoutsRepo.setShopAccount(deps.db, shopId, acct.id);
  return payoutsRepo.shop(deps.db, shopId)!.paymentAccountId ?? acct.id;
}

/** The next payout call for the order, claimed; a claim left by an earlier caller comes back unchanged. */
function claimStep(db: Db, orderId: string, destination: string | null): PayoutStep | null {
  return db.transaction(
    (tx) => {
      const t = tx as unknown as Db;
      const o = ordersRepo.find(t, orderId)!;
      if (o.payoutStep) return o.payoutStep;
      const due = payoutDue(o, payoutsRepo.refundedOf(t, o.id));
      let step: PayoutStep | null = null;
      if (!o.transferId) {
        // the first key stays `transfer-<order>` so a transfer sent before a crash is found again
        if (due > 0 && destination) step = { kind: 'transfer', key: o.payoutSeq === 0 ? `transfer-${o.id}` : `transfer-${o.id}-${o.payoutSeq}`, amountMinor: due, destination };
      } else {
        const held = payoutsRepo.paidOutOf(t, o.id);
        if (held > due) step = { kind: 'reversal', key: `reversal-${o.id}-${o.payoutSeq}`, amountMinor: held - due };
      }
      if (step) payoutsRepo.claimPayoutStep(t, o.id, step, o.payoutSeq + 1);
      return step;
    },
    { behavior: 'immediate' },
  );
}

/** Writes what the provider did, once: only the caller that still finds its claim on the row records it. */
function recordStep(deps: PayoutDeps, o: OrderRow, step: PayoutStep, providerId: string): void {
  const at = deps.now();
  deps.db.transaction((tx) => {
    const t = tx as unknown as Db;
    if (!payoutsRepo.clearPayoutStep(t, o.id, step.key)) return;
    if (step.kind === 'transfer') {
      ordersRepo.setTransfer(t, o.id, providerId);
      ordersRepo.insertLedger(t, {
        id: crypto.randomUUID(),
        shopId: o.shopId,
        orderId: o.id,
        kind: 'transfer',
        amountMinor: step.amountMinor,
        currency: o.currency,
        providerRef: providerId,
        memo: 'payout to the shop',
        createdAt: at,
      });
    } else {
      ordersRepo.insertLedger(t, {
        id: crypto.randomUUID(),
        shopId: o.shopId,
        orderId: o.id,
        kind: 'refund_reversal',
        amountMinor: -step.amountMinor,
        currency: o.currency,
        providerRef: providerId,
        memo: 'taken back from the shop payout (refund)',
        createdAt: at,
      });
    }
  });
}

export class PayoutError extends Error {
  constructor(
    message: string,
    public readonly definite: boolean,
  ) {
    super(message);
    this.name = 'PayoutError';
  }
}

/**
 * Brings one order's payout to what is due: at most a transfer and then a reversal. Throws a
 * PayoutError when the provider refused or did not answer; what was recorded stays recorded.
 */
export async function settleOrder(deps: PayoutDeps, orderId: string): Promise<void> {
  const { db } = deps;
  const stripe = paymentsClient(deps.env);
  for (let i = 0; i < 4; i++) {
    const o = ordersRepo.find(db, orderId);
    if (!o) return;
    const c = ordersRepo.checkout(db, o.checkoutId);
    if (!c || c.state !== 'paid') return;
    const needsAccount = !o.transferId && !o.payoutStep && payoutDue(o, payoutsRepo.refundedOf(db, o.id)) > 0;
    const destination = needsAccount ? await shopAccount(deps, stripe, o.shopId) : null;
    const step = claimStep(db, o.id, destination);
    if (!step) return;
    let providerId: string;
    try {
      if (step.kind === 'transfer') {
        const tr = await stripe.transfers.create(
          {
            amount: step.amountMinor,
            currency: o.currency.toLowerCase(),
            destination: step.destination!,
            transfer_group: transferGroupOf(c.id),
            ...(c.chargeId ? { source_transaction: c.chargeId } : {}),
            description: `Order ${o.number}`,
            metadata: { orderId: o.id, orderNumber: o.number },
          },
          { idempotencyKey: step.key },
        );
        providerId = tr.id;
      } else {
        const rev = await stripe.transfers.createReversal(o.transferId!, { amount: step.amountMinor, metadata: { orderId: o.id } }, { idempotencyKey: step.key });
        providerId = rev.id;
      }
    } catch (e) {
      const definite = isDefiniteFailure(e);
      if (definite) payoutsRepo.clearPayoutStep(db, o.id, step.key);
      throw new PayoutError(`${step.kind} of ${step.amountMinor} for order ${o.number} ${definite ? 'refused' : 'not confirmed'} by the payment provider: ${providerMessage(e)}`, definite);
    }
    recordStep(deps, o, step, providerId);
  }
}
