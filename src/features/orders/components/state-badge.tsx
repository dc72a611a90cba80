import { LINE_STATE_LABELS, type LineState } from '../../../../shared/schemas/order.ts';

const tone: Record<LineState, string> = {
  awaiting_proof: 'bg-marigold-wash text-ink',
  changes_requested: 'bg-danger-wash text-danger',
  approved: 'bg-thread-wash text-thread-deep',
  cut: 'bg-thread-wash text-thread-deep',
  pressed: 'bg-thread-wash text-thread-deep',
  shipped: 'bg-thread text-white',
  cancelled: 'bg-paper-deep text-ink-soft',
  refunded: 'bg-paper-deep text-ink-soft',
};

export function StateBadge({ state }: { state: LineState }) {
  return <span className={`inline-flex rounded-full px-2.5 py-0.5 text-sm font-bold ${tone[state]}`}>{LINE_STATE_LABELS[state]}</span>;
}
