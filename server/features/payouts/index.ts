// Public module of the payouts feature: what each shop is paid for an order, brought up to date after
// a payment (payments) or a refund (refunds).
export { type PayoutDeps, PayoutError, settleOrder } from './payouts.service.ts';
