import { describe, expect, it } from 'vitest';
import { addMonths, monthRange, monthWeeks, parseMonth } from './calendar-month';

describe('Roast Calendar months', () => {
  it('steps across year ends both ways', () => {
    expect(addMonths('2026-12', 1)).toBe('2027-01');
    expect(addMonths('2027-01', -1)).toBe('2026-12');
    expect(addMonths('2026-03', -14)).toBe('2025-01');
  });

  it('spans a whole month, leap February included', () => {
    expect(monthRange('2026-12')).toEqual({ from: '2026-12-01', to: '2026-12-31' });
    expect(monthRange('2028-02')).toEqual({ from: '2028-02-01', to: '2028-02-29' });
    expect(monthRange('2026-02')).toEqual({ from: '2026-02-01', to: '2026-02-28' });
  });

  it('lays a month out in Monday-first weeks', () => {
    // December 1, 2026 is a Tuesday (any wall calendar for 2026).
    const weeks = monthWeeks('2026-12');
    expect(weeks[0]).toEqual([null, '2026-12-01', '2026-12-02', '2026-12-03', '2026-12-04', '2026-12-05', '2026-12-06']);
    expect(weeks.at(-1)).toEqual(['2026-12-28', '2026-12-29', '2026-12-30', '2026-12-31', null, null, null]);
    expect(weeks.flat().filter(Boolean)).toHaveLength(31);
  });

  it('reads only a real month from the address', () => {
    expect(parseMonth('2026-12')).toBe('2026-12');
    expect(parseMonth('2026-13')).toBeNull();
    expect(parseMonth('december')).toBeNull();
    expect(parseMonth(null)).toBeNull();
  });
});
