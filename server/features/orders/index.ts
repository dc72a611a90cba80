// Public module of the orders feature: the shopper's order routes; the order-line state machine
// (the only way any feature moves a line); and what payments, payouts and refunds use to make orders
// from a paid checkout, read and show them, and mail about them.

export { assertEachCanMove, assertMove, type LineMove, recordFirstState, transition, transitionAll } from './line-state.ts';
export { type OrderParty, orderParty } from './order-access.ts';
export { confirmationMail, type MailOrder, newOrderMail, refundMail } from './order-mails.ts';
export { orderDetail } from './order-view.ts';
export { type OrderLineRow, type OrderRow, ordersRepo } from './orders.repo.ts';
export { ordersRouter } from './orders.routes.ts';
export { createOrdersForCheckout } from './orders.service.ts';
