// One Checkout Session for the whole cart. The session is made for one (cart, version): a second
// tab, a double click or a retried request finds the same checkout row and sends the same
// Idempotency-Key with the same parameters, so the provider hands back the same session and there
// is one charge at most (Stripe API docs, "Idempotent requests").
import crypto from 'node:crypto';
import type Stripe from 'stripe';
import { type CheckoutStarted, type CheckoutState, type CheckoutStatus, type PricedCheckout, SHIPPING_COUNTRIES } from '../../../shared/schemas/checkout.ts';
import type { Db } from '../../db/client.ts';
import type { AppDeps } from '../../deps.ts';
import { AppError, badRequest, conflict, notFound } from '../../http/app-error.ts';
import type { SessionUser } from '../../http/auth-guards.ts';
import { paymentsClient } from '../../integrations/payments.ts';
// checkout reads the cart (one-way: cart never imports checkout)
import { type HoldItem, holdStock, releaseHolds } from '../blanks/index.ts';
import { type CartRow, cartView, newCartVersion } from '../cart/index.ts';
// the discount step after line pricing; a code's use is reserved with the checkout row (one-way)
import { assertCodesApply, frozenOffers, releaseUses, reserveUses, withOffers } from '../offers/index.ts';
import { type CheckoutRow, checkoutRepo } from './checkout.repo.ts';
import { CANCELLED_WORDS, declineInOurWords } from './decline-words.ts';

export type CheckoutDeps = Pick<AppDeps, 'db' | 'now' | 'env'>;

export const transferGroupOf = (checkoutId: string) => `checkout_${checkoutId}`;

function sessionParams(deps: CheckoutDeps, c: CheckoutRow, email: string): Stripe.Checkout.SessionCreateParams {
  const priced = c.priced;
  const cur = priced.currency.toLowerCase();
  const items: Stripe.Checkout.SessionCreateParams.LineItem[] = [];
  for (const s of priced.shops) {
    for (const l of s.lines) {
      const name = l.snapshot.summary.find((x) => x.value && !/colour/i.test(x.label))?.value;
      // a line with a share of a code is sent as one item at what it costs after the code (its
      // share need not divide by the quantity), so the page's total is exactly the checkout's
      const off = l.discountMinor ?? 0;
      const title = `${off > 0 && l.quantity > 1 ? `${l.quantity} × ` : ''}${l.title}${name ? ` — ${name}` : ''}`;
      const description = off > 0 ? `From ${s.shopName}, with code ${s.discount?.code ?? ''}` : `From ${s.shopName}`;
      items.push({
        quantity: off > 0 ? 1 : l.quantity,
        price_data: { currency: cur, unit_amount: off > 0 ? l.totalMinor : l.unitPriceMinor, product_data: { name: title.slice(0, 250), description: description.slice(0, 500) } },
      });
    }
    if (s.shippingMinor > 0) items.push({ quantity: 1, price_data: { currency: cur, unit_amount: s.shippingMinor, product_data: { name: `Shipping from ${s.shopName}`.slice(0, 250) } } });
  }
  const base = deps.env.baseUrl;
  return {
    mode: 'payment',
    line_items: items,
    metadata: { checkoutId: c.id },
    client_reference_id: c.id,
    customer_email: email,
    payment_intent_data: { transfer_group: transferGroupOf(c.id), metadata: { checkoutId: c.id } },
    // the shops post parcels, so the payment page asks where to
    shipping_address_collection: { allowed_countries: [...SHIPPING_COUNTRIES] },
    success_url: `${base}/checkout/return?session_id={CHECKOUT_SESSION_ID}`,
    cancel_url: `${base}/cart?checkout=cancelled`,
  };
}

function freeze(view: ReturnType<typeof cartView>): PricedCheckout {
  return {
    currency: view.currency!,
    totalMinor: view.totalMinor,
    shops: view.shops.map((s) => ({
      shopId: s.shopId,
      shopName: s.shopName,
      shippingMinor: s.shippingMinor,
      subtotalMinor: s.subtotalMinor,
      totalMinor: s.totalMinor,
      ...frozenOffers(s),
      lines: s.lines.map((l) => ({
        cartLineId: l.id,
        listingId: l.listingId,
        title: l.snapshot.listingTitle,
        quantity: l.quantity,
        unitPriceMinor: l.unitPriceMinor,
        // what the shopper pays for the line: its price less its share of the shop's code
        totalMinor: l.lineTotalMinor - (l.discountMinor ?? 0),
        discountMinor: l.discountMinor ?? 0,
        snapshot: { ...l.snapshot, unitPriceMinor: l.unitPriceMinor },
      })),
    })),
  };
}

/** The size × colour of every line whose listing offers blanks, for the stock hold. */
function holdItemsOf(view: ReturnType<typeof cartView>): HoldItem[] {
  return view.shops.flatMap((s) =>
    s.lines.flatMap((l) => {
      const b = l.snapshot.blank;
      if (!b.blankTypeId || !b.sizeId || !b.colourId) return [];
      const what = `${l.snapshot.listingTitle} in size ${b.sizeLabel ?? '?'}, ${(b.colourName ?? '').toLowerCase()},`;
      return [{ blankTypeId: b.blankTypeId, sizeId: b.sizeId, colourId: b.colourId, quantity: l.quantity, what }];
    }),
  );
}

/** A checkout that can no longer be paid gives its stock back in the same transaction. */
function expireAndRelease(db: CheckoutDeps['db'], checkoutId: string, at: number): void {
  db.transaction((tx) => {
    const t = tx as unknown as typeof db;
    checkoutRepo.setState(t, checkoutId, 'expired');
    releaseHolds(t, checkoutId);
    releaseUses(t, checkoutId, at);
  });
}

/** POST /api/checkout: opens (or finds) the Checkout Session for this version of the user's cart. */
export async function openCheckout(deps: CheckoutDeps, cart: CartRow | null, user: Pick<SessionUser, 'id' | 'email'>, attempt = 0): Promise<CheckoutStarted> {
  const { db } = deps;
  const view = withOffers(deps, cartView(db, cart));
  if (!cart || view.itemCount === 0) throw badRequest('Your cart is empty. Add something first.');
  const gone = view.shops.flatMap((s) => s.lines).filter((l) => !l.available);
  if (gone.length > 0)
    throw conflict(`${gone.map((l) => `“${l.snapshot.listingTitle}”`).join(', ')} ${gone.length > 1 ? 'are' : 'is'} no longer on sale. Remove ${gone.length > 1 ? 'them' : 'it'} to check out.`);
  const currencies = new Set(view.shops.map((s) => s.currency));
  if (currencies.size > 1) throw conflict('Your cart mixes currencies; check out one currency at a time.');
  assertCodesApply(view);

  // the checkout row, its codes' uses and the stock its blanks take are written together: a code with
  // no use left or a size × colour gone to someone else rolls it all back, and the shopper is told before paying
  const c = db.transaction(
    (tx) => {
      const t = tx as unknown as Db;
      checkoutRepo.insertIfAbsent(t, {
        id: crypto.randomUUID(),
        userId: user.id,
        cartId: cart.id,
        cartVersion: cart.version,
        state: 'open',
        currency: view.currency!,
        totalMinor: view.totalMinor,
        priced: freeze(view),
        createdAt: deps.now(),
      });
      const row = checkoutRepo.forCartVersion(t, cart.id, cart.version)!;
      if (row.state === 'open' && row.userId === user.id) {
        reserveUses(t, row, deps.now());
        holdStock(t, row.id, holdItemsOf(view), deps.now());
      }
      return row;
    },
    { behavior: 'immediate' },
  );
  if (c.userId !== user.id) throw notFound('That cart is not yours.');
  if (c.state === 'paid') throw conflict('This cart has been paid already. Your order is on its way to the shops.');
  // this version's payment page expired (its stock went back): start afresh, holding stock again
  if (c.state === 'expired' && attempt === 0) return openCheckout(deps, newCartVersion(deps, cart.id), user, 1);

  const stripe = paymentsClient(deps.env);
  // a payment page left open for an older version of this cart must not be paid as well
  for (const old of checkoutRepo.openForCart(db, cart.id).filter((x) => x.cartVersion < cart.version && x.providerSessionId)) {
    try {
      await stripe.checkout.sessions.expire(old.providerSessionId!);
      expireAndRelease(db, old.id, deps.now());
    } catch {
      // already completed or expired at the provider: its own webhook tells us which
    }
  }
  // an older version whose payment page never opened holds stock nobody can pay for
  for (const old of checkoutRepo.openForCart(db, cart.id).filter((x) => x.cartVersion < cart.version && !x.providerSessionId)) expireAndRelease(db, old.id, deps.now());
  let session: Stripe.Checkout.Session;
  try {
    session = await stripe.checkout.sessions.create(sessionParams(deps, c, user.email), { idempotencyKey: `checkout-${cart.id}-v${cart.version}` });
  } catch (e) {
    console.error('checkout: session create failed', e);
    db.transaction((tx) => void releaseHolds(tx as unknown as typeof db, c.id));
    throw new AppError(502, 'payment_provider', 'We could not open the payment page just now. Nothing was charged; please try again in a moment.');
  }
  if (!c.providerSessionId) checkoutRepo.setSession(db, c.id, session.id);

  if (session.status === 'expired' && attempt === 0) {
    // the page for this cart version timed out: mark it and start afresh with a new version
    expireAndRelease(db, c.id, deps.now());
    return openCheckout(deps, newCartVersion(deps, cart.id), user, 1);
  }
  const url = session.status === 'complete' ? `${deps.env.baseUrl}/checkout/return?session_id=${session.id}` : session.url;
  if (!url) throw new AppError(502, 'payment_provider', 'The payment page is not available. Nothing was charged; please try again.');
  return { checkoutId: c.id, sessionId: session.id, url };
}

async function problemOf(deps: CheckoutDeps, sessionId: string): Promise<{ problem: string | null; payUrl: string | null; providerState: string; paid: boolean }> {
  const stripe = paymentsClient(deps.env);
  const s = await stripe.checkout.sessions.retrieve(sessionId, { expand: ['payment_intent'] });
  const pi = typeof s.payment_intent === 'object' ? s.payment_intent : null;
  const err = pi?.last_payment_error ?? null;
  return { problem: declineInOurWords(err), payUrl: s.status === 'open' ? s.url : null, providerState: s.status ?? 'open', paid: s.payment_status === 'paid' };
}

function statusOf(db: Db, c: CheckoutRow, extra: { problem: string | null; payUrl: string | null; paid: boolean }): CheckoutStatus {
  return {
    checkoutId: c.id,
    sessionId: c.providerSessionId,
    state: c.state as CheckoutState,
    payUrl: c.state === 'open' ? extra.payUrl : null,
    problem: c.state === 'paid' ? null : extra.problem,
    totalMinor: c.totalMinor,
    currency: c.currency,
    paymentReceived: c.state === 'paid' || extra.paid,
    orders: checkoutRepo.ordersOf(db, c.id),
  };
}

/**
 * GET /api/checkout/:sessionId/status — for the return page. Waits up to `waitMs` for the webhook
 * to turn the payment into orders (the provider may redirect the shopper before it calls us).
 */
export async function checkoutStatus(deps: CheckoutDeps, user: SessionUser, sessionId: string, waitMs: number) {
  const { db } = deps;
  let c = checkoutRepo.bySession(db, sessionId);
  if (!c || c.userId !== user.id) throw notFound('We could not find that payment.');
  const until = Date.now() + waitMs;
  while (c.state === 'open' && Date.now() < until) {
    await new Promise((r) => setTimeout(r, 150));
    c = checkoutRepo.find(db, c.id)!;
  }
  if (c.state !== 'open') return statusOf(db, c, { problem: null, payUrl: null, paid: c.state === 'paid' });
  const p = await problemOf(deps, sessionId).catch(() => ({ problem: null, payUrl: null, providerState: 'open', paid: false }));
  return statusOf(db, c, p);
}

/** GET /api/checkout/latest — the cart page asks why the shopper came back (cancelled or declined). */
export async function latestCheckout(deps: CheckoutDeps, user: SessionUser) {
  const c = checkoutRepo.latestOpenForUser(deps.db, user.id);
  if (!c || !c.providerSessionId) return null;
  const p = await problemOf(deps, c.providerSessionId).catch(() => ({ problem: null, payUrl: null, providerState: 'open', paid: false }));
  return statusOf(deps.db, c, { ...p, problem: p.problem ?? (p.paid ? null : CANCELLED_WORDS) });
}
