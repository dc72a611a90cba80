// Checkout Sessions in the fake (fakes/stripe/resources/checkout-sessions.ts): create, list, expire,
// parameter errors.
// Reference for the expected behaviour: Stripe API docs (Checkout Session object and endpoints),
// as summarised in DEVELOPERS.md, "Money and payments".

import type Stripe from 'stripe';
import { describe, expect, it } from 'vitest';
import { pay, SECRET, sessionParams, startReceiver, TOTAL, waitFor, withStripeFakes } from './helpers.ts';

const { fake, closers } = withStripeFakes();

describe('checkout sessions', () => {
  it('when a session is created, then it is open, totals the line items and points to the fake hosted page', async () => {
    const { f, stripe } = await fake();
    const s = await stripe.checkout.sessions.create(sessionParams());
    expect(s.id).toMatch(/^cs_test_/);
    expect(s.object).toBe('checkout.session');
    expect(s.status).toBe('open');
    expect(s.payment_status).toBe('unpaid');
    expect(s.amount_total).toBe(TOTAL);
    expect(s.metadata).toEqual({ checkout_id: 'chk_1' });
    expect(s.url).toBe(`${f.url}/pay/${s.id}`);
    const items = await stripe.checkout.sessions.listLineItems(s.id);
    expect(items.data.map((i) => [i.description, i.quantity, i.amount_total])).toEqual([
      ['Holiday tote, "Mila"', 1, 2400],
      ['Kids tee, "Mila"', 2, 2500],
    ]);

    const page = await fetch(s.url!);
    const html = await page.text();
    expect(page.status).toBe(200);
    expect(html).toContain('<h1>Namesake test payment</h1>');
    expect(html).toContain('Test mode: no real money moves');
    expect(html).toContain('$49.00'); // 4900 minor units of USD (ISO 4217: 2 decimals)
    expect(html).toContain('Holiday tote, &quot;Mila&quot;'); // escaped
    for (const id of ['card_number', 'card_expiry', 'card_cvc']) {
      expect(html).toMatch(new RegExp(`<label for="${id}">`));
      expect(html).toMatch(new RegExp(`<input id="${id}" name="${id}"`));
    }
    expect(html).not.toContain('id="ship_name"'); // no shipping_address_collection, no address fields
    expect(html).toMatch(/background: #fbf7f0/);
    expect(html).toMatch(/color: #1f2a44/);
    expect(html).toMatch(/background: #e0a526/);
    expect(html).toContain('href="http://127.0.0.1:9/cart?cancelled=1"');
  });

  it('when shipping_address_collection names a country badly, then the API answers 400 naming the parameter', async () => {
    const { stripe } = await fake();
    await expect(stripe.checkout.sessions.create(sessionParams({ shipping_address_collection: { allowed_countries: ['gbr' as 'GB'] } }))).rejects.toMatchObject({
      statusCode: 400,
      param: 'shipping_address_collection[allowed_countries][0]',
    });
  });

  it('when a session is expired through the API, then the page refuses payment and the session cannot be expired twice', async () => {
    const receiver = await startReceiver();
    closers.push(receiver.close);
    const { stripe } = await fake({ webhookUrl: receiver.url });
    const s = await stripe.checkout.sessions.create(sessionParams());
    const expired = await stripe.checkout.sessions.expire(s.id);
    expect(expired.status).toBe('expired');
    expect(expired.url).toBeNull();
    const res = await pay(s.url!, '4242424242424242');
    expect(res.status).toBe(410);
    expect(await res.text()).toContain('This payment page has expired');
    await expect(stripe.checkout.sessions.expire(s.id)).rejects.toMatchObject({ type: 'StripeInvalidRequestError', statusCode: 400 });
    const got = await waitFor(() => receiver.received.find((r) => r.body.includes('checkout.session.expired')));
    const ev = stripe.webhooks.constructEvent(got.body, got.signature, SECRET);
    expect(ev.type).toBe('checkout.session.expired');
    expect((ev.data.object as Stripe.Checkout.Session).id).toBe(s.id);
  });

  it('when expires_at passes, then an open session becomes expired by itself', async () => {
    let clock = Date.now();
    const { stripe } = await fake({ now: () => clock });
    const s = await stripe.checkout.sessions.create(sessionParams({ expires_at: Math.floor(clock / 1000) + 3600 }));
    expect(s.expires_at).toBe(Math.floor(clock / 1000) + 3600);
    clock += 3601 * 1000;
    expect((await stripe.checkout.sessions.retrieve(s.id)).status).toBe('expired');
    // Stripe accepts expires_at only 30 min – 24 h ahead.
    await expect(stripe.checkout.sessions.create(sessionParams({ expires_at: Math.floor(clock / 1000) + 60 }))).rejects.toMatchObject({ param: 'expires_at' });
  });

  it('when sessions are listed, then the newest come first and has_more pages through them', async () => {
    const { stripe } = await fake();
    const ids: string[] = [];
    for (let i = 0; i < 3; i++) ids.push((await stripe.checkout.sessions.create(sessionParams())).id);
    const page1 = await stripe.checkout.sessions.list({ limit: 2 });
    expect(page1.object).toBe('list');
    expect(page1.data.map((s) => s.id)).toEqual([ids[2], ids[1]]);
    expect(page1.has_more).toBe(true);
    const page2 = await stripe.checkout.sessions.list({ limit: 2, starting_after: ids[1] });
    expect(page2.data.map((s) => s.id)).toEqual([ids[0]]);
    expect(page2.has_more).toBe(false);
  });

  it('when parameters are missing or wrong, then Stripe-shaped 400 errors name the parameter', async () => {
    const { stripe } = await fake();
    await expect(stripe.checkout.sessions.create({ ...sessionParams(), line_items: [] })).rejects.toMatchObject({ statusCode: 400, param: 'line_items' });
    await expect(
      stripe.checkout.sessions.create(sessionParams({ line_items: [{ price_data: { currency: 'usd', unit_amount: 10, product_data: { name: 'x' } }, quantity: 1 }] })),
    ).rejects.toMatchObject({ code: 'amount_too_small' });
    await expect(stripe.checkout.sessions.retrieve('cs_test_nope')).rejects.toMatchObject({ statusCode: 404, code: 'resource_missing' });
  });
});
