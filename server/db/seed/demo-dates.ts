// Date helpers for the demo seed. The dates an order gets come from the trade engine's schedule
// (shared/domain/roast-schedule), as checkout and the payment webhook give them, so the demo shows
// the same ship days, holidays and holds the product computes. Day dates are shop-local
// 'YYYY-MM-DD' strings; weekdays are ISO (1 = Monday … 7 = Sunday).
import { TZDate } from '@date-fns/tz';
import { datesForRoastDate, greenOrderDates, type CalendarOverride, type ScheduleSettings } from '../../../shared/domain/roast-schedule';
import { instantAt } from '../../../shared/domain/shop-time';
import { weekdays, type BrewMethod, type RoastLevel } from '../../../shared/domain/vocabulary';
import { defaultShopSettings } from '../../../shared/schemas/settings';

export type DemoCalendarSettings = {
  timeZone: string;
  roastWeekdays: number[];
  shipWeekdays: number[];
  transitDays: number;
  degasHoldDays: number;
  restDaysFilter: number;
  restDaysEspresso: number;
  bestBeforeDays: number;
};

export type DeliveryDates = { roastDate: string; shipDate: string; readyFrom: string; bestBefore: string };

export function demoCalendar(
  now: Date,
  settings: DemoCalendarSettings,
  closedDates: ReadonlySet<string> = new Set(),
  shipClosedDates: ReadonlySet<string> = new Set(),
) {
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

  // The seed's settings row as the schedule reads it; what the row leaves out is the product default.
  const schedule: ScheduleSettings = {
    ...defaultShopSettings,
    timeZone: settings.timeZone,
    roastWeekdays: settings.roastWeekdays.map((day) => weekdays[day - 1] ?? 'mon'),
    shipWeekdays: settings.shipWeekdays.map((day) => weekdays[day - 1] ?? 'mon'),
    transitDays: settings.transitDays,
    degasHoldDays: settings.degasHoldDays,
    restDays: { filter: settings.restDaysFilter, espresso: settings.restDaysEspresso },
    bestBeforeDays: settings.bestBeforeDays,
  };
  const calendar = {
    overrides: Object.fromEntries(
      [...new Set([...closedDates, ...shipClosedDates])].map((date): [string, CalendarOverride] => [
        date,
        { open: !closedDates.has(date) && settings.roastWeekdays.includes(isoWeekday(date)), shipOpen: shipClosedDates.has(date) ? false : null },
      ]),
    ),
  };

  /** The dates the schedule gives a delivery roasted on `roastDate`. */
  const datesFor = (roastDate: string, brewMethod: BrewMethod, roastLevel: RoastLevel): DeliveryDates => {
    const { shipDate, readyFrom, bestBefore } = datesForRoastDate(roastDate, { brewMethod, roastLevel }, schedule, calendar);
    return { roastDate, shipDate, readyFrom, bestBefore };
  };

  /** The ship date of a green order paid in the morning of `date` (after the cutoff time: the next ship day). */
  const nextShipDay = (date: string): string =>
    greenOrderDates(instantAt(date, defaultShopSettings.cutoff.time, settings.timeZone), schedule, calendar).shipDate;

  /** The instant of a shop-local wall-clock time on a date. */
  const at = (date: string, time: string): Date => {
    const [y, m, d] = date.split('-').map(Number) as [number, number, number];
    const [hh, mm] = time.split(':').map(Number) as [number, number];
    return new Date(new TZDate(y, m - 1, d, hh, mm, 0, settings.timeZone).getTime());
  };

  return {
    today,
    clock,
    addDays,
    isoWeekday,
    isRoastWeekday,
    isOpenRoastDay,
    openRoastDayFrom,
    weekdayOnOrAfter,
    roastWeekdaysFromToday,
    datesFor,
    nextShipDay,
    at,
  };
}

export type DemoCalendar = ReturnType<typeof demoCalendar>;
