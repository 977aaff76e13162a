import { describe, expect, it } from 'vitest';
import { carrierHolidayOn, federalHolidays } from './carrier-holidays';

// Check values: the observed dates OPM publishes for federal employees (OPM, "Federal Holidays",
// 2026 and 2027 lists, from memory), which follow 5 U.S.C. 6103 (the eleven holidays and their
// rules) and Executive Order 11582 (Saturday → the Friday before, Sunday → the Monday after).
// Weekdays worked by hand from a calendar: 1 Jan 2026 is a Thursday, 1 Jan 2027 a Friday.

describe('US federal holidays as observed', () => {
  it('gives the 2026 dates, with Independence Day (Sat 4 Jul) observed Fri 3 Jul', () => {
    expect(federalHolidays(2026).map((holiday) => [holiday.name, holiday.observed])).toEqual([
      ["New Year's Day", '2026-01-01'], // Thu
      ['Martin Luther King Jr. Day', '2026-01-19'], // Mondays 5, 12, 19: the third
      ["Washington's Birthday", '2026-02-16'], // Feb starts on a Sunday: Mondays 2, 9, 16
      ['Memorial Day', '2026-05-25'], // 31 May is a Sunday: the last Monday is the 25th
      ['Juneteenth', '2026-06-19'], // Fri
      ['Independence Day', '2026-07-03'], // Sat 4 Jul → Fri 3 Jul
      ['Labor Day', '2026-09-07'], // 1 Sep is a Tuesday: first Monday the 7th
      ['Columbus Day', '2026-10-12'], // 1 Oct is a Thursday: Mondays 5, 12
      ['Veterans Day', '2026-11-11'], // Wed
      ['Thanksgiving Day', '2026-11-26'], // 1 Nov is a Sunday: Thursdays 5, 12, 19, 26
      ['Christmas Day', '2026-12-25'], // Fri
    ]);
    expect(federalHolidays(2026).find((holiday) => holiday.name === 'Independence Day')?.date).toBe('2026-07-04');
  });

  it('gives the 2027 dates, with Juneteenth, Independence Day and Christmas moved off the weekend', () => {
    expect(federalHolidays(2027).map((holiday) => [holiday.name, holiday.observed])).toEqual([
      ["New Year's Day", '2027-01-01'], // Fri
      ['Martin Luther King Jr. Day', '2027-01-18'], // Mondays 4, 11, 18
      ["Washington's Birthday", '2027-02-15'], // 1 Feb is a Monday: 1, 8, 15
      ['Memorial Day', '2027-05-31'], // 31 May is a Monday
      ['Juneteenth', '2027-06-18'], // Sat 19 Jun → Fri 18 Jun
      ['Independence Day', '2027-07-05'], // Sun 4 Jul → Mon 5 Jul
      ['Labor Day', '2027-09-06'], // 1 Sep is a Wednesday: Monday the 6th
      ['Columbus Day', '2027-10-11'], // 1 Oct is a Friday: Mondays 4, 11
      ['Veterans Day', '2027-11-11'], // Thu
      ['Thanksgiving Day', '2027-11-25'], // 1 Nov is a Monday: Thursdays 4, 11, 18, 25
      ['Christmas Day', '2027-12-24'], // Sat 25 Dec → Fri 24 Dec
    ]);
  });

  it("observes New Year's Day 2028 (a Saturday) on Fri 31 Dec 2027", () => {
    expect(carrierHolidayOn('2027-12-31')?.name).toBe("New Year's Day");
    expect(carrierHolidayOn('2028-01-01')).toBeNull();
    expect(federalHolidays(2028)[0]).toEqual({ name: "New Year's Day", date: '2028-01-01', observed: '2027-12-31' });
  });

  it('names the holiday observed on a day and nothing on other days', () => {
    expect(carrierHolidayOn('2026-12-25')?.name).toBe('Christmas Day');
    expect(carrierHolidayOn('2026-07-03')?.name).toBe('Independence Day');
    // The statutory day itself is not the day off when it falls on a weekend.
    expect(carrierHolidayOn('2026-07-04')).toBeNull();
    expect(carrierHolidayOn('2026-12-24')).toBeNull();
    expect(carrierHolidayOn('2027-06-19')).toBeNull();
  });
});
