// The payment webhook: signature and age checked by the official SDK's constructEvent on the raw
// body (stripe-node src/Webhooks.ts: v1 = HMAC-SHA256(secret, `${t}.${body}`), tolerance 300 s),
// each event processed once (Stripe API docs, "Handle duplicate events"), and nothing lost when
// our server is down at delivery time (the fake retries with back-off, as Stripe does).

import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { checkouts, ledger, orders, webhookEvents } from '../../server/db/schema.ts';
import { CARDS, makeShopWithListing, makeWorld, nameChoices, payOnPage, WEBHOOK_SECRET, type World, waitFor } from './checkout.fixtures.ts';

let w: World;
beforeAll(async () => {
  w = await makeWorld();
}, 30_000);
afterAll(async () => w?.teardown());

type FakeEvent = { id: string; type: string; event: Record<string, unknown>; delivery: { status: string; attempts: number } | null };
async function fakeEvents(): Promise<FakeEvent[]> {
  return ((await (await fetch(`${w.fake.url}/_fake/events`)).json()) as { data: FakeEvent[] }).data;
}

async function paidCartOfTwoShops() {
  const a = await makeShopWithListing(w);
  const b = await makeShopWithListing(w);
  const buyer = await w.makeUser('shopper');
  const agent = await w.signIn(buyer.email);
  await agent
    .post('/api/cart/lines')
    .send({ listingId: a.listingId, choices: nameChoices('Mira') })
    .expect(201);
  await agent
    .post('/api/cart/lines')
    .send({ listingId: b.listingId, choices: nameChoices('Theo') })
    .expect(201);
  const started = (await agent.post('/api/checkout').send({}).expect(201)).body as { checkoutId: string; sessionId: string; url: string };
  return { agent, buyer, started };
}

const post = (body: string, signature: string) => fetch(`${w.appUrl}/api/payments/webhook`, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': signature }, body });

const counts = () => ({
  orders: w.db.select().from(orders).all().length,
  events: w.db.select().from(webhookEvents).all().length,
  ledger: w.db.select().from(ledger).all().length,
});

describe('payment webhook', () => {
  it('when the same checkout.session.completed arrives 10 times, then exactly one set of orders, transfers and e-mails', async () => {
    const { started, buyer } = await paidCartOfTwoShops();
    await payOnPage(started.url, CARDS.ok);
    await waitFor(
      () =>
        w.db
          .select()
          .from(orders)
          .where(eq(orders.checkoutId, started.checkoutId))
          .all()
          .filter((o) => o.transferId).length === 2,
    );
    const ev = (await fakeEvents()).find((e) => e.type === 'checkout.session.completed' && (e.event as { data: { object: { id: string } } }).data.object.id === started.sessionId)!;
    const payload = JSON.stringify(ev.event, null, 2);
    const before = counts();

    const replies = await Promise.all(Array.from({ length: 10 }, () => post(payload, w.stripe.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET }))));
    expect(replies.map((r) => r.status)).toEqual(Array(10).fill(200));
    expect(counts()).toEqual(before);
    expect(w.db.select().from(orders).where(eq(orders.checkoutId, started.checkoutId)).all()).toHaveLength(2);
    const c = w.db.select().from(checkouts).where(eq(checkouts.id, started.checkoutId)).get()!;
    expect((await w.stripe.transfers.list({ transfer_group: `checkout_${c.id}` })).data).toHaveLength(2);
    await new Promise((r) => setTimeout(r, 300));
    expect((await w.mailTo(buyer.email)).filter((m) => /order/i.test(m.subject))).toHaveLength(1);
  });

  it('when the signature is wrong or the timestamp is stale, then 400 and nothing is written', async () => {
    const { started } = await paidCartOfTwoShops();
    // the event as the fake would send it, but delivered by us with bad headers
    const fakeEvent = {
      id: 'evt_forged_1',
      object: 'event',
      type: 'checkout.session.completed',
      created: Math.floor(Date.now() / 1000),
      data: {
        object: { id: started.sessionId, object: 'checkout.session', metadata: { checkoutId: started.checkoutId }, payment_status: 'paid', amount_total: 1, currency: 'usd', payment_intent: null },
      },
    };
    const payload = JSON.stringify(fakeEvent);
    const before = counts();

    const wrongSecret = await post(payload, w.stripe.webhooks.generateTestHeaderString({ payload, secret: 'whsec_not_ours' }));
    expect(wrongSecret.status).toBe(400);
    const tampered = await post(payload.replace('"paid"', '"paid" '), w.stripe.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET }));
    expect(tampered.status).toBe(400);
    const stale = await post(payload, w.stripe.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET, timestamp: Math.floor(Date.now() / 1000) - 301 }));
    expect(stale.status).toBe(400);
    const missing = await fetch(`${w.appUrl}/api/payments/webhook`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: payload });
    expect(missing.status).toBe(400);

    expect(counts()).toEqual(before);
    expect(w.db.select().from(webhookEvents).where(eq(webhookEvents.id, 'evt_forged_1')).get()).toBeUndefined();
    expect(w.db.select().from(checkouts).where(eq(checkouts.id, started.checkoutId)).get()!.state).toBe('open');
  });

  it('when the app is down as the payment completes, then the retried webhook creates the orders after restart', async () => {
    const { started, agent, buyer } = await paidCartOfTwoShops();
    await w.stopApp();
    const pay = await payOnPage(started.url, CARDS.ok);
    expect(pay.status).toBe(303);
    // the fake tries, fails (connection refused) and schedules retries
    await waitFor(async () => (await fakeEvents()).find((e) => e.type === 'checkout.session.completed' && e.delivery && e.delivery.attempts >= 1 && e.delivery.status === 'pending'));
    expect(w.db.select().from(orders).where(eq(orders.checkoutId, started.checkoutId)).all()).toHaveLength(0);

    await w.startApp();
    const made = await waitFor(() => {
      const os = w.db.select().from(orders).where(eq(orders.checkoutId, started.checkoutId)).all();
      return os.length === 2 && os.every((o) => o.transferId) && os;
    }, 15_000);
    expect(made).toHaveLength(2);
    const status = await agent.get(`/api/checkout/${started.sessionId}/status`);
    expect(status.body.state).toBe('paid');
    expect((await agent.get('/api/cart')).body.itemCount).toBe(0);
    await waitFor(async () => (await w.mailTo(buyer.email)).some((m) => /order/i.test(m.subject)));
  });
});
