// /v1/transfers (Connect "separate charges and transfers"): create to a connected account, list by
// transfer_group or destination, retrieve, and reversals (partial or whole).
import { z } from 'zod';
import type { Handler } from '../api.ts';
import { invalid } from '../http.ts';
import { listOf, withExpand } from '../lists.ts';
import { currency, expandList, listQuery, metadata, posInt, retrieveSchema, validate } from '../params.ts';
import { newId, type Store } from '../store.ts';
import type { Transfer, TransferReversal } from '../types.ts';
import { availableBalance } from './balance.ts';

const createSchema = z.object({
  amount: posInt,
  currency,
  destination: z.string().min(1),
  transfer_group: z.string().max(500).optional(),
  source_transaction: z.string().optional(),
  description: z.string().max(1000).optional(),
  metadata: metadata.optional(),
  expand: expandList,
});
const listTransfersSchema = z.object({ ...listQuery, transfer_group: z.string().optional(), destination: z.string().optional() });
const reversalSchema = z.object({ amount: posInt.optional(), metadata: metadata.optional(), expand: expandList });

/** A transfer funded by a charge must match its currency and, with the others from it, stay within its amount. */
function checkSourceTransaction(store: Store, chargeId: string, amount: number, cur: string): void {
  const ch = store.mustGet('charges', chargeId, 'charge', 'source_transaction');
  if (ch.status !== 'succeeded') throw invalid(`The charge ${ch.id} has not succeeded.`, { code: 'parameter_invalid', param: 'source_transaction' });
  if (ch.currency !== cur)
    throw invalid(`The currency of source_transaction's balance transaction (${ch.currency}) must be the same as the transfer currency (${cur}).`, { code: 'parameter_invalid', param: 'currency' });
  const already = store
    .all('transfers')
    .filter((t) => t.source_transaction === ch.id)
    .reduce((sum, t) => sum + t.amount - t.amount_reversed, 0);
  if (already + amount > ch.amount) {
    throw invalid(`Transfers using this source_transaction would total ${already + amount}, more than the charge's ${ch.amount}.`, { code: 'balance_insufficient', param: 'amount' });
  }
}

export const createTransfer: Handler = (fake, call) => {
  const p = validate(createSchema, call.params);
  const dest = fake.store.get('accounts', p.destination);
  if (!dest) throw invalid(`No such destination: '${p.destination}'`, { code: 'resource_missing', param: 'destination' });
  if (p.source_transaction) checkSourceTransaction(fake.store, p.source_transaction, p.amount, p.currency);
  if (p.amount > availableBalance(fake.store, p.currency)) {
    throw invalid('You have insufficient available funds in your Stripe account.', { code: 'balance_insufficient', param: 'amount' });
  }
  const id = newId('tr_');
  const tr: Transfer = fake.store.insert('transfers', {
    id,
    object: 'transfer',
    amount: p.amount,
    amount_reversed: 0,
    balance_transaction: newId('txn_'),
    created: fake.nowSec(),
    currency: p.currency,
    description: p.description ?? null,
    destination: dest.id,
    destination_payment: newId('py_'),
    livemode: false,
    metadata: p.metadata ?? {},
    reversals: { object: 'list', data: [], has_more: false, url: `/v1/transfers/${id}/reversals` },
    reversed: false,
    source_transaction: p.source_transaction ?? null,
    source_type: 'card',
    transfer_group: p.transfer_group ?? null,
  });
  return withExpand(fake.store, tr, p.expand);
};

export const listTransfers: Handler = (fake, call) => {
  const q = validate(listTransfersSchema, call.params);
  const items = fake.store.all('transfers').filter((t) => (!q.transfer_group || t.transfer_group === q.transfer_group) && (!q.destination || t.destination === q.destination));
  return listOf(fake.store, items, '/v1/transfers', q);
};

export const retrieveTransfer: Handler = (fake, call) => {
  const q = validate(retrieveSchema, call.params);
  return withExpand(fake.store, fake.store.mustGet('transfers', call.id, 'transfer'), q.expand);
};

export const createReversal: Handler = (fake, call) => {
  const p = validate(reversalSchema, call.params);
  const tr = fake.store.mustGet('transfers', call.id, 'transfer');
  const remaining = tr.amount - tr.amount_reversed;
  const amount = p.amount ?? remaining;
  if (remaining === 0) throw invalid(`Transfer ${tr.id} has already been fully reversed.`, { code: 'transfer_already_reversed' });
  if (amount > remaining) throw invalid(`Reversal amount (${amount}) is greater than the amount not yet reversed (${remaining}).`, { code: 'amount_too_large', param: 'amount' });
  const rev: TransferReversal = { id: newId('trr_'), object: 'transfer_reversal', amount, created: fake.nowSec(), currency: tr.currency, metadata: p.metadata ?? {}, transfer: tr.id };
  tr.amount_reversed += amount;
  tr.reversed = tr.amount_reversed === tr.amount;
  tr.reversals.data.unshift(rev);
  return withExpand(fake.store, rev, p.expand);
};
