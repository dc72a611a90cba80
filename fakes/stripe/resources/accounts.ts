// /v1/accounts (Connect connected accounts): create, list, retrieve, update. Simpler than Stripe: an
// account is ready for transfers at once (no onboarding), and each requested capability is active.
import { z } from 'zod';
import type { Handler } from '../api.ts';
import { listOf, withExpand } from '../lists.ts';
import { email, expandList, listSchema, metadata, retrieveSchema, validate } from '../params.ts';
import { newId, patch } from '../store.ts';
import type { Account } from '../types.ts';

const createSchema = z.object({
  type: z.enum(['express', 'standard', 'custom']).optional(),
  country: z
    .string()
    .regex(/^[A-Za-z]{2}$/, 'expected a two-letter country code')
    .transform((s) => s.toUpperCase())
    .optional(),
  email: email.optional(),
  business_type: z.enum(['individual', 'company', 'non_profit', 'government_entity']).optional(),
  business_profile: z.object({ name: z.string().max(200).optional(), url: z.string().max(500).optional(), product_description: z.string().optional(), mcc: z.string().optional() }).optional(),
  capabilities: z.record(z.string(), z.object({ requested: z.enum(['true', 'false']) })).optional(),
  metadata: metadata.optional(),
  expand: expandList,
});
const updateSchema = createSchema.omit({ type: true, country: true });

const DEFAULT_CURRENCY: Record<string, string> = { US: 'usd', GB: 'gbp', CA: 'cad', AU: 'aud', JP: 'jpy' };

export const createAccount: Handler = (fake, call) => {
  const p = validate(createSchema, call.params);
  const id = newId('acct_', 16);
  const country = p.country ?? 'US';
  const requested = Object.entries(p.capabilities ?? { transfers: { requested: 'true' } }).filter(([, v]) => v.requested === 'true');
  const acct: Account = fake.store.insert('accounts', {
    id,
    object: 'account',
    business_profile: { name: null, url: null, product_description: null, mcc: null, ...(p.business_profile ?? {}) },
    business_type: p.business_type ?? null,
    capabilities: Object.fromEntries(requested.map(([k]) => [k, 'active' as const])),
    charges_enabled: true,
    country,
    created: fake.nowSec(),
    default_currency: DEFAULT_CURRENCY[country] ?? 'eur',
    details_submitted: true,
    email: p.email ?? null,
    metadata: p.metadata ?? {},
    payouts_enabled: true,
    type: p.type ?? 'standard',
  });
  return withExpand(fake.store, acct, p.expand);
};

export const listAccounts: Handler = (fake, call) => {
  const q = validate(listSchema, call.params);
  return listOf(fake.store, fake.store.all('accounts'), '/v1/accounts', q);
};

export const retrieveAccount: Handler = (fake, call) => {
  const q = validate(retrieveSchema, call.params);
  return withExpand(fake.store, fake.store.mustGet('accounts', call.id, 'account', 'account'), q.expand);
};

export const updateAccount: Handler = (fake, call) => {
  const p = validate(updateSchema, call.params);
  const acct = fake.store.mustGet('accounts', call.id, 'account', 'account');
  if (p.email !== undefined) acct.email = p.email;
  if (p.business_type !== undefined) acct.business_type = p.business_type;
  if (p.business_profile) patch(acct.business_profile, p.business_profile);
  if (p.metadata) patch(acct.metadata, p.metadata);
  if (p.capabilities) for (const [k, v] of Object.entries(p.capabilities)) if (v.requested === 'true') acct.capabilities[k] = 'active';
  return withExpand(fake.store, acct, p.expand);
};
