import { SHIP_MARK_LABELS, type ShipMark } from '../../../shared/business/marks.ts';
import { Badge } from './form-controls.tsx';

const TONES = { late: 'danger', due_today: 'marigold', at_risk: 'marigold' } as const;

/** `late`, `due today` or `at risk` as a badge (words, not colour alone). Usable in the workroom queue. */
export function ShipMarkBadge({ mark }: { mark: ShipMark | null }) {
  if (!mark) return null;
  return <Badge tone={TONES[mark]}>{SHIP_MARK_LABELS[mark]}</Badge>;
}
