import { SHIP_MARK_LABELS, type ShipMark } from '../../../shared/business/marks.ts';
import { NEED_MARK_LABELS, type NeedMark } from '../../../shared/business/needed-by.ts';
import { Badge } from './form-controls.tsx';

const TONES = { late: 'danger', due_today: 'marigold', at_risk: 'marigold' } as const;

/** `late`, `due today` or `at risk` as a badge (words, not colour alone). Usable in the workroom queue. */
export function ShipMarkBadge({ mark }: { mark: ShipMark | null }) {
  if (!mark) return null;
  return <Badge tone={TONES[mark]}>{SHIP_MARK_LABELS[mark]}</Badge>;
}

const NEED_TONES = { will_miss: 'danger', at_risk: 'marigold' } as const;

/** A needed-by mark (shared/business/needed-by.ts) with the shopper's date, as a badge. */
export function NeedMarkBadge({ mark, neededBy }: { mark: NeedMark | null | undefined; neededBy: string | null | undefined }) {
  if (!neededBy) return null;
  if (!mark) return <Badge tone="muted">needed by {neededBy}</Badge>;
  return <Badge tone={NEED_TONES[mark]}>{`${NEED_MARK_LABELS[mark]}: ${neededBy}`}</Badge>;
}
