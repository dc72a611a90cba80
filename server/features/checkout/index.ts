// Public module of the checkout feature: its routes, opening a checkout (the demo seed pays its
// purchases the way a shopper does), and the transfer group a payment's payouts are filed under.
export { checkoutRouter } from './checkout.routes.ts';
export { openCheckout, transferGroupOf } from './checkout.service.ts';
