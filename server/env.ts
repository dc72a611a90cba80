import { z } from 'zod';
import path from 'node:path';

const bool = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'])
  .transform((v) => v === 'true' || v === '1' || v === 'yes');

const schema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default('127.0.0.1'),
  DATA_DIR: z.string().default('./data'),
  BASE_URL: z.string().url().optional(),
  AUTH_SECRET: z.string().min(32, 'AUTH_SECRET must be at least 32 characters').optional(),
  DEMO_MODE: bool.optional(),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().default(2525),
  SMTP_SECURE: bool.default(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASS: z.string().optional(),
  MAIL_FROM: z.string().default('Namesake <hello@namesake.test>'),
  /** start the local SMTP capture server (default: yes unless SMTP_HOST is set to something else) */
  MAIL_FAKE: bool.optional(),
  STRIPE_SECRET_KEY: z.string().default('sk_test_namesake_local'),
  /** where the Stripe SDK points; empty = the real Stripe API */
  STRIPE_API_BASE: z.string().default('http://127.0.0.1:12111'),
  STRIPE_WEBHOOK_SECRET: z.string().default('whsec_namesake_local'),
  /** start the local Stripe fake (default: yes when STRIPE_API_BASE is on this machine) */
  STRIPE_FAKE: bool.optional(),
  /** port of the local Stripe fake (default: the port in STRIPE_API_BASE; 0 = any free port) */
  STRIPE_FAKE_PORT: z.coerce.number().int().min(0).max(65535).optional(),
  PLATFORM_FEE_BPS: z.coerce.number().int().min(0).max(5000).default(800),
  /** the payment provider's fee, for the seller's cost of goods: percentage in basis points + fixed per charge */
  PAYMENT_FEE_BPS: z.coerce.number().int().min(0).max(5000).default(290),
  PAYMENT_FEE_FIXED_MINOR: z.coerce.number().int().min(0).max(10_000).default(30),
  /** IANA time zone for shops' calendar days (ship-by dates, the morning digest) */
  BUSINESS_TIME_ZONE: z.string().default('UTC').refine((tz) => { try { new Intl.DateTimeFormat('en', { timeZone: tz }); return true; } catch { return false; } }, 'Use an IANA time zone name, e.g. Europe/London.'),
  /** when the sellers' morning digest goes out (cron, in BUSINESS_TIME_ZONE); DIGEST=false turns it off */
  DIGEST_CRON: z.string().default('0 7 * * *'),
  DIGEST: bool.default(true),
  LOG_REQUESTS: bool.default(true),
  /** better-auth's per-IP limits on the auth routes (default: on, except under NODE_ENV=test so suites can sign in freely) */
  AUTH_IP_RATE_LIMIT: bool.optional(),
});

export type Env = ReturnType<typeof loadEnv>;

/** Reads and checks the environment once; a bad value stops start-up with a clear message. */
export function loadEnv(source: Record<string, string | undefined> = process.env) {
  const parsed = schema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`Namesake cannot start: the environment has problems:\n${lines}`);
  }
  const e = parsed.data;
  const production = e.NODE_ENV === 'production';
  if (production && !e.AUTH_SECRET) throw new Error('Namesake cannot start: set AUTH_SECRET (32+ random characters) in production.');
  const dataDir = path.resolve(e.DATA_DIR);
  const baseUrl = (e.BASE_URL ?? `http://localhost:${e.PORT}`).replace(/\/$/, '');
  const local = (u: string) => /^(https?:\/\/)?(127\.0\.0\.1|localhost|\[::1\])/.test(u);
  return {
    ...e,
    production,
    dataDir,
    baseUrl,
    authSecret: e.AUTH_SECRET ?? 'namesake-development-secret-not-for-production-use',
    demoMode: e.DEMO_MODE ?? !production,
    mailDir: path.join(dataDir, 'mail'),
    uploadsDir: path.join(dataDir, 'uploads'),
    dbFile: path.join(dataDir, 'namesake.db'),
    startMailFake: e.MAIL_FAKE ?? local(e.SMTP_HOST),
    startStripeFake: e.STRIPE_FAKE ?? (e.STRIPE_API_BASE !== '' && local(e.STRIPE_API_BASE)),
  };
}
