// Needed-by arithmetic across weekends and days off. Every expected date below was counted by hand
// on a printed calendar of December 2026 – January 2027 (1 December 2026 is a Tuesday, 1 January 2027
// a Friday; checked against Python's datetime.date(...).strftime('%A')), not computed by the code.
import { describe, expect, it } from 'vitest';
import { earliestArrival, latestShipDay, neededByVerdict, needMark } from '../../shared/business/needed-by.ts';
import { addWorkingDays, type WorkCalendar } from '../../shared/business/working-days.ts';

const WEEKDAYS: WorkCalendar = { workingDays: [1, 2, 3, 4, 5], daysOff: [] };

describe('when a shop working Monday to Friday is ordered from on a Thursday', () => {
  const plan = { processingDays: 3, shippingDays: 2, calendar: WEEKDAYS };
  it('then the weekend is skipped in making and in the post', () => {
    // Thu 3 Dec → making Fri 4, Mon 7, Tue 8 → posted Tue 8 → in the post Wed 9, Thu 10
    expect(earliestArrival('2026-12-03', plan)).toEqual({ shipBy: '2026-12-08', arrival: '2026-12-10' });
  });
  it('then it can make Thursday the 10th and not Wednesday the 9th', () => {
    expect(neededByVerdict('2026-12-03', '2026-12-10', plan).canMake).toBe(true);
    expect(neededByVerdict('2026-12-03', '2026-12-09', plan).canMake).toBe(false);
  });
});

describe('when the shop has a day off on the Monday', () => {
  const plan = { processingDays: 3, shippingDays: 2, calendar: { workingDays: [1, 2, 3, 4, 5], daysOff: ['2026-12-07'] } };
  it('then making skips it and the parcel arrives a day later', () => {
    // Thu 3 → Fri 4, (Sat, Sun, Mon 7 off) Tue 8, Wed 9 → posted Wed 9 → Thu 10, Fri 11
    expect(earliestArrival('2026-12-03', plan)).toEqual({ shipBy: '2026-12-09', arrival: '2026-12-11' });
  });
});

describe('when a shop works Tuesday to Saturday', () => {
  it('then it makes on Saturday, but the post does not carry on Saturday', () => {
    const plan = { processingDays: 2, shippingDays: 2, calendar: { workingDays: [2, 3, 4, 5, 6], daysOff: [] } };
    // Fri 4 → Sat 5, (Sun, Mon) Tue 8 → posted Tue 8 → Wed 9, Thu 10
    expect(earliestArrival('2026-12-04', plan)).toEqual({ shipBy: '2026-12-08', arrival: '2026-12-10' });
    // posted Saturday 5 (1 processing day) → the post moves Mon 7, Tue 8
    expect(earliestArrival('2026-12-04', { ...plan, processingDays: 1 })).toEqual({ shipBy: '2026-12-05', arrival: '2026-12-08' });
  });
});

describe('when the holidays fall between order and arrival', () => {
  it('then the days off stop both the making and the post', () => {
    const cal = { workingDays: [1, 2, 3, 4, 5], daysOff: ['2026-12-24', '2026-12-25', '2026-12-31', '2027-01-01'] };
    // Mon 21 → Tue 22, Wed 23, (Thu 24, Fri 25 off, weekend) Mon 28 → post Tue 29, Wed 30, (Thu 31, Fri 1 off, weekend) Mon 4
    expect(earliestArrival('2026-12-21', { processingDays: 3, shippingDays: 3, calendar: cal })).toEqual({ shipBy: '2026-12-28', arrival: '2027-01-04' });
  });
});

describe('the last day to post for a needed-by date', () => {
  it('when the date is a Monday, then two post days lead back over the weekend to Thursday', () => {
    // post days ending on Mon 14: Fri 11, Mon 14 → hand over by Thu 10
    expect(latestShipDay('2026-12-14', { shippingDays: 2, calendar: WEEKDAYS })).toBe('2026-12-10');
  });
  it('when that Thursday is a day off, then it is the Wednesday', () => {
    expect(latestShipDay('2026-12-14', { shippingDays: 2, calendar: { workingDays: [1, 2, 3, 4, 5], daysOff: ['2026-12-10'] } })).toBe('2026-12-09');
  });
  it('when the date is a Sunday and the post takes 1 day, then it is the Thursday (the post delivers Friday)', () => {
    expect(latestShipDay('2026-12-13', { shippingDays: 1, calendar: WEEKDAYS })).toBe('2026-12-10');
  });
  it('then posting on it arrives in time and posting a working day later does not, for every day of a month', () => {
    for (let d = 1; d <= 30; d++) {
      const needed = addWorkingDays('2026-12-01', d, { workingDays: [1, 2, 3, 4, 5, 6, 7], daysOff: [] });
      for (const shippingDays of [0, 1, 2, 5]) {
        const cal = { workingDays: [2, 3, 4, 5, 6], daysOff: ['2026-12-25', '2027-01-01'] };
        const post = { workingDays: [1, 2, 3, 4, 5], daysOff: cal.daysOff };
        const latest = latestShipDay(needed, { shippingDays, calendar: cal });
        expect(addWorkingDays(latest, shippingDays, post) <= needed).toBe(true);
        expect(addWorkingDays(addWorkingDays(latest, 1, cal), shippingDays, post) > needed).toBe(true);
      }
    }
  });
});

describe('the workroom mark of an order with a needed-by date', () => {
  const base = { state: 'approved', shipBy: '2026-12-10', neededBy: '2026-12-11', shippingDays: 2, calendar: WEEKDAYS };
  it('when the shop’s own date is later than the last day to post, then it is at risk and sorted by that earlier day', () => {
    // post days ending Fri 11: Thu 10, Fri 11 → hand over by Wed 9, before the ship-by Thu 10
    expect(needMark({ ...base, today: '2026-12-04' })).toEqual({ mark: 'at_risk', shipBy: '2026-12-09' });
  });
  it('when the last day to post has passed, then the date will be missed', () => {
    expect(needMark({ ...base, today: '2026-12-10' })).toEqual({ mark: 'will_miss', shipBy: '2026-12-09' });
  });
  it('when there is room, then no mark and the shop’s own date stands', () => {
    expect(needMark({ ...base, neededBy: '2026-12-18', today: '2026-12-04' })).toEqual({ mark: null, shipBy: '2026-12-10' });
  });
  it('when a weekend leaves one working day before the last day to post, then it is at risk', () => {
    // needed Wed 16 → post Tue 15, Wed 16 → hand over by Mon 14; on Fri 11 one working day (Mon 14) is left
    expect(needMark({ ...base, shipBy: '2026-12-14', neededBy: '2026-12-16', today: '2026-12-11' }).mark).toBe('at_risk');
    expect(needMark({ ...base, shipBy: '2026-12-14', neededBy: '2026-12-16', today: '2026-12-09' }).mark).toBe(null);
  });
  it('when the line is shipped, then no mark', () => {
    expect(needMark({ ...base, state: 'shipped', today: '2026-12-10' }).mark).toBe(null);
  });
});
