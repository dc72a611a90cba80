import { betterAuth } from 'better-auth';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import { APIError, createAuthMiddleware } from 'better-auth/api';
import { admin } from 'better-auth/plugins';
import { newPasswordSchema } from '../shared/schemas/auth.ts';
import * as authSchema from './db/auth-schema.ts';
import type { Db } from './db/client.ts';
import type { Env } from './env.ts';
import { appOrigins } from './http/same-origin.ts';
import { escapeHtml, type Mailer, mailLayout } from './integrations/mailer.ts';

export type AuthDeps = { db: Db; env: Env; mailer: Mailer };

/**
 * The header better-auth's own IP limits read the client address from. server/http/auth-input.ts
 * always overwrites it with the socket's address, so a client cannot set it.
 */
export const CLIENT_IP_HEADER = 'x-namesake-client-ip';

/**
 * Session lifetime. Sliding: a session lasts 14 days from its last use (better-auth moves
 * `expiresAt` forward at most once a day, `updateAge`). Absolute: whatever the use, a session ends
 * 30 days after it was created (sign-in); server/http/auth-guards.ts refuses and deletes an older
 * one where every session is loaded. OWASP ASVS 7.3.1 (inactivity) and 7.3.2 (absolute lifetime).
 */
export const SESSION_IDLE_SECONDS = 60 * 60 * 24 * 14;
export const SESSION_REFRESH_SECONDS = 60 * 60 * 24;
export const SESSION_ABSOLUTE_MS = 30 * 24 * 60 * 60 * 1000;

/** Body fields of better-auth endpoints that set a password (every other endpoint only checks one). */
const NEW_PASSWORD_FIELD: Record<string, 'password' | 'newPassword'> = {
  '/sign-up/email': 'password',
  '/admin/create-user': 'password',
  '/change-password': 'newPassword',
  '/reset-password': 'newPassword',
  '/set-password': 'newPassword',
  '/admin/set-user-password': 'newPassword',
};

/**
 * The password rules of sign-up for every endpoint that sets a password, however it is called
 * (HTTP through our input guard, or `auth.api.*` on the server): a backstop for the guard.
 */
const passwordRules = createAuthMiddleware(async (ctx) => {
  const body = (ctx.body ?? {}) as Record<string, unknown>;
  const field = NEW_PASSWORD_FIELD[ctx.path] ?? ('newPassword' in body ? 'newPassword' : undefined);
  if (!field || body[field] === undefined) return;
  const checked = newPasswordSchema.safeParse(body[field]);
  if (!checked.success) throw new APIError('BAD_REQUEST', { code: 'WEAK_PASSWORD', message: checked.error.issues[0]?.message ?? 'Choose another password.' });
});

/** better-auth with e-mail + password, the admin plugin's role column, and reset mail through our mailer. */
export function createAuth({ db, env, mailer }: AuthDeps) {
  return betterAuth({
    baseURL: env.baseUrl,
    basePath: '/api/auth',
    secret: env.authSecret,
    trustedOrigins: appOrigins(env),
    database: drizzleAdapter(db, { provider: 'sqlite', schema: authSchema }),
    telemetry: { enabled: false },
    logger: { disabled: env.NODE_ENV === 'test' },
    emailAndPassword: {
      enabled: true,
      minPasswordLength: 8,
      maxPasswordLength: 128,
      autoSignIn: true,
      revokeSessionsOnPasswordReset: true,
      resetPasswordTokenExpiresIn: 60 * 60,
      async sendResetPassword({ user, url }) {
        await mailer.send({
          to: user.email,
          subject: 'Reset your Namesake password',
          text: `Hello ${user.name},\n\nSomeone (hopefully you) asked to reset the password of your Namesake account.\nOpen this link within an hour to choose a new one:\n\n${url}\n\nIf it wasn't you, ignore this e-mail: your password stays as it is.`,
          html: mailLayout(
            'Reset your password',
            `<p>Hello ${escapeHtml(user.name)},</p><p>Someone (hopefully you) asked to reset the password of your Namesake account. Open this link within an hour to choose a new one:</p><p><a href="${escapeHtml(url)}" style="background:#e0a526;color:#1f2a44;padding:10px 16px;border-radius:8px;text-decoration:none;font-weight:700">Choose a new password</a></p><p style="font-size:13px">${escapeHtml(url)}</p><p>If it wasn't you, ignore this e-mail: your password stays as it is.</p>`,
          ),
        });
      },
    },
    // sliding 14 days with a 30-day absolute cap (SESSION_ABSOLUTE_MS, enforced in auth-guards.ts)
    session: { expiresIn: SESSION_IDLE_SECONDS, updateAge: SESSION_REFRESH_SECONDS },
    hooks: { before: passwordRules },
    // IP-wide limits from better-auth; per-account sign-in limits live in server/http/auth-input.ts.
    // Counted in the database (the rate_limit table), so every server process (WORKERS) shares them.
    rateLimit: {
      enabled: env.AUTH_IP_RATE_LIMIT ?? env.NODE_ENV !== 'test',
      storage: 'database',
      window: 60,
      max: 200,
      customRules: { '/sign-in/email': { window: 60, max: 30 }, '/sign-up/email': { window: 60, max: 20 }, '/request-password-reset': { window: 60, max: 5 } },
    },
    advanced: {
      ipAddress: { ipAddressHeaders: [CLIENT_IP_HEADER] },
      useSecureCookies: env.production,
      defaultCookieAttributes: { httpOnly: true, sameSite: 'lax', secure: env.production },
    },
    plugins: [admin({ defaultRole: 'shopper', adminRoles: ['admin'] })],
  });
}
export type Auth = ReturnType<typeof createAuth>;
