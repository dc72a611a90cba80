// Payouts moved to their own feature (server/features/payouts). This forwarder stays only until
// refunds.service.ts imports settleOrder from server/features/payouts/index.ts; then delete it.
export { settleOrder } from '../payouts/index.ts';
