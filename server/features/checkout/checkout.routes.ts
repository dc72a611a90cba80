import { Router } from 'express';
import { z } from 'zod';
import { checkoutStatusParams } from '../../../shared/schemas/checkout.ts';
import type { AppDeps } from '../../deps.ts';
import { unauthorized } from '../../http/app-error.ts';
import { currentUser } from '../../http/auth-guards.ts';
import { validate } from '../../http/validate.ts';
import { cartOfRequest } from '../cart/index.ts';
import { checkoutStatus, latestCheckout, openCheckout } from './checkout.service.ts';

const statusQuery = z.object({ wait: z.coerce.number().int().min(0).max(10_000).default(0) });

/** /api/checkout */
export function checkoutRouter(deps: AppDeps): Router {
  const r = Router();
  r.use((req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    // guests build a cart freely, and sign in (or sign up) to pay; the cart waits for them
    if (!req.user) throw unauthorized('Sign in or create an account to check out. Your cart will wait for you.');
    next();
  });
  r.post('/', async (req, res) => {
    const user = currentUser(req);
    res.status(201).json(await openCheckout(deps, cartOfRequest(deps, req, res, { create: false }), user));
  });
  r.get('/latest', async (req, res) => {
    res.json({ checkout: await latestCheckout(deps, currentUser(req)) });
  });
  r.get('/:sessionId/status', validate({ params: checkoutStatusParams, query: statusQuery }), async (req, res) => {
    const { wait } = res.locals.query as z.infer<typeof statusQuery>;
    res.json(await checkoutStatus(deps, currentUser(req), String(req.params.sessionId), wait));
  });
  return r;
}
