/**
 * Calendar dates and the shop's wall clock, independent of the host's time zone.
 *
 * Days (roast date, ship date) are ISO dates `YYYY-MM-DD` with no time zone: day arithmetic on
 * them cannot be disturbed by DST. Instants are `Date`s (UTC). The two meet only through an IANA
 * time zone, via the runtime's Intl time-zone data.
 *
 * - `isIsoDate(text)`, `addDays(date, n)`, `daysBetween(from, to)`, `weekdayOf(date)`.
 * - `isValidTimeZone(name)`, `isClockTime(text)` ("HH:MM", 24-hour).
 * - `utcOffsetMinutes(instant, timeZone)`: the zone's offset from UTC at an instant.
 * - `localDateOf(instant, timeZone)`, `localTimeOf(instant, timeZone)`: the shop's date and "HH:MM".
 * - `instantAt(date, time, timeZone)`: the instant a wall-clock time happens. A time skipped by a
 *   spring-forward change is read with the offset before the change (02:30 → 03:30 new time); a
 *   time repeated by a fall-back change is its first occurrence.
 */
import { weekdays, type Weekday } from './vocabulary';

export type IsoDate = string;

const MS_PER_MINUTE = 60_000;
const MS_PER_DAY = 86_400_000;
const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;
const CLOCK_TIME = /^([01]\d|2[0-3]):([0-5]\d)$/;

/**
 * Remembers a pure function's answers: schedules over thousands of subscriptions ask the same few
 * hundred days and instants again and again. Only successful answers are kept, and the memory is
 * emptied when it fills, so arbitrary input cannot grow it without bound.
 */
function remembered<K, V>(compute: (key: K) => V, limit = 20_000): (key: K) => V {
  const answers = new Map<K, V>();
  return (key) => {
    const known = answers.get(key);
    if (known !== undefined) return known;
    const answer = compute(key);
    if (answers.size >= limit) answers.clear();
    answers.set(key, answer);
    return answer;
  };
}

const epochDay = remembered(computeEpochDay);

function computeEpochDay(date: IsoDate): number {
  const match = ISO_DATE.exec(date);
  if (!match) throw new RangeError(`not an ISO date (YYYY-MM-DD): ${date}`);
  const [, year, month, day] = match.map(Number) as [number, number, number, number];
  const ms = Date.UTC(year, month - 1, day);
  const roundTrip = new Date(ms);
  if (roundTrip.getUTCMonth() !== month - 1 || roundTrip.getUTCDate() !== day || year < 1000) {
    throw new RangeError(`not a calendar date: ${date}`);
  }
  return ms / MS_PER_DAY;
}

const fromEpochDay = remembered((day: number): IsoDate => new Date(day * MS_PER_DAY).toISOString().slice(0, 10));

export function isIsoDate(text: string): boolean {
  try {
    epochDay(text);
    return true;
  } catch {
    return false;
  }
}

export function isClockTime(text: string): boolean {
  return CLOCK_TIME.test(text);
}

export function addDays(date: IsoDate, days: number): IsoDate {
  if (!Number.isSafeInteger(days)) throw new RangeError(`days must be whole, got ${days}`);
  return fromEpochDay(epochDay(date) + days);
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: IsoDate, to: IsoDate): number {
  return epochDay(to) - epochDay(from);
}

export function weekdayOf(date: IsoDate): Weekday {
  // Epoch day 0 (1970-01-01) was a Thursday, index 3 with Monday first.
  const index = (((epochDay(date) + 3) % 7) + 7) % 7;
  return weekdays[index] as Weekday;
}

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(timeZone: string): Intl.DateTimeFormat {
  let formatter = formatters.get(timeZone);
  if (!formatter) {
    formatter = new Intl.DateTimeFormat('en-US', {
      timeZone,
      hourCycle: 'h23',
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: 'numeric',
      minute: 'numeric',
      second: 'numeric',
    });
    formatters.set(timeZone, formatter);
  }
  return formatter;
}

export function isValidTimeZone(name: string): boolean {
  if (name.trim() === '') return false;
  try {
    formatterFor(name);
    return true;
  } catch {
    return false;
  }
}

interface WallClock {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
  second: number;
}

function wallClockAt(ms: number, timeZone: string): WallClock {
  const fields: Record<string, number> = {};
  for (const part of formatterFor(timeZone).formatToParts(ms)) {
    if (part.type !== 'literal') fields[part.type] = Number(part.value);
  }
  return {
    year: fields.year ?? NaN,
    month: fields.month ?? NaN,
    day: fields.day ?? NaN,
    hour: fields.hour ?? NaN,
    minute: fields.minute ?? NaN,
    second: fields.second ?? NaN,
  };
}

function wallClockAsUtcMs(clock: WallClock): number {
  return Date.UTC(clock.year, clock.month - 1, clock.day, clock.hour, clock.minute, clock.second);
}

function offsetMsAt(ms: number, timeZone: string): number {
  const wholeSeconds = Math.floor(ms / 1000) * 1000;
  return wallClockAsUtcMs(wallClockAt(wholeSeconds, timeZone)) - wholeSeconds;
}

export function utcOffsetMinutes(instant: Date, timeZone: string): number {
  return offsetMsAt(instant.getTime(), timeZone) / MS_PER_MINUTE;
}

function assertInstant(instant: Date): number {
  const ms = instant.getTime();
  if (Number.isNaN(ms)) throw new RangeError('invalid instant');
  return ms;
}

const pad = (value: number): string => String(value).padStart(2, '0');

const localDateAt = remembered((key: string): IsoDate => {
  const [ms, timeZone] = key.split('|') as [string, string];
  const clock = wallClockAt(Number(ms), timeZone);
  return `${String(clock.year).padStart(4, '0')}-${pad(clock.month)}-${pad(clock.day)}`;
});

export function localDateOf(instant: Date, timeZone: string): IsoDate {
  return localDateAt(`${assertInstant(instant)}|${timeZone}`);
}

export function localTimeOf(instant: Date, timeZone: string): string {
  const clock = wallClockAt(assertInstant(instant), timeZone);
  return `${pad(clock.hour)}:${pad(clock.minute)}`;
}

const instantMsAt = remembered((key: string): number => {
  const [date, time, timeZone] = key.split('|') as [IsoDate, string, string];
  return computeInstantAt(date, time, timeZone).getTime();
});

export function instantAt(date: IsoDate, time: string, timeZone: string): Date {
  // A fresh Date each time: callers may change the one they get.
  return new Date(instantMsAt(`${date}|${time}|${timeZone}`));
}

function computeInstantAt(date: IsoDate, time: string, timeZone: string): Date {
  const match = CLOCK_TIME.exec(time);
  if (!match) throw new RangeError(`not a clock time (HH:MM): ${time}`);
  const wallMs = epochDay(date) * MS_PER_DAY + (Number(match[1]) * 60 + Number(match[2])) * MS_PER_MINUTE;
  // Offsets a day either side straddle at most one change; try both and keep those that round-trip.
  const offsetBefore = offsetMsAt(wallMs - MS_PER_DAY, timeZone);
  const offsetAfter = offsetMsAt(wallMs + MS_PER_DAY, timeZone);
  const candidates = [wallMs - offsetBefore, wallMs - offsetAfter].filter((ms) => ms + offsetMsAt(ms, timeZone) === wallMs);
  if (candidates.length === 0) return new Date(wallMs - offsetBefore);
  return new Date(Math.min(...candidates));
}
