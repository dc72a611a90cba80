/**
 * "Needed by" dates: can a shop get a parcel to the shopper by a date, and how urgent is an order
 * whose shopper named one. Pure, on 'yyyy-MM-dd' calendar dates (working-days.ts does the counting).
 *
 * Two calendars take part:
 *  - the shop's own (its working weekdays and days off) for the processing days, exactly as the
 *    order's ship-by date is computed;
 *  - the post's for the shop's shipping estimate: Monday to Friday, less the shop's days off (they
 *    are mostly public holidays, when parcels do not move either). Counting those as transit days
 *    would promise dates the shop cannot keep, so the estimate errs on the late side.
 */

import { addDays } from 'date-fns';
import { isFinishedLine } from '../schemas/order.ts';
import { addWorkingDays, formatDay, isWorkingDay, parseDay, type WorkCalendar, workingDaysBetween } from './working-days.ts';

/** Monday to Friday: the weekdays parcels travel. */
export const POST_WEEK: readonly number[] = [1, 2, 3, 4, 5];

export const postCalendar = (shop: WorkCalendar): WorkCalendar => ({ workingDays: POST_WEEK, daysOff: shop.daysOff });

export type DeliveryPlan = { processingDays: number; shippingDays: number; calendar: WorkCalendar };

/** Ordered (paid) on `today`: the ship-by date and the day the parcel should arrive. */
export function earliestArrival(today: string, plan: DeliveryPlan): { shipBy: string; arrival: string } {
  const shipBy = addWorkingDays(today, Math.max(0, plan.processingDays), plan.calendar);
  return { shipBy, arrival: addWorkingDays(shipBy, Math.max(0, plan.shippingDays), postCalendar(plan.calendar)) };
}

/** The last day on or before `day` that is a working day of `cal` (scans at most a year and a half back). */
export function lastWorkingDayOnOrBefore(day: string, cal: WorkCalendar): string {
  let d = parseDay(day);
  for (let i = 0; i < 550; i++) {
    const s = formatDay(d);
    if (isWorkingDay(s, cal)) return s;
    d = addDays(d, -1);
  }
  throw new Error('No working day found within 18 months.');
}

/**
 * The last day the shop can post the parcel and still have it arrive by `neededBy`: the latest of
 * its own working days from which `shippingDays` post days end on or before `neededBy`.
 */
export function latestShipDay(neededBy: string, plan: Pick<DeliveryPlan, 'shippingDays' | 'calendar'>): string {
  const post = postCalendar(plan.calendar);
  const n = Math.max(0, plan.shippingDays);
  // walk back over n post days: the parcel must be handed over before the first of them
  let d = parseDay(neededBy);
  if (n > 0) {
    let last = lastWorkingDayOnOrBefore(neededBy, post);
    for (let k = 1; k < n; k++) last = lastWorkingDayOnOrBefore(formatDay(addDays(parseDay(last), -1)), post);
    d = addDays(parseDay(last), -1);
  }
  return lastWorkingDayOnOrBefore(formatDay(d), plan.calendar);
}

export type NeededByVerdict = { neededBy: string; shipBy: string; arrival: string; latestShip: string; canMake: boolean };

/** Whether an order paid `today` can arrive by `neededBy`. */
export function neededByVerdict(today: string, neededBy: string, plan: DeliveryPlan): NeededByVerdict {
  const { shipBy, arrival } = earliestArrival(today, plan);
  return { neededBy, shipBy, arrival, latestShip: latestShipDay(neededBy, plan), canMake: arrival <= neededBy };
}

export const NEED_MARKS = ['will_miss', 'at_risk'] as const;
export type NeedMark = (typeof NEED_MARKS)[number];
export const NEED_MARK_LABELS: Record<NeedMark, string> = { will_miss: 'needed-by will be missed', at_risk: 'needed-by at risk' };

/**
 * The workroom's mark for an open line whose order has a needed-by date: `will_miss` when the last
 * day to post it has passed; `at_risk` when the shop's usual ship-by date is later than that day, or
 * at most one working day is left before it. Also the date the order must really ship by (the
 * earlier of the two), which the workroom sorts on with every other ship-by date.
 */
export function needMark(args: { state: string; shipBy: string; neededBy: string | null; today: string; shippingDays: number; calendar: WorkCalendar }): {
  mark: NeedMark | null;
  shipBy: string;
} {
  const { state, shipBy, neededBy, today, calendar } = args;
  if (!neededBy || isFinishedLine(state)) return { mark: null, shipBy };
  const latest = latestShipDay(neededBy, { shippingDays: args.shippingDays, calendar });
  const effective = latest < shipBy ? latest : shipBy;
  if (today > latest) return { mark: 'will_miss', shipBy: effective };
  if (latest < shipBy || workingDaysBetween(today, latest, calendar) <= 1) return { mark: 'at_risk', shipBy: effective };
  return { mark: null, shipBy: effective };
}
