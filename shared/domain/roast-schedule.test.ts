import { TZDate } from '@date-fns/tz';
import { addBusinessDays, format } from 'date-fns';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { defaultShopSettings } from '../schemas/settings';
import {
  arrivalDate,
  cutoffInstant,
  datesForRoastDate,
  dayCapacityGrams,
  greenOrderDates,
  isOpenRoastDay,
  isShipDay,
  roastCalendarDays,
  ScheduleError,
  scheduleOrder,
  subscriptionDeliveries,
  type RoastCalendar,
  type ScheduleSettings,
} from './roast-schedule';
import { carrierHolidayOn } from './carrier-holidays';
import { addDays, localDateOf, weekdayOf } from './shop-time';

// Default shop: New York; roasts Mon, Wed, Fri; cutoff 12:00 the day before; ships Mon–Fri after a
// 1-day degassing hold; 3 transit days; rest filter 2 / espresso 7 (medium +0, light +1); best-before
// 28 days (product defaults). Ready on arrival and the weekend hold are on (the product's rule):
// with 3 transit days, a parcel shipped Wed, Thu or Fri would be in transit over Sat and Sun, so
// roasted parcels ship Mon or Tue (common practice: no parcel sits over a weekend). March 2025 has
// no US federal holiday (5 U.S.C. 6103).
const shop: ScheduleSettings = defaultShopSettings;
const medium = { brewMethod: 'filter', roastLevel: 'medium' } as const;

function order(paidAt: string, greenGrams = 1000, brewMethod: 'filter' | 'espresso' = 'filter') {
  return { paidAt: new Date(paidAt), greenGrams, brewMethod, roastLevel: 'medium' } as const;
}

function referenceInstant(date: string, time: string, zone: string): number {
  const [year, month, day] = date.split('-').map(Number) as [number, number, number];
  const [hour, minute] = time.split(':').map(Number) as [number, number];
  return new TZDate(year, month - 1, day, hour, minute, zone).getTime();
}

describe('one order: roast date after the cutoff', () => {
  it('roasts on the next roast day when paid a minute before its cutoff', () => {
    // Paid Tue 4 Mar 2025, 11:59 EST (16:59Z). Wed 5 Mar's cutoff is Tue 12:00 EST = 17:00Z: not passed.
    // Ready (filter): Wed + 2 = Fri 7 Mar. Best-before: Wed + 28 = Wed 2 Apr. Ship: the hold allows
    // Thu 6 Mar, but Thu → Fri, Mon, Tue 11 and Fri → Mon, Tue, Wed cross the weekend of 8–9 Mar;
    // Mon 10 → Tue, Wed, Thu 13 Mar does not, and lands after Fri 7 (ready on arrival).
    expect(scheduleOrder(order('2025-03-04T16:59:00Z'), shop)).toEqual({
      roastDate: '2025-03-05',
      cutoffAt: '2025-03-04T17:00:00.000Z',
      shipDate: '2025-03-10',
      readyFrom: '2025-03-07',
      bestBefore: '2025-04-02',
      expectedArrival: '2025-03-13',
    });
  });

  it('moves to the following roast day at the cutoff and a minute after', () => {
    // Paid at 12:00 EST exactly: the cutoff has passed. Next: Fri 7 Mar (cutoff Thu 12:00).
    // Espresso rests 7 days: Fri 14 Mar. Ship: Fri + 1 = Sat, not a ship day → Mon 10 Mar, but
    // Mon → Tue, Wed, Thu 13 lands before it is ready; Tue 11 → Wed, Thu, Fri 14 Mar: ready on arrival.
    for (const paidAt of ['2025-03-04T17:00:00Z', '2025-03-04T17:01:00Z']) {
      expect(scheduleOrder(order(paidAt, 1000, 'espresso'), shop)).toMatchObject({
        roastDate: '2025-03-07',
        shipDate: '2025-03-11',
        readyFrom: '2025-03-14',
        expectedArrival: '2025-03-14',
      });
    }
  });

  it('skips a closed roast day and a full one', () => {
    const closed: RoastCalendar = { overrides: { '2025-03-05': { open: false, note: 'Roaster service' } } };
    expect(scheduleOrder(order('2025-03-04T12:00:00Z'), shop, closed).roastDate).toBe('2025-03-07');
    // 59,000 g planned + 2,000 g > 60,000 g capacity → Friday; 58,000 + 2,000 fits exactly → Wednesday.
    expect(scheduleOrder(order('2025-03-04T12:00:00Z', 2000), shop, { plannedGreenGrams: { '2025-03-05': 59_000 } }).roastDate).toBe('2025-03-07');
    expect(scheduleOrder(order('2025-03-04T12:00:00Z', 2000), shop, { plannedGreenGrams: { '2025-03-05': 58_000 } }).roastDate).toBe('2025-03-05');
  });

  it('uses an extra roast day the owner opens, with its own capacity', () => {
    const saturday: RoastCalendar = { overrides: { '2025-03-08': { open: true, capacityGrams: 5000 } } };
    // Paid Thu 6 Mar after noon: Fri's cutoff has passed; Sat 8 Mar is open by override.
    expect(scheduleOrder(order('2025-03-06T18:00:00Z', 4000), shop, saturday).roastDate).toBe('2025-03-08');
    expect(scheduleOrder(order('2025-03-06T18:00:00Z', 6000), shop, saturday).roastDate).toBe('2025-03-10');
  });

  it('reads the cutoff in local time across the US spring-forward change', () => {
    // Mon 10 Mar 2025 roasts; cutoff Sun 9 Mar 12:00, which is EDT (clocks went forward at 02:00): 16:00Z, not 17:00Z.
    expect(cutoffInstant('2025-03-10', shop).toISOString()).toBe('2025-03-09T16:00:00.000Z');
    expect(scheduleOrder(order('2025-03-09T15:59:00Z'), shop).roastDate).toBe('2025-03-10');
    expect(scheduleOrder(order('2025-03-09T16:00:00Z'), shop).roastDate).toBe('2025-03-12');
    expect(scheduleOrder(order('2025-03-09T16:30:00Z'), shop).roastDate).toBe('2025-03-12');
  });

  it('reads a cutoff time the spring-forward change skips as the hour after', () => {
    // Cutoff 02:30 the day before: on Sun 9 Mar 02:30 does not exist; it reads as 03:30 EDT = 07:30Z.
    const early = { ...shop, cutoff: { time: '02:30', daysBefore: 1 } };
    expect(cutoffInstant('2025-03-10', early).toISOString()).toBe('2025-03-09T07:30:00.000Z');
    expect(scheduleOrder(order('2025-03-09T07:29:00Z'), early).roastDate).toBe('2025-03-10');
    expect(scheduleOrder(order('2025-03-09T07:30:00Z'), early).roastDate).toBe('2025-03-12');
  });

  it('reads the cutoff in local time across the US fall-back change', () => {
    // Mon 3 Nov 2025 roasts; cutoff Sun 2 Nov 12:00 EST (clocks went back at 02:00) = 17:00Z.
    expect(cutoffInstant('2025-11-03', shop).toISOString()).toBe('2025-11-02T17:00:00.000Z');
    expect(scheduleOrder(order('2025-11-02T16:30:00Z'), shop).roastDate).toBe('2025-11-03');
    expect(scheduleOrder(order('2025-11-02T17:00:00Z'), shop).roastDate).toBe('2025-11-05');
    // A cutoff inside the repeated hour (01:30) is its first occurrence, 01:30 EDT = 05:30Z.
    const night = { ...shop, cutoff: { time: '01:30', daysBefore: 1 } };
    expect(scheduleOrder(order('2025-11-02T05:29:00Z'), night).roastDate).toBe('2025-11-03');
    expect(scheduleOrder(order('2025-11-02T06:15:00Z'), night).roastDate).toBe('2025-11-05');
  });

  it('reads the cutoff in local time across a southern-hemisphere change (Sydney, October)', () => {
    const sydney = { ...shop, timeZone: 'Australia/Sydney' };
    // Mon 6 Oct 2025 roasts; cutoff Sun 5 Oct 12:00 AEDT (+11, clocks forward that morning) = 01:00Z.
    expect(cutoffInstant('2025-10-06', sydney).toISOString()).toBe('2025-10-05T01:00:00.000Z');
    expect(scheduleOrder(order('2025-10-05T00:59:00Z'), sydney).roastDate).toBe('2025-10-06');
    expect(scheduleOrder(order('2025-10-05T01:00:00Z'), sydney).roastDate).toBe('2025-10-08');
    // A day earlier, noon on Sat 4 Oct is still AEST (+10) = 02:00Z.
    expect(cutoffInstant('2025-10-05', { ...sydney, cutoff: { time: '12:00', daysBefore: 1 } }).toISOString()).toBe('2025-10-04T02:00:00.000Z');
  });

  it('places every cutoff where @date-fns/tz puts the same local time', () => {
    const zone = fc.constantFrom('America/New_York', 'America/Denver', 'Australia/Sydney', 'America/Santiago', 'Europe/London');
    const day = fc.integer({ min: 0, max: 3 * 365 }).map((offset) => addDays('2024-01-01', offset));
    const time = fc.constantFrom('00:00', '06:45', '12:00', '17:30', '23:59');
    fc.assert(
      fc.property(day, zone, time, fc.integer({ min: 0, max: 3 }), (roastDate, timeZone, cutoffTime, daysBefore) => {
        const settings = { ...shop, timeZone, cutoff: { time: cutoffTime, daysBefore } };
        expect(cutoffInstant(roastDate, settings).getTime()).toBe(referenceInstant(addDays(roastDate, -daysBefore), cutoffTime, timeZone));
      }),
    );
  });

  it('picks the first qualifying day and derives consistent dates, for any payment and calendar', () => {
    const calendar = fc.record({
      closed: fc.uniqueArray(fc.integer({ min: 0, max: 40 }), { maxLength: 12 }),
      planned: fc.array(fc.tuple(fc.integer({ min: 0, max: 40 }), fc.integer({ min: 0, max: 60_000 })), { maxLength: 12 }),
    });
    const paidAt = fc.integer({ min: Date.UTC(2025, 0, 1), max: Date.UTC(2026, 0, 1) }).map((ms) => new Date(ms));
    const zone = fc.constantFrom('America/New_York', 'America/Denver', 'Australia/Sydney');
    fc.assert(
      fc.property(paidAt, zone, calendar, fc.integer({ min: 1, max: 20_000 }), (at, timeZone, days, greenGrams) => {
        const settings = { ...shop, timeZone };
        const start = localDateOf(at, timeZone);
        const roastCalendar: RoastCalendar = {
          overrides: Object.fromEntries(days.closed.map((offset) => [addDays(start, offset), { open: false }])),
          plannedGreenGrams: Object.fromEntries(days.planned.map(([offset, grams]) => [addDays(start, offset), grams])),
        };
        const qualifies = (date: string): boolean =>
          isOpenRoastDay(date, settings, roastCalendar) &&
          at.getTime() < cutoffInstant(date, settings).getTime() &&
          (roastCalendar.plannedGreenGrams?.[date] ?? 0) + greenGrams <= dayCapacityGrams(date, settings, roastCalendar);
        const dates = scheduleOrder({ paidAt: at, greenGrams, ...medium }, settings, roastCalendar);
        expect(qualifies(dates.roastDate)).toBe(true);
        for (let date = start; date < dates.roastDate; date = addDays(date, 1)) expect(qualifies(date)).toBe(false);
        const earliestShip = addDays(dates.roastDate, settings.degasHoldDays);
        expect(dates.shipDate >= earliestShip).toBe(true);
        expect(isShipDay(dates.shipDate, settings, roastCalendar)).toBe(true);
        // Ready on arrival, and never in transit over a Saturday or Sunday (a Monday ship day with
        // 3 transit days always exists, so the weekend hold never gives way here).
        expect(dates.expectedArrival >= dates.readyFrom).toBe(true);
        for (let date = addDays(dates.shipDate, 1); date < dates.expectedArrival; date = addDays(date, 1)) {
          expect(['sat', 'sun']).not.toContain(weekdayOf(date));
        }
        expect(dates.readyFrom).toBe(addDays(dates.roastDate, 2));
        expect(dates.bestBefore).toBe(addDays(dates.roastDate, 28));
      }),
    );
  });

  it('refuses when no roast day within the horizon has room', () => {
    // 70,000 g is more than any day's 60,000 g capacity.
    let caught: unknown;
    try {
      scheduleOrder(order('2025-03-04T12:00:00Z', 70_000), shop);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(ScheduleError);
    expect(caught).toMatchObject({ code: 'no_roast_day', message: expect.stringContaining('70,000 g') });
  });
});

describe('dates that follow from a roast date', () => {
  it('counts transit in business days like date-fns when no holiday falls in transit', () => {
    const day = fc.integer({ min: 0, max: 2000 }).map((offset) => addDays('2024-01-01', offset));
    fc.assert(
      fc.property(day, fc.integer({ min: 0, max: 10 }), (shipDate, transit) => {
        fc.pre(weekdayOf(shipDate) !== 'sat' && weekdayOf(shipDate) !== 'sun');
        const [year, month, dayOfMonth] = shipDate.split('-').map(Number) as [number, number, number];
        const reference = format(addBusinessDays(new TZDate(year, month - 1, dayOfMonth, 'UTC'), transit), 'yyyy-MM-dd');
        // Holidays are no transit days (tested with hand-worked dates below).
        for (let date = addDays(shipDate, 1); date <= reference; date = addDays(date, 1)) fc.pre(carrierHolidayOn(date) === null);
        expect(arrivalDate(shipDate, transit)).toBe(reference);
      }),
    );
  });

  it('rests espresso longer than filter and adjusts rest by level', () => {
    // Filter 2 days, espresso 7 (product defaults; filter 2–7, espresso 7–14 from memory);
    // light +1 day by default (Smrke et al. 2017; the day from memory): 5 Mar + 8 = 13 Mar.
    expect(datesForRoastDate('2025-03-05', { brewMethod: 'espresso', roastLevel: 'light' }, shop).readyFrom).toBe('2025-03-13');
    const adjusted = { ...shop, restAdjustDays: { ...shop.restAdjustDays, dark: -1, light: 2 } };
    expect(datesForRoastDate('2025-03-05', { brewMethod: 'filter', roastLevel: 'dark' }, adjusted).readyFrom).toBe('2025-03-06');
    expect(datesForRoastDate('2025-03-05', { brewMethod: 'filter', roastLevel: 'light' }, adjusted).readyFrom).toBe('2025-03-09');
    const neverNegative = { ...shop, restAdjustDays: { ...shop.restAdjustDays, dark: -9 } };
    expect(datesForRoastDate('2025-03-05', { brewMethod: 'filter', roastLevel: 'dark' }, neverNegative).readyFrom).toBe('2025-03-05');
  });

  it('keeps parcels in on a closed ship day, not on a day closed to roasting only, and fails clearly without any ship day', () => {
    // Ship straight after the hold: Wed 5 Mar's roast ships Thu 6 Mar; with shipping closed on
    // Thu 6 it ships Fri 7 Mar; closing Thu 6 to roasting only (it is no roast weekday) keeps Thu 6.
    const straight = { ...shop, shipPolicy: 'after_degassing', holdOverWeekend: false } as const;
    expect(datesForRoastDate('2025-03-05', medium, straight).shipDate).toBe('2025-03-06');
    expect(datesForRoastDate('2025-03-05', medium, straight, { overrides: { '2025-03-06': { open: false, shipOpen: false } } }).shipDate).toBe('2025-03-07');
    expect(datesForRoastDate('2025-03-05', medium, straight, { overrides: { '2025-03-06': { open: false } } }).shipDate).toBe('2025-03-06');
    const sundaysOnly = { ...shop, shipWeekdays: ['sun'] as const };
    const closedSundays = Object.fromEntries(Array.from({ length: 30 }, (_, week) => [addDays('2025-03-09', week * 7), { open: false, shipOpen: false }]));
    expect(() => datesForRoastDate('2025-03-05', medium, sundaysOnly, { overrides: closedSundays })).toThrow(/No ship day/);
  });
});

describe('subscription deliveries', () => {
  const base = {
    anchorDate: '2025-03-05',
    cadenceWeeks: 2 as const,
    count: 4,
    now: new Date('2025-03-01T12:00:00Z'),
    ...medium,
  };

  it('roasts every two weeks on the anchor weekday', () => {
    const deliveries = subscriptionDeliveries(base, shop);
    expect(deliveries.map((delivery) => delivery.roastDate)).toEqual(['2025-03-05', '2025-03-19', '2025-04-02', '2025-04-16']);
    expect(deliveries.every((delivery) => delivery.status === 'scheduled' && !delivery.movedByClosure && !delivery.locked)).toBe(true);
    // Wed 5 Mar ships Mon 10 Mar, the first ship day that does not sit over a weekend (above).
    expect(deliveries[0]).toMatchObject({ shipDate: '2025-03-10', readyFrom: '2025-03-07', bestBefore: '2025-04-02' });
  });

  it('moves one delivery past a closed day and keeps the next on its anchor', () => {
    // Wed 19 Mar closed → Fri 21 Mar; the next stays on Wed 2 Apr (no drift).
    const deliveries = subscriptionDeliveries(base, shop, { overrides: { '2025-03-19': { open: false } } });
    expect(deliveries.map((delivery) => [delivery.nominalDate, delivery.roastDate, delivery.movedByClosure])).toEqual([
      ['2025-03-05', '2025-03-05', false],
      ['2025-03-19', '2025-03-21', true],
      ['2025-04-02', '2025-04-02', false],
      ['2025-04-16', '2025-04-16', false],
    ]);
  });

  it('shows a skipped delivery as skipped and leaves the rest in place', () => {
    const deliveries = subscriptionDeliveries({ ...base, skippedDates: ['2025-03-19'] }, shop);
    expect(deliveries.map((delivery) => delivery.status)).toEqual(['scheduled', 'skipped', 'scheduled', 'scheduled']);
    expect(deliveries[2]?.roastDate).toBe('2025-04-02');
  });

  it('resumes after a pause on the original grid', () => {
    // Paused until 10 Apr: 5 Mar, 19 Mar and 2 Apr do not happen; 16 Apr and 30 Apr are on the old grid.
    const deliveries = subscriptionDeliveries({ ...base, count: 2, pausedUntil: '2025-04-10' }, shop);
    expect(deliveries.map((delivery) => delivery.roastDate)).toEqual(['2025-04-16', '2025-04-30']);
  });

  it('locks a delivery once its cutoff has passed', () => {
    // The 5 Mar delivery's cutoff is Tue 4 Mar 12:00 EST = 17:00Z.
    expect(subscriptionDeliveries({ ...base, count: 1, now: new Date('2025-03-04T16:59:00Z') }, shop)[0]?.locked).toBe(false);
    expect(subscriptionDeliveries({ ...base, count: 1, now: new Date('2025-03-04T17:00:00Z') }, shop)[0]?.locked).toBe(true);
  });

  it('lists from a later date without walking the whole history, and re-anchors for a cadence change', () => {
    // From 1 Jun: 5 Mar + 14 k days → first on or after is 11 Jun.
    const later = subscriptionDeliveries({ ...base, count: 2, from: '2025-06-01', now: new Date('2025-05-30T12:00:00Z') }, shop);
    expect(later.map((delivery) => delivery.roastDate)).toEqual(['2025-06-11', '2025-06-25']);
    // Cadence changes to weekly on 5 Mar at 13:00 EST: 19 Mar is the first unlocked delivery and anchors the new series.
    const now = new Date('2025-03-05T18:00:00Z');
    const nextUnlocked = subscriptionDeliveries({ ...base, now }, shop).find((delivery) => !delivery.locked);
    expect(nextUnlocked?.nominalDate).toBe('2025-03-19');
    const weekly = subscriptionDeliveries({ ...base, anchorDate: nextUnlocked?.nominalDate ?? '', cadenceWeeks: 1, count: 3, now }, shop);
    expect(weekly.map((delivery) => delivery.roastDate)).toEqual(['2025-03-19', '2025-03-26', '2025-04-02']);
  });

  it('keeps each cutoff at local noon across the US spring-forward change', () => {
    // Weekly on Fridays from 7 Mar 2025: cutoffs Thu 6 Mar 12:00 EST (17:00Z) and Thu 13 Mar 12:00 EDT (16:00Z).
    const deliveries = subscriptionDeliveries({ ...base, anchorDate: '2025-03-07', cadenceWeeks: 1, count: 2 }, shop);
    expect(deliveries.map((delivery) => delivery.cutoffAt)).toEqual(['2025-03-06T17:00:00.000Z', '2025-03-13T16:00:00.000Z']);
  });

  it('fails clearly when a closure outlasts the search horizon', () => {
    const longClosure = Object.fromEntries(Array.from({ length: 130 }, (_, offset) => [addDays('2025-03-05', offset), { open: false }]));
    expect(() => subscriptionDeliveries(base, shop, { overrides: longClosure })).toThrow(/No open roast day within 120 days of 2025-03-05/);
  });

  it('never drifts: each delivery is the first open roast day on or after its grid date', () => {
    const closures = fc.uniqueArray(fc.integer({ min: 0, max: 200 }), { maxLength: 40 });
    fc.assert(
      fc.property(
        closures,
        fc.constantFrom(1, 2, 3, 4 as const),
        fc.uniqueArray(fc.integer({ min: 0, max: 8 }), { maxLength: 3 }),
        (closed, cadence, skips) => {
          const cadenceWeeks = cadence as 1 | 2 | 3 | 4;
          const calendar: RoastCalendar = { overrides: Object.fromEntries(closed.map((offset) => [addDays('2025-03-05', offset), { open: false }])) };
          const skippedDates = skips.map((index) => addDays('2025-03-05', index * 7 * cadenceWeeks));
          const deliveries = subscriptionDeliveries({ ...base, cadenceWeeks, count: 8, skippedDates }, shop, calendar);
          deliveries.forEach((delivery, index) => {
            expect(delivery.nominalDate).toBe(addDays('2025-03-05', index * 7 * cadenceWeeks));
            expect(isOpenRoastDay(delivery.roastDate, shop, calendar)).toBe(true);
            for (let date = delivery.nominalDate; date < delivery.roastDate; date = addDays(date, 1)) {
              expect(isOpenRoastDay(date, shop, calendar)).toBe(false);
            }
            expect(delivery.status).toBe(skippedDates.includes(delivery.nominalDate) ? 'skipped' : 'scheduled');
          });
        },
      ),
    );
  });
});

describe('the Roast Calendar view and green orders', () => {
  it('lists each day with its state, capacity, plan and note', () => {
    const calendar: RoastCalendar = {
      overrides: { '2025-03-05': { open: false, note: 'Holiday' }, '2025-03-08': { open: true, capacityGrams: 20_000 } },
      plannedGreenGrams: { '2025-03-07': 41_000 },
    };
    const days = roastCalendarDays('2025-03-03', '2025-03-09', shop, calendar);
    expect(days.map((day) => [day.date, day.weekday, day.open, day.capacityGrams, day.plannedGreenGrams])).toEqual([
      ['2025-03-03', 'mon', true, 60_000, 0],
      ['2025-03-04', 'tue', false, 0, 0],
      ['2025-03-05', 'wed', false, 0, 0],
      ['2025-03-06', 'thu', false, 0, 0],
      ['2025-03-07', 'fri', true, 60_000, 41_000],
      ['2025-03-08', 'sat', true, 20_000, 0],
      ['2025-03-09', 'sun', false, 0, 0],
    ]);
    expect(days[2]?.note).toBe('Holiday');
    expect(() => roastCalendarDays('2025-03-09', '2025-03-03', shop)).toThrow(RangeError);
  });

  it('ships green coffee the same day before the cutoff time, else the next ship day', () => {
    // Fri 7 Mar 2025, 11:00 EST → ships Fri; arrives after 3 business days: Wed 12 Mar.
    expect(greenOrderDates(new Date('2025-03-07T16:00:00Z'), shop)).toEqual({ shipDate: '2025-03-07', expectedArrival: '2025-03-12' });
    // 13:00 EST → Sat is not a ship day → Mon 10 Mar; arrives Thu 13 Mar.
    expect(greenOrderDates(new Date('2025-03-07T18:00:00Z'), shop)).toEqual({ shipDate: '2025-03-10', expectedArrival: '2025-03-13' });
  });
});
