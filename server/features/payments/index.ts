// The payments feature's public face: what other features may use of it. Anything not exported
// here stays inside server/features/payments.
export { settleOrder } from './payouts.service.ts';
