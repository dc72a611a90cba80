import path from 'node:path';
import { z } from 'zod';

const bool = z.enum(['true', 'false', '1', '0', 'yes', 'no']).transform((v) => v === 'true' || v === '1' || v === 'yes');

/** An empty value counts as unset (e.g. `AUTH_SECRET=` in an env file). */
const optional = <T extends z.ZodType>(t: T) => z.preprocess((v) => (v === '' ? undefined : v), t.optional());

const schema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default('127.0.0.1'),
  DATA_DIR: z.string().default('./data'),
  BASE_URL: optional(z.url({ protocol: /^https?$/, error: 'use an http(s) address, e.g. https://shop.example.com' })),
  AUTH_SECRET: optional(z.string().min(32, 'use at least 32 characters')),
  /** staging and demos: run the local mail and payment fakes (and use their keys) even in production */
  LOCAL_FAKES: bool.optional(),
  /** seed the demo scenario into an empty database (default: yes outside production) */
  DEMO_DATA: bool.optional(),
  /** the older name of DEMO_DATA, still read */
  DEMO_MODE: bool.optional(),
  /** which proxies may set X-Forwarded-For / -Proto: `loopback`, a hop count, or addresses/CIDRs separated by commas */
  TRUST_PROXY: z
    .string()
    .default('loopback')
    .refine(
      (v) => /^\s*\d+\s*$/.test(v) || v.split(',').every((t) => /^(loopback|linklocal|uniquelocal|[0-9a-f:.]+(\/\d{1,3})?)$/i.test(t.trim())),
      'use loopback, a hop count, or proxy addresses/CIDRs separated by commas (e.g. 10.0.0.5, 172.16.0.0/12)',
    )
    .transform((v) => (/^\s*\d+\s*$/.test(v) ? Number(v) : v)),
  SMTP_HOST: optional(z.string()),
  SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
  SMTP_SECURE: bool.default(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASS: z.string().optional(),
  MAIL_FROM: z.string().default('Namesake <hello@namesake.test>'),
  /** start the local SMTP capture server (outside production: yes unless SMTP_HOST is set to another machine) */
  MAIL_FAKE: bool.optional(),
  STRIPE_SECRET_KEY: optional(z.string()),
  /** where the Stripe SDK points; empty = the real Stripe API (the default in production without LOCAL_FAKES) */
  STRIPE_API_BASE: z.string().optional(),
  STRIPE_WEBHOOK_SECRET: optional(z.string()),
  /** start the local Stripe fake (outside production: yes when STRIPE_API_BASE is on this machine) */
  STRIPE_FAKE: bool.optional(),
  /** port of the local Stripe fake (default: the port in STRIPE_API_BASE; 0 = any free port) */
  STRIPE_FAKE_PORT: z.coerce.number().int().min(0).max(65535).optional(),
  PLATFORM_FEE_BPS: z.coerce.number().int().min(0).max(5000).default(800),
  /** the payment provider's fee, for the seller's cost of goods: percentage in basis points + fixed per charge */
  PAYMENT_FEE_BPS: z.coerce.number().int().min(0).max(5000).default(290),
  PAYMENT_FEE_FIXED_MINOR: z.coerce.number().int().min(0).max(10_000).default(30),
  /** IANA time zone for shops' calendar days (ship-by dates, the morning digest) */
  BUSINESS_TIME_ZONE: z
    .string()
    .default('UTC')
    .refine((tz) => {
      try {
        new Intl.DateTimeFormat('en', { timeZone: tz });
        return true;
      } catch {
        return false;
      }
    }, 'Use an IANA time zone name, e.g. Europe/London.'),
  /** when the sellers' morning digest goes out (cron, in BUSINESS_TIME_ZONE); DIGEST=false turns it off */
  DIGEST_CRON: z.string().default('0 7 * * *'),
  DIGEST: bool.default(true),
  LOG_REQUESTS: bool.default(true),
  /** server processes (node:cluster) sharing the port and the SQLite file; 1 = this process alone */
  WORKERS: z.coerce.number().int().min(1).max(16).default(1),
  /** better-auth's per-IP limits on the auth routes (default: on, except under NODE_ENV=test so suites can sign in freely) */
  AUTH_IP_RATE_LIMIT: bool.optional(),
});

export type Env = ReturnType<typeof loadEnv>;

/** The local fakes' own keys: used only outside production or with LOCAL_FAKES=true. */
export const LOCAL_STRIPE_SECRET_KEY = 'sk_test_namesake_local';
export const LOCAL_STRIPE_WEBHOOK_SECRET = 'whsec_namesake_local';
const LOCAL_STRIPE_API_BASE = 'http://127.0.0.1:12111';
const DEVELOPMENT_AUTH_SECRET = 'namesake-development-secret-not-for-production-use';

const isLocal = (u: string) => /^(https?:\/\/)?(127\.0\.0\.1|localhost|\[::1\])(:|\/|$)/.test(u);

/**
 * Reads and checks the environment once. Every problem is one line naming its variable, and any
 * problem stops start-up. In production no secret has a default: AUTH_SECRET always, and BASE_URL,
 * the payment keys and SMTP_HOST unless LOCAL_FAKES=true runs the local fakes with their own keys.
 */
export function loadEnv(source: Record<string, string | undefined> = process.env) {
  const parsed = schema.safeParse(source);
  const problems = parsed.success ? [] : parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
  // production's own checks run even when a value is malformed, so every problem shows at once
  const production = (parsed.data?.NODE_ENV ?? source.NODE_ENV) === 'production';
  const localFakes = parsed.data?.LOCAL_FAKES ?? ['true', '1', 'yes'].includes(source.LOCAL_FAKES ?? '');
  if (production) problems.push(...productionProblems(source, parsed.data, localFakes));
  if (!parsed.success || problems.length) throw new Error(`Namesake cannot start: the environment has problems:\n${problems.map((p) => `  ${p}`).join('\n')}`);
  const e = parsed.data;

  const dataDir = path.resolve(e.DATA_DIR);
  const baseUrl = (e.BASE_URL ?? `http://localhost:${e.PORT}`).replace(/\/$/, '');
  const SMTP_HOST = e.SMTP_HOST ?? '127.0.0.1';
  // outside production, and with LOCAL_FAKES, the fakes are the default services
  const STRIPE_API_BASE = e.STRIPE_API_BASE ?? (!production || localFakes ? LOCAL_STRIPE_API_BASE : '');
  return {
    ...e,
    production,
    localFakes,
    dataDir,
    baseUrl,
    SMTP_HOST,
    STRIPE_API_BASE,
    STRIPE_SECRET_KEY: e.STRIPE_SECRET_KEY ?? LOCAL_STRIPE_SECRET_KEY,
    STRIPE_WEBHOOK_SECRET: e.STRIPE_WEBHOOK_SECRET ?? LOCAL_STRIPE_WEBHOOK_SECRET,
    // in production AUTH_SECRET is always set (checked above)
    authSecret: e.AUTH_SECRET ?? DEVELOPMENT_AUTH_SECRET,
    /** seed the demo scenario into an empty database; never implied in production */
    demoData: e.DEMO_DATA ?? e.DEMO_MODE ?? !production,
    mailDir: path.join(dataDir, 'mail'),
    uploadsDir: path.join(dataDir, 'uploads'),
    /** finished work sheet PDFs, readable by every server process */
    worksheetsDir: path.join(dataDir, 'worksheets'),
    dbFile: path.join(dataDir, 'namesake.db'),
    startMailFake: production ? localFakes && e.MAIL_FAKE !== false : (e.MAIL_FAKE ?? (localFakes || isLocal(SMTP_HOST))),
    startStripeFake: production ? localFakes && e.STRIPE_FAKE !== false : (e.STRIPE_FAKE ?? (localFakes || (STRIPE_API_BASE !== '' && isLocal(STRIPE_API_BASE)))),
  };
}

type Parsed = z.infer<typeof schema>;

/** What production needs set; one line per variable. `e` is missing when some value was malformed. */
function productionProblems(source: Record<string, string | undefined>, e: Parsed | undefined, localFakes: boolean): string[] {
  const unset = (k: string) => (source[k] ?? '') === '';
  const out: string[] = [];
  if (unset('AUTH_SECRET')) out.push('AUTH_SECRET: required in production: 32 or more random characters (e.g. `openssl rand -base64 48`)');
  if (!localFakes) {
    if (unset('BASE_URL')) out.push('BASE_URL: required in production: the public address people open, e.g. https://shop.example.com');
    if (unset('STRIPE_SECRET_KEY')) out.push('STRIPE_SECRET_KEY: required in production: the secret key from the Stripe dashboard (sk_live_… or sk_test_…)');
    if (unset('STRIPE_WEBHOOK_SECRET')) out.push('STRIPE_WEBHOOK_SECRET: required in production: the signing secret (whsec_…) of the webhook endpoint BASE_URL/api/payments/webhook');
    if (unset('SMTP_HOST')) out.push('SMTP_HOST: required in production: the mail server that sends the e-mails (with SMTP_PORT, SMTP_USER, SMTP_PASS)');
    if (e?.MAIL_FAKE) out.push('MAIL_FAKE: the local mail fake runs in production only with LOCAL_FAKES=true');
    if (e?.STRIPE_FAKE) out.push('STRIPE_FAKE: the local payment fake runs in production only with LOCAL_FAKES=true');
  }
  // Secure cookies travel over https only; browsers make an exception for localhost
  if (e?.BASE_URL && !e.BASE_URL.startsWith('https://') && !isLocal(e.BASE_URL)) {
    out.push(`BASE_URL: must start with https:// in production (sign-in cookies are Secure); put a TLS reverse proxy in front (got ${e.BASE_URL})`);
  }
  return out;
}
