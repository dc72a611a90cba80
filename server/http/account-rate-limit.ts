/**
 * Per-account rate limits on the routes that start heavy work (uploads, cart adds, cut-sheet
 * builds, work sheet PDFs): keyed by the signed-in user's id, so one account cannot keep the
 * worker pool busy by itself; a guest is keyed by address. The numbers live in the app's deps
 * (AppDeps.rateLimits), so tests can lower them. The counts live in the database (AppDeps.limitStore,
 * rate-limit-store.ts), shared by every server process.
 */
import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit, type Store } from 'express-rate-limit';
import { AppError } from './app-error.ts';

export type RateLimits = {
  /** Photo, logo and motif uploads per account per minute. */
  uploadsPerMinute: number;
  /** Items added to a cart per account (or guest address) per minute. */
  cartAddsPerMinute: number;
  /** Cut-sheet builds per account per minute. */
  cutSheetsPerMinute: number;
  /** Work sheet PDF jobs started per account per minute. */
  pdfJobsPerMinute: number;
  /** Order messages, reviews and shop replies per account per minute: each may send someone an e-mail. */
  messagesPerMinute: number;
};

export const DEFAULT_RATE_LIMITS: RateLimits = Object.freeze({
  uploadsPerMinute: 30,
  cartAddsPerMinute: 60,
  cutSheetsPerMinute: 20,
  pdfJobsPerMinute: 10,
  messagesPerMinute: 10,
});

/** Makes the store of one limiter, by a name of its own. */
export type LimitStoreFactory = (name: string) => Store;

/** A limiter of `limit` requests per minute per account; past it, 429 naming what and how many. */
export function perAccountLimit(limit: number, what: string, store: Store): RequestHandler {
  return rateLimit({
    store,
    windowMs: 60_000,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => (req.user ? `user:${req.user.id}` : `ip:${ipKeyGenerator(req.ip ?? '')}`),
    handler: (_req, _res, next, options) => {
      const retry = Math.ceil(options.windowMs / 1000);
      next(new AppError(429, 'rate_limited', `Too many ${what}: at most ${limit} a minute. Please wait up to ${retry} seconds and try again.`));
    },
  });
}
