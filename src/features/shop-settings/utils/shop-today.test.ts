import { describe, expect, it } from 'vitest';
import { shopToday } from './shop-today';

describe('the shop’s today', () => {
  it('is the date on the shop’s wall calendar, not the server’s or UTC’s', () => {
    // 02:30 UTC on December 2 is still the evening of December 1 in Denver (UTC−7 in winter; IANA tz database).
    const instant = new Date('2026-12-02T02:30:00Z');
    expect(shopToday({ timeZone: 'America/Denver' }, instant)).toBe('2026-12-01');
    expect(shopToday({ timeZone: 'Europe/Berlin' }, instant)).toBe('2026-12-02');
  });
});
