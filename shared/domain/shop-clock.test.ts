import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatShopInstant } from './shop-clock';

// Offsets from the IANA time zone database: America/Chicago is UTC−6 (CST) in winter, UTC−5 (CDT)
// from the second Sunday of March; America/Denver is UTC−7 (MST) in winter, UTC−6 (MDT) in summer.
describe('formatShopInstant (the staff pages’ one clock)', () => {
  it('reads an instant in the shop’s zone and names the zone', () => {
    expect(formatShopInstant('2026-12-03T16:03:00.000Z', 'America/Chicago', 'time')).toBe('10:03 AM CST');
    expect(formatShopInstant('2026-12-03T16:03:00.000Z', 'America/Denver', 'time')).toBe('9:03 AM MST');
    expect(formatShopInstant('2026-07-01T16:03:00.000Z', 'America/Denver', 'time')).toBe('10:03 AM MDT');
    expect(formatShopInstant('2026-12-03T16:03:00.000Z', 'America/Chicago', 'date-time')).toBe('Dec 3, 2026, 10:03 AM CST');
  });

  it('gives the shop’s day of an instant, which can differ from the UTC day', () => {
    // 02:30 UTC on Dec 4 is still the evening of Dec 3 in Chicago (UTC−6).
    expect(formatShopInstant('2026-12-04T02:30:00.000Z', 'America/Chicago', 'date')).toBe('Dec 3, 2026');
    expect(formatShopInstant('2026-12-04T02:30:00.000Z', 'UTC', 'date')).toBe('Dec 4, 2026');
  });

  it('always labels a time with its zone, whatever the instant and zone', () => {
    const zones = ['America/Chicago', 'America/Denver', 'America/New_York', 'America/Los_Angeles', 'Pacific/Honolulu', 'Europe/Berlin', 'UTC'];
    fc.assert(
      fc.property(fc.date({ min: new Date('2000-01-01'), max: new Date('2100-01-01'), noInvalidDate: true }), fc.constantFrom(...zones), (instant, zone) => {
        const time = formatShopInstant(instant, zone, 'time');
        expect(time).toMatch(/^\d{1,2}:\d{2}\s[AP]M\s\S+$/);
        expect(formatShopInstant(instant, zone, 'date-time').endsWith(time.replace(/^.*?(\d{1,2}:\d{2})/, '$1'))).toBe(true);
      }),
    );
  });
});
