import { useMemo } from 'react';
import { SHIP_MARKS } from '../../../../shared/business/marks.ts';
import type { DueLine } from '../../../../shared/schemas/business.ts';
import { useDue } from '../api/get-due.ts';
import { ShipMarkBadge } from './ship-mark-badge.tsx';

export type ShipByLookup = { get(lineId: string): DueLine | undefined; sortKey(lineId: string): string };

/**
 * Ship-by dates and marks for the workroom's queue, keyed by line id. `sortKey` orders late, due
 * today, at risk, then the rest by ship-by date; finished lines (not in the due list) come last.
 */
export function useShipByLookup(): ShipByLookup {
  const due = useDue();
  return useMemo(() => {
    const by = new Map((due.data?.lines ?? []).map((l) => [l.lineId, l]));
    return {
      get: (id) => by.get(id),
      sortKey: (id) => {
        const l = by.get(id);
        if (!l) return '9|9999-12-31';
        return `${l.mark ? SHIP_MARKS.indexOf(l.mark) : SHIP_MARKS.length}|${l.shipBy ?? '9999-12-31'}`;
      },
    };
  }, [due.data]);
}

export function ShipByCell({ info }: { info: DueLine | undefined }) {
  if (!info?.shipBy) return <span className="text-ink-soft">—</span>;
  return (
    <span className="flex flex-col items-start gap-1">
      <span className="font-semibold whitespace-nowrap tabular-nums">{info.shipBy}</span>
      <ShipMarkBadge mark={info.mark} />
    </span>
  );
}
