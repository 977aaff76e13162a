import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { averageDailyUseGrams, coverWindowDays, daysOfCover, isAtReorderPoint, useReasons } from './stock-cover';

describe('daysOfCover', () => {
  it('divides stock by the average daily use of the last four weeks', () => {
    // 28 days used 14 kg → 500 g a day; 6 kg on hand lasts 12 days.
    expect(daysOfCover(6000, 14_000)).toBe(12);
    expect(coverWindowDays).toBe(28);
  });

  it('rounds down to whole days, never promising a day the stock cannot cover', () => {
    // 100 g a day (2800 g over 28 days); 1050 g lasts 10.5 days → 10.
    expect(daysOfCover(1050, 2800)).toBe(10);
    expect(daysOfCover(99, 2800)).toBe(0);
  });

  it('is null when nothing was used in the window, and zero when the shelf is empty', () => {
    expect(daysOfCover(5000, 0)).toBeNull();
    expect(daysOfCover(0, 2800)).toBe(0);
  });

  it('takes another window length', () => {
    expect(daysOfCover(700, 700, 7)).toBe(7);
  });

  it('refuses fractional or negative grams and empty windows', () => {
    expect(() => daysOfCover(-1, 10)).toThrow(RangeError);
    expect(() => daysOfCover(10, 1.5)).toThrow(RangeError);
    expect(() => daysOfCover(10, 10, 0)).toThrow(RangeError);
  });

  it('never says the stock lasts longer than it does at the average pace', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000 }), fc.integer({ min: 1, max: 10_000_000 }), (stock, used) => {
        const days = daysOfCover(stock, used)!;
        // days × daily use ≤ stock < (days + 1) × daily use, in exact integers (× 28).
        expect(days * used).toBeLessThanOrEqual(stock * coverWindowDays);
        expect((days + 1) * used).toBeGreaterThan(stock * coverWindowDays);
      }),
    );
  });
});

describe('averageDailyUseGrams', () => {
  it('spreads the window use over its days, rounded down', () => {
    expect(averageDailyUseGrams(14_000)).toBe(500);
    expect(averageDailyUseGrams(27)).toBe(0);
  });
});

describe('isAtReorderPoint', () => {
  it('alerts at or below a set reorder point and never without one', () => {
    expect(isAtReorderPoint(5000, 5000)).toBe(true);
    expect(isAtReorderPoint(4999, 5000)).toBe(true);
    expect(isAtReorderPoint(5001, 5000)).toBe(false);
    expect(isAtReorderPoint(0, 0)).toBe(false);
  });
});

describe('useReasons', () => {
  it('counts sales and roasts as use, not samples, losses, counts or refunds', () => {
    expect([...useReasons].sort()).toEqual(['roast', 'sale']);
  });
});
