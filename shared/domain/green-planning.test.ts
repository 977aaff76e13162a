import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { KeptDelivery } from './delivery-plan';
import { earliestNominalDateStillAhead, planGreen, subscriptionRoastDemand, type GreenPlanInput, type SubscriptionForPlanning } from './green-planning';
import { defaultLossModel } from './roast-loss';
import type { RoastCalendar, ScheduleSettings } from './roast-schedule';

// A shop in New York that roasts on Tuesdays only, cutoff 12:00 the day before.
const schedule: ScheduleSettings = {
  timeZone: 'America/New_York',
  roastWeekdays: ['tue'],
  cutoff: { time: '12:00', daysBefore: 1 },
  shipWeekdays: ['mon', 'tue', 'wed', 'thu', 'fri'],
  transitDays: 3,
  degasHoldDays: 1,
  restDays: { filter: 2, espresso: 7 },
  restAdjustDays: { light: 0, medium: 0, 'medium-dark': 0, dark: 0, french: 0 },
  bestBeforeDays: 28,
  dayCapacityGrams: 60_000,
  shipPolicy: 'after_degassing',
  holdOverWeekend: false,
};
// Medium's default loss 15 % (from memory: medium 14–16 %, midpoint); overage 2 % (the shop's own setting).
const roastSettings = {
  overagePct: 2,
  lossModel: defaultLossModel,
  lossModelMinBatches: 3,
  roaster: { capacityGrams: 15_000, minLoadPct: 50, maxLoadPct: 80 },
};
// Monday 1 March 2027, 08:00 EST: before the cutoff of Tuesday 2 March's roast.
const now = new Date('2027-03-01T13:00:00Z');
const today = '2027-03-01';
const until = '2027-04-25'; // today + 8 weeks − 1 day

const choice = { roastLevel: 'medium', bagSize: '12oz', bagsPerDelivery: 2, grind: 'whole-bean', brewMethod: 'filter' } as const;

function weekly(overrides: Partial<SubscriptionForPlanning> = {}): SubscriptionForPlanning {
  return {
    status: 'active',
    anchorDate: '2027-03-02',
    cadenceWeeks: 1,
    pausedUntil: null,
    cancelAtPeriodEnd: false,
    choice,
    lotCode: 'LOT-A',
    kept: [],
    ...overrides,
  };
}

function skippedOn(nominalDate: string): KeptDelivery {
  return {
    id: `skip-${nominalDate}`,
    nominalDate,
    roastDate: nominalDate,
    shipDate: nominalDate,
    readyFrom: nominalDate,
    bestBefore: nominalDate,
    status: 'skipped',
    orderId: null,
    choice: null,
  };
}

function planFor(subscriptions: SubscriptionForPlanning[], calendar: RoastCalendar = {}, lot: Partial<GreenPlanInput['lots'][number]> = {}) {
  const demand = subscriptionRoastDemand(subscriptions, schedule, calendar, now, until);
  return planGreen({
    today,
    weeks: 8,
    lots: [{ code: 'LOT-A', stockGrams: 20_000, leadTimeDays: 14, greenSoldGrams: 0, ...lot }],
    demand,
    settings: roastSettings,
  }).lots[0]!;
}

const four = () => [weekly(), weekly(), weekly(), weekly()];

describe('planGreen — one lot, four weekly subscriptions of 2 × 12 oz at medium', () => {
  // 12 oz = 340.19 g, filled to 341 g (NIST SP 811: 1 oz = 28.349523125 g; rounded up to a whole gram).
  // Roasted per Tuesday: 4 subscriptions × 2 bags × 341 g = 2,728 g.
  // Green per Tuesday: ceil(2,728 × 1.02 ÷ (1 − 0.15)) = ceil(2,782.56 ÷ 0.85) = ceil(3,273.6) = 3,274 g.
  // Stock 20,000 g: six Tuesdays take 6 × 3,274 = 19,644 g, leaving 356 g; the seventh (13 April) needs 3,274 g.
  // Run-out day Tuesday 13 April 2027, in the week from Monday 12 April; reorder by 13 April − 14 days = 30 March.
  it('runs out on the seventh roast day and must be reordered 14 days before it', () => {
    const plan = planFor(four());
    expect(plan.weeks.map((week) => week.roastGreenGrams)).toEqual([3274, 3274, 3274, 3274, 3274, 3274, 3274, 3274]);
    expect(plan.weeks[5]!.stockAfterGrams).toBe(20_000 - 6 * 3274);
    expect(plan.needGrams).toBe(8 * 3274);
    expect(plan.runOutDate).toBe('2027-04-13');
    expect(plan.runOutWeek).toBe('2027-04-12');
    expect(plan.reorderBy).toBe('2027-03-30');
    expect(plan.reorderNow).toBe(false);
  });

  // All four skip Tuesday 16 March: that week needs nothing, so 20,000 g covers six roast days out of
  // the first seven weeks (19,644 g) and the run-out moves a week on, to 20 April; reorder by 6 April.
  it('a week every subscriber skips moves the run-out a week later', () => {
    const plan = planFor(four().map((subscription) => ({ ...subscription, kept: [skippedOn('2027-03-16')] })));
    expect(plan.weeks[2]!.roastGreenGrams).toBe(0);
    expect(plan.runOutDate).toBe('2027-04-20');
    expect(plan.reorderBy).toBe('2027-04-06');
  });

  // One subscriber skips 16 March: 3 × 2 × 341 = 2,046 g roasted → ceil(2,046 × 1.02 ÷ 0.85) = ceil(2,455.2) = 2,456 g.
  // Weeks 1–6 take 5 × 3,274 + 2,456 = 18,826 g, leaving 1,174 g: still short on 13 April.
  it('one skip lowers its week and leaves the run-out where it was', () => {
    const subscriptions = four();
    subscriptions[0] = { ...subscriptions[0]!, kept: [skippedOn('2027-03-16')] };
    const plan = planFor(subscriptions);
    expect(plan.weeks[2]!.roastGreenGrams).toBe(2456);
    expect(plan.weeks[5]!.stockAfterGrams).toBe(20_000 - 18_826);
    expect(plan.runOutDate).toBe('2027-04-13');
  });

  // Two subscribers pause until 23 March: the first three Tuesdays roast for two, 2 × 2 × 341 = 1,364 g →
  // ceil(1,364 × 1.02 ÷ 0.85) = ceil(1,636.8) = 1,637 g each. After seven weeks: 3 × 1,637 + 4 × 3,274 = 18,007 g,
  // leaving 1,993 g; Tuesday 20 April needs 3,274 g → run-out 20 April, reorder by 6 April.
  it('a pause lowers the weeks it covers and moves the run-out later', () => {
    const subscriptions = four();
    subscriptions[0] = { ...subscriptions[0]!, pausedUntil: '2027-03-23' };
    subscriptions[1] = { ...subscriptions[1]!, pausedUntil: '2027-03-23' };
    const plan = planFor(subscriptions);
    expect(plan.weeks.slice(0, 4).map((week) => week.roastGreenGrams)).toEqual([1637, 1637, 1637, 3274]);
    expect(plan.weeks[6]!.stockAfterGrams).toBe(1993);
    expect(plan.runOutDate).toBe('2027-04-20');
    expect(plan.reorderBy).toBe('2027-04-06');
  });

  // Closing Tuesday 13 April moves its deliveries to the next open roast day, 20 April: that week needs
  // nothing and 20 April roasts 8 × 2 × 341 = 5,456 g → ceil(5,456 × 1.02 ÷ 0.85) = ceil(6,547.2) = 6,548 g.
  // The 356 g left after six weeks last until 20 April; reorder by 6 April.
  it('a closed roast day moves its need to the next open day, and the run-out with it', () => {
    const plan = planFor(four(), { overrides: { '2027-04-13': { open: false } } });
    expect(plan.weeks[6]!.roastGreenGrams).toBe(0);
    expect(plan.weeks[7]!.roastGreenGrams).toBe(6548);
    expect(plan.runOutDate).toBe('2027-04-20');
    expect(plan.reorderBy).toBe('2027-04-06');
  });

  // 2,800 g of green sold over the last 28 days is 100 g a day; by Tuesday 30 March (day 30) sales have
  // taken 3,000 g and five roast days 16,370 g: 19,370 g. By 6 April (day 37): 3,700 + 19,644 = 23,344 g > 20,000.
  // Day by day: the first day past 20,000 g is Tuesday 6 April (Monday 5 April stands at 3,600 + 16,370 = 19,970 g).
  it('the recent pace of green sales brings the run-out forward', () => {
    const plan = planFor(four(), {}, { greenSoldGrams: 2800 });
    expect(plan.weeks[0]!.salesGreenGrams).toBe(700);
    expect(plan.runOutDate).toBe('2027-04-06');
    expect(plan.reorderBy).toBe('2027-03-23');
  });

  it('a lead time longer than the stock lasts asks for the order now', () => {
    const plan = planFor(four(), {}, { stockGrams: 5000, leadTimeDays: 14 });
    // 5,000 g covers 2 March (3,274 g) but not 9 March: reorder by 23 February, already past.
    expect(plan.runOutDate).toBe('2027-03-09');
    expect(plan.reorderBy).toBe('2027-02-23');
    expect(plan.reorderNow).toBe(true);
  });

  it('a cancelled subscription and a lot nobody buys need nothing', () => {
    const plan = planFor([weekly({ status: 'cancelled' })]);
    expect(plan.needGrams).toBe(0);
    expect(plan.runOutDate).toBeNull();
    expect(plan.reorderBy).toBeNull();
  });
});

describe('earliestNominalDateStillAhead — which kept deliveries a plan from today still reads', () => {
  it('is the day after the last open roast day before today (Tuesdays only: Tuesday 23 February 2027 → Wednesday 24 February)', () => {
    expect(earliestNominalDateStillAhead('2027-03-01', schedule, {})).toBe('2027-02-24');
    // Today itself a roast day: the last one before it is a week back.
    expect(earliestNominalDateStillAhead('2027-03-02', schedule, {})).toBe('2027-02-24');
  });

  it('reaches back past a closed roast day: a delivery due on it moved to today or later', () => {
    const closed: RoastCalendar = { overrides: { '2027-02-23': { open: false } } };
    expect(earliestNominalDateStillAhead('2027-03-01', schedule, closed)).toBe('2027-02-17');
  });

  it('falls back to the search horizon when no roast day was open in it', () => {
    // 120 days before 1 March 2027: 28 (February) + 31 (January) + 31 (December) + 30 (November) → 1 November 2026.
    expect(earliestNominalDateStillAhead('2027-03-01', { ...schedule, roastWeekdays: [] }, {})).toBe('2026-11-01');
  });
});

describe('planGreen — Roaster’s Rotation', () => {
  it('a picked day charges its lot; an unpicked day is counted apart', () => {
    const rotation = weekly({ lotCode: null });
    const demand = subscriptionRoastDemand([rotation], schedule, {}, now, until, { '2027-03-02': 'LOT-A' });
    const plan = planGreen({
      today,
      weeks: 2,
      lots: [{ code: 'LOT-A', stockGrams: 20_000, leadTimeDays: 14, greenSoldGrams: 0 }],
      demand,
      settings: roastSettings,
    });
    // 2 × 341 = 682 g roasted → ceil(682 × 1.02 ÷ 0.85) = ceil(818.4) = 819 g green.
    expect(plan.lots[0]!.weeks.map((week) => week.roastGreenGrams)).toEqual([819, 0]);
    expect(plan.unpickedRotationGreenGrams).toEqual([0, 819]);
  });
});

describe('planGreen — properties', () => {
  it('stock after each week is the stock less everything needed so far, and more stock never runs out sooner', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 60_000 }), fc.integer({ min: 0, max: 20_000 }), fc.integer({ min: 1, max: 4 }), (stock, sold, cadence) => {
        const subscriptions = [weekly({ cadenceWeeks: cadence })];
        const base = planFor(subscriptions, {}, { stockGrams: stock, greenSoldGrams: sold });
        let left = stock;
        for (const week of base.weeks) {
          left -= week.needGrams;
          expect(week.stockAfterGrams).toBe(left);
        }
        const more = planFor(subscriptions, {}, { stockGrams: stock + 1000, greenSoldGrams: sold });
        if (base.runOutDate !== null && more.runOutDate !== null) expect(more.runOutDate >= base.runOutDate).toBe(true);
        if (base.runOutDate === null) expect(more.runOutDate).toBeNull();
      }),
      { numRuns: 60 },
    );
  });
});
