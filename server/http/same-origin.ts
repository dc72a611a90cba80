import type { RequestHandler } from 'express';
import { forbidden } from './app-error.ts';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * CSRF defence for cookie-authenticated requests: a state-changing request whose Origin (or
 * Sec-Fetch-Site) says it came from another site is refused. Cookies are also SameSite=Lax.
 */
export function sameOrigin(allowed: string[]): RequestHandler {
  const ok = new Set(allowed.map((o) => o.replace(/\/$/, '')));
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next();
    if (req.path.startsWith('/payments/webhook')) return next(); // signed server-to-server call
    const origin = req.get('origin');
    const site = req.get('sec-fetch-site');
    if (site === 'cross-site') throw forbidden('Requests from other sites are not accepted.');
    if (origin && origin !== 'null' && !ok.has(origin)) {
      const host = req.get('host');
      if (!host || hostOf(origin) !== host) throw forbidden('Requests from other sites are not accepted.');
    }
    if (origin === 'null') throw forbidden('Requests from other sites are not accepted.');
    next();
  };
}

/** The host of an Origin header; a malformed one (never sent by a browser) matches nothing. */
function hostOf(origin: string): string | null {
  try {
    return new URL(origin).host;
  } catch {
    return null;
  }
}
