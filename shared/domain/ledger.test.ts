import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ledgerWeekStarts, monthlyRecurringCents, orderSalesKind, subscriptionWeeks, weekStartOf, type SubscriptionHistory } from './ledger';
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

describe('subscriptionWeeks', () => {
  // Two weeks in New York: Monday 1 March and Monday 8 March 2027 (EST, UTC−5, until 14 March).
  const weeks = ['2027-03-01', '2027-03-08'];
  const at = (instant: string) => new Date(instant);
  const subscription = (fields: Partial<SubscriptionHistory>): SubscriptionHistory => ({
    createdAt: at('2027-01-04T15:00:00Z'),
    cancelledAt: null,
    pausedAt: null,
    pausedUntil: null,
    priceCents: 3000,
    cadenceWeeks: 1,
    ...fields,
  });

  it('counts on the books, started, paused and cancelled by week, with the recurring revenue of those still paying', () => {
    const rows = [
      // Weekly at $30.00 since January: 13,000 cents a month in both weeks.
      subscription({}),
      // Started Wednesday 3 March, every 2 weeks at $30.00: 6,500 cents a month from the first week.
      subscription({ createdAt: at('2027-03-03T17:00:00Z'), cadenceWeeks: 2 }),
      // Paused Tuesday 9 March until 1 April: on the books, but no revenue at the end of the second week.
      subscription({ pausedAt: at('2027-03-09T17:00:00Z'), pausedUntil: '2027-04-01' }),
      // Cancelled Sunday 7 March 23:30 EST (Monday 04:30 UTC): counted in the first week, gone by its end.
      subscription({ cancelledAt: at('2027-03-08T04:30:00Z') }),
    ];
    expect(subscriptionWeeks(rows, weeks, 'America/New_York')).toEqual([
      { weekStart: '2027-03-01', active: 3, started: 1, paused: 0, cancelled: 1, monthlyRecurringCents: 13_000 + 6500 + 13_000 },
      { weekStart: '2027-03-08', active: 3, started: 0, paused: 1, cancelled: 0, monthlyRecurringCents: 13_000 + 6500 },
    ]);
  });
});
