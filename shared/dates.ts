/**
 * The one way dates are shown, everywhere: "Dec 2, 2026", and with the time "Dec 2, 2026, 4:31 PM".
 * A calendar day ("2026-12-02": ship-by dates, days off, report days) is a day, not an instant, so it
 * is shown as that same day wherever the viewer is; an instant (a timestamp in ms, or an ISO date-time)
 * is shown in the viewer's own time zone. One fixed locale, so the server and the browser agree.
 */
const LOCALE = 'en-US';
const DAY_FORMAT = new Intl.DateTimeFormat(LOCALE, { year: 'numeric', month: 'short', day: 'numeric', timeZone: 'UTC' });
const DATE_FORMAT = new Intl.DateTimeFormat(LOCALE, { year: 'numeric', month: 'short', day: 'numeric' });
const DATE_TIME_FORMAT = new Intl.DateTimeFormat(LOCALE, { year: 'numeric', month: 'short', day: 'numeric', hour: 'numeric', minute: '2-digit' });

const CALENDAR_DAY = /^(\d{4})-(\d{2})-(\d{2})$/;

/** "Dec 2, 2026" for a calendar day ("2026-12-02") or an instant (ms since 1970, or an ISO date-time). */
export function formatDate(value: number | string): string {
  if (typeof value === 'string') {
    const day = CALENDAR_DAY.exec(value);
    if (day) return DAY_FORMAT.format(new Date(Date.UTC(Number(day[1]), Number(day[2]) - 1, Number(day[3]))));
    const ms = Date.parse(value);
    return Number.isNaN(ms) ? value : DATE_FORMAT.format(new Date(ms));
  }
  return DATE_FORMAT.format(new Date(value));
}

/** "Dec 2, 2026, 4:31 PM" for an instant (ms since 1970, or an ISO date-time). */
export function formatDateTime(value: number | string): string {
  const ms = typeof value === 'string' ? Date.parse(value) : value;
  return Number.isNaN(ms) ? String(value) : DATE_TIME_FORMAT.format(new Date(ms));
}
