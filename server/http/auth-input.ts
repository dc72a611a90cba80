import express, { type RequestHandler, Router } from 'express';
import { rateLimit, type Store } from 'express-rate-limit';
import {
  adminCreateUserSchema,
  adminSetUserPasswordSchema,
  changePasswordSchema,
  requestResetSchema,
  resetPasswordSchema,
  signInSchema,
  signUpSchema,
  updateUserSchema,
} from '../../shared/schemas/auth.ts';
import { CLIENT_IP_HEADER } from '../auth.ts';
import { requireRole, requireUser } from './auth-guards.ts';
import { validate } from './validate.ts';

/**
 * The plain form of an auth path: percent-escapes decoded (once), backslashes read as slashes,
 * `.` and `..` segments resolved, empty segments and a trailing slash dropped, lower case — except
 * the reset token in `/api/auth/reset-password/<token>`, which is case-sensitive. `null` when the
 * escapes cannot be decoded.
 *
 * better-auth builds a WHATWG URL from the request, which resolves `..`, `%2e%2e` and `\`; Express
 * matches our guards on the raw path. A request whose path is not already in this form is refused
 * before either sees it, so both always agree on which endpoint is called (and so which limits and
 * checks apply).
 */
export function canonicalAuthPath(raw: string): string | null {
  let decoded: string;
  try {
    decoded = decodeURIComponent(raw);
  } catch {
    return null;
  }
  const out: string[] = [];
  for (const seg of decoded.replace(/\\/g, '/').split('/')) {
    if (seg === '' || seg === '.') continue;
    if (seg === '..') out.pop();
    else out.push(seg);
  }
  const tokenAt = out.length === 4 && out[0]!.toLowerCase() === 'api' && out[1]!.toLowerCase() === 'auth' && out[2]!.toLowerCase() === 'reset-password' ? 3 : -1;
  return `/${out.map((s, i) => (i === tokenAt ? s : s.toLowerCase())).join('/')}`;
}

/** 400 for an auth address that is not in its plain form (see canonicalAuthPath). */
export const plainAuthPath: RequestHandler = (req, res, next) => {
  const raw = req.originalUrl.split('?')[0] ?? '';
  if (raw.startsWith('/') && canonicalAuthPath(raw) === raw) return next();
  res.status(400).json({
    error: { code: 'bad_request', message: 'Use the plain address of this endpoint: lower case, no dot segments, doubled slashes or escapes.' },
  });
};

/**
 * Runs in front of better-auth: refuses any auth address that is not in its one plain form,
 * parses the JSON body, validates it with the shared schemas so bad input gets our one error
 * shape with field messages, and limits failed sign-ins per account (OWASP ASVS 6.3.1) — five
 * failures a minute for one e-mail, then 429 until the minute is over, so an attacker is slowed
 * without locking the real user out for long.
 *
 * `session` loads the signed-in user (auth-guards' loadSession): the account routes below need it.
 */
export function authInput(opts: { signInFailuresPerMinute: number; session: RequestHandler; store?: Store }): Router {
  const r = Router();
  r.use(plainAuthPath);
  // better-auth's own IP limits read the client address from this header; we always overwrite it
  // with the socket's address (Express `req.ip`, trusting only a proxy on loopback), so it can't be spoofed
  r.use((req, _res, next) => {
    req.headers[CLIENT_IP_HEADER] = req.ip ?? 'unknown';
    next();
  });
  // loads the session here too, so a session past its absolute age is ended before better-auth reads it
  r.use(opts.session);
  r.use(express.json({ limit: '16kb' }));
  const perAccount = rateLimit({
    store: opts.store,
    windowMs: 60_000,
    limit: opts.signInFailuresPerMinute,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) =>
      `signin:${String(req.body?.email ?? '')
        .trim()
        .toLowerCase()}`,
    handler: (_req, res) => {
      res.status(429).json({ error: { code: 'too_many_attempts', message: 'Too many sign-in attempts for this account. Wait a minute and try again.' } });
    },
  });
  const nothing: RequestHandler = (_req, _res, next) => next();
  r.post('/sign-up/email', validate({ body: signUpSchema.passthrough() }));
  r.post('/sign-in/email', validate({ body: signInSchema.passthrough() }), opts.signInFailuresPerMinute > 0 ? perAccount : nothing);
  r.post('/request-password-reset', validate({ body: requestResetSchema.passthrough() }));
  r.post('/reset-password', validate({ body: resetPasswordSchema.passthrough() }));
  // who asks first (401/403 in our shape; better-auth checks again), then the body: every endpoint
  // that sets a password uses the sign-up rules (server/auth.ts checks again in a hook)
  r.post('/change-password', requireUser, validate({ body: changePasswordSchema }));
  r.post('/update-user', requireUser, validate({ body: updateUserSchema }));
  r.post('/admin/set-user-password', requireRole('admin'), validate({ body: adminSetUserPasswordSchema.passthrough() }));
  r.post('/admin/create-user', requireRole('admin'), validate({ body: adminCreateUserSchema.passthrough() }));
  return r;
}
