import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  assessBatchLoss,
  defaultLossModel,
  estimateLevelFromLoss,
  greenNeededForRoasted,
  lossPctOf,
  resolveExpectedLoss,
  roastedYieldFromGreen,
  roastedYieldRange,
} from './roast-loss';
import { roastLevels } from './vocabulary';

const lossPct = fc.integer({ min: 0, max: 3000 }).map((hundredths) => hundredths / 100);
const overagePct = fc.integer({ min: 0, max: 2000 }).map((hundredths) => hundredths / 100);

describe('the default loss model', () => {
  it('holds the usual level ranges and midpoints', () => {
    expect(defaultLossModel.light).toEqual({ minPct: 11, maxPct: 14, defaultPct: 12.5 }); // usual trade figures, from memory
    expect(defaultLossModel.medium).toEqual({ minPct: 14, maxPct: 16, defaultPct: 15 }); // usual trade figures, from memory
    expect(defaultLossModel['medium-dark']).toEqual({ minPct: 16, maxPct: 18, defaultPct: 17 }); // usual trade figures, from memory
    expect(defaultLossModel.dark).toEqual({ minPct: 18, maxPct: 20, defaultPct: 19 }); // usual trade figures, from memory
    expect(defaultLossModel.french).toEqual({ minPct: 20, maxPct: 25, defaultPct: 22 }); // usual trade figures, from memory
  });

  it('keeps medium to dark inside the typical 14–20 % total loss', () => {
    for (const level of ['medium', 'medium-dark', 'dark'] as const) {
      const range = defaultLossModel[level];
      expect(range.minPct).toBeGreaterThanOrEqual(14); // Barista Hustle, RS 3.05 Mass Loss
      expect(range.maxPct).toBeLessThanOrEqual(20); // Barista Hustle, RS 3.05 Mass Loss
    }
  });

  it('rises with roast colour: each level loses at least as much as the lighter one', () => {
    for (let index = 1; index < roastLevels.length; index += 1) {
      const lighter = defaultLossModel[roastLevels[index - 1]!];
      const darker = defaultLossModel[roastLevels[index]!];
      expect(darker.defaultPct).toBeGreaterThan(lighter.defaultPct); // Barista Hustle, RS 3.05: loss rises with colour
    }
  });
});

describe('green needed and roasted yield', () => {
  it('works the roast list example by hand', () => {
    // 6 × 341 g + 4 × 454 g = 3,862 g roasted; ceil(3,862 × 1.02 ÷ 0.85) = ceil(4,634.4) = 4,635 (common practice formula)
    expect(greenNeededForRoasted(3862, 15, 2)).toBe(4635);
    // 1,000 g green at 15 % loss yields 850 g (common practice: green × (1 − loss))
    expect(roastedYieldFromGreen(1000, 15)).toBe(850);
    // 850 g roasted at 15 % loss needs exactly 1,000 g green (common practice: roasted ÷ (1 − loss))
    expect(greenNeededForRoasted(850, 15)).toBe(1000);
  });

  it('rounds green up to the next whole gram, worked by hand', () => {
    // Green = roasted × (1 + overage) ÷ (1 − loss), rounded up (common practice formula):
    expect(greenNeededForRoasted(1000, 15)).toBe(1177); // 1,000 ÷ 0.85 = 1,176.47
    expect(greenNeededForRoasted(340, 12.5)).toBe(389); // 340 ÷ 0.875 = 388.57
    expect(greenNeededForRoasted(454, 19, 2)).toBe(572); // 454 × 1.02 = 463.08; ÷ 0.81 = 571.70
    expect(greenNeededForRoasted(2268, 22)).toBe(2908); // 2,268 ÷ 0.78 = 2,907.69
    expect(greenNeededForRoasted(1000, 14.25, 1.5)).toBe(1184); // 1,015 ÷ 0.8575 = 1,183.67
    expect(greenNeededForRoasted(100, 20)).toBe(125); // 100 ÷ 0.8 = 125 exactly: no extra gram
    expect(greenNeededForRoasted(0, 15)).toBe(0);
    // Yield rounds down: 1,177 × 0.85 = 1,000.45 → 1,000; 389 × 0.875 = 340.375 → 340.
    expect(roastedYieldFromGreen(1177, 15)).toBe(1000);
    expect(roastedYieldFromGreen(389, 12.5)).toBe(340);
  });

  it('never under-plans, and one gram less green would fall short', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 5_000_000 }), lossPct, (roasted, loss) => {
        const green = greenNeededForRoasted(roasted, loss);
        expect(roastedYieldFromGreen(green, loss)).toBeGreaterThanOrEqual(roasted);
        expect(roastedYieldFromGreen(green - 1, loss)).toBeLessThan(roasted);
      }),
    );
  });

  it('plans more green for more overage and for more loss', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 5_000_000 }), lossPct, overagePct, (roasted, loss, overage) => {
        const green = greenNeededForRoasted(roasted, loss, overage);
        expect(greenNeededForRoasted(roasted, loss, overage + 0.01)).toBeGreaterThanOrEqual(green);
        expect(greenNeededForRoasted(roasted, loss + 0.01, overage)).toBeGreaterThanOrEqual(green);
      }),
    );
  });

  it('gives a yield range that brackets the default', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 100_000 }), fc.constantFrom(...roastLevels), (green, level) => {
        const range = roastedYieldRange(green, defaultLossModel[level]);
        expect(range.min).toBeLessThanOrEqual(range.default);
        expect(range.default).toBeLessThanOrEqual(range.max);
        expect(range.max).toBeLessThan(green);
      }),
    );
  });

  it('refuses impossible inputs', () => {
    expect(() => greenNeededForRoasted(-1, 15)).toThrow(RangeError);
    expect(() => greenNeededForRoasted(100, 100)).toThrow(RangeError);
    expect(() => greenNeededForRoasted(100, 15, -1)).toThrow(RangeError);
    expect(() => roastedYieldFromGreen(1.5, 15)).toThrow(RangeError);
    expect(() => lossPctOf(0, 0)).toThrow(RangeError);
    expect(() => lossPctOf(100, 101)).toThrow(RangeError);
  });
});

describe('measured loss', () => {
  it('computes loss to two decimals, half-up', () => {
    expect(lossPctOf(1000, 850)).toBe(15);
    expect(lossPctOf(80, 68)).toBe(15);
    expect(lossPctOf(3, 2)).toBe(33.33);
    expect(lossPctOf(6, 5)).toBe(16.67);
  });

  it('switches from the level default to the lot after the third recorded batch', () => {
    const twoBatches = { batchCount: 2, greenGramsIn: 20_000, roastedGramsOut: 17_200 };
    const threeBatches = { batchCount: 3, greenGramsIn: 30_000, roastedGramsOut: 25_800 };
    expect(resolveExpectedLoss('medium', defaultLossModel, twoBatches)).toMatchObject({ lossPct: 15, source: 'level' });
    expect(resolveExpectedLoss('medium', defaultLossModel, threeBatches)).toMatchObject({ lossPct: 14, source: 'lot' });
    expect(resolveExpectedLoss('medium', defaultLossModel, twoBatches, 2)).toMatchObject({ lossPct: 14, source: 'lot' });
    expect(resolveExpectedLoss('medium', defaultLossModel)).toMatchObject({ lossPct: 15, source: 'level' });
  });

  it('rounds a measured loss up to 0.01 %, so it never under-plans green', () => {
    // 449 g lost of 3,000 g = 14.9666… % → 14.97 %
    const record = { batchCount: 3, greenGramsIn: 3000, roastedGramsOut: 2551 };
    expect(resolveExpectedLoss('medium', defaultLossModel, record).lossPct).toBe(14.97);
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 0, max: 4000 }), (green, lostPerMyriad) => {
        const roasted = green - Math.floor((green * lostPerMyriad) / 10_000);
        const expected = resolveExpectedLoss('dark', defaultLossModel, { batchCount: 5, greenGramsIn: green, roastedGramsOut: roasted });
        expect(expected.lossPct).toBeGreaterThanOrEqual(((green - roasted) / green) * 100 - 1e-9);
        expect(expected.lossPct).toBeLessThan(((green - roasted) / green) * 100 + 0.01 + 1e-9);
      }),
    );
  });

  it('flags a batch outside its level range and accepts one on the edge', () => {
    expect(assessBatchLoss('medium', 10_000, 8_500, defaultLossModel)).toEqual({ lossPct: 15, withinExpected: true, position: 'within' });
    expect(assessBatchLoss('medium', 10_000, 8_600, defaultLossModel)).toMatchObject({ lossPct: 14, withinExpected: true });
    expect(assessBatchLoss('medium', 10_000, 8_601, defaultLossModel)).toMatchObject({ withinExpected: false, position: 'below' });
    expect(assessBatchLoss('medium', 10_000, 8_399, defaultLossModel)).toMatchObject({ withinExpected: false, position: 'above' });
  });
});

describe('estimating the level from a measured loss', () => {
  it('names the level whose range holds the loss', () => {
    expect(estimateLevelFromLoss(12.5, defaultLossModel)).toEqual({ level: 'light', withinRange: true });
    expect(estimateLevelFromLoss(15.2, defaultLossModel)).toEqual({ level: 'medium', withinRange: true });
    expect(estimateLevelFromLoss(17, defaultLossModel)).toEqual({ level: 'medium-dark', withinRange: true });
    expect(estimateLevelFromLoss(19.5, defaultLossModel)).toEqual({ level: 'dark', withinRange: true });
    expect(estimateLevelFromLoss(23, defaultLossModel)).toEqual({ level: 'french', withinRange: true });
  });

  it('breaks a tie on a shared edge by the nearer default, and names the nearest range outside all', () => {
    expect(estimateLevelFromLoss(14, defaultLossModel).level).toBe('medium'); // 1 from 15, 1.5 from 12.5
    expect(estimateLevelFromLoss(8, defaultLossModel)).toEqual({ level: 'light', withinRange: false });
    expect(estimateLevelFromLoss(31, defaultLossModel)).toEqual({ level: 'french', withinRange: false });
  });

  it('never names a lighter level for a larger loss', () => {
    fc.assert(
      fc.property(lossPct, lossPct, (a, b) => {
        const [low, high] = a <= b ? [a, b] : [b, a];
        const lowLevel = roastLevels.indexOf(estimateLevelFromLoss(low, defaultLossModel).level);
        const highLevel = roastLevels.indexOf(estimateLevelFromLoss(high, defaultLossModel).level);
        expect(highLevel).toBeGreaterThanOrEqual(lowLevel);
      }),
    );
  });
});
