/**
 * Carrier holidays: the US federal holidays of 5 U.S.C. 6103, on the day they are observed
 * (a holiday on a Saturday is observed the Friday before, on a Sunday the Monday after: Executive
 * Order 11582). No parcel ships on one and transit does not count one.
 *
 * A small rule table rather than a holiday package: the rules are eleven lines of law, the client
 * bundle carries this file too, and the packages that fit carry every country's rules or a date
 * library of their own. Inauguration Day (Washington D.C. area only) is left out.
 *
 * - `federalHolidays(year)`: the eleven holidays of a year with their observed dates (New Year's
 *   Day of a year can be observed on 31 December of the year before).
 * - `carrierHolidayOn(date)`: the holiday observed on a day, or null.
 */
import { addDays, weekdayOf, type IsoDate } from './shop-time';
import type { Weekday } from './vocabulary';

export interface CarrierHoliday {
  name: string;
  /** The day the statute names. */
  date: IsoDate;
  /** The day it is observed (and the carriers close). */
  observed: IsoDate;
}

const pad = (n: number) => String(n).padStart(2, '0');
const dayOf = (year: number, month: number, day: number): IsoDate => `${year}-${pad(month)}-${pad(day)}`;
const weekdayIndex: Record<Weekday, number> = { mon: 0, tue: 1, wed: 2, thu: 3, fri: 4, sat: 5, sun: 6 };

/** The `nth` (1-based) given weekday of a month. */
function nthWeekday(year: number, month: number, weekday: Weekday, nth: number): IsoDate {
  const first = dayOf(year, month, 1);
  const toFirst = (weekdayIndex[weekday] - weekdayIndex[weekdayOf(first)] + 7) % 7;
  return addDays(first, toFirst + (nth - 1) * 7);
}

/** The last given weekday of a month. */
function lastWeekday(year: number, month: number, weekday: Weekday): IsoDate {
  const last = addDays(month === 12 ? dayOf(year + 1, 1, 1) : dayOf(year, month + 1, 1), -1);
  return addDays(last, -((weekdayIndex[weekdayOf(last)] - weekdayIndex[weekday] + 7) % 7));
}

function observedOn(date: IsoDate): IsoDate {
  const weekday = weekdayOf(date);
  if (weekday === 'sat') return addDays(date, -1);
  if (weekday === 'sun') return addDays(date, 1);
  return date;
}

const rules: readonly { name: string; date: (year: number) => IsoDate }[] = [
  { name: "New Year's Day", date: (year) => dayOf(year, 1, 1) },
  { name: 'Martin Luther King Jr. Day', date: (year) => nthWeekday(year, 1, 'mon', 3) },
  { name: "Washington's Birthday", date: (year) => nthWeekday(year, 2, 'mon', 3) },
  { name: 'Memorial Day', date: (year) => lastWeekday(year, 5, 'mon') },
  { name: 'Juneteenth', date: (year) => dayOf(year, 6, 19) },
  { name: 'Independence Day', date: (year) => dayOf(year, 7, 4) },
  { name: 'Labor Day', date: (year) => nthWeekday(year, 9, 'mon', 1) },
  { name: 'Columbus Day', date: (year) => nthWeekday(year, 10, 'mon', 2) },
  { name: 'Veterans Day', date: (year) => dayOf(year, 11, 11) },
  { name: 'Thanksgiving Day', date: (year) => nthWeekday(year, 11, 'thu', 4) },
  { name: 'Christmas Day', date: (year) => dayOf(year, 12, 25) },
];

const byYear = new Map<number, readonly CarrierHoliday[]>();

export function federalHolidays(year: number): readonly CarrierHoliday[] {
  let holidays = byYear.get(year);
  if (!holidays) {
    holidays = rules.map((rule) => {
      const date = rule.date(year);
      return { name: rule.name, date, observed: observedOn(date) };
    });
    byYear.set(year, holidays);
  }
  return holidays;
}

/** The holiday observed on `date`, or null. */
export function carrierHolidayOn(date: IsoDate): CarrierHoliday | null {
  const year = Number(date.slice(0, 4));
  // Next year's New Year's Day can be observed on 31 December.
  for (const holiday of [...federalHolidays(year), ...federalHolidays(year + 1).slice(0, 1)]) {
    if (holiday.observed === date) return holiday;
  }
  return null;
}
