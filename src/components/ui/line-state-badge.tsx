import { LINE_STATE_LABELS, type LineState } from '../../../shared/schemas/order.ts';
import { Badge, type BadgeTone } from './form-controls.tsx';

/**
 * One colour per line state, wherever a line's state is shown (shopper orders, the workroom queue,
 * order and proof pages). The words say the state too, so colour is never the only signal.
 */
export const LINE_STATE_TONES: Record<LineState, BadgeTone> = {
  awaiting_proof: 'marigold',
  changes_requested: 'danger',
  approved: 'thread',
  planned: 'neutral',
  cut: 'neutral',
  pressed: 'ink',
  shipped: 'done',
  cancelled: 'muted',
  refunded: 'muted',
};

/** The workroom's short state words, as sellers read them ("awaiting proof", "cut"). */
export const lineStateWords = (s: LineState | string) => s.replace(/_/g, ' ');

/**
 * A line's state as a badge. `words="shopper"` uses the sentences shoppers see ("Vinyl cut"),
 * `words="workroom"` the short state words of the workroom.
 */
export function LineStateBadge({ state, words = 'shopper' }: { state: LineState | string; words?: 'shopper' | 'workroom' }) {
  const known = state in LINE_STATE_TONES ? (state as LineState) : null;
  const text = words === 'shopper' && known ? LINE_STATE_LABELS[known] : lineStateWords(state);
  return <Badge tone={known ? LINE_STATE_TONES[known] : 'muted'}>{text}</Badge>;
}
