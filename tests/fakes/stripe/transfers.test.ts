// Connected accounts and transfers in the fake (fakes/stripe/resources/accounts.ts, transfers.ts).
// Reference for the expected behaviour: Stripe API docs (Connect "separate charges and transfers"),
// as summarised in DEVELOPERS.md, "Money and payments".
import { describe, expect, it } from 'vitest';
import { paidSession, withStripeFakes } from './helpers.ts';

const { fake } = withStripeFakes();

describe('connected accounts and transfers', () => {
  it('when transfers are made per shop, then listing by transfer_group returns exactly that group', async () => {
    const { stripe } = await fake();
    const shopA = await stripe.accounts.create({ type: 'express', country: 'US', email: 'a@shop.test', metadata: { shop: 'a' } });
    const shopB = await stripe.accounts.create({ type: 'express', country: 'US', email: 'b@shop.test' });
    expect(shopA.id).toMatch(/^acct_/);
    expect((await stripe.accounts.retrieve(shopA.id)).metadata).toEqual({ shop: 'a' });
    const pi = await paidSession(stripe);
    const tA = await stripe.transfers.create({ amount: 2208, currency: 'usd', destination: shopA.id, transfer_group: 'chk_1', metadata: { order: 'o1' } });
    const tB = await stripe.transfers.create({ amount: 2300, currency: 'usd', destination: shopB.id, transfer_group: 'chk_1', source_transaction: pi.latest_charge as string });
    await stripe.transfers.create({ amount: 100, currency: 'usd', destination: shopB.id, transfer_group: 'other' });
    expect(tA.id).toMatch(/^tr_/);
    const group = await stripe.transfers.list({ transfer_group: 'chk_1' });
    expect(group.data.map((t) => t.id).sort()).toEqual([tA.id, tB.id].sort());
    expect(group.data.reduce((s, t) => s + t.amount, 0)).toBe(4508);
    expect(group.data.find((t) => t.id === tA.id)?.destination).toBe(shopA.id);

    await expect(stripe.transfers.create({ amount: 100, currency: 'usd', destination: 'acct_missing' })).rejects.toMatchObject({ code: 'resource_missing', param: 'destination' });
    // The platform balance left is 4900 − 4608 = 292.
    await expect(stripe.transfers.create({ amount: 293, currency: 'usd', destination: shopA.id })).rejects.toMatchObject({ code: 'balance_insufficient' });
  });
});
