import express, { type RequestHandler, Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { requestResetSchema, resetPasswordSchema, signInSchema, signUpSchema } from '../../shared/schemas/auth.ts';
import { validate } from './validate.ts';

/**
 * Runs in front of better-auth: parses the JSON body, validates it with the shared schemas so bad
 * input gets our one error shape with field messages, and limits failed sign-ins per account
 * (OWASP ASVS 6.3.1) — five failures a minute for one e-mail, then 429 until the minute is over,
 * so an attacker is slowed without locking the real user out for long.
 */
export const CLIENT_IP_HEADER = 'x-namesake-client-ip';

export function authInput(opts: { signInFailuresPerMinute: number }): Router {
  const r = Router();
  // better-auth's own IP limits read the client address from this header; we always overwrite it
  // with the socket's address (Express `req.ip`, trusting only a proxy on loopback), so it can't be spoofed
  r.use((req, _res, next) => {
    req.headers[CLIENT_IP_HEADER] = req.ip ?? 'unknown';
    next();
  });
  r.use(express.json({ limit: '16kb' }));
  const perAccount = rateLimit({
    windowMs: 60_000,
    limit: opts.signInFailuresPerMinute,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `signin:${String(req.body?.email ?? '').trim().toLowerCase()}`,
    handler: (_req, res) => {
      res.status(429).json({ error: { code: 'too_many_attempts', message: 'Too many sign-in attempts for this account. Wait a minute and try again.' } });
    },
  });
  const nothing: RequestHandler = (_req, _res, next) => next();
  r.post('/sign-up/email', validate({ body: signUpSchema.passthrough() }));
  r.post('/sign-in/email', validate({ body: signInSchema.passthrough() }), opts.signInFailuresPerMinute > 0 ? perAccount : nothing);
  r.post('/request-password-reset', validate({ body: requestResetSchema.passthrough() }));
  r.post('/reset-password', validate({ body: resetPasswordSchema.passthrough() }));
  return r;
}
