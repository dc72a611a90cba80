// Public module of the orders feature: the shopper's order routes; the order-line state machine
// (the only way any feature moves a line); and what payments, payouts and refunds use to make orders
// from a paid checkout, read and show them, and mail about them.
export { ordersRouter } from './orders.routes.ts';
export { createOrdersForCheckout } from './orders.service.ts';
export { assertEachCanMove, assertMove, recordFirstState, transition, transitionAll, type LineMove } from './line-state.ts';
export { ordersRepo, type OrderLineRow, type OrderRow } from './orders.repo.ts';
export { orderDetail } from './order-view.ts';
export { confirmationMail, newOrderMail, refundMail, type MailOrder } from './order-mails.ts';
