import { fromNodeHeaders } from 'better-auth/node';
import type { Request, RequestHandler } from 'express';
import type { Role } from '../../shared/schemas/auth.ts';
import { type Auth, SESSION_ABSOLUTE_MS } from '../auth.ts';
import type { Db } from '../db/client.ts';
import { forbidden, unauthorized } from './app-error.ts';
import { authRepo, type ShopRow } from './auth.repo.ts';

export type SessionUser = { id: string; email: string; name: string; role: Role };
export type { ShopRow };

declare module 'express-serve-static-core' {
  interface Request {
    /** set by `loadSession` when the request carries a valid session cookie */
    user?: SessionUser;
    sessionId?: string;
  }
}

const asRole = (r: unknown): Role => (r === 'seller' || r === 'admin' ? r : 'shopper');

/**
 * Reads the session cookie (if any) through better-auth and puts the user on `req.user`.
 * better-auth slides the expiry (server/auth.ts); here a session older than the absolute cap
 * (SESSION_ABSOLUTE_MS from its creation, by `now`) is refused and deleted, so the cookie is dead.
 */
export function loadSession(deps: { auth: Auth; db: Db; now: () => number }): RequestHandler {
  return async (req, _res, next) => {
    // no session cookie, nothing to look up: guests' requests skip the database
    if (!req.headers.cookie?.includes('session_token')) return next();
    const result = await deps.auth.api.getSession({ headers: fromNodeHeaders(req.headers) });
    if (result && deps.now() - new Date(result.session.createdAt).getTime() > SESSION_ABSOLUTE_MS) {
      authRepo.deleteSession(deps.db, result.session.id);
      return next();
    }
    if (result && !result.user.banned) {
      req.user = { id: result.user.id, email: result.user.email, name: result.user.name, role: asRole(result.user.role) };
      req.sessionId = result.session.id;
    }
    next();
  };
}

export const requireUser: RequestHandler = (req, _res, next) => {
  if (!req.user) throw unauthorized();
  next();
};

/** 401 for a guest; 403 when the user has none of the roles. An admin passes every role check. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (req, _res, next) => {
    if (!req.user) throw unauthorized();
    if (req.user.role !== 'admin' && !roles.includes(req.user.role)) throw forbidden();
    next();
  };
}

export function currentUser(req: Request): SessionUser {
  if (!req.user) throw unauthorized();
  return req.user;
}

/** The shop the signed-in seller owns; 403 when they have none. Everything a seller touches is scoped by it. */
export function ownShop(db: Db, req: Request): ShopRow {
  const shop = authRepo.shopOfOwner(db, currentUser(req).id);
  if (!shop) throw forbidden('Open a shop first.');
  return shop;
}

/** The shop of whoever asks, or null for a guest or a user without a shop. */
export function shopOfRequester(db: Db, req: Request): ShopRow | null {
  return req.user ? (authRepo.shopOfOwner(db, req.user.id) ?? null) : null;
}
