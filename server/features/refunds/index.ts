// Public module of the refunds feature: the refund routes, and the recording of a refund the
// provider made (payments' charge.refunded webhook).
export { refundsRouter } from './refunds.routes.ts';
export { recordProviderRefund } from './refunds.service.ts';
