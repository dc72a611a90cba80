// The orders feature's public face: what other features may use of it. Anything not exported here
// stays inside server/features/orders.
export { assertEachCanMove, assertMove, recordFirstState, transition, transitionAll, type LineMove } from './line-state.ts';
export { ordersRepo, type OrderLineRow, type OrderRow } from './orders.repo.ts';
export { orderDetail } from './order-view.ts';
export { refundMail } from './order-mails.ts';
