// Webhook handling and the money that follows a payment.
//
// checkout.session.completed → in ONE transaction: record the event id, create one order per shop,
// write the charge rows, mark the checkout paid, take the paid lines out of the cart. A repeat of
// the event finds its id and changes nothing. After the commit, `settle` makes one transfer per
// order (Idempotency-Key per order, so a crash and a retry never pay a shop twice) and sends the
// e-mails once. If settling fails, the endpoint answers 500 and the provider's retry settles again.
import crypto from 'node:crypto';
import type Stripe from 'stripe';
import type { AppDeps } from '../../app.ts';
import type { Db } from '../../db/client.ts';
import { paymentsClient } from '../../integrations/payments.ts';
import { parseShipTo, type ShipTo } from '../../../shared/schemas/checkout.ts';
// payments drives orders and reads checkouts (one-way: neither imports payments)
import { createOrdersForCheckout } from '../orders/orders.service.ts';
import { ordersRepo } from '../orders/orders.repo.ts';
import { confirmationMail, newOrderMail, type MailOrder } from '../orders/order-mails.ts';
import { transferGroupOf } from '../checkout/checkout.service.ts';
import { paymentsRepo } from './payments.repo.ts';

export type PaymentsDeps = Pick<AppDeps, 'db' | 'now' | 'env' | 'mailer'>;

export type Handled = { outcome: 'orders_created' | 'duplicate' | 'ignored' | 'recorded'; checkoutId?: string };

export async function handleEvent(deps: PaymentsDeps, event: Stripe.Event): Promise<Handled> {
  const { db } = deps;
  const at = deps.now();
  if (event.type === 'checkout.session.completed' || event.type === 'checkout.session.async_payment_succeeded') {
    const session = event.data.object as Stripe.Checkout.Session;
    const checkoutId = session.metadata?.checkoutId ?? '';
    let created = false;
    const fresh = db.transaction((tx) => {
      const t = tx as unknown as Db;
      if (!paymentsRepo.recordEvent(t, event.id, event.type, at)) return false;
      const c = paymentsRepo.checkout(t, checkoutId);
      if (!c || session.payment_status !== 'paid') return true;
      if (session.amount_total !== c.totalMinor || (session.currency ?? '').toUpperCase() !== c.currency.toUpperCase()) {
        // never make orders for a payment that does not match what we asked for
        console.error(`payments: session ${session.id} paid ${session.amount_total} ${session.currency}, checkout ${c.id} expected ${c.totalMinor} ${c.currency}`);
        return true;
      }
      const pi = typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
      if (!paymentsRepo.markPaid(t, c.id, at, pi)) return true; // paid through an earlier event
      createOrdersForCheckout(t, {
        checkoutId: c.id,
        buyerId: c.userId,
        currency: c.currency,
        shops: c.priced.shops,
        paidAt: at,
        feeBps: deps.env.PLATFORM_FEE_BPS,
        paymentIntentId: pi,
        timeZone: deps.env.BUSINESS_TIME_ZONE,
      });
      const shipTo = shipToOf(session);
      if (shipTo) paymentsRepo.setShipTo(t, c.id, shipTo);
      paymentsRepo.removeCartLines(t, c.cartId, c.priced.shops.flatMap((s) => s.lines.map((l) => l.cartLineId)), at);
      created = true;
      return true;
    });
    // a repeat still settles: the first delivery may have committed and then died before transfers
    if (checkoutId) await settle(deps, checkoutId);
    return { outcome: !fresh ? 'duplicate' : created ? 'orders_created' : 'recorded', checkoutId };
  }
  if (event.type === 'checkout.session.expired') {
    const session = event.data.object as Stripe.Checkout.Session;
    db.transaction((tx) => {
      const t = tx as unknown as Db;
      if (paymentsRepo.recordEvent(t, event.id, event.type, at) && session.metadata?.checkoutId) paymentsRepo.markExpired(t, session.metadata.checkoutId);
    });
    return { outcome: 'recorded' };
  }
  // other events (charge.refunded for refunds we made ourselves, …) need nothing from us
  paymentsRepo.recordEvent(db, event.id, event.type, at);
  return { outcome: 'ignored' };
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

/** The shop's connected account, created on first need (Idempotency-Key per shop). */
async function shopAccount(deps: PaymentsDeps, stripe: Stripe, shopId: string): Promise<string> {
  const shop = paymentsRepo.shop(deps.db, shopId)!;
  if (shop.paymentAccountId) return shop.paymentAccountId;
  const owner = paymentsRepo.shopOwner(deps.db, shopId);
  const acct = await stripe.accounts.create(
    { type: 'express', country: 'US', email: owner?.email, business_profile: { name: shop.name }, capabilities: { transfers: { requested: true } }, metadata: { shopId } },
    { idempotencyKey: `account-${shopId}` },
  );
  paymentsRepo.setShopAccount(deps.db, shopId, acct.id);
  return paymentsRepo.shop(deps.db, shopId)!.paymentAccountId ?? acct.id;
}

/** Transfers (one per order, lines + shipping − fee) and the e-mails, each exactly once. */
export async function settle(deps: PaymentsDeps, checkoutId: string): Promise<void> {
  const { db } = deps;
  let c = paymentsRepo.checkout(db, checkoutId);
  if (!c || c.state !== 'paid') return;
  const stripe = paymentsClient(deps.env);
  if (!c.chargeId && c.paymentIntentId) {
    const pi = await stripe.paymentIntents.retrieve(c.paymentIntentId);
    const charge = typeof pi.latest_charge === 'string' ? pi.latest_charge : (pi.latest_charge?.id ?? null);
    if (charge) paymentsRepo.setCharge(db, c.id, charge);
    c = paymentsRepo.checkout(db, checkoutId)!;
  }
  const orders = ordersRepo.ofCheckout(db, c.id);
  for (const o of orders.filter((x) => !x.transferId)) {
    const amount = o.totalMinor - o.platformFeeMinor;
    if (amount <= 0) continue;
    const destination = await shopAccount(deps, stripe, o.shopId);
    const tr = await stripe.transfers.create(
      {
        amount,
        currency: o.currency.toLowerCase(),
        destination,
        transfer_group: transferGroupOf(c.id),
        ...(c.chargeId ? { source_transaction: c.chargeId } : {}),
        description: `Order ${o.number}`,
        metadata: { orderId: o.id, orderNumber: o.number },
      },
      { idempotencyKey: `transfer-${o.id}` },
    );
    const at = deps.now();
    db.transaction((tx) => {
      const t = tx as unknown as Db;
      if (!ordersRepo.setTransfer(t, o.id, tr.id)) return; // another delivery recorded this one
      ordersRepo.insertLedger(t, { id: crypto.randomUUID(), shopId: o.shopId, orderId: o.id, kind: 'platform_fee', amountMinor: o.platformFeeMinor, currency: o.currency, providerRef: c!.chargeId, memo: `fee ${deps.env.PLATFORM_FEE_BPS} bps`, createdAt: at });
      ordersRepo.insertLedger(t, { id: crypto.randomUUID(), shopId: o.shopId, orderId: o.id, kind: 'transfer', amountMinor: amount, currency: o.currency, providerRef: tr.id, memo: 'payout to the shop', createdAt: at });
    });
  }
  if (paymentsRepo.claimMail(db, c.id, deps.now())) await sendOrderMails(deps, c.id).catch((e: unknown) => console.error('payments: order e-mails failed', e));
}

async function sendOrderMails(deps: PaymentsDeps, checkoutId: string): Promise<void> {
  const { db } = deps;
  const c = paymentsRepo.checkout(db, checkoutId)!;
  const orders = ordersRepo.ofCheckout(db, checkoutId);
  const lines = ordersRepo.lines(db, orders.map((o) => o.id));
  const shops = new Map(ordersRepo.shopsByIds(db, orders.map((o) => o.shopId)).map((s) => [s.id, s]));
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
