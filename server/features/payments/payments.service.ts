// Webhook handling and the money that follows a payment.
//
// The posted event is signed, but its body is not taken at its word: the Checkout Session is fetched
// from the provider by id and must belong to the checkout it names (our row, its metadata and
// client_reference_id), be complete and paid, and match the amount and currency we asked for.
//
// checkout.session.completed → in ONE transaction: record the event id, create one order per shop,
// write the charge and platform-fee rows, mark the checkout paid, take the paid lines out of the
// cart. A repeat of the event finds its id and changes nothing. After the commit, `settle` pays each
// shop (payouts.service.ts: net of refunds, each call claimed with its Idempotency-Key, so a crash and
// a retry never pay a shop twice) and sends the e-mails once. If a payout fails, the endpoint answers
// 500 and the provider's retry settles again.
//
// charge.refunded → refunds we asked for whose local write did not happen (the provider said yes and
// we crashed, or the write failed) are recorded from the provider's list of refunds of that payment,
// matched by the refund intent id in their metadata; never refunded again. Then each order's payout
// is brought to what is due.
import crypto from 'node:crypto';
import type Stripe from 'stripe';
import { parseShipTo, type ShipTo } from '../../../shared/schemas/checkout.ts';
import type { Db } from '../../db/client.ts';
import type { AppDeps } from '../../deps.ts';
import { isDefiniteFailure, paymentsClient, providerMessage } from '../../integrations/payments.ts';
import { releaseHolds, sellHolds } from '../blanks/index.ts';
import { confirmUses, releaseUses } from '../offers/index.ts';
// payments drives orders, refunds and payouts (one-way: none of them imports payments)
import { confirmationMail, createOrdersForCheckout, type MailOrder, newOrderMail, ordersRepo } from '../orders/index.ts';
import { settleOrder } from '../payouts/index.ts';
import { recordProviderRefund } from '../refunds/index.ts';
import { type CheckoutRow, paymentsRepo } from './payments.repo.ts';

export type PaymentsDeps = Pick<AppDeps, 'db' | 'now' | 'env' | 'mailer'>;

export type Handled = { outcome: 'orders_created' | 'duplicate' | 'ignored' | 'recorded' | 'rejected'; checkoutId?: string };

/**
 * The session as the provider has it, and our checkout it belongs to; or why the posted body is not
 * believed. A provider that cannot be reached throws (the webhook answers 500 and is retried).
 */
async function trustedSession(deps: PaymentsDeps, posted: Stripe.Checkout.Session): Promise<{ c: CheckoutRow; s: Stripe.Checkout.Session } | { rejected: string }> {
  const { db } = deps;
  const sessionId = typeof posted?.id === 'string' ? posted.id : '';
  if (!sessionId) return { rejected: 'the event names no session' };
  const named = posted.metadata?.checkoutId;
  const c = paymentsRepo.checkoutBySession(db, sessionId) ?? (named ? paymentsRepo.checkout(db, named) : undefined);
  if (!c) return { rejected: `session ${sessionId} belongs to no checkout of ours` };
  if (c.providerSessionId && c.providerSessionId !== sessionId) return { rejected: `checkout ${c.id} was opened with another session than ${sessionId}` };
  if (named && named !== c.id) return { rejected: `the body names checkout ${named}, session ${sessionId} belongs to ${c.id}` };
  let s: Stripe.Checkout.Session;
  try {
    s = await paymentsClient(deps.env).checkout.sessions.retrieve(sessionId);
  } catch (e) {
    if (isDefiniteFailure(e)) return { rejected: `the provider does not know session ${sessionId}: ${providerMessage(e)}` };
    throw e;
  }
  if (s.metadata?.checkoutId !== c.id || (s.client_reference_id && s.client_reference_id !== c.id)) {
    return { rejected: `session ${sessionId} at the provider belongs to checkout ${s.metadata?.checkoutId ?? '?'}, not ${c.id}` };
  }
  return { c, s };
}

export async function handleEvent(deps: PaymentsDeps, event: Stripe.Event): Promise<Handled> {
  const { db } = deps;
  const at = deps.now();
  if (event.type === 'checkout.session.completed' || event.type === 'checkout.session.async_payment_succeeded') {
    const trusted = await trustedSession(deps, event.data.object as Stripe.Checkout.Session);
    if ('rejected' in trusted) return reject(deps, event, trusted.rejected);
    const { c: checkout, s: session } = trusted;
    const checkoutId = checkout.id;
    if (session.status !== 'complete' || session.payment_status !== 'paid') return reject(deps, event, `session ${session.id} is ${session.status}, ${session.payment_status}`);
    if (session.amount_total !== checkout.totalMinor || (session.currency ?? '').toUpperCase() !== checkout.currency.toUpperCase()) {
      // never make orders for a payment that does not match what we asked for
      return reject(deps, event, `session ${session.id} paid ${session.amount_total} ${session.currency}, checkout ${checkoutId} expected ${checkout.totalMinor} ${checkout.currency}`);
    }
    let created = false;
    const fresh = db.transaction((tx) => {
      const t = tx as unknown as Db;
      if (!paymentsRepo.recordEvent(t, event.id, event.type, at)) return false;
      const c = paymentsRepo.checkout(t, checkoutId)!;
      const priced = c.priced;
      const pi = typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
      if (!paymentsRepo.markPaid(t, c.id, at, pi)) return true; // paid through an earlier event
      confirmUses(t, c.id, at);
      sellHolds(t, c.id);
      const made = createOrdersForCheckout(t, {
        checkoutId: c.id,
        buyerId: c.userId,
        currency: c.currency,
        shops: c.priced.shops,
        paidAt: at,
        feeBps: deps.env.PLATFORM_FEE_BPS,
        paymentIntentId: pi,
        timeZone: deps.env.BUSINESS_TIME_ZONE,
      });
      // the platform's fee is earned with the charge; what is paid out follows in settle
      for (const o of made) {
        ordersRepo.insertLedger(t, {
          id: crypto.randomUUID(),
          shopId: o.shopId,
          orderId: o.id,
          kind: 'platform_fee',
          amountMinor: o.platformFeeMinor,
          currency: o.currency,
          providerRef: pi,
          memo: `fee ${deps.env.PLATFORM_FEE_BPS} bps`,
          createdAt: at,
        });
      }
      const shipTo = shipToOf(session);
      if (shipTo) paymentsRepo.setShipTo(t, c.id, shipTo);
      paymentsRepo.removeCartLines(
        t,
        c.cartId,
        c.priced.shops.flatMap((s) => s.lines.map((l) => l.cartLineId)),
        at,
      );
      created = true;
      return true;
    });
    // a repeat still settles: the first delivery may have committed and then died before transfers
    await settle(deps, checkoutId);
    return { outcome: !fresh ? 'duplicate' : created ? 'orders_created' : 'recorded', checkoutId };
  }
  if (event.type === 'checkout.session.expired') {
    const trusted = await trustedSession(deps, event.data.object as Stripe.Checkout.Session);
    if ('rejected' in trusted) return reject(deps, event, trusted.rejected);
    if (trusted.s.status !== 'expired') return reject(deps, event, `session ${trusted.s.id} is ${trusted.s.status}, not expired`);
    db.transaction((tx) => {
      const t = tx as unknown as Db;
      if (paymentsRepo.recordEvent(t, event.id, event.type, at)) {
        paymentsRepo.markExpired(t, trusted.c.id);
        releaseUses(t, trusted.c.id, at);
        // the blanks held for a payment that can no longer be made go back on sale (unless it was paid)
        if (paymentsRepo.checkout(t, trusted.c.id)?.state !== 'paid') releaseHolds(t, trusted.c.id);
      }
    });
    return { outcome: 'recorded', checkoutId: trusted.c.id };
  }
  if (event.type === 'charge.refunded') {
    const checkoutId = await reconcileRefunds(deps, event.data.object as Stripe.Charge);
    paymentsRepo.recordEvent(db, event.id, event.type, at);
    return { outcome: checkoutId ? 'recorded' : 'ignored', ...(checkoutId ? { checkoutId } : {}) };
  }
  paymentsRepo.recordEvent(db, event.id, event.type, at);
  return { outcome: 'ignored' };
}

function reject(deps: PaymentsDeps, event: Stripe.Event, why: string): Handled {
  console.error(`payments: ${event.type} ${event.id} not acted on: ${why}`);
  paymentsRepo.recordEvent(deps.db, event.id, event.type, deps.now());
  return { outcome: 'rejected' };
}

/**
 * Records every refund of the charge's payment that we asked for and have not recorded (the list
 * comes from the provider, not from the posted body), then brings the payouts of the checkout's
 * orders to what is due. Returns the checkout id, or null when the payment is not one of ours.
 */
async function reconcileRefunds(deps: PaymentsDeps, posted: Stripe.Charge): Promise<string | null> {
  const pi = typeof posted?.payment_intent === 'string' ? posted.payment_intent : (posted?.payment_intent?.id ?? null);
  const c = pi ? paymentsRepo.checkoutByPaymentIntent(deps.db, pi) : undefined;
  if (!pi || !c) return null;
  const stripe = paymentsClient(deps.env);
  const orderIds = new Set(ordersRepo.ofCheckout(deps.db, c.id).map((o) => o.id));
  for await (const r of stripe.refunds.list({ payment_intent: pi, limit: 100 })) {
    const intentId = r.metadata?.refundIntentId;
    if (r.status !== 'succeeded' || !intentId) continue;
    await recordProviderRefund(deps, intentId, { id: r.id, amount: r.amount }, orderIds);
  }
  const failures: unknown[] = [];
  for (const id of orderIds) await settleOrder(deps, id).catch((e: unknown) => failures.push(e));
  if (failures.length) throw failures[0];
  return c.id;
}

/**
 * The parcel address from the session: `collected_information.shipping_details` in current API
 * versions, `shipping_details` in older ones (Stripe API docs, Checkout Session object).
 */
export function shipToOf(session: Stripe.Checkout.Session): ShipTo | null {
  const s = session as unknown as { collected_information?: { shipping_details?: unknown } | null; shipping_details?: unknown };
  const d = (s.collected_information?.shipping_details ?? s.shipping_details ?? null) as { name?: unknown; address?: Record<string, unknown> | null } | null;
  if (!d?.address) return null;
  const a = d.address;
  const opt = (v: unknown) => (typeof v === 'string' && v.trim() ? v : null);
  return parseShipTo({ name: d.name, line1: a.line1, line2: opt(a.line2), city: a.city, postalCode: a.postal_code, state: opt(a.state), country: a.country });
}

/**
 * Pays each shop of a paid checkout what is due (payouts.service.ts) and sends the e-mails once. The
 * e-mails go even when a payout fails (the shopper has paid); the failure is then thrown so the
 * webhook answers 500 and the provider's retry pays again.
 */
export async function settle(deps: PaymentsDeps, checkoutId: string): Promise<void> {
  const { db } = deps;
  const c = paymentsRepo.checkout(db, checkoutId);
  if (!c || c.state !== 'paid') return;
  if (!c.chargeId && c.paymentIntentId) {
    const pi = await paymentsClient(deps.env).paymentIntents.retrieve(c.paymentIntentId);
    const charge = typeof pi.latest_charge === 'string' ? pi.latest_charge : (pi.latest_charge?.id ?? null);
    if (charge) paymentsRepo.setCharge(db, c.id, charge);
  }
  const failures: unknown[] = [];
  for (const o of ordersRepo.ofCheckout(db, c.id)) await settleOrder(deps, o.id).catch((e: unknown) => failures.push(e));
  if (paymentsRepo.claimMail(db, c.id, deps.now())) await sendOrderMails(deps, c.id).catch((e: unknown) => console.error('payments: order e-mails failed', e));
  if (failures.length) throw failures[0];
}

async function sendOrderMails(deps: PaymentsDeps, checkoutId: string): Promise<void> {
  const { db } = deps;
  const c = paymentsRepo.checkout(db, checkoutId)!;
  const orders = ordersRepo.ofCheckout(db, checkoutId);
  const lines = ordersRepo.lines(
    db,
    orders.map((o) => o.id),
  );
  const shops = new Map(
    ordersRepo
      .shopsByIds(
        db,
        orders.map((o) => o.shopId),
      )
      .map((s) => [s.id, s]),
  );
  const buyer = ordersRepo.userEmail(db, c.userId);
  const mailOrders: Array<MailOrder & { shopId: string; feeMinor: number }> = orders.map((o) => ({
    shopId: o.shopId,
    number: o.number,
    shopName: shops.get(o.shopId)?.name ?? 'A shop',
    currency: o.currency,
    subtotalMinor: o.subtotalMinor,
    shippingMinor: o.shippingMinor,
    totalMinor: o.totalMinor,
    feeMinor: o.platformFeeMinor,
    lines: lines.filter((l) => l.orderId === o.id).map((l) => ({ title: l.listingTitle, quantity: l.quantity, totalMinor: l.totalMinor, snapshot: l.snapshot })),
  }));
  const sends: Promise<void>[] = [];
  if (buyer) sends.push(deps.mailer.send(confirmationMail(buyer, mailOrders, deps.env.baseUrl)));
  for (const o of mailOrders) {
    const owner = paymentsRepo.shopOwner(db, o.shopId);
    if (owner) sends.push(deps.mailer.send(newOrderMail(owner, { ...o, buyerName: buyer?.name ?? 'A shopper' }, deps.env.baseUrl)));
  }
  const results = await Promise.allSettled(sends);
  for (const r of results) if (r.status === 'rejected') console.error('payments: an order e-mail failed', r.reason);
}

/** Marks a checkout's order e-mails as sent without sending them (the demo seed's purchases mail no one). */
export function skipOrderMails(deps: Pick<PaymentsDeps, 'db'>, checkoutId: string, at: number): void {
  paymentsRepo.claimMail(deps.db, checkoutId, at);
}
