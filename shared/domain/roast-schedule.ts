/**
 * The Roast Calendar: which days roast and ship, and the dates each order and subscription
 * delivery gets, in the shop's time zone.
 *
 * - `isOpenRoastDay(date, settings, calendar)`, `isShipDay(date, settings, calendar)`,
 *   `dayCapacityGrams(date, settings, calendar)`.
 * - `cutoffInstant(roastDate, settings)`: orders paid before it can roast that day.
 * - `datesForRoastDate(roastDate, coffee, settings, calendar)`: ready-from (roast + rest for the
 *   brew method and level), ship date (`shipDateFor`), best-before (roast + bestBeforeDays),
 *   expected arrival (ship + transit business days). `datesForLines` does the same for a parcel
 *   of several coffees: its slowest-resting bag decides.
 * - `shipDateFor(earliest, readyFrom, settings, calendar)`: the first ship day on or after the
 *   degassing hold that the ship policy and the weekend hold accept (below).
 * - `scheduleOrder(order, settings, calendar)`: for an instant of payment, the first open roast
 *   day whose cutoff has not passed and with capacity left, and the dates that follow from it.
 * - `subscriptionDeliveries(subscription, settings, calendar)`: the anchored series of deliveries
 *   for a cadence, honouring skips, a pause and closures without drifting. To change the cadence,
 *   anchor the new series on the `nominalDate` of the first delivery that is not locked.
 * - `roastCalendarDays(from, to, settings, calendar)`: the calendar view of a date range.
 * - `greenOrderDates(paidAt, settings, calendar)`: green coffee ships (no roast) on the first ship
 *   day on or after the payment day, or the next one when paid after the cutoff time.
 *
 * Rules: a cutoff has passed at the cutoff instant itself. Roast days and ship days are separate
 * calendars: an override's `open` decides whether a day roasts, its `shipOpen` whether parcels go
 * out (left out: the weekly ship weekdays, less carrier holidays). Carrier holidays
 * (./carrier-holidays) are no ship days unless an override opens one, and never transit days:
 * transit counts Monday–Friday that are not holidays.
 *
 * Ship policy (`shipPolicy`): `ready_on_arrival` holds a roasted parcel until its expected arrival
 * is on or after its ready-from date (ship ≥ ready-from − transit, in business days);
 * `after_degassing` ships it on the first ship day after the degassing hold and the customer is
 * told the ready-from date. Weekend hold (`holdOverWeekend`): a roasted parcel "crosses a weekend"
 * when a Saturday or Sunday falls after its ship date and before its expected arrival (it would
 * sit in a depot); it waits for the first ship day from which it does not. Holidays alone do not
 * count (transit already skips them). When no ship day within the search horizon avoids a weekend
 * (transit of five or more business days always crosses one), the weekend hold gives way and the
 * parcel ships on the first day the other rules allow. Green coffee keeps for months: it waits for
 * neither rule. Subscription deliveries are booked ahead and not held back by
 * capacity; one-time orders are. Searches look at most `SEARCH_HORIZON_DAYS` ahead and throw a
 * `ScheduleError` when nothing is found.
 */
import { carrierHolidayOn } from './carrier-holidays';
import { addDays, daysBetween, instantAt, localDateOf, weekdayOf, type IsoDate } from './shop-time';
import type { BrewMethod, CadenceWeeks, RoastLevel, ShipPolicy, Weekday } from './vocabulary';

export interface ScheduleSettings {
  timeZone: string;
  roastWeekdays: readonly Weekday[];
  cutoff: { time: string; daysBefore: number };
  shipWeekdays: readonly Weekday[];
  transitDays: number;
  degasHoldDays: number;
  restDays: Record<BrewMethod, number>;
  /** Added to the brew method's rest per level (darker roasts degas faster). */
  restAdjustDays: Record<RoastLevel, number>;
  bestBeforeDays: number;
  dayCapacityGrams: number;
  shipPolicy: ShipPolicy;
  holdOverWeekend: boolean;
}

export interface CalendarOverride {
  /** Whether the day roasts. */
  open: boolean;
  /** Whether parcels go out; null or left out follows the ship weekdays and carrier holidays. */
  shipOpen?: boolean | null;
  capacityGrams?: number | null;
  note?: string | null;
}

export interface RoastCalendar {
  overrides?: Readonly<Record<IsoDate, CalendarOverride>>;
  /** Green grams already planned per roast day. */
  plannedGreenGrams?: Readonly<Record<IsoDate, number>>;
}

export const SEARCH_HORIZON_DAYS = 120;

export class ScheduleError extends Error {
  constructor(
    readonly code: 'no_roast_day' | 'no_ship_day',
    message: string,
  ) {
    super(message);
    this.name = 'ScheduleError';
  }
}

const businessDays: ReadonlySet<Weekday> = new Set(['mon', 'tue', 'wed', 'thu', 'fri']);

export function isOpenRoastDay(date: IsoDate, settings: ScheduleSettings, calendar: RoastCalendar = {}): boolean {
  const override = calendar.overrides?.[date];
  return override ? override.open : settings.roastWeekdays.includes(weekdayOf(date));
}

export function isShipDay(date: IsoDate, settings: ScheduleSettings, calendar: RoastCalendar = {}): boolean {
  const shipOpen = calendar.overrides?.[date]?.shipOpen;
  if (shipOpen !== undefined && shipOpen !== null) return shipOpen;
  return settings.shipWeekdays.includes(weekdayOf(date)) && carrierHolidayOn(date) === null;
}

/** A day parcels move: Monday to Friday, not a carrier holiday. */
export function isTransitDay(date: IsoDate): boolean {
  return businessDays.has(weekdayOf(date)) && carrierHolidayOn(date) === null;
}

/** Green grams the day can roast; zero when closed. */
export function dayCapacityGrams(date: IsoDate, settings: ScheduleSettings, calendar: RoastCalendar = {}): number {
  if (!isOpenRoastDay(date, settings, calendar)) return 0;
  return calendar.overrides?.[date]?.capacityGrams ?? settings.dayCapacityGrams;
}

export function cutoffInstant(roastDate: IsoDate, settings: ScheduleSettings): Date {
  return instantAt(addDays(roastDate, -settings.cutoff.daysBefore), settings.cutoff.time, settings.timeZone);
}

function firstDayFrom(start: IsoDate, accept: (date: IsoDate) => boolean): IsoDate | undefined {
  for (let offset = 0; offset <= SEARCH_HORIZON_DAYS; offset += 1) {
    const date = addDays(start, offset);
    if (accept(date)) return date;
  }
  return undefined;
}

function firstShipDayFrom(start: IsoDate, settings: ScheduleSettings, calendar: RoastCalendar, accept: (date: IsoDate) => boolean = () => true): IsoDate {
  const shipDate = firstDayFrom(start, (date) => isShipDay(date, settings, calendar) && accept(date));
  if (!shipDate) {
    throw new ScheduleError('no_ship_day', `No ship day within ${SEARCH_HORIZON_DAYS} days of ${start}.`);
  }
  return shipDate;
}

/** The date after `transitDays` transit days (business days that are not carrier holidays). */
export function arrivalDate(shipDate: IsoDate, transitDays: number): IsoDate {
  let date = shipDate;
  for (let remaining = transitDays; remaining > 0;) {
    date = addDays(date, 1);
    if (isTransitDay(date)) remaining -= 1;
  }
  return date;
}

/** True when a Saturday or Sunday falls after the ship date and before the expected arrival. */
export function crossesWeekend(shipDate: IsoDate, expectedArrival: IsoDate): boolean {
  for (let date = addDays(shipDate, 1); date < expectedArrival; date = addDays(date, 1)) {
    if (!businessDays.has(weekdayOf(date))) return true;
  }
  return false;
}

/**
 * The ship date of a roasted parcel that may leave from `earliest` (roast + degassing hold) and is
 * ready to brew from `readyFrom`: the first ship day the ship policy and the weekend hold accept.
 */
export function shipDateFor(earliest: IsoDate, readyFrom: IsoDate, settings: ScheduleSettings, calendar: RoastCalendar = {}): IsoDate {
  const readyOnArrival = (date: IsoDate) => settings.shipPolicy !== 'ready_on_arrival' || arrivalDate(date, settings.transitDays) >= readyFrom;
  const byPolicy = firstShipDayFrom(earliest, settings, calendar, readyOnArrival);
  if (!settings.holdOverWeekend) return byPolicy;
  const noWeekend = firstDayFrom(byPolicy, (date) => isShipDay(date, settings, calendar) && !crossesWeekend(date, arrivalDate(date, settings.transitDays)));
  return noWeekend ?? byPolicy;
}

export interface CoffeeForRest {
  brewMethod: BrewMethod;
  roastLevel: RoastLevel;
}

export interface RoastDates {
  roastDate: IsoDate;
  /** Orders paid at or after this instant miss the roast date (ISO-8601 UTC). */
  cutoffAt: string;
  shipDate: IsoDate;
  readyFrom: IsoDate;
  bestBefore: IsoDate;
  expectedArrival: IsoDate;
}

export function restDaysFor(coffee: CoffeeForRest, settings: ScheduleSettings): number {
  return Math.max(0, settings.restDays[coffee.brewMethod] + settings.restAdjustDays[coffee.roastLevel]);
}

const noCalendar: RoastCalendar = {};
/**
 * Each settings-and-calendar pair's dates by roast day and rest: a plan over thousands of
 * subscriptions asks for the same few roast days again and again. Both are read-only inputs, so
 * an answer holds for as long as they live.
 */
const datesMemo = new WeakMap<ScheduleSettings, WeakMap<RoastCalendar, Map<string, RoastDates>>>();

export function datesForRoastDate(roastDate: IsoDate, coffee: CoffeeForRest, settings: ScheduleSettings, calendar: RoastCalendar = noCalendar): RoastDates {
  const restDays = restDaysFor(coffee, settings);
  let byCalendar = datesMemo.get(settings);
  if (!byCalendar) datesMemo.set(settings, (byCalendar = new WeakMap()));
  let byDay = byCalendar.get(calendar);
  if (!byDay) byCalendar.set(calendar, (byDay = new Map()));
  const key = `${roastDate}|${restDays}`;
  let dates = byDay.get(key);
  if (!dates) byDay.set(key, (dates = computeDates(roastDate, restDays, settings, calendar)));
  // A copy: callers spread and change what they get.
  return { ...dates };
}

function computeDates(roastDate: IsoDate, restDays: number, settings: ScheduleSettings, calendar: RoastCalendar): RoastDates {
  const readyFrom = addDays(roastDate, restDays);
  const shipDate = shipDateFor(addDays(roastDate, settings.degasHoldDays), readyFrom, settings, calendar);
  return {
    roastDate,
    cutoffAt: cutoffInstant(roastDate, settings).toISOString(),
    shipDate,
    readyFrom,
    bestBefore: addDays(roastDate, settings.bestBeforeDays),
    expectedArrival: arrivalDate(shipDate, settings.transitDays),
  };
}

/** The dates of a parcel of several coffees roasted on one day: the slowest-resting bag decides. */
export function datesForLines(roastDate: IsoDate, lines: readonly CoffeeForRest[], settings: ScheduleSettings, calendar: RoastCalendar = {}): RoastDates {
  const slowest = lines.reduce<CoffeeForRest | undefined>(
    (current, line) => (current === undefined || restDaysFor(line, settings) > restDaysFor(current, settings) ? line : current),
    undefined,
  );
  return datesForRoastDate(roastDate, slowest ?? { brewMethod: 'filter', roastLevel: 'medium' }, settings, calendar);
}

export interface OrderToSchedule extends CoffeeForRest {
  paidAt: Date;
  /** Green grams the order adds to its roast day. */
  greenGrams: number;
}

export function scheduleOrder(order: OrderToSchedule, settings: ScheduleSettings, calendar: RoastCalendar = {}): RoastDates {
  const paidMs = order.paidAt.getTime();
  const paidDate = localDateOf(order.paidAt, settings.timeZone);
  const roastDate = firstDayFrom(
    paidDate,
    (date) =>
      isOpenRoastDay(date, settings, calendar) &&
      paidMs < cutoffInstant(date, settings).getTime() &&
      (calendar.plannedGreenGrams?.[date] ?? 0) + order.greenGrams <= dayCapacityGrams(date, settings, calendar),
  );
  if (!roastDate) {
    throw new ScheduleError(
      'no_roast_day',
      `No open roast day within ${SEARCH_HORIZON_DAYS} days has ${order.greenGrams.toLocaleString('en-US')} g of capacity left.`,
    );
  }
  return datesForRoastDate(roastDate, order, settings, calendar);
}

export interface SubscriptionForSchedule extends CoffeeForRest {
  /** Roast date of the first delivery; every later one sits on this weekly grid. */
  anchorDate: IsoDate;
  cadenceWeeks: CadenceWeeks;
  /** Nominal (grid) dates of deliveries the subscriber skipped. */
  skippedDates?: readonly IsoDate[];
  /** Deliveries whose grid date falls before this date are paused (not listed). */
  pausedUntil?: IsoDate | null;
  /** List deliveries roasting on or after this date; defaults to today in the shop. */
  from?: IsoDate;
  count: number;
  now: Date;
}

export interface ScheduledDelivery extends RoastDates {
  /** The delivery's place on the grid; stable when a closure moves the roast date. */
  nominalDate: IsoDate;
  status: 'scheduled' | 'skipped';
  movedByClosure: boolean;
  /** True once the cutoff has passed: changes then reach the next delivery. */
  locked: boolean;
}

/**
 * The day after the last open roast day before `date`, within the search horizon; null when none
 * was open. A delivery roasts on the first open roast day on or after its grid date, so one due on
 * or before that roast day roasted before `date`.
 */
export function firstGridDateStillAhead(date: IsoDate, settings: ScheduleSettings, calendar: RoastCalendar = {}): IsoDate | null {
  for (let back = 1; back <= SEARCH_HORIZON_DAYS; back += 1) {
    const day = addDays(date, -back);
    if (isOpenRoastDay(day, settings, calendar)) return addDays(day, 1);
  }
  return null;
}

export function subscriptionDeliveries(subscription: SubscriptionForSchedule, settings: ScheduleSettings, calendar: RoastCalendar = {}): ScheduledDelivery[] {
  const periodDays = subscription.cadenceWeeks * 7;
  const from = subscription.from ?? localDateOf(subscription.now, settings.timeZone);
  const skipped = new Set(subscription.skippedDates ?? []);
  const pausedUntil = subscription.pausedUntil ?? null;
  // A delivery can only move later, to the first open roast day on or after its grid date: start at
  // the first grid date after the last roast day before `from` (else the search horizon before it).
  const stillAhead = firstGridDateStillAhead(from, settings, calendar);
  const firstIndex = Math.max(
    0,
    stillAhead === null
      ? Math.floor((daysBetween(subscription.anchorDate, from) - SEARCH_HORIZON_DAYS) / periodDays)
      : Math.ceil(daysBetween(subscription.anchorDate, stillAhead) / periodDays),
  );
  const deliveries: ScheduledDelivery[] = [];
  for (let index = firstIndex; deliveries.length < subscription.count; index += 1) {
    const nominalDate = addDays(subscription.anchorDate, index * periodDays);
    if (pausedUntil !== null && nominalDate < pausedUntil) continue;
    const roastDate = firstDayFrom(nominalDate, (date) => isOpenRoastDay(date, settings, calendar));
    if (!roastDate) {
      throw new ScheduleError('no_roast_day', `No open roast day within ${SEARCH_HORIZON_DAYS} days of ${nominalDate}.`);
    }
    if (roastDate < from) continue;
    const dates = datesForRoastDate(roastDate, subscription, settings, calendar);
    deliveries.push({
      ...dates,
      nominalDate,
      status: skipped.has(nominalDate) ? 'skipped' : 'scheduled',
      movedByClosure: roastDate !== nominalDate,
      locked: subscription.now.getTime() >= Date.parse(dates.cutoffAt),
    });
  }
  return deliveries;
}

export interface CalendarDay {
  date: IsoDate;
  weekday: Weekday;
  open: boolean;
  /** Parcels go out this day. */
  shipOpen: boolean;
  /** Staff's choice for shipping this day; null follows the ship weekdays and carrier holidays. */
  shipOverride: boolean | null;
  /** The carrier holiday observed this day, or null. */
  holiday: string | null;
  capacityGrams: number;
  plannedGreenGrams: number;
  note: string | null;
}

export const MAX_CALENDAR_SPAN_DAYS = 366;

export function roastCalendarDays(from: IsoDate, to: IsoDate, settings: ScheduleSettings, calendar: RoastCalendar = {}): CalendarDay[] {
  const span = daysBetween(from, to);
  if (span < 0 || span >= MAX_CALENDAR_SPAN_DAYS) {
    throw new RangeError(`the range must run forwards and span at most ${MAX_CALENDAR_SPAN_DAYS} days`);
  }
  return Array.from({ length: span + 1 }, (_, offset) => {
    const date = addDays(from, offset);
    return {
      date,
      weekday: weekdayOf(date),
      open: isOpenRoastDay(date, settings, calendar),
      shipOpen: isShipDay(date, settings, calendar),
      shipOverride: calendar.overrides?.[date]?.shipOpen ?? null,
      holiday: carrierHolidayOn(date)?.name ?? null,
      capacityGrams: dayCapacityGrams(date, settings, calendar),
      plannedGreenGrams: calendar.plannedGreenGrams?.[date] ?? 0,
      note: calendar.overrides?.[date]?.note ?? null,
    };
  });
}

export function greenOrderDates(paidAt: Date, settings: ScheduleSettings, calendar: RoastCalendar = {}): { shipDate: IsoDate; expectedArrival: IsoDate } {
  const paidDate = localDateOf(paidAt, settings.timeZone);
  const beforeCutoff = paidAt.getTime() < instantAt(paidDate, settings.cutoff.time, settings.timeZone).getTime();
  const shipDate = firstShipDayFrom(beforeCutoff ? paidDate : addDays(paidDate, 1), settings, calendar);
  return { shipDate, expectedArrival: arrivalDate(shipDate, settings.transitDays) };
}
