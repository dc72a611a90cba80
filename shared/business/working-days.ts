/**
 * Working-day arithmetic for ship-by dates and the workroom's marks. Pure: calendar dates travel as
 * 'yyyy-MM-dd' strings; inside, date-fns works on local-midnight Dates, which keeps the arithmetic
 * free of the process's time zone (addDays moves by calendar days, not by 24 h, across DST).
 * A timestamp becomes a calendar date in the shop's time zone through Intl (browser and Node alike).
 */
import { addDays, differenceInCalendarDays, format, getISODay, isValid, parse } from 'date-fns';

export type WorkCalendar = {
  /** ISO weekdays the shop works: 1 = Monday … 7 = Sunday */
  workingDays: readonly number[];
  /** single dates off ('yyyy-MM-dd'), e.g. holidays */
  daysOff: readonly string[];
};

const DAY_RE = /^\d{4}-\d{2}-\d{2}$/;

/** Parses a 'yyyy-MM-dd' calendar date strictly (2026-02-30 is refused). */
export function parseDay(day: string): Date {
  const d = DAY_RE.test(day) ? parse(day, 'yyyy-MM-dd', new Date(2000, 0, 1)) : new Date(Number.NaN);
  if (!isValid(d) || format(d, 'yyyy-MM-dd') !== day) throw new Error(`Not a calendar date: ${day}`);
  return d;
}

export const formatDay = (d: Date): string => format(d, 'yyyy-MM-dd');

export function isValidDay(day: string): boolean {
  try {
    parseDay(day);
    return true;
  } catch {
    return false;
  }
}

/** ISO weekday (1 = Monday … 7 = Sunday) of a calendar date. */
export const isoWeekday = (day: string): number => getISODay(parseDay(day));

export function isWorkingDay(day: string, cal: WorkCalendar): boolean {
  return cal.workingDays.includes(isoWeekday(day)) && !cal.daysOff.includes(day);
}

/** The calendar date of a moment in a time zone (IANA name, e.g. 'Europe/London'; default UTC). */
export function dayInZone(ms: number, timeZone = 'UTC'): string {
  const parts = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).formatToParts(new Date(ms));
  const get = (t: string) => parts.find((p) => p.type === t)!.value;
  return `${get('year')}-${get('month')}-${get('day')}`;
}

/** The hour (0–23) of a moment in a time zone. */
export function hourInZone(ms: number, timeZone = 'UTC'): number {
  const h = new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', hourCycle: 'h23' }).formatToParts(new Date(ms)).find((p) => p.type === 'hour')!.value;
  return Number(h);
}

// a shop that works no day at all would loop forever; a year and a half is far beyond any real order
const MAX_SCAN_DAYS = 550;

/**
 * The date `n` working days after `day` (the day itself does not count: an order paid on Friday
 * starts being worked on the next working day). n = 0 gives `day` itself.
 */
export function addWorkingDays(day: string, n: number, cal: WorkCalendar): string {
  if (!Number.isInteger(n) || n < 0) throw new Error('n must be a whole number of days, 0 or more');
  if (!cal.workingDays.some((d) => d >= 1 && d <= 7)) throw new Error('The shop must work on at least one weekday.');
  let d = parseDay(day);
  let left = n;
  for (let i = 0; left > 0; i++) {
    if (i > MAX_SCAN_DAYS) throw new Error('Too many days off: no working day found within 18 months.');
    d = addDays(d, 1);
    if (isWorkingDay(formatDay(d), cal)) left--;
  }
  return formatDay(d);
}

/**
 * Working days from `from` (exclusive) up to `to` (inclusive): how many working days are left
 * before a ship-by date. 0 when `to` is `from`; negative (minus the working days between) when `to`
 * is already past.
 */
export function workingDaysBetween(from: string, to: string, cal: WorkCalendar): number {
  const a = parseDay(from);
  const b = parseDay(to);
  const span = differenceInCalendarDays(b, a);
  if (span === 0) return 0;
  const sign = span > 0 ? 1 : -1;
  let count = 0;
  for (let i = 1; i <= Math.abs(span); i++) {
    // counting backwards, the working day being left behind is the later one of each pair
    const day = formatDay(addDays(a, sign > 0 ? i : -(i - 1)));
    if (isWorkingDay(day, cal)) count++;
  }
  return sign * count;
}

/** The ship-by date of an order paid at `paidAtMs`: the shop's processing days in working days. */
export function shipByDate(paidAtMs: number, processingDays: number, cal: WorkCalendar, timeZone = 'UTC'): string {
  return addWorkingDays(dayInZone(paidAtMs, timeZone), Math.max(0, Math.round(processingDays)), cal);
}

/** A shop's calendar from its stored columns: Monday to Friday when it has named no working day. */
export const calendarOfShop = (s: { workingDays: readonly number[] | null; daysOff: readonly string[] | null }): WorkCalendar => ({
  workingDays: s.workingDays?.length ? s.workingDays : [1, 2, 3, 4, 5],
  daysOff: s.daysOff ?? [],
});
