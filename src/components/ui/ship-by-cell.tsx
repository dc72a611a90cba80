import { formatDate } from '../../../shared/dates.ts';
import type { DueLine } from '../../../shared/schemas/business.ts';
import { NeedMarkBadge, ShipMarkBadge } from './ship-mark-badge.tsx';

/**
 * Ship-by dates and marks keyed by line id (the business feature's useShipByLookup makes one from
 * the due list). `sortKey` orders late, due today, at risk, then the rest by ship-by date; finished
 * lines (not in the due list) come last.
 */
export type ShipByLookup = { get(lineId: string): DueLine | undefined; sortKey(lineId: string): string };

/** A line's ship-by date with its mark, or a dash when it has none. */
export function ShipByCell({ info }: { info: DueLine | undefined }) {
  if (!info?.shipBy) return <span className="text-ink-soft">—</span>;
  return (
    <span className="flex flex-col items-start gap-1">
      <span className="font-semibold whitespace-nowrap tabular-nums">{formatDate(info.shipBy)}</span>
      <ShipMarkBadge mark={info.mark} />
      <NeedMarkBadge mark={info.needMark} neededBy={info.neededBy} />
    </span>
  );
}
