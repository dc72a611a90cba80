// Public module of the payouts feature: what each shop is paid for an order, brought up to date after
// a payment (payments) or a refund (refunds).
export { settleOrder, PayoutError, type PayoutDeps } from './payouts.service.ts';
