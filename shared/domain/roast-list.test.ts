import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { defaultShopSettings } from '../schemas/settings';
import { buildRoastList, type RoastListInput, type RoastOrderLine } from './roast-list';
import { greenNeededForRoasted } from './roast-loss';
import { bagFillGrams } from './units';
import { roastLevels } from './vocabulary';

// 12 kg roaster at 50–80 % (max load 9,600 g, preferred minimum 6,000 g, floor 3,000 g), 2 % overage,
// usual loss defaults, 3 batches before a lot's own loss counts, 60 kg a day.
const settings = defaultShopSettings;

function input(lines: RoastOrderLine[], extra: Partial<RoastListInput> = {}): RoastListInput {
  return { date: '2025-03-05', lines, settings, stockGrams: { 'RD-101': 50_000, 'RD-102': 50_000 }, dayCapacityGrams: 60_000, ...extra };
}

describe('buildRoastList', () => {
  it('works the hand example: one lot at medium, 6 × 12 oz + 4 × 1 lb', () => {
    // Roasted: 6 × 341 + 4 × 454 = 2,046 + 1,816 = 3,862 g.
    // Green: ceil(3,862 × 1.02 ÷ 0.85) = ceil(4,634.4) = 4,635 g (15 % medium default, usual trade figures, from memory).
    // One batch (≤ 9,600 g) of 4,635 g: 38.6 % of 12 kg, under the preferred 50 % but over the 25 % floor.
    const list = buildRoastList(
      input([
        { lotCode: 'RD-101', roastLevel: 'medium', fillGrams: bagFillGrams('12oz'), quantity: 6 },
        { lotCode: 'RD-101', roastLevel: 'medium', fillGrams: bagFillGrams('1lb'), quantity: 4 },
      ]),
    );
    expect(list.lines).toEqual([
      {
        lotCode: 'RD-101',
        roastLevel: 'medium',
        bags: 10,
        roastedGrams: 3862,
        lossPct: 15,
        lossSource: 'level',
        greenGrams: 4635,
        batches: [{ greenGrams: 4635 }],
        toRoast: { roastedGrams: 3862, greenGrams: 4635, batches: [{ greenGrams: 4635 }] },
      },
    ]);
    expect(list.pull).toEqual([{ lotCode: 'RD-101', greenGrams: 4635, stockGrams: 50_000, shortfallGrams: 0 }]);
    expect(list.totals).toEqual({ roastedGrams: 3862, greenGrams: 4635, batches: 1, toRoast: { roastedGrams: 3862, greenGrams: 4635, batches: 1 } });
    expect(list.warnings).toEqual([
      expect.objectContaining({ code: 'below_preferred_load', lotCode: 'RD-101', roastLevel: 'medium', message: expect.stringContaining('6,000 g') }),
    ]);
  });

  it("uses the lot's measured loss once it has three batches at the level", () => {
    // 3 batches: 30,000 g in, 25,800 g out → 14 % loss. Green = ceil(3,862 × 1.02 ÷ 0.86) = ceil(4,580.5…) = 4,581 g.
    const lines: RoastOrderLine[] = [{ lotCode: 'RD-101', roastLevel: 'medium', fillGrams: 3862, quantity: 1 }];
    const twoBatches = buildRoastList(input(lines, { lotLoss: { 'RD-101': { medium: { batchCount: 2, greenGramsIn: 20_000, roastedGramsOut: 17_200 } } } }));
    expect(twoBatches.lines[0]).toMatchObject({ lossPct: 15, lossSource: 'level', greenGrams: 4635 });
    const threeBatches = buildRoastList(input(lines, { lotLoss: { 'RD-101': { medium: { batchCount: 3, greenGramsIn: 30_000, roastedGramsOut: 25_800 } } } }));
    expect(threeBatches.lines[0]).toMatchObject({ lossPct: 14, lossSource: 'lot', greenGrams: 4581 });
  });

  it('groups by lot and level, lists the pull per lot with its shortfall, and orders lines by lot then level', () => {
    const list = buildRoastList(
      input(
        [
          { lotCode: 'RD-102', roastLevel: 'dark', fillGrams: 454, quantity: 10 },
          { lotCode: 'RD-101', roastLevel: 'light', fillGrams: 341, quantity: 20 },
          { lotCode: 'RD-102', roastLevel: 'light', fillGrams: 454, quantity: 10 },
        ],
        { stockGrams: { 'RD-101': 50_000, 'RD-102': 9_000 } },
      ),
    );
    expect(list.lines.map((line) => [line.lotCode, line.roastLevel])).toEqual([
      ['RD-101', 'light'],
      ['RD-102', 'light'],
      ['RD-102', 'dark'],
    ]);
    // RD-102: light ceil(4,540 × 1.02 ÷ 0.875) = ceil(5,292.3) = 5,293; dark ceil(4,540 × 1.02 ÷ 0.81) = ceil(5,717.0…) = 5,718.
    expect(list.lines[1]?.greenGrams).toBe(5293);
    expect(list.lines[2]?.greenGrams).toBe(5718);
    expect(list.pull[1]).toEqual({ lotCode: 'RD-102', greenGrams: 11_011, stockGrams: 9_000, shortfallGrams: 2_011 });
    expect(list.warnings.find((warning) => warning.code === 'green_shortfall')).toMatchObject({
      lotCode: 'RD-102',
      message: expect.stringContaining('2,011 g short'),
    });
  });

  it('proposes raising a batch under the floor, and warns when the day is over capacity', () => {
    // 1 × 12 oz at light: ceil(341 × 1.02 ÷ 0.875) = 398 g, under the 3,000 g floor: raise by 2,602 g → 2,276 g roasted at 12.5 %.
    const small = buildRoastList(input([{ lotCode: 'RD-101', roastLevel: 'light', fillGrams: 341, quantity: 1 }]));
    expect(small.lines[0]?.floorProposal).toEqual({ batchGreenGrams: 3000, extraGreenGrams: 2602, extraRoastedGrams: 2276 });
    expect(small.warnings).toEqual([expect.objectContaining({ code: 'below_minimum_load', message: expect.stringContaining('2,276 g roasted to stock') })]);
    const busy = buildRoastList(input([{ lotCode: 'RD-101', roastLevel: 'medium', fillGrams: 454, quantity: 150 }], { stockGrams: { 'RD-101': 100_000 } }));
    // ceil(68,100 × 1.02 ÷ 0.85) = 81,720 g against 60,000 g; 9 batches of 9,080 g.
    expect(busy.totals).toMatchObject({ greenGrams: 81_720, batches: 9 });
    expect(busy.warnings[0]).toMatchObject({ code: 'over_day_capacity', message: expect.stringContaining('21,720 g over') });
  });

  it('treats a lot with no stock record as out of stock, and an empty day as empty', () => {
    const list = buildRoastList(input([{ lotCode: 'RD-777', roastLevel: 'medium', fillGrams: 9000, quantity: 1 }]));
    expect(list.pull[0]).toMatchObject({ stockGrams: 0, shortfallGrams: list.pull[0]?.greenGrams });
    expect(buildRoastList(input([]))).toEqual({
      date: '2025-03-05',
      lines: [],
      pull: [],
      totals: { roastedGrams: 0, greenGrams: 0, batches: 0, toRoast: { roastedGrams: 0, greenGrams: 0, batches: 0 } },
      warnings: [],
    });
    expect(() => buildRoastList(input([{ lotCode: 'RD-101', roastLevel: 'medium', fillGrams: 341, quantity: 0 }]))).toThrow(RangeError);
    expect(() => buildRoastList(input([{ lotCode: 'RD-101', roastLevel: 'blonde' as 'light', fillGrams: 341, quantity: 1 }]))).toThrow(/unknown roast level/);
  });

  it('groups hundreds of lots and levels exactly like a plain Map would, codes sharing endings included', () => {
    // Codes end alike ("…-07") or differ only at the start, so many pairs share a hash slot.
    const lotCode = fc
      .tuple(fc.constantFrom('ET', 'CO', 'KE', 'GT', 'BR', 'PE'), fc.integer({ min: 0, max: 60 }))
      .map(([origin, number]) => `${origin}-${String(number % 12).padStart(2, '0')}${'x'.repeat(number >= 12 ? number % 5 : 0)}`);
    const line = fc.record({
      lotCode,
      roastLevel: fc.constantFrom(...roastLevels),
      fillGrams: fc.integer({ min: 1, max: 3000 }),
      quantity: fc.integer({ min: 1, max: 5 }),
    });
    fc.assert(
      fc.property(fc.array(line, { minLength: 1, maxLength: 600 }), (lines) => {
        const expected = new Map<string, { roasted: number; bags: number }>();
        for (const each of lines) {
          const key = `${each.lotCode} ${each.roastLevel}`;
          const total = expected.get(key) ?? { roasted: 0, bags: 0 };
          expected.set(key, { roasted: total.roasted + each.fillGrams * each.quantity, bags: total.bags + each.quantity });
        }
        const list = buildRoastList(input(lines));
        expect(
          new Map(list.lines.map((planned) => [`${planned.lotCode} ${planned.roastLevel}`, { roasted: planned.roastedGrams, bags: planned.bags }])),
        ).toEqual(expected);
        // Lines run by lot code, then from light to French.
        const keys = list.lines.map((planned) => [planned.lotCode, roastLevels.indexOf(planned.roastLevel)] as const);
        expect(keys).toEqual([...keys].sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : a[1] - b[1])));
      }),
      { numRuns: 60 },
    );
    expect(() => buildRoastList(input([{ lotCode: '', roastLevel: 'medium', fillGrams: 341, quantity: 1 }]))).toThrow(/no lot code/);
  });

  it('keeps every lot apart on a day with more lots and levels than its first table holds', () => {
    // 60 lots × 5 levels = 300 pairs: more than a quarter of the 1,024 starting slots, so the table grows.
    const lines = Array.from({ length: 60 }, (_, lot) =>
      roastLevels.map((roastLevel, level) => ({ lotCode: `RD-${String(lot).padStart(3, '0')}`, roastLevel, fillGrams: 341, quantity: 1 + level })),
    ).flat();
    const list = buildRoastList(input([...lines, ...lines]));
    expect(list.lines).toHaveLength(300);
    expect(list.lines.every((planned) => planned.roastedGrams === 2 * 341 * (1 + roastLevels.indexOf(planned.roastLevel)))).toBe(true);
    expect(list.pull).toHaveLength(60);
  });

  it('never under-plans green, and its totals are the sums of its lines', () => {
    const line = fc.record({
      lotCode: fc.constantFrom('RD-101', 'RD-102', 'RD-103'),
      roastLevel: fc.constantFrom(...roastLevels),
      fillGrams: fc.constantFrom(341, 454, 908),
      quantity: fc.integer({ min: 1, max: 30 }),
    });
    const overage = fc.integer({ min: 0, max: 1000 }).map((hundredths) => hundredths / 100);
    fc.assert(
      fc.property(fc.array(line, { maxLength: 30 }), overage, (lines, overagePct) => {
        const list = buildRoastList(input(lines, { settings: { ...settings, overagePct } }));
        for (const planned of list.lines) {
          const roasted = lines
            .filter((each) => each.lotCode === planned.lotCode && each.roastLevel === planned.roastLevel)
            .reduce((sum, each) => sum + each.fillGrams * each.quantity, 0);
          expect(planned.roastedGrams).toBe(roasted);
          // Green per line is the loss model's own rounding (greenNeededForRoasted, checked by hand in roast-loss.test.ts).
          expect(planned.greenGrams).toBe(greenNeededForRoasted(roasted, planned.lossPct, overagePct));
          expect(planned.batches.reduce((sum, batch) => sum + batch.greenGrams, 0)).toBe(planned.greenGrams);
        }
        expect(list.totals.greenGrams).toBe(list.lines.reduce((sum, planned) => sum + planned.greenGrams, 0));
        expect(list.totals.greenGrams).toBe(list.pull.reduce((sum, pull) => sum + pull.greenGrams, 0));
        expect(list.totals.batches).toBe(list.lines.reduce((sum, planned) => sum + planned.batches.length, 0));
      }),
    );
  });
});
