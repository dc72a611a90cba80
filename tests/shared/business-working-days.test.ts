// Working-day arithmetic (shared/business/working-days.ts) and the ship-by marks.
// References: date-fns's own addBusinessDays / differenceInBusinessDays (Sat + Sun off) for
// hand-picked and swept dates, and the printed month of December 2026 below.

import { addBusinessDays, differenceInBusinessDays, format, parseISO } from 'date-fns';
import { describe, expect, test } from 'vitest';
import { compareByShipBy, shipMark } from '../../shared/business/marks.ts';
import { addWorkingDays, dayInZone, isoWeekday, shipByDate, type WorkCalendar, workingDaysBetween } from '../../shared/business/working-days.ts';

const MON_FRI: WorkCalendar = { workingDays: [1, 2, 3, 4, 5], daysOff: [] };

// December 2026 as printed in any 2026 wall calendar (weeks starting Monday). Anchor: 1 January
// 2026 is a Thursday (ISO 8601 week 2026-W01 runs Mon 29 Dec 2025 – Sun 4 Jan 2026), and
// 1 December 2026 is a Tuesday.
const DECEMBER_2026 = `
Mo Tu We Th Fr Sa Su
    1  2  3  4  5  6
 7  8  9 10 11 12 13
14 15 16 17 18 19 20
21 22 23 24 25 26 27
28 29 30 31`;

function printedWeekdays(grid: string): Map<number, number> {
  const out = new Map<number, number>();
  for (const row of grid.split('\n').slice(2)) {
    for (let col = 0; col < 7; col++) {
      const cell = row.slice(col * 3, col * 3 + 2).trim();
      if (cell) out.set(Number(cell), col + 1);
    }
  }
  return out;
}

describe('the calendar itself', () => {
  test('when reading the anchor dates, then 2026-01-01 is a Thursday and 2026-12-01 a Tuesday', () => {
    expect(isoWeekday('2026-01-01')).toBe(4);
    expect(isoWeekday('2026-12-01')).toBe(2);
  });

  test('when every day of December 2026 is checked against the printed month, then each weekday matches', () => {
    const printed = printedWeekdays(DECEMBER_2026);
    expect(printed.size).toBe(31);
    for (const [d, weekday] of printed) expect(isoWeekday(`2026-12-${String(d).padStart(2, '0')}`)).toBe(weekday);
  });

  test('when a date does not exist, then it is refused', () => {
    expect(() => addWorkingDays('2026-02-29', 1, MON_FRI)).toThrow(/calendar date/);
    expect(() => addWorkingDays('2026-13-01', 1, MON_FRI)).toThrow(/calendar date/);
  });
});

describe('adding working days', () => {
  test('when the shop works Monday to Friday (Sat + Sun off), then the result equals date-fns addBusinessDays for every start day of 2026 and 1–12 days', () => {
    for (let start = parseISO('2026-01-01'); start.getFullYear() === 2026; start = new Date(start.getFullYear(), start.getMonth(), start.getDate() + 1)) {
      const day = format(start, 'yyyy-MM-dd');
      // date-fns counts from a weekend start as if it were the Friday before; our start day never counts, so compare from weekdays only
      if ([6, 7].includes(isoWeekday(day))) continue;
      for (const n of [1, 2, 3, 5, 12]) expect(addWorkingDays(day, n, MON_FRI), `${day} + ${n}`).toBe(format(addBusinessDays(start, n), 'yyyy-MM-dd'));
    }
  });

  test('when counting working days between weekdays, then the count equals date-fns differenceInBusinessDays', () => {
    const pairs: Array<[string, string]> = [
      ['2026-12-04', '2026-12-09'],
      ['2026-12-01', '2026-12-31'],
      ['2026-11-27', '2026-12-02'],
      ['2026-02-27', '2026-03-02'],
      ['2026-12-09', '2026-12-04'],
    ];
    for (const [a, b] of pairs) expect(workingDaysBetween(a, b, MON_FRI), `${a} → ${b}`).toBe(differenceInBusinessDays(parseISO(b), parseISO(a)));
  });

  test('when days off fall inside the span, then they are skipped (December 2026 holidays)', () => {
    const cal: WorkCalendar = { workingDays: [1, 2, 3, 4, 5], daysOff: ['2026-12-24', '2026-12-25'] };
    // Tue 22 Dec + 3: Wed 23 (1), Thu 24 off, Fri 25 off, Mon 28 (2), Tue 29 (3)
    expect(addWorkingDays('2026-12-22', 3, cal)).toBe('2026-12-29');
    expect(addWorkingDays('2026-12-22', 3, MON_FRI)).toBe('2026-12-25');
  });

  test('when the span crosses a month and year end, then the count carries on into January', () => {
    // Wed 30 Dec 2026 + 3: Thu 31 (1), Fri 1 Jan 2027 (2), Mon 4 Jan (3); with 1 Jan off → Tue 5 Jan
    expect(addWorkingDays('2026-12-30', 3, MON_FRI)).toBe('2027-01-04');
    expect(addWorkingDays('2026-12-30', 3, { workingDays: [1, 2, 3, 4, 5], daysOff: ['2027-01-01'] })).toBe('2027-01-05');
    // end of February in a common year: Fri 27 Feb 2026 + 1 → Mon 2 Mar
    expect(addWorkingDays('2026-02-27', 1, MON_FRI)).toBe('2026-03-02');
  });

  test('when the shop works other weekdays (Tue–Sat), then Sunday and Monday are skipped', () => {
    const cal: WorkCalendar = { workingDays: [2, 3, 4, 5, 6], daysOff: [] };
    // Fri 4 Dec + 2: Sat 5 (1), Tue 8 (2)
    expect(addWorkingDays('2026-12-04', 2, cal)).toBe('2026-12-08');
  });

  test('when the shop works no day at all, then it is refused rather than looping', () => {
    expect(() => addWorkingDays('2026-12-04', 1, { workingDays: [], daysOff: [] })).toThrow(/at least one weekday/);
  });
});

describe('ship-by date and marks (Must show)', () => {
  const paidFriday16 = Date.UTC(2026, 11, 4, 16, 0); // Fri 4 Dec 2026, 16:00 UTC

  test('when a Sat+Sun-off shop with 3 processing days is paid Friday 16:00, then it ships by Wednesday', () => {
    const d = shipByDate(paidFriday16, 3, MON_FRI, 'UTC');
    expect(d).toBe('2026-12-09');
    expect(isoWeekday(d)).toBe(3);
  });

  test('when that line is not cut on Tuesday, then it is at risk; cut, it is not; Wednesday due today; Thursday late', () => {
    const shipBy = shipByDate(paidFriday16, 3, MON_FRI);
    const mark = (state: string, today: string) => shipMark({ state, shipBy, today, calendar: MON_FRI });
    expect(mark('approved', '2026-12-07')).toBeNull(); // Monday: two working days left
    expect(mark('approved', '2026-12-08')).toBe('at_risk');
    expect(mark('awaiting_proof', '2026-12-08')).toBe('at_risk');
    expect(mark('cut', '2026-12-08')).toBeNull();
    expect(mark('pressed', '2026-12-09')).toBe('due_today');
    expect(mark('cut', '2026-12-10')).toBe('late');
    expect(mark('shipped', '2026-12-10')).toBeNull();
  });

  test('when the weekend sits between today and the ship-by date, then Friday before a Monday ship-by is at risk', () => {
    // ship by Mon 14 Dec; on Fri 11 Dec one working day (Monday) is left
    expect(shipMark({ state: 'approved', shipBy: '2026-12-14', today: '2026-12-11', calendar: MON_FRI })).toBe('at_risk');
  });

  test('when the shop is in New York, then a payment at 23:30 local on Thursday counts as Thursday, not as the UTC Friday', () => {
    const at = Date.UTC(2026, 11, 4, 4, 30); // 23:30 EST on Thu 3 Dec (UTC-5)
    expect(dayInZone(at, 'UTC')).toBe('2026-12-04');
    expect(dayInZone(at, 'America/New_York')).toBe('2026-12-03');
    // Thu + 3 working days: Fri 4, Mon 7, Tue 8; counted from the UTC Friday it would be Wed 9
    expect(shipByDate(at, 3, MON_FRI, 'America/New_York')).toBe('2026-12-08');
    expect(shipByDate(at, 3, MON_FRI, 'UTC')).toBe('2026-12-09');
  });

  test('when sorting the queue, then late comes first, then due today, at risk, then by date', () => {
    const rows = [
      { id: 'a', shipBy: '2026-12-20', mark: null },
      { id: 'b', shipBy: '2026-12-09', mark: 'at_risk' as const },
      { id: 'c', shipBy: '2026-12-01', mark: 'late' as const },
      { id: 'd', shipBy: '2026-12-08', mark: 'due_today' as const },
      { id: 'e', shipBy: '2026-12-15', mark: null },
    ];
    expect([...rows].sort(compareByShipBy).map((r) => r.id)).toEqual(['c', 'd', 'b', 'e', 'a']);
  });
});
