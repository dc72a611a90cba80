import type { RequestHandler } from 'express';
import type { ZodType } from 'zod';

type Parts = { body?: ZodType; query?: ZodType; params?: ZodType };

/**
 * Validates request parts with shared zod schemas. A failure throws the ZodError, which the
 * error handler turns into a 400 with field messages. Parsed values replace the raw ones
 * (`req.query` is read-only in Express 5, so the parsed query lives on `res.locals.query`).
 */
export function validate(parts: Parts): RequestHandler {
  return (req, res, next) => {
    if (parts.params) req.params = parts.params.parse(req.params) as typeof req.params;
    if (parts.query) res.locals.query = parts.query.parse(req.query);
    if (parts.body) req.body = parts.body.parse(req.body ?? {});
    next();
  };
}
