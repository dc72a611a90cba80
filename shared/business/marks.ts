/**
 * The workroom's ship-by marks on a line: `due_today`, `at_risk` (not yet cut with one working day
 * left) and `late`. Pure; "today" is passed in as a calendar date in the shop's time zone.
 */

import { isFinishedLine, UNCUT_LINE_STATES } from '../schemas/order.ts';
import { parseDay, type WorkCalendar, workingDaysBetween } from './working-days.ts';

export const SHIP_MARKS = ['late', 'due_today', 'at_risk'] as const;
export type ShipMark = (typeof SHIP_MARKS)[number];
export const SHIP_MARK_LABELS: Record<ShipMark, string> = { late: 'late', due_today: 'due today', at_risk: 'at risk' };

export function shipMark(args: { state: string; shipBy: string | null; today: string; calendar: WorkCalendar }): ShipMark | null {
  const { state, shipBy, today, calendar } = args;
  if (!shipBy || isFinishedLine(state)) return null;
  if (parseDay(today) > parseDay(shipBy)) return 'late';
  if (today === shipBy) return 'due_today';
  if ((UNCUT_LINE_STATES as readonly string[]).includes(state) && workingDaysBetween(today, shipBy, calendar) <= 1) return 'at_risk';
  return null;
}

/** Sort key for the queue: late first, then due today, at risk, then the rest by ship-by date. */
export function compareByShipBy(a: { shipBy: string | null; mark: ShipMark | null }, b: { shipBy: string | null; mark: ShipMark | null }): number {
  const rank = (m: ShipMark | null) => (m ? SHIP_MARKS.indexOf(m) : SHIP_MARKS.length);
  return rank(a.mark) - rank(b.mark) || (a.shipBy ?? '9999-12-31').localeCompare(b.shipBy ?? '9999-12-31');
}
