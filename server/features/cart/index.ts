// Public module of the cart feature: its routes; the cart as checkout reads it (the request's cart,
// its priced view, a new version); adding a line and finding a user's cart (the demo seed); and the
// listing → engine → line snapshot mapping, which the workroom's proof edits and the business price
// check reuse so every path prices and composes an item the same way.

export type { CartRow } from './cart.repo.ts';
export { cartRouter } from './cart.routes.ts';
export { addLine, cartView, newCartVersion, resolveCart } from './cart.service.ts';
export { cartOfRequest } from './cart-cookie.ts';
export { buildSnapshot, buildSnapshotOffThread, readLiveContent, snapshotLookups } from './design.ts';
