// The guest cart's id lives in an HttpOnly cookie (OWASP ASVS 3.3.1 Secure in production, 3.3.2
// SameSite, 3.3.4 HttpOnly). The id is a random UUID: knowing it is what owns a guest cart.
import type { Request, Response } from 'express';
import type { CartRow } from './cart.repo.ts';
import { type CartDeps, resolveCart } from './cart.service.ts';

export const CART_COOKIE = 'ns_cart';
const MAX_AGE_S = 30 * 24 * 3600;

export function readCartCookie(req: Request): string | null {
  const header = req.headers.cookie ?? '';
  for (const part of header.split(';')) {
    const i = part.indexOf('=');
    if (i < 0) continue;
    if (part.slice(0, i).trim() === CART_COOKIE) {
      const v = decodeURIComponent(part.slice(i + 1).trim());
      return /^[0-9a-f-]{36}$/.test(v) ? v : null;
    }
  }
  return null;
}

export function setCartCookie(res: Response, id: string, secure: boolean): void {
  res.cookie(CART_COOKIE, id, { httpOnly: true, sameSite: 'lax', secure, path: '/', maxAge: MAX_AGE_S * 1000 });
}

export function clearCartCookie(res: Response, secure: boolean): void {
  res.clearCookie(CART_COOKIE, { httpOnly: true, sameSite: 'lax', secure, path: '/' });
}

/** The cart of this request (cart.service.ts resolveCart), with the guest cookie set or cleared as it says. */
export function cartOfRequest(deps: CartDeps, req: Request, res: Response, opts: { create: boolean }): CartRow | null {
  const { cart, cookie } = resolveCart(deps, { userId: req.user?.id ?? null, cookieCartId: readCartCookie(req) }, opts);
  if (cookie === 'clear') clearCartCookie(res, deps.env.production);
  else if (cookie) setCartCookie(res, cookie.set, deps.env.production);
  return cart;
}
