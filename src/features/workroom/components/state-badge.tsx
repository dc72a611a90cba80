import type { LineState } from '../../../../shared/schemas/order.ts';
import { stateWords } from './format.ts';

const tones: Record<string, string> = {
  awaiting_proof: 'border-marigold bg-marigold-wash text-ink',
  changes_requested: 'border-danger bg-danger-wash text-danger',
  approved: 'border-thread bg-thread-wash text-thread-deep',
  cut: 'border-ink-soft bg-white text-ink',
  pressed: 'border-ink bg-paper-deep text-ink',
  shipped: 'border-thread-deep bg-thread text-white',
};

export function StateBadge({ state }: { state: LineState | string }) {
  return <span className={`inline-block rounded-full border px-2.5 py-0.5 text-sm font-bold whitespace-nowrap ${tones[state] ?? 'border-line bg-white text-ink-soft'}`}>{stateWords(state)}</span>;
}
