import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkDayCapacity, HARD_FLOOR_LOAD_PCT, loadLimits, planBatches } from './batch-planner';

const twelveKilo = { capacityGrams: 12_000, minLoadPct: 50, maxLoadPct: 80 };

describe('load limits', () => {
  it('puts the hard floor at a quarter of rated capacity', () => {
    expect(HARD_FLOOR_LOAD_PCT).toBe(25); // S. Rao, The Coffee Roaster's Companion (2014)
    expect(loadLimits(twelveKilo)).toEqual({ maxLoadGrams: 9600, preferredMinGrams: 6000, floorGrams: 3000 }); // usual 50–80 % load (from memory)
  });

  it('refuses a maximum below the floor and a roaster without capacity', () => {
    expect(() => loadLimits({ capacityGrams: 1000, minLoadPct: 10, maxLoadPct: 20 })).toThrow(/hard floor/);
    expect(() => loadLimits({ capacityGrams: 0, minLoadPct: 50, maxLoadPct: 80 })).toThrow(RangeError);
  });
});

describe('planBatches', () => {
  it('roasts the hand-worked 4,635 g in one batch, below the preferred minimum', () => {
    // 4,635 g on a 12 kg roaster: 1 batch (≤ 9,600 g), 38.6 % of capacity: under 50 %, over 25 %
    const plan = planBatches(4635, twelveKilo, 15);
    expect(plan.batches).toEqual([4635]);
    expect(plan.belowPreferredLoad).toBe(true);
    expect(plan.belowFloor).toBe(false);
    expect(plan.floorProposal).toBeUndefined();
  });

  it('splits 20,000 g into three even batches', () => {
    // ceil(20,000 ÷ 9,600) = 3; 20,000 = 6,667 + 6,667 + 6,666
    expect(planBatches(20_000, twelveKilo, 15).batches).toEqual([6667, 6667, 6666]);
  });

  it('proposes raising a batch below the floor and says what it adds to stock', () => {
    // 2,000 g < 3,000 g floor: raise to 3,000 g, 1,000 g more green, 850 g roasted at 15 % loss
    const plan = planBatches(2000, twelveKilo, 15);
    expect(plan.belowFloor).toBe(true);
    expect(plan.floorProposal).toEqual({ batchGreenGrams: 3000, extraGreenGrams: 1000, extraRoastedGrams: 850 });
  });

  it('plans nothing for nothing', () => {
    expect(planBatches(0, twelveKilo, 15).batches).toEqual([]);
    expect(() => planBatches(-5, twelveKilo, 15)).toThrow(RangeError);
  });

  it('uses the fewest batches, each within the maximum, differing by at most a gram', () => {
    const roaster = fc.record({
      capacityGrams: fc.integer({ min: 500, max: 30_000 }),
      minLoadPct: fc.integer({ min: 25, max: 60 }),
      maxLoadPct: fc.integer({ min: 60, max: 100 }),
    });
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 500_000 }), roaster, (green, settings) => {
        const plan = planBatches(green, settings, 15);
        const { maxLoadGrams } = plan.limits;
        expect(plan.batches.reduce((sum, load) => sum + load, 0)).toBe(green);
        expect(Math.max(...plan.batches)).toBeLessThanOrEqual(maxLoadGrams);
        expect(Math.max(...plan.batches) - Math.min(...plan.batches)).toBeLessThanOrEqual(1);
        // One batch fewer could not hold it.
        expect(green).toBeGreaterThan((plan.batches.length - 1) * maxLoadGrams);
        if (plan.floorProposal) {
          expect(plan.floorProposal.batchGreenGrams * plan.batches.length).toBe(green + plan.floorProposal.extraGreenGrams);
          expect(plan.floorProposal.extraRoastedGrams).toBeLessThan(plan.floorProposal.extraGreenGrams);
        }
      }),
    );
  });
});

describe('day capacity', () => {
  it('warns only when the planned green exceeds it', () => {
    expect(checkDayCapacity(60_000, 60_000)).toEqual({ withinCapacity: true, overByGrams: 0 });
    expect(checkDayCapacity(61_500, 60_000)).toEqual({ withinCapacity: false, overByGrams: 1500 });
  });
});
