// The fake's hosted test-card payment page (fakes/stripe/hosted-page.ts, payment-form.ts): test cards,
// declines, the extra confirmation step, card and address checks.
// Reference for the expected behaviour: Stripe API docs ("Testing" test cards, Checkout shipping address collection),
// as summarised in DEVELOPERS.md, "Money and payments".

import type Stripe from 'stripe';
import { describe, expect, it } from 'vitest';
import { pay, sessionParams, TOTAL, withStripeFakes } from './helpers.ts';

const { fake } = withStripeFakes();

describe('the hosted payment page', () => {
  it('when JPY is used, then the page shows no decimals (zero-decimal currency, ISO 4217 / Stripe "Currencies")', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams({ line_items: [{ price_data: { currency: 'jpy', unit_amount: 3200, product_data: { name: 'Pouch' } }, quantity: 1 }] }));
    const html = await (await fetch(s.url!)).text();
    expect(html).toContain('¥3,200');
  });

  it('when paid with 4242 4242 4242 4242, then the session completes, a charge exists and the shopper goes to success_url', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams());
    const res = await pay(s.url!, '4242 4242 4242 4242');
    expect(res.status).toBe(303);
    expect(res.headers.get('location')).toBe(`http://127.0.0.1:9/checkout/success?session_id=${s.id}`);

    const done = await stripe.checkout.sessions.retrieve(s.id, { expand: ['payment_intent.latest_charge'] });
    expect(done.status).toBe('complete');
    expect(done.payment_status).toBe('paid');
    expect(done.url).toBeNull();
    const pi = done.payment_intent as Stripe.PaymentIntent;
    expect(pi.id).toMatch(/^pi_/);
    expect(pi.status).toBe('succeeded');
    expect(pi.amount_received).toBe(TOTAL);
    expect(pi.transfer_group).toBe('chk_1');
    const ch = pi.latest_charge as Stripe.Charge;
    expect(ch.id).toMatch(/^ch_/);
    expect(ch.status).toBe('succeeded');
    expect(ch.amount).toBe(TOTAL);
    expect(ch.payment_method_details?.card?.last4).toBe('4242');
    const again = await stripe.paymentIntents.retrieve(pi.id);
    expect(again.latest_charge).toBe(ch.id);
  });

  it('when a second tab posts the card after the payment went through, then it lands on success_url and nothing is charged twice', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams());
    expect((await pay(s.url!, '4242424242424242')).status).toBe(303);
    const second = await pay(s.url!, '4242424242424242');
    expect(second.status).toBe(303);
    expect(second.headers.get('location')).toContain(s.id);
    const done = await stripe.checkout.sessions.retrieve(s.id);
    const charges = await stripe.charges.list({ payment_intent: done.payment_intent as string });
    expect(charges.data).toHaveLength(1);
  });

  it('when two tabs submit the card at the same moment, then there is one charge', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams());
    const res = await Promise.all([pay(s.url!, '4242424242424242'), pay(s.url!, '4242424242424242')]);
    expect(res.map((r) => r.status)).toEqual([303, 303]);
    const pi = (await stripe.checkout.sessions.retrieve(s.id)).payment_intent as string;
    expect((await stripe.charges.list({ payment_intent: pi })).data).toHaveLength(1);
  });

  it('when paid with 4000 0000 0000 0002, then it is declined with card_declined, the page says so and the session stays open', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams());
    const res = await pay(s.url!, '4000 0000 0000 0002');
    const html = await res.text();
    expect(res.status).toBe(402);
    expect(html).toContain('role="alert"');
    expect(html).toContain('Your card was declined');
    expect(html).toContain('Go back to your cart');
    expect(html).toContain('href="http://127.0.0.1:9/cart?cancelled=1"');
    const open = await stripe.checkout.sessions.retrieve(s.id, { expand: ['payment_intent'] });
    expect(open.status).toBe('open');
    expect(open.payment_status).toBe('unpaid');
    const pi = open.payment_intent as Stripe.PaymentIntent;
    expect(pi.status).toBe('requires_payment_method');
    expect(pi.last_payment_error?.code).toBe('card_declined');
    expect(pi.last_payment_error?.decline_code).toBe('generic_decline');

    // The shopper may retry on the same session.
    expect((await pay(s.url!, '4242424242424242')).status).toBe(303);
    expect((await stripe.checkout.sessions.retrieve(s.id)).status).toBe('complete');
  });

  it('when paid with 4000 0000 0000 9995, then it is declined for insufficient_funds and can be retried', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams());
    const res = await pay(s.url!, '4000000000009995');
    const html = await res.text();
    expect(res.status).toBe(402);
    expect(html).toContain('doesn&#39;t have enough funds');
    expect(html).toContain('href="http://127.0.0.1:9/cart?cancelled=1"');
    expect(html).toContain('name="card_number"'); // the form is still there to retry
    const open = await stripe.checkout.sessions.retrieve(s.id, { expand: ['payment_intent.latest_charge'] });
    expect(open.status).toBe('open');
    const pi = open.payment_intent as Stripe.PaymentIntent;
    expect(pi.last_payment_error?.code).toBe('card_declined');
    expect(pi.last_payment_error?.decline_code).toBe('insufficient_funds');
    expect((pi.latest_charge as Stripe.Charge).status).toBe('failed');
  });

  it('when paid with 4000 0027 6000 3184, then an extra confirmation step comes first; failing it keeps the session open, completing it pays', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams());
    const first = await pay(s.url!, '4000 0027 6000 3184');
    const html = await first.text();
    expect(first.status).toBe(200);
    expect(html).toContain('Complete authentication');
    expect(html).toContain('Fail authentication');
    let cur = await stripe.checkout.sessions.retrieve(s.id, { expand: ['payment_intent'] });
    expect(cur.status).toBe('open');
    expect((cur.payment_intent as Stripe.PaymentIntent).status).toBe('requires_action');

    const failed = await fetch(`${s.url}/authenticate`, { method: 'POST', body: new URLSearchParams({ result: 'fail' }), redirect: 'manual' });
    expect(failed.status).toBe(402);
    expect(await failed.text()).toContain('extra confirmation was not completed');
    cur = await stripe.checkout.sessions.retrieve(s.id, { expand: ['payment_intent'] });
    expect(cur.status).toBe('open');
    const pi = cur.payment_intent as Stripe.PaymentIntent;
    expect(pi.status).toBe('requires_payment_method');
    expect(pi.last_payment_error?.code).toBe('payment_intent_authentication_failure');

    await pay(s.url!, '4000002760003184');
    const ok = await fetch(`${s.url}/authenticate`, { method: 'POST', body: new URLSearchParams({ result: 'complete' }), redirect: 'manual' });
    expect(ok.status).toBe(303);
    expect(ok.headers.get('location')).toContain(s.id);
    cur = await stripe.checkout.sessions.retrieve(s.id, { expand: ['payment_intent'] });
    expect(cur.status).toBe('complete');
    expect((cur.payment_intent as Stripe.PaymentIntent).status).toBe('succeeded');
  });

  it('when the card details are malformed, then fields are marked in text and nothing is attempted', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams());
    const res = await pay(s.url!, '4242 4242 4242 4241', '13/20', '1');
    const html = await res.text();
    expect(res.status).toBe(400);
    expect(html).toContain('That card number isn&#39;t valid');
    expect(html).toContain('Enter the expiry date as MM/YY');
    expect(html).toContain('Enter the 3 or 4 digits');
    expect(html.match(/ aria-invalid="true">/g)).toHaveLength(3);
    expect((await stripe.checkout.sessions.retrieve(s.id)).payment_intent).toBeNull();
    const past = await pay(s.url!, '4242424242424242', '01/20');
    expect(await past.text()).toContain('This card has expired');
  });

  // Stripe API docs, Checkout Session: `shipping_address_collection.allowed_countries` makes the hosted
  // page ask for an address; the result is `collected_information.shipping_details` (`shipping_details` in older versions).

  it('when shipping_address_collection is set, then the page asks for the address, checks it and stores it on the session', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams({ shipping_address_collection: { allowed_countries: ['GB', 'US'] } }));
    expect(s.shipping_address_collection?.allowed_countries).toEqual(['GB', 'US']);
    const page = await (await fetch(s.url!)).text();
    for (const id of ['ship_name', 'ship_line1', 'ship_line2', 'ship_city', 'ship_postal_code', 'ship_state', 'ship_country']) expect(page).toContain(`id="${id}"`);
    expect(page).toContain('<option value="GB">United Kingdom</option>');
    expect(page).not.toContain('<option value="FR">');

    const card = { card_number: '4242 4242 4242 4242', card_expiry: '12/34', card_cvc: '123' };
    const post = (form: Record<string, string>) => fetch(s.url!, { method: 'POST', body: new URLSearchParams(form), redirect: 'manual' });
    // no address at all: each required field is marked, the optional ones are not, and nothing is charged
    const bare = await post(card);
    const bareHtml = await bare.text();
    expect(bare.status).toBe(400);
    expect(bareHtml).toContain('Enter the name of the person the parcel is for.');
    expect(bareHtml).toContain('Enter the first line of the address');
    expect(bareHtml).toContain('Enter the town or city.');
    expect(bareHtml).toContain('Enter the postal code.');
    expect(bareHtml).toContain('Choose the country the parcel goes to.');
    expect(bareHtml).not.toContain('id="ship_line2-error"');
    expect(bareHtml).not.toContain('id="ship_state-error"');
    // a country outside the list is refused, and what was typed comes back in the fields
    const address = { ship_name: 'Dana Field', ship_line1: '12 Acorn Lane', ship_line2: '', ship_city: 'Harbourtown', ship_postal_code: 'ht1 2ab', ship_state: '' };
    const wrong = await post({ ...card, ...address, ship_country: 'FR' });
    const wrongHtml = await wrong.text();
    expect(wrong.status).toBe(400);
    expect(wrongHtml).toContain('We can only send parcels to the countries in the list.');
    expect(wrongHtml).toContain('value="12 Acorn Lane"');
    expect((await stripe.checkout.sessions.retrieve(s.id)).payment_intent).toBeNull();

    const ok = await post({ ...card, ...address, ship_country: 'GB' });
    expect(ok.status).toBe(303);
    const done = await stripe.checkout.sessions.retrieve(s.id);
    const expected = { name: 'Dana Field', address: { line1: '12 Acorn Lane', line2: null, city: 'Harbourtown', postal_code: 'HT1 2AB', state: null, country: 'GB' } };
    expect(done.status).toBe('complete');
    expect(done.collected_information?.shipping_details).toEqual(expected);
    expect((done as unknown as { shipping_details: unknown }).shipping_details).toEqual(expected);
  });

  it('when a card needs the extra confirmation, then the address typed with it is kept until the payment completes', async () => {
    const { stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams({ shipping_address_collection: { allowed_countries: ['US'] } }));
    const form = {
      ship_name: 'Priya Lane',
      ship_line1: '7 Lantern Row',
      ship_line2: 'Unit 2',
      ship_city: 'Springfield',
      ship_postal_code: '12345',
      ship_state: 'OR',
      ship_country: 'US',
      card_number: '4000 0027 6000 3184',
      card_expiry: '12/34',
      card_cvc: '123',
    };
    expect((await fetch(s.url!, { method: 'POST', body: new URLSearchParams(form), redirect: 'manual' })).status).toBe(200);
    expect((await fetch(`${s.url}/authenticate`, { method: 'POST', body: new URLSearchParams({ result: 'complete' }), redirect: 'manual' })).status).toBe(303);
    const done = await stripe.checkout.sessions.retrieve(s.id);
    expect(done.collected_information?.shipping_details?.address).toEqual({ line1: '7 Lantern Row', line2: 'Unit 2', city: 'Springfield', postal_code: '12345', state: 'OR', country: 'US' });
  });
});
