import { betterAuth } from 'better-auth';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import { admin } from 'better-auth/plugins';
import type { Db } from './db/client.ts';
import * as authSchema from './db/auth-schema.ts';
import type { Env } from './env.ts';
import { CLIENT_IP_HEADER } from './http/auth-input.ts';
import { appOrigins } from './http/same-origin.ts';
import { mailLayout, escapeHtml, type Mailer } from './integrations/mailer.ts';

export type AuthDeps = { db: Db; env: Env; mailer: Mailer };

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
          html: mailLayout('Reset your password', `<p>Hello ${escapeHtml(user.name)},</p><p>Someone (hopefully you) asked to reset the password of your Namesake account. Open this link within an hour to choose a new one:</p><p><a href="${escapeHtml(url)}" style="background:#e0a526;color:#1f2a44;padding:10px 16px;border-radius:8px;text-decoration:none;font-weight:700">Choose a new password</a></p><p style="font-size:13px">${escapeHtml(url)}</p><p>If it wasn't you, ignore this e-mail: your password stays as it is.</p>`),
        });
      },
    },
    session: { expiresIn: 60 * 60 * 24 * 14, updateAge: 60 * 60 * 24 },
    // IP-wide limits from better-auth; per-account sign-in limits live in server/http/auth-guards.ts
    rateLimit: {
      enabled: env.AUTH_IP_RATE_LIMIT ?? env.NODE_ENV !== 'test',
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
