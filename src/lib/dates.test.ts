import { describe, expect, it } from 'vitest';
import {
  formatDay,
  formatDayLong,
  formatDayLongNoYear,
  formatDayShort,
  formatDayShortWithWeekday,
  formatDayWithWeekday,
  formatInstant,
  formatInstantDate,
  formatInstantWithWeekday,
  formatMonth,
} from './dates';

describe('dates as people read them', () => {
  it('prints a shop day as written, whatever the zone', () => {
    expect(formatDay('2026-12-04')).toBe('Dec 4, 2026');
    expect(formatDayShort('2026-12-03')).toBe('Dec 3');
    expect(formatDayShortWithWeekday('2026-12-03')).toBe('Thu, Dec 3');
    expect(formatDayWithWeekday('2026-12-09')).toBe('Wed, Dec 9, 2026');
    expect(formatDayLongNoYear('2026-12-03')).toBe('Thursday, December 3');
    expect(formatDayLong('2026-12-03')).toBe('Thursday, December 3, 2026');
    expect(formatMonth('2026-12')).toBe('December 2026');
  });

  it('prints an instant in the reader’s zone', () => {
    expect(formatInstant(new Date('2026-12-01T16:05:00'))).toBe('Dec 1, 2026, 4:05 PM');
    expect(formatInstantDate(new Date('2026-12-01T16:05:00'))).toBe('Dec 1, 2026');
    expect(formatInstantWithWeekday(new Date('2026-12-08T12:00:00'))).toBe('Tue, Dec 8, 12:00 PM');
  });
});
