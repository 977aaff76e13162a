import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ledgerWeekStarts, monthlyRecurringCents, orderSalesKind, weekStartOf } from './ledger';
import { weekdayOf } from './shop-time';

describe('ledgerWeekStarts', () => {
  it('ends with the Monday of the week holding today (ISO 8601 weeks start on Monday)', () => {
    // Thursday 4 March 2027 → Monday 1 March; the two weeks before start 15 and 22 February.
    expect(ledgerWeekStarts('2027-03-04', 3)).toEqual(['2027-02-15', '2027-02-22', '2027-03-01']);
    // A Sunday belongs to the week that began six days before it.
    expect(weekStartOf('2027-03-07')).toBe('2027-03-01');
    expect(weekStartOf('2027-03-01')).toBe('2027-03-01');
  });

  it('every start is a Monday, seven days apart', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 20_000 }), fc.integer({ min: 1, max: 60 }), (offset, weeks) => {
        const today = new Date(Date.UTC(2000, 0, 1) + offset * 86_400_000).toISOString().slice(0, 10);
        const starts = ledgerWeekStarts(today, weeks);
        expect(starts).toHaveLength(weeks);
        for (const start of starts) expect(weekdayOf(start)).toBe('mon');
        expect(starts.at(-1)! <= today).toBe(true);
      }),
    );
  });
});

describe('monthlyRecurringCents', () => {
  it('is a delivery price × 52 ÷ 12 ÷ cadence, half up (52 weeks a year, common practice)', () => {
    // $30.00 weekly: 3,000 × 52 ÷ 12 = 13,000 cents; every 2 weeks 6,500; every 3 weeks 4,333.33 → 4,333.
    expect(monthlyRecurringCents(3000, 1)).toBe(13_000);
    expect(monthlyRecurringCents(3000, 2)).toBe(6500);
    expect(monthlyRecurringCents(3000, 3)).toBe(4333);
    // $19.99 every 4 weeks: 1,999 × 52 ÷ 48 = 2,165.58 → 2,166.
    expect(monthlyRecurringCents(1999, 4)).toBe(2166);
  });
});

describe('orderSalesKind', () => {
  it('tells green, a roasted one-off and a subscription delivery apart', () => {
    expect(orderSalesKind('green', null)).toBe('green');
    expect(orderSalesKind('roasted', null)).toBe('roasted');
    expect(orderSalesKind('roasted', 'sub-1')).toBe('subscription');
  });
});
