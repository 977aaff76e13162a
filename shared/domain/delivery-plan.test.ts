import { describe, expect, it } from 'vitest';
import {
  deliveryGreenGrams,
  deliveryToCharge,
  firstRoastDates,
  nextDelivery,
  planDeliveries,
  roastDatesWhenPaid,
  type KeptDelivery,
  type SubscriptionForPlan,
} from './delivery-plan';
import { defaultLossModel } from './roast-loss';
import type { ScheduleSettings } from './roast-schedule';

// A shop in New York roasting Monday, Wednesday and Friday, cutoff 12:00 the day before, shipping on
// weekdays after a one-day degassing hold, filter rest 2 days, espresso 7, best-before 28 days.
const settings: ScheduleSettings = {
  timeZone: 'America/New_York',
  roastWeekdays: ['mon', 'wed', 'fri'],
  cutoff: { time: '12:00', daysBefore: 1 },
  shipWeekdays: ['mon', 'tue', 'wed', 'thu', 'fri'],
  transitDays: 3,
  degasHoldDays: 1,
  restDays: { filter: 2, espresso: 7 },
  restAdjustDays: { light: 0, medium: 0, 'medium-dark': 0, dark: 0, french: 0 },
  bestBeforeDays: 28,
  dayCapacityGrams: 60_000,
  // Which delivery a charge is for does not depend on the ship day: ship straight after the hold.
  shipPolicy: 'after_degassing',
  holdOverWeekend: false,
};
const choice = { roastLevel: 'medium', bagSize: '12oz', bagsPerDelivery: 1, grind: 'whole-bean', brewMethod: 'filter' } as const;
const weekly: SubscriptionForPlan = { status: 'active', anchorDate: '2031-01-06', cadenceWeeks: 1, pausedUntil: null, cancelAtPeriodEnd: false, choice };
// Monday 6 January 2031, 10:00 EST.
const now = new Date('2031-01-06T15:00:00Z');

function row(nominalDate: string, overrides: Partial<KeptDelivery> = {}): KeptDelivery {
  return {
    id: `row-${nominalDate}`,
    nominalDate,
    roastDate: nominalDate,
    shipDate: nominalDate,
    readyFrom: nominalDate,
    bestBefore: nominalDate,
    status: 'scheduled',
    orderId: null,
    choice: null,
    ...overrides,
  };
}

describe('planDeliveries', () => {
  it('lays kept rows over the weekly grid: a skipped date stays skipped, a frozen row keeps its dates, an unfrozen one follows the subscription', () => {
    const kept = [
      row('2031-01-06', { choice: { ...choice, roastLevel: 'dark' }, shipDate: '2031-01-07', readyFrom: '2031-01-08', bestBefore: '2031-02-03' }),
      row('2031-01-13', { status: 'skipped' }),
      row('2031-01-20', { orderId: 'order-1' }),
    ];
    const plan = planDeliveries({ ...weekly, choice: { ...choice, brewMethod: 'espresso' } }, kept, settings, {}, now, 4);
    expect(plan.map((d) => [d.roastDate, d.status, d.locked, d.choice.roastLevel, d.readyFrom])).toEqual([
      // Frozen: the stored dates and the dark level it had when its cutoff (Sunday 12:00) passed.
      ['2031-01-06', 'scheduled', true, 'dark', '2031-01-08'],
      // Unfrozen rows and the grid follow the subscription now: espresso rests 7 days.
      ['2031-01-13', 'skipped', false, 'medium', '2031-01-20'],
      ['2031-01-20', 'scheduled', false, 'medium', '2031-01-27'],
      ['2031-01-27', 'scheduled', false, 'medium', '2031-02-03'],
    ]);
    expect(plan.map((d) => d.keptId)).toEqual(['row-2031-01-06', 'row-2031-01-13', 'row-2031-01-20', null]);
  });

  it('a closed roast day moves a grid delivery to the next open one; a pause drops grid dates before it; a pending cancellation leaves only kept rows', () => {
    const closed = { overrides: { '2031-01-13': { open: false } } };
    // Monday 13 closed → Wednesday 15.
    expect(planDeliveries(weekly, [], settings, closed, now, 3).map((d) => d.roastDate)).toEqual(['2031-01-06', '2031-01-15', '2031-01-20']);
    expect(planDeliveries({ ...weekly, pausedUntil: '2031-01-25' }, [], settings, {}, now, 2).map((d) => d.roastDate)).toEqual(['2031-01-27', '2031-02-03']);
    expect(planDeliveries({ ...weekly, cancelAtPeriodEnd: true }, [row('2031-01-13', { orderId: 'o' })], settings, {}, now, 3).map((d) => d.roastDate)).toEqual(
      ['2031-01-13'],
    );
    expect(planDeliveries({ ...weekly, anchorDate: null }, [], settings, {}, now, 3)).toEqual([]);
  });

  it('shows a held row even after its roast date, and hides a shipped one', () => {
    const plan = planDeliveries(weekly, [row('2030-12-30', { status: 'held' }), row('2031-01-06', { status: 'shipped', orderId: 'o' })], settings, {}, now, 2);
    expect(plan.map((d) => `${d.roastDate} ${d.status}`)).toEqual(['2030-12-30 held', '2031-01-13 scheduled']);
  });
});

describe('deliveryToCharge and nextDelivery', () => {
  it('a charge pays for a held delivery first, else the first neither paid nor skipped', () => {
    const paidThenSkipped = planDeliveries(weekly, [row('2031-01-06', { orderId: 'o' }), row('2031-01-13', { status: 'skipped' })], settings, {}, now, 4);
    expect(deliveryToCharge(paidThenSkipped)?.roastDate).toBe('2031-01-20');
    expect(nextDelivery(paidThenSkipped)?.roastDate).toBe('2031-01-06');
    const withHeld = planDeliveries(weekly, [row('2031-01-13', { status: 'held' })], settings, {}, now, 4);
    expect(deliveryToCharge(withHeld)?.roastDate).toBe('2031-01-13');
  });
});

describe('firstRoastDates and roastDatesWhenPaid', () => {
  it('the first delivery roasts on the first open roast day whose cutoff is ahead', () => {
    // Monday 10:00: Monday's cutoff (Sunday 12:00) has passed; Wednesday's (Tuesday 12:00) is ahead.
    expect(firstRoastDates(now, choice, settings, {}).roastDate).toBe('2031-01-08');
  });

  it('a delivery paid before its cutoff keeps its day; paid after, it moves to the next open roast day', () => {
    const [delivery] = planDeliveries(weekly, [], settings, {}, now, 2).slice(1);
    // Monday 13's cutoff is Sunday 12 at 12:00 EST (17:00 UTC).
    expect(roastDatesWhenPaid(delivery!, new Date('2031-01-12T16:59:00Z'), settings, {}).roastDate).toBe('2031-01-13');
    // At 12:00 exactly it has passed: Wednesday 15 (cutoff Tuesday 12:00) is the next.
    expect(roastDatesWhenPaid(delivery!, new Date('2031-01-12T17:00:00Z'), settings, {}).roastDate).toBe('2031-01-15');
  });
});

describe('deliveryGreenGrams', () => {
  it('2 × 12 oz at medium needs 819 g of green', () => {
    // 2 × 341 g fill (12 oz = 340.19 g, rounded up; NIST SP 811) = 682 g roasted; + 2 % overage (Restday default)
    // = 695.64 g; ÷ (1 − 0.15) medium loss (usual trade figures, from memory) = 818.4 g → rounded up to 819 g.
    expect(deliveryGreenGrams({ roastLevel: 'medium', bagSize: '12oz', bagsPerDelivery: 2 }, { lossModel: defaultLossModel, overagePct: 2 })).toBe(819);
  });
});
