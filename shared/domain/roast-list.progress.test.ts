import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { defaultShopSettings } from '../schemas/settings';
import { buildRoastList, type RoastListInput, type RoastOrderLine } from './roast-list';
import { roastLevels } from './vocabulary';

// A 12 kg roaster at 50–80 % (max load 9,600 g), 2 % overage, the usual loss defaults (medium 15 %,
// from memory), 60 kg a day: the shop defaults.
const settings = defaultShopSettings;
const twentyPounds: RoastOrderLine[] = [{ lotCode: 'RD-201', roastLevel: 'medium', fillGrams: 454, quantity: 20 }];

function input(extra: Partial<RoastListInput> = {}): RoastListInput {
  return { date: '2025-03-05', lines: twentyPounds, settings, stockGrams: { 'RD-201': 8_000 }, dayCapacityGrams: 60_000, ...extra };
}

describe('buildRoastList — what is still to roast', () => {
  it('plans the uncovered roasted weight only, and the pull and warnings follow it', () => {
    // Planned: 20 × 454 = 9,080 g roasted; green ceil(9,080 × 1.02 ÷ 0.85) = ceil(10,896) = 10,896 g (two batches of 5,448 g);
    // 8,000 g in stock would be 2,896 g short.
    const planned = buildRoastList(input());
    expect(planned.pull).toEqual([{ lotCode: 'RD-201', greenGrams: 10_896, stockGrams: 8_000, shortfallGrams: 2_896 }]);
    // 5,000 g roasted already covered: 4,080 g to go; green ceil(4,080 × 1.02 ÷ 0.85) = ceil(4,896) = 4,896 g, one batch,
    // under the preferred 6,000 g (50 % of 12 kg), over the floor, within stock.
    const partly = buildRoastList(input({ coveredRoastedGrams: { 'RD-201': { medium: 5_000 } } }));
    expect(partly.lines[0]).toMatchObject({
      greenGrams: 10_896,
      batches: [{ greenGrams: 5_448 }, { greenGrams: 5_448 }],
      toRoast: { roastedGrams: 4_080, greenGrams: 4_896, batches: [{ greenGrams: 4_896 }] },
    });
    expect(partly.pull).toEqual([{ lotCode: 'RD-201', greenGrams: 4_896, stockGrams: 8_000, shortfallGrams: 0 }]);
    expect(partly.warnings.map((warning) => warning.code)).toEqual(['below_preferred_load']);
  });

  it('has nothing to pull or warn about once the roast covers the line, more than covering it included', () => {
    for (const covered of [9_080, 12_000]) {
      const done = buildRoastList(input({ coveredRoastedGrams: { 'RD-201': { medium: covered } } }));
      expect(done.lines[0]!.toRoast).toEqual({ roastedGrams: 0, greenGrams: 0, batches: [] });
      expect(done.lines[0]!.floorProposal).toBeUndefined();
      expect(done.pull).toEqual([]);
      expect(done.warnings).toEqual([]);
      expect(done.totals).toEqual({ roastedGrams: 9_080, greenGrams: 10_896, batches: 2, toRoast: { roastedGrams: 0, greenGrams: 0, batches: 0 } });
    }
  });

  it('never plans more to roast than the whole day, and the pull is the sum of what is left', () => {
    const line = fc.record({
      lotCode: fc.constantFrom('RD-1', 'RD-2', 'RD-3'),
      roastLevel: fc.constantFrom(...roastLevels),
      fillGrams: fc.constantFrom(227, 341, 454, 908),
      quantity: fc.integer({ min: 1, max: 40 }),
    });
    fc.assert(
      fc.property(fc.array(line, { minLength: 1, maxLength: 12 }), fc.integer({ min: 0, max: 20_000 }), (lines, coveredEach) => {
        const coveredRoastedGrams = Object.fromEntries(
          ['RD-1', 'RD-2', 'RD-3'].map((code) => [code, Object.fromEntries(roastLevels.map((level) => [level, coveredEach]))]),
        );
        const list = buildRoastList({ date: '2025-03-05', lines, settings, stockGrams: {}, dayCapacityGrams: 60_000, coveredRoastedGrams });
        for (const planned of list.lines) {
          expect(planned.toRoast.roastedGrams).toBe(Math.max(0, planned.roastedGrams - coveredEach));
          expect(planned.toRoast.greenGrams).toBeLessThanOrEqual(planned.greenGrams);
          expect(planned.toRoast.batches.reduce((sum, batch) => sum + batch.greenGrams, 0)).toBe(planned.toRoast.greenGrams);
        }
        expect(list.pull.reduce((sum, pull) => sum + pull.greenGrams, 0)).toBe(list.totals.toRoast.greenGrams);
      }),
    );
  });
});
