/**
 * Dates as people read them, in one place. Two kinds (money aside, the only way time is shown):
 * - a shop day (`YYYY-MM-DD`: a roast date, a ship date) is a calendar date in the shop's time zone
 *   already, so it prints as written, whatever the reader's own zone;
 * - an instant (an ISO 8601 timestamp) prints in the reader's own time zone; staff pages use the
 *   shop's clock instead (`useShopClock` in shop-clock.tsx), in the shop's zone and labelled.
 */
const locale = 'en-US';

function dayFormat(options: Intl.DateTimeFormatOptions) {
  // Midnight UTC of the day, formatted in UTC, is that day in every zone.
  const format = new Intl.DateTimeFormat(locale, { ...options, timeZone: 'UTC' });
  return (date: string) => format.format(new Date(`${date}T00:00:00Z`));
}

function instantFormat(options: Intl.DateTimeFormatOptions) {
  const format = new Intl.DateTimeFormat(locale, options);
  return (instant: string | Date) => format.format(new Date(instant));
}

/** "2026-12-04" → "Dec 4, 2026" */
export const formatDay = dayFormat({ dateStyle: 'medium' });
/** "2026-12-03" → "Dec 3" */
export const formatDayShort = dayFormat({ month: 'short', day: 'numeric' });
/** "2026-12-03" → "Thu, Dec 3" */
export const formatDayShortWithWeekday = dayFormat({ weekday: 'short', month: 'short', day: 'numeric' });
/** "2026-12-09" → "Wed, Dec 9, 2026" */
export const formatDayWithWeekday = dayFormat({ weekday: 'short', month: 'short', day: 'numeric', year: 'numeric' });
/** "2026-12-03" → "Thursday, December 3" */
export const formatDayLongNoYear = dayFormat({ weekday: 'long', month: 'long', day: 'numeric' });
/** "2026-12-03" → "Thursday, December 3, 2026" */
export const formatDayLong = dayFormat({ weekday: 'long', month: 'long', day: 'numeric', year: 'numeric' });

const monthFormat = dayFormat({ month: 'long', year: 'numeric' });
/** "2026-12" → "December 2026" */
export function formatMonth(month: string): string {
  return monthFormat(`${month}-01`);
}

/** An instant in the reader's time: "Dec 1, 2026, 4:05 PM" */
export const formatInstant = instantFormat({ dateStyle: 'medium', timeStyle: 'short' });
/** The reader's day of an instant: "Dec 1, 2026" */
export const formatInstantDate = instantFormat({ dateStyle: 'medium' });
/** An instant in the reader's time, with the weekday and without the year: "Tue, Dec 8, 12:00 PM" */
export const formatInstantWithWeekday = instantFormat({ weekday: 'short', month: 'short', day: 'numeric', hour: 'numeric', minute: '2-digit' });
