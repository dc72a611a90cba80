// Where the demo orders are paid: the local payment fake, so that refunds, transfers and payouts of
// demo orders work like any other. The fake the server started (or one already answering at
// STRIPE_API_BASE) is used; when the payment calls point at this machine but nothing answers there
// (a server run with STRIPE_FAKE=false), a fake is started on a free port for the seed, with its
// state in DATA_DIR/stripe where a later start with the fake on finds it. With a real provider
// (STRIPE_API_BASE empty) there is no test card to pay with: no demo orders.
import path from 'node:path';
import type { Env } from '../env.ts';

export type SeedPayments = { env: Env; close(): Promise<void> };

async function fakeAnswers(base: string): Promise<boolean> {
  try {
    const res = await fetch(new URL('/_fake/health', base), { signal: AbortSignal.timeout(2000) });
    return res.ok;
  } catch {
    return false;
  }
}

export async function demoPaymentProvider(env: Env): Promise<SeedPayments | null> {
  if (!env.STRIPE_API_BASE) return null;
  if (await fakeAnswers(env.STRIPE_API_BASE)) return { env, close: async () => {} };
  if (!/^https?:\/\/(127\.0\.0\.1|localhost|\[::1\])(:|\/|$)/.test(env.STRIPE_API_BASE)) return null;
  const { startStripeFake } = await import('../../fakes/stripe/server.ts');
  const fake = await startStripeFake({ port: 0, dataDir: path.join(env.dataDir, 'stripe'), webhookSecret: env.STRIPE_WEBHOOK_SECRET });
  return { env: { ...env, STRIPE_API_BASE: fake.url }, close: () => fake.close() };
}
