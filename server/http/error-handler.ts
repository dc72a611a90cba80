import type { ErrorRequestHandler } from 'express';
import { ZodError } from 'zod';
import { fieldsFromIssues } from '../../shared/api-error.ts';
import { AppError } from './app-error.ts';

/** The one error middleware: ZodError → 400 with fields, AppError → its status, else → 500 (logged). */
export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  if (err instanceof ZodError) {
    res.status(400).json({ error: { code: 'invalid_input', message: 'Some fields need attention.', fields: fieldsFromIssues(err.issues) } });
    return;
  }
  if (err instanceof AppError) {
    res.status(err.status).json({ error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) } });
    return;
  }
  // body-parser errors carry a status (malformed JSON 400, too large 413)
  const status = typeof err?.status === 'number' && err.status >= 400 && err.status < 500 ? err.status : 500;
  if (status < 500) {
    const message = err.type === 'entity.too.large' ? 'That request is too large.' : 'The request body could not be read.';
    res.status(status).json({ error: { code: err.type === 'entity.too.large' ? 'too_large' : 'bad_request', message } });
    return;
  }
  console.error(err);
  res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on our side. Please try again.' } });
};
