// The hosted test-card payment page at /pay/:session (and /pay/:session/authenticate for the extra
// confirmation step): shows what is paid for, takes a test card (and the address when the session
// collects one) and answers as the Stripe "Testing" docs describe for each test card.
import type http from 'node:http';
import { z } from 'zod';
import type { Fake } from './context.ts';
import { authPage, messagePage, type PayPageInput, payPage } from './html.ts';
import { parseForm, readBody, redirect, send, sendHtml } from './http.ts';
import { cardBehaviour, checkCard, checkShipping } from './payment-form.ts';
import { declinePayment, requireAction, succeedPayment } from './resources/payment-intents.ts';
import type { CheckoutSession } from './types.ts';

const MAX_FORM = 16 * 1024;

const authFormSchema = z.object({ result: z.enum(['complete', 'fail']) });

type DeclineCode = 'generic_decline' | 'insufficient_funds' | 'test_mode_live_card';

// What the shopper reads after a decline.
const DECLINE_TEXT: Record<DeclineCode | 'authentication_failed', string> = {
  generic_decline: 'Your card was declined, so nothing was charged. Try another card, or go back to your cart.',
  insufficient_funds: "Your card was declined because it doesn't have enough funds, so nothing was charged. Try another card, or go back to your cart.",
  test_mode_live_card: 'This is a test payment page: it takes only the test card numbers listed below. Nothing was charged.',
  authentication_failed: 'The extra confirmation was not completed, so nothing was charged. Try again, or use another card.',
};

// What the API records as the decline message (Stripe's wording).
const DECLINE_MESSAGE: Record<DeclineCode, string> = {
  generic_decline: 'Your card was declined.',
  insufficient_funds: 'Your card has insufficient funds.',
  test_mode_live_card: 'Your card was declined. Your request was in test mode, but used a non test card.',
};

function successUrl(s: CheckoutSession): string {
  return s.success_url.replaceAll('{CHECKOUT_SESSION_ID}', s.id).replaceAll('%7BCHECKOUT_SESSION_ID%7D', s.id);
}

function renderPay(fake: Fake, res: http.ServerResponse, s: CheckoutSession, status: number, extra: Partial<PayPageInput> = {}): void {
  const items = (fake.store.state.session_extra[s.id]?.line_items ?? []).map((li) => ({ name: li.description, quantity: li.quantity, amount: li.amount_total }));
  sendHtml(
    res,
    status,
    payPage({
      sessionId: s.id,
      action: `/pay/${s.id}`,
      amount: s.amount_total,
      currency: s.currency,
      items,
      email: s.customer_email,
      cancelUrl: s.cancel_url,
      shippingCountries: s.shipping_address_collection?.allowed_countries ?? null,
      ...extra,
    }),
  );
}

/** A session that no longer takes payment: complete (a second tab lands on success) or expired. */
function closedPage(res: http.ServerResponse, s: CheckoutSession, method: string): void {
  if (s.status !== 'complete') {
    const back = s.cancel_url ? { href: s.cancel_url, text: 'Go back to your cart' } : null;
    sendHtml(res, 410, messagePage('This payment page has expired', 'This payment page is no longer open, so nothing was charged. Start the payment again from your cart.', back));
  } else if (method === 'POST') {
    // A second tab or a resubmitted form lands on the shop's success page: one payment, never two.
    redirect(res, successUrl(s));
  } else {
    sendHtml(res, 200, messagePage('This payment is complete', 'This payment has already been made. Nothing more to do here.', { href: successUrl(s), text: 'Continue to the shop' }));
  }
}

/** The answer to the extra confirmation step: complete pays, fail declines and shows the card form again. */
async function handleAuthenticate(fake: Fake, res: http.ServerResponse, s: CheckoutSession, form: Record<string, unknown>): Promise<void> {
  const extra = fake.store.state.session_extra[s.id];
  const r = authFormSchema.safeParse(form);
  if (!extra?.pending_auth || !r.success) return redirect(res, `/pay/${s.id}`);
  if (r.data.result === 'complete') {
    succeedPayment(fake, s, extra.pending_auth, extra.pending_shipping ?? null);
    await fake.store.persist();
    return redirect(res, successUrl(s));
  }
  declinePayment(fake, s, null, {
    type: 'invalid_request_error',
    code: 'payment_intent_authentication_failure',
    message: 'We are unable to authenticate your payment method. Please choose a different payment method and try again.',
  });
  await fake.store.persist();
  return renderPay(fake, res, s, 402, { error: DECLINE_TEXT.authentication_failed });
}

/** A card (and address) posted on the payment page. */
async function handleCard(fake: Fake, res: http.ServerResponse, s: CheckoutSession, form: Record<string, unknown>): Promise<void> {
  const checked = checkCard(form, new Date(fake.now()));
  const allowed = s.shipping_address_collection?.allowed_countries ?? null;
  const ship = allowed ? checkShipping(form, allowed) : null;
  const fieldErrors: NonNullable<PayPageInput['fieldErrors']> = { ...checked.errors, ...ship?.errors };
  if (Object.keys(fieldErrors).length > 0) {
    return renderPay(fake, res, s, 400, {
      error: ship && Object.keys(ship.errors).length > 0 ? 'Please correct the details marked below.' : 'Please correct the card details marked below.',
      fieldErrors,
      values: { card_number: checked.values.card_number, card_expiry: checked.values.card_expiry, ...(ship ? ship.values : {}) },
    });
  }
  const shipping = ship?.details ?? null;
  const behaviour = cardBehaviour(checked.number);
  if (behaviour === 'succeed') {
    succeedPayment(fake, s, checked.card, shipping);
    await fake.store.persist();
    return redirect(res, successUrl(s));
  }
  if (behaviour === 'authenticate') {
    requireAction(fake, s, checked.card, shipping);
    await fake.store.persist();
    return sendHtml(res, 200, authPage({ action: `/pay/${s.id}/authenticate`, amount: s.amount_total, currency: s.currency, cancelUrl: s.cancel_url }));
  }
  const declineCode: DeclineCode = behaviour ?? 'test_mode_live_card';
  declinePayment(fake, s, checked.card, { type: 'card_error', code: 'card_declined', decline_code: declineCode, message: DECLINE_MESSAGE[declineCode] });
  await fake.store.persist();
  // the card was refused, not the address: keep what was typed there so only the card is entered again
  return renderPay(fake, res, s, 402, { error: DECLINE_TEXT[declineCode], ...(ship ? { values: ship.values } : {}) });
}

/** Serves /pay/:session and /pay/:session/authenticate. */
export async function handlePage(fake: Fake, req: http.IncomingMessage, res: http.ServerResponse, pathname: string): Promise<void> {
  const method = (req.method ?? 'GET').toUpperCase();
  const m = /^\/pay\/([^/]+)(\/authenticate)?$/.exec(pathname);
  const s = m?.[1] ? fake.store.get('checkout_sessions', m[1]) : undefined;
  if (!m || !s) return sendHtml(res, 404, messagePage('Payment not found', 'There is no payment at this address.'));
  const isAuth = Boolean(m[2]);
  if (method === 'GET') {
    if (s.status !== 'open') return closedPage(res, s, method);
    if (isAuth) return redirect(res, `/pay/${s.id}`);
    return renderPay(fake, res, s, 200);
  }
  if (method !== 'POST') return send(res, 405, 'Method not allowed', { allow: 'GET, POST', 'content-type': 'text/plain' });
  let form: Record<string, unknown>;
  try {
    form = parseForm(await readBody(req, MAX_FORM));
  } catch {
    return renderPay(fake, res, s, 400, { error: 'The form could not be read. Please try again.' });
  }
  if (s.status !== 'open') return closedPage(res, s, method);
  // Everything from here to the state change is synchronous, so two tabs posting at once make one charge.
  return isAuth ? handleAuthenticate(fake, res, s, form) : handleCard(fake, res, s, form);
}
