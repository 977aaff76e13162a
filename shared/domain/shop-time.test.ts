import { TZDate, tzOffset } from '@date-fns/tz';
import { addDays as addDaysReference, differenceInCalendarDays, format, getISODay } from 'date-fns';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { addDays, daysBetween, instantAt, isClockTime, isIsoDate, isValidTimeZone, localDateOf, localTimeOf, utcOffsetMinutes, weekdayOf } from './shop-time';
import { weekdays } from './vocabulary';

// The reference for every check here is date-fns 4 with @date-fns/tz, an independent library.
const zones = [
  'America/New_York',
  'America/Denver',
  'America/Phoenix',
  'Australia/Sydney',
  'Australia/Lord_Howe',
  'America/Santiago',
  'Pacific/Auckland',
  'Europe/London',
  'Asia/Kolkata',
  'America/St_Johns',
  'UTC',
];

const isoDate = fc
  .integer({ min: Date.UTC(2020, 0, 1) / 86_400_000, max: Date.UTC(2030, 11, 31) / 86_400_000 })
  .map((day) => new Date(day * 86_400_000).toISOString().slice(0, 10));
const clockTime = fc
  .integer({ min: 0, max: 24 * 60 - 1 })
  .map((minutes) => `${String(Math.floor(minutes / 60)).padStart(2, '0')}:${String(minutes % 60).padStart(2, '0')}`);
const instant = fc.integer({ min: Date.UTC(2020, 0, 1), max: Date.UTC(2030, 11, 31) }).map((ms) => new Date(ms));

/**
 * Compares `instantAt` with @date-fns/tz. In a repeated (fall-back) hour the reference picks one
 * occurrence or the other depending on the zone; Restday always takes the first. There both must
 * show the asked wall time and Restday's must be the earlier.
 */
function checkAgainstReference(date: string, time: string, zone: string): void {
  const [year, month, day] = date.split('-').map(Number) as [number, number, number];
  const [hour, minute] = time.split(':').map(Number) as [number, number];
  const reference = new TZDate(year, month - 1, day, hour, minute, zone).getTime();
  const mine = instantAt(date, time, zone).getTime();
  if (mine === reference) return;
  const wallClock = (ms: number): string => format(new TZDate(ms, zone), 'yyyy-MM-dd HH:mm');
  expect(wallClock(mine), `${date} ${time} ${zone}`).toBe(`${date} ${time}`);
  expect(wallClock(reference), `${date} ${time} ${zone}`).toBe(`${date} ${time}`);
  expect(mine).toBeLessThan(reference);
}

function referenceDate(date: string): TZDate {
  const [year, month, day] = date.split('-').map(Number) as [number, number, number];
  return new TZDate(year, month - 1, day, 'UTC');
}

describe('calendar dates', () => {
  it('adds days and counts them like date-fns', () => {
    fc.assert(
      fc.property(isoDate, fc.integer({ min: -1000, max: 1000 }), (date, days) => {
        const expected = format(addDaysReference(referenceDate(date), days), 'yyyy-MM-dd');
        expect(addDays(date, days)).toBe(expected);
        expect(daysBetween(date, expected)).toBe(differenceInCalendarDays(referenceDate(expected), referenceDate(date)));
      }),
    );
  });

  it('names the weekday like date-fns (ISO, Monday first)', () => {
    fc.assert(
      fc.property(isoDate, (date) => {
        expect(weekdayOf(date)).toBe(weekdays[getISODay(referenceDate(date)) - 1]);
      }),
    );
    expect(weekdayOf('2025-03-09')).toBe('sun'); // US DST started on Sunday 9 March 2025 (common practice: second Sunday in March)
  });

  it('refuses what is not a calendar date or a clock time', () => {
    expect(isIsoDate('2025-02-29')).toBe(false);
    expect(isIsoDate('2024-02-29')).toBe(true);
    expect(isIsoDate('2025-13-01')).toBe(false);
    expect(isIsoDate('25-01-01')).toBe(false);
    expect(() => addDays('2025-01-01', 1.5)).toThrow(RangeError);
    expect(isClockTime('23:59')).toBe(true);
    expect(isClockTime('24:00')).toBe(false);
    expect(isClockTime('9:00')).toBe(false);
    expect(() => instantAt('2025-01-01', '25:00', 'UTC')).toThrow(RangeError);
    expect(() => localDateOf(new Date(Number.NaN), 'UTC')).toThrow(RangeError);
  });
});

describe('the shop wall clock', () => {
  it('knows valid IANA zones', () => {
    expect(isValidTimeZone('America/Denver')).toBe(true);
    expect(isValidTimeZone('Mars/Olympus_Mons')).toBe(false);
    expect(isValidTimeZone('')).toBe(false);
  });

  it('gives the local date, time and offset of any instant like @date-fns/tz', () => {
    fc.assert(
      fc.property(instant, fc.constantFrom(...zones), (at, zone) => {
        const reference = new TZDate(at.getTime(), zone);
        expect(localDateOf(at, zone)).toBe(format(reference, 'yyyy-MM-dd'));
        expect(localTimeOf(at, zone)).toBe(format(reference, 'HH:mm'));
        expect(utcOffsetMinutes(at, zone)).toBe(tzOffset(zone, at));
      }),
    );
  });

  it('finds the instant of any wall-clock time like @date-fns/tz, DST gaps and overlaps included', () => {
    fc.assert(
      fc.property(isoDate, clockTime, fc.constantFrom(...zones), (date, time, zone) => {
        checkAgainstReference(date, time, zone);
      }),
      { numRuns: 2000 },
    );
  });

  it('agrees with @date-fns/tz every 10 minutes of the 2025 DST change days, in every zone', () => {
    // Change days (2025): US, UK, Chile, New Zealand, Australia (Sydney and Lord Howe, whose change is 30 minutes).
    const changeDays = [
      '2025-03-09',
      '2025-11-02',
      '2025-03-30',
      '2025-10-26',
      '2025-04-05',
      '2025-04-06',
      '2025-09-06',
      '2025-09-07',
      '2025-09-28',
      '2025-10-05',
    ];
    for (const date of changeDays) {
      for (const zone of zones) {
        for (let minutes = 0; minutes < 24 * 60; minutes += 10) {
          const time = `${String(Math.floor(minutes / 60)).padStart(2, '0')}:${String(minutes % 60).padStart(2, '0')}`;
          checkAgainstReference(date, time, zone);
        }
      }
    }
  });

  it('handles the US spring-forward and fall-back days', () => {
    // 9 March 2025, New York: 02:00 EST → 03:00 EDT. 01:59 EST = 06:59Z; 02:30 does not exist and reads as 03:30 EDT = 07:30Z.
    expect(instantAt('2025-03-09', '01:59', 'America/New_York').toISOString()).toBe('2025-03-09T06:59:00.000Z');
    expect(instantAt('2025-03-09', '02:30', 'America/New_York').toISOString()).toBe('2025-03-09T07:30:00.000Z');
    expect(instantAt('2025-03-09', '12:00', 'America/New_York').toISOString()).toBe('2025-03-09T16:00:00.000Z');
    // 2 November 2025: 02:00 EDT → 01:00 EST. 01:30 happens twice; the first (EDT, 05:30Z) is used.
    expect(instantAt('2025-11-02', '01:30', 'America/New_York').toISOString()).toBe('2025-11-02T05:30:00.000Z');
    expect(instantAt('2025-11-02', '12:00', 'America/New_York').toISOString()).toBe('2025-11-02T17:00:00.000Z');
    // Denver, the demo shop: noon MST = 19:00Z before the change, noon MDT = 18:00Z after.
    expect(instantAt('2025-03-08', '12:00', 'America/Denver').toISOString()).toBe('2025-03-08T19:00:00.000Z');
    expect(instantAt('2025-03-10', '12:00', 'America/Denver').toISOString()).toBe('2025-03-10T18:00:00.000Z');
  });

  it('handles a southern-hemisphere zone, where DST starts in October', () => {
    // Sydney, 5 October 2025: 02:00 AEST (+10) → 03:00 AEDT (+11). 02:30 reads as 03:30 AEDT = 16:30Z the day before.
    expect(instantAt('2025-10-05', '02:30', 'Australia/Sydney').toISOString()).toBe('2025-10-04T16:30:00.000Z');
    // 6 April 2025: 03:00 AEDT → 02:00 AEST. 02:30 happens twice; Restday takes the first (AEDT), 15:30Z the day before.
    expect(instantAt('2025-04-06', '02:30', 'Australia/Sydney').toISOString()).toBe('2025-04-05T15:30:00.000Z');
    expect(localDateOf(new Date('2025-10-04T14:00:00Z'), 'Australia/Sydney')).toBe('2025-10-05');
  });
});
