import { addDays, weekdayOf } from '@shared/domain/shop-time';
import { weekdays } from '@shared/domain/vocabulary';

const MONTH = /^(\d{4})-(0[1-9]|1[0-2])$/;

/** "2026-12" for a "YYYY-MM" text; null for anything else. */
export function parseMonth(text: string | null): string | null {
  return text && MONTH.test(text) ? text : null;
}

export function monthOf(date: string): string {
  return date.slice(0, 7);
}

/** The month `count` months after `month` ("2026-12", 1 → "2027-01"). */
export function addMonths(month: string, count: number): string {
  const [year, monthNumber] = month.split('-').map(Number) as [number, number];
  const index = year * 12 + (monthNumber - 1) + count;
  return `${String(Math.floor(index / 12)).padStart(4, '0')}-${String((index % 12) + 1).padStart(2, '0')}`;
}

/** First and last day of a month, both inclusive. */
export function monthRange(month: string): { from: string; to: string } {
  const from = `${month}-01`;
  return { from, to: addDays(`${addMonths(month, 1)}-01`, -1) };
}

/** The month as weeks of seven days, Monday first; days outside the month are null. */
export function monthWeeks(month: string): (string | null)[][] {
  const { from, to } = monthRange(month);
  const weeks: (string | null)[][] = [];
  let week: (string | null)[] = Array.from({ length: weekdays.indexOf(weekdayOf(from)) }, () => null);
  for (let date = from; date <= to; date = addDays(date, 1)) {
    week.push(date);
    if (week.length === 7) {
      weeks.push(week);
      week = [];
    }
  }
  if (week.length > 0) weeks.push([...week, ...Array.from({ length: 7 - week.length }, () => null)]);
  return weeks;
}
