import { type Request, type Response, Router } from 'express';
import { addCartLineSchema, cartLineParams, updateCartLineSchema } from '../../../shared/schemas/cart.ts';
// the discount step after line pricing, and the per-shop code and needed-by date (one-way: offers never imports cart)
import { applyCodeSchema, cartShopParams, neededBySchema } from '../../../shared/schemas/offers.ts';
import type { AppDeps } from '../../deps.ts';
import { perAccountLimit } from '../../http/account-rate-limit.ts';
import { validate } from '../../http/validate.ts';
import { removeCartCode, setCartCode, setNeededBy, withOffers } from '../offers/index.ts';
import { type CartRow, cartRepo } from './cart.repo.ts';
import { addLine, cartView, newCartVersion, removeLine, setQuantity } from './cart.service.ts';
import { cartOfRequest } from './cart-cookie.ts';

/** /api/cart — guests and signed-in shoppers alike. */
export function cartRouter(deps: AppDeps): Router {
  const r = Router();
  const priced = (cart: CartRow | null) => withOffers(deps, cartView(deps.db, cart));
  r.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  r.get('/', (req, res) => {
    res.json(priced(cartOfRequest(deps, req, res, { create: false })));
  });
  r.post('/lines', perAccountLimit(deps.rateLimits.cartAddsPerMinute, 'items added to the cart', deps.limitStore('cart-adds')), validate({ body: addCartLineSchema }), async (req, res) => {
    const cart = cartOfRequest(deps, req, res, { create: true })!;
    await addLine(deps, cart, req.body);
    res.status(201).json(priced(cartRepo.find(deps.db, cart.id) ?? null));
  });
  r.patch('/lines/:lineId', validate({ params: cartLineParams, body: updateCartLineSchema }), (req, res) => {
    const cart = cartOfRequest(deps, req, res, { create: false });
    setQuantity(deps, cart, String(req.params.lineId), req.body.quantity);
    res.json(priced(cartRepo.find(deps.db, cart!.id) ?? null));
  });
  r.delete('/lines/:lineId', validate({ params: cartLineParams }), (req, res) => {
    const cart = cartOfRequest(deps, req, res, { create: false });
    removeLine(deps, cart, String(req.params.lineId));
    res.json(priced(cartRepo.find(deps.db, cart!.id) ?? null));
  });
  // a shop's code and needed-by date: each change is a new cart version (a checkout is made per version)
  const onShop = (change: (view: ReturnType<typeof cartView>, shopId: string, body: Record<string, unknown>) => void) => (req: Request, res: Response) => {
    const cart = cartOfRequest(deps, req, res, { create: false });
    change(cartView(deps.db, cart), String(req.params.shopId), req.body);
    res.json(priced(newCartVersion(deps, cart!.id)));
  };
  const codesTried = perAccountLimit(deps.rateLimits.cartAddsPerMinute, 'codes tried', deps.limitStore('cart-codes'));
  r.post(
    '/shops/:shopId/code',
    codesTried,
    validate({ params: cartShopParams, body: applyCodeSchema }),
    onShop((v, shopId, b) => setCartCode(deps, v, shopId, String(b.code))),
  );
  r.delete(
    '/shops/:shopId/code',
    validate({ params: cartShopParams }),
    onShop((v, shopId) => removeCartCode(deps, v, shopId)),
  );
  r.put(
    '/shops/:shopId/needed-by',
    validate({ params: cartShopParams, body: neededBySchema }),
    onShop((v, shopId, b) => setNeededBy(deps, v, shopId, (b.neededBy as string | null) ?? null)),
  );
  return r;
}
