import type { RequestHandler } from 'express';
import type { Env } from '../env.ts';
import { forbidden } from './app-error.ts';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Vite's dev server (`npm run dev`), which proxies /api to us. */
const VITE_DEV_PORT = 5173;

/**
 * The origins the app's own pages are served from — the one list for our CSRF check and better-auth's
 * trustedOrigins. Production: BASE_URL's origin only. Elsewhere also the app's own port on both
 * localhost and 127.0.0.1, and Vite's dev server on both.
 */
export function appOrigins(env: Pick<Env, 'production' | 'baseUrl' | 'PORT'>): string[] {
  const base = new URL(env.baseUrl).origin;
  if (env.production) return [base];
  const ports = new Set([env.PORT, Number(new URL(env.baseUrl).port || 0), VITE_DEV_PORT].filter((p) => p > 0));
  return [...new Set([base, ...[...ports].flatMap((p) => [`http://localhost:${p}`, `http://127.0.0.1:${p}`])])];
}

/**
 * CSRF defence for cookie-authenticated requests: a state-changing request whose Origin (or
 * Sec-Fetch-Site) says it came from another site is refused. Cookies are also SameSite=Lax.
 * `sameHost` (outside production) also lets an Origin through whose host is the request's Host.
 */
export function sameOrigin(allowed: string[], { sameHost = true }: { sameHost?: boolean } = {}): RequestHandler {
  const ok = new Set(allowed.map((o) => o.replace(/\/$/, '')));
  return (req, _res, next) => {
    if (SAFE.has(req.method)) return next();
    if (req.path.startsWith('/payments/webhook')) return next(); // signed server-to-server call
    const origin = req.get('origin');
    const site = req.get('sec-fetch-site');
    if (site === 'cross-site') throw forbidden('Requests from other sites are not accepted.');
    if (origin && origin !== 'null' && !ok.has(origin)) {
      const host = req.get('host');
      if (!sameHost || !host || hostOf(origin) !== host) throw forbidden('Requests from other sites are not accepted.');
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
