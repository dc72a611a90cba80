// Public module of the payments feature: the provider's webhook, and its handler for the demo seed,
// which pays its purchases the way a shopper does.
export { paymentsWebhookRouter } from './payments.routes.ts';
export { handleEvent, skipOrderMails } from './payments.service.ts';
