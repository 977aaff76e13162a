// Date logic for the demo seed only, deliberately small and in one place. The real scheduling rules
// (capacity, DST edge cases, holidays for shipping) belong to the trade engine in shared/domain; a
// later change swaps this for it. Day dates are shop-local 'YYYY-MM-DD' strings; weekdays are ISO
// (1 = Monday … 7 = Sunday).
import { TZDate } from '@date-fns/tz';
import type { BrewMethod } from '../../../shared/domain/vocabulary';

export type DemoCalendarSettings = {
  timeZone: string;
  roastWeekdays: number[];
  shipWeekdays: number[];
  degasHoldDays: number;
  restDaysFilter: number;
  restDaysEspresso: number;
  bestBeforeDays: number;
};

export type DeliveryDates = { roastDate: string; shipDate: string; readyFrom: string; bestBefore: string };

export function demoCalendar(now: Date, settings: DemoCalendarSettings, closedDates: ReadonlySet<string> = new Set()) {
  const addDays = (date: string, days: number): string => {
    const [y, m, d] = date.split('-').map(Number) as [number, number, number];
    return new Date(Date.UTC(y, m - 1, d + days)).toISOString().slice(0, 10);
  };
  const isoWeekday = (date: string): number => {
    const [y, m, d] = date.split('-').map(Number) as [number, number, number];
    return new Date(Date.UTC(y, m - 1, d)).getUTCDay() || 7;
  };
  // The shop's wall clock at `now`.
  const parts = Object.fromEntries(
    new Intl.DateTimeFormat('en-CA', {
      timeZone: settings.timeZone,
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      hourCycle: 'h23',
    })
      .formatToParts(now)
      .map((p) => [p.type, p.value]),
  );
  const today = `${parts.year}-${parts.month}-${parts.day}`;
  const clock = `${today} ${parts.hour}:${parts.minute}`;

  const isRoastWeekday = (date: string) => settings.roastWeekdays.includes(isoWeekday(date));
  const isOpenRoastDay = (date: string) => isRoastWeekday(date) && !closedDates.has(date);
  /** The first open roast day on or after `date` (a closure moves a delivery to the next one). */
  const openRoastDayFrom = (date: string): string => {
    let d = date;
    for (let i = 0; i < 60 && !isOpenRoastDay(d); i += 1) d = addDays(d, 1);
    return d;
  };

  /** The first date on or after `date` that falls on ISO weekday `weekday`. */
  const weekdayOnOrAfter = (date: string, weekday: number): string => addDays(date, (weekday - isoWeekday(date) + 7) % 7);

  /** The next `count` roast weekdays from today (today included), closures included. */
  const roastWeekdaysFromToday = (count: number): string[] => {
    const out: string[] = [];
    for (let d = today; out.length < count; d = addDays(d, 1)) if (isRoastWeekday(d)) out.push(d);
    return out;
  };

  /** Ship after the degassing hold on a ship weekday; ready = roast + rest; best before = roast + N. */
  const datesFor = (roastDate: string, brewMethod: BrewMethod): DeliveryDates => {
    let shipDate = addDays(roastDate, settings.degasHoldDays);
    for (let i = 0; i < 7 && !settings.shipWeekdays.includes(isoWeekday(shipDate)); i += 1) shipDate = addDays(shipDate, 1);
    const rest = brewMethod === 'espresso' ? settings.restDaysEspresso : settings.restDaysFilter;
    return { roastDate, shipDate, readyFrom: addDays(roastDate, rest), bestBefore: addDays(roastDate, settings.bestBeforeDays) };
  };

  /** The next ship weekday strictly after `date`. */
  const nextShipDay = (date: string): string => {
    let d = addDays(date, 1);
    for (let i = 0; i < 7 && !settings.shipWeekdays.includes(isoWeekday(d)); i += 1) d = addDays(d, 1);
    return d;
  };

  /** The instant of a shop-local wall-clock time on a date. */
  const at = (date: string, time: string): Date => {
    const [y, m, d] = date.split('-').map(Number) as [number, number, number];
    const [hh, mm] = time.split(':').map(Number) as [number, number];
    return new Date(new TZDate(y, m - 1, d, hh, mm, 0, settings.timeZone).getTime());
  };

  return { today, clock, addDays, isoWeekday, isRoastWeekday, isOpenRoastDay, openRoastDayFrom, weekdayOnOrAfter, roastWeekdaysFromToday, datesFor, nextShipDay, at };
}

export type DemoCalendar = ReturnType<typeof demoCalendar>;
