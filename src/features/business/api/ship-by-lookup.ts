import { useMemo } from 'react';
import { SHIP_MARKS } from '../../../../shared/business/marks.ts';
import type { ShipByLookup } from '../../../components/ui/ship-by-cell.tsx';
import { useDue } from './get-due.ts';

/** Ship-by dates and marks of the shop's open lines, for the workroom's queue (see ShipByLookup). */
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
