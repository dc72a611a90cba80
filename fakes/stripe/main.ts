// Runs the Stripe fake on its own: `node_modules/.bin/tsx fakes/stripe/main.ts`.
import path from 'node:path';
import { z } from 'zod';
import { startStripeFake } from './server.ts';

const env = z
  .object({
    STRIPE_FAKE_PORT: z.coerce.number().int().min(0).max(65535).default(12111),
    DATA_DIR: z.string().min(1).default('./data'),
    STRIPE_WEBHOOK_URL: z.url().optional(),
    STRIPE_WEBHOOK_SECRET: z.string().min(1).default('whsec_namesake_local'),
    STRIPE_FAKE_PUBLIC_URL: z.url().optional(),
  })
  .safeParse(process.env);

if (!env.success) {
  console.error(`stripe fake: bad environment: ${env.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ')}`);
  process.exit(1);
}

const fake = await startStripeFake({
  port: env.data.STRIPE_FAKE_PORT,
  dataDir: path.join(env.data.DATA_DIR, 'stripe'),
  webhookUrl: env.data.STRIPE_WEBHOOK_URL,
  webhookSecret: env.data.STRIPE_WEBHOOK_SECRET,
  publicUrl: env.data.STRIPE_FAKE_PUBLIC_URL,
  log: (m) => console.log(m),
});
console.log(`stripe fake listening on ${fake.url}${env.data.STRIPE_WEBHOOK_URL ? `, webhooks to ${env.data.STRIPE_WEBHOOK_URL}` : ''}`);

let stopping = false;
async function stop(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  console.log(`stripe fake: ${signal}, stopping`);
  await fake.close();
  process.exit(0);
}
process.on('SIGTERM', () => void stop('SIGTERM'));
process.on('SIGINT', () => void stop('SIGINT'));
