import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { batchMetrics, developmentTimeRatioPct, DRUM_DTR_TARGET_PCT, journalMetrics } from './roast-metrics';
import { defaultLossModel } from './roast-loss';

describe('development time ratio', () => {
  it('divides development by the whole roast', () => {
    // 10-minute drum roast with first crack at 8:00: 120 s ÷ 600 s = 20 % (S. Rao, Development Time Ratio, 2016)
    expect(developmentTimeRatioPct(480, 600)).toBe(20);
    expect(DRUM_DTR_TARGET_PCT).toEqual({ min: 20, max: 25 }); // S. Rao, Development Time Ratio (2016)
    expect(() => developmentTimeRatioPct(0, 0)).toThrow(RangeError);
  });

  it('gives hand-worked ratios to two decimals, halves rounded up', () => {
    // DTR = (end − first crack) ÷ end (S. Rao, Development Time Ratio, 2016); worked by hand:
    expect(developmentTimeRatioPct(555, 705)).toBe(21.28); // 150 ÷ 705 = 21.2765… %
    expect(developmentTimeRatioPct(540, 690)).toBe(21.74); // 9:00 → 11:30: 150 ÷ 690 = 21.7391… %
    expect(developmentTimeRatioPct(420, 560)).toBe(25); // 7:00 → 9:20: 140 ÷ 560 = 25 % exactly
    expect(developmentTimeRatioPct(400, 600)).toBe(33.33); // 200 ÷ 600 = 33.333… %
    expect(developmentTimeRatioPct(200, 600)).toBe(66.67); // 400 ÷ 600 = 66.666… %
    expect(developmentTimeRatioPct(599, 600)).toBe(0.17); // 1 ÷ 600 = 0.1666… %
    expect(developmentTimeRatioPct(0, 1)).toBe(100);
  });

  it('lies between 0 and 100 % and falls as first crack comes later', () => {
    fc.assert(
      fc.property(fc.integer({ min: 2, max: 3600 }), fc.integer({ min: 0, max: 3598 }), (end, crack) => {
        fc.pre(crack + 1 < end);
        const ratio = developmentTimeRatioPct(crack, end);
        expect(ratio).toBeGreaterThan(0);
        expect(ratio).toBeLessThanOrEqual(100);
        expect(developmentTimeRatioPct(crack + 1, end)).toBeLessThanOrEqual(ratio);
      }),
    );
  });
});

describe('Roast Journal metrics', () => {
  it('computes a popper roast', () => {
    // 80 g green → 68 g roasted = 15 % loss: medium (usual trade ranges, from memory).
    // First crack at 3:00 (popper, common practice), end at 3:45: 45 s development, 20 % of 225 s.
    const result = journalMetrics({ greenGrams: 80, roastedGrams: 68, yellowSeconds: 75, firstCrackSeconds: 180, endSeconds: 225 }, defaultLossModel, 'light');
    expect(result).toEqual({
      ok: true,
      value: {
        lossPct: 15,
        developmentSeconds: 45,
        developmentTimeRatio: 20,
        estimatedLevel: 'medium',
        estimateWithinRange: true,
        comparedWithSuggestion: 'darker',
      },
    });
  });

  it('leaves out development without a first-crack time', () => {
    const result = journalMetrics({ greenGrams: 80, roastedGrams: 70, endSeconds: 240 }, defaultLossModel, 'light');
    expect(result.ok && result.value).toEqual({ lossPct: 12.5, estimatedLevel: 'light', estimateWithinRange: true, comparedWithSuggestion: 'same' });
  });

  it.each([
    [{ greenGrams: 80, roastedGrams: 80, endSeconds: 240 }, 'roastedGrams', /less than the green weight/],
    [{ greenGrams: 80, roastedGrams: 30, endSeconds: 240 }, 'roastedGrams', /more than 50 %/],
    [{ greenGrams: 0, roastedGrams: 0, endSeconds: 240 }, 'greenGrams', /more than 0/],
    [{ greenGrams: 80, roastedGrams: 70, firstCrackSeconds: 300, endSeconds: 240 }, 'firstCrackSeconds', /First crack must come before the end/],
    [{ greenGrams: 80, roastedGrams: 70, firstCrackSeconds: -5, endSeconds: 240 }, 'firstCrackSeconds', /0 or more/],
    [{ greenGrams: 80, roastedGrams: 70, yellowSeconds: 200, firstCrackSeconds: 180, endSeconds: 240 }, 'yellowSeconds', /Yellow must come before first crack/],
    [{ greenGrams: 80, roastedGrams: 70, yellowSeconds: 300, endSeconds: 240 }, 'yellowSeconds', /before the end of the roast/],
    [{ greenGrams: 80, roastedGrams: 70, endSeconds: 0 }, 'endSeconds', /more than 0 seconds/],
    [{ greenGrams: 80.5, roastedGrams: 70, endSeconds: 240 }, 'greenGrams', /whole grams/],
  ])('rejects %j with a message on %s', (entry, field, message) => {
    const result = journalMetrics(entry, defaultLossModel);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.fields[field]).toMatch(message);
  });
});

describe('batch metrics', () => {
  it('reports loss inside the range and a development ratio on target', () => {
    // 10 kg in, 8.5 kg out = 15 %: medium 14–16 % (usual trade figures, from memory); 132 s of 600 s = 22 % (S. Rao 2016 target 20–25 %)
    const result = batchMetrics(
      { roastLevel: 'medium', greenGramsIn: 10_000, roastedGramsOut: 8_500, totalSeconds: 600, firstCrackSeconds: 468 },
      defaultLossModel,
    );
    expect(result).toEqual({
      ok: true,
      value: { lossPct: 15, withinExpected: true, lossPosition: 'within', developmentSeconds: 132, developmentTimeRatio: 22, developmentWithinTarget: true },
    });
  });

  it('flags a loss outside the level range and a short development', () => {
    const result = batchMetrics(
      { roastLevel: 'dark', greenGramsIn: 10_000, roastedGramsOut: 8_700, totalSeconds: 720, firstCrackSeconds: 660 },
      defaultLossModel,
    );
    expect(result.ok && result.value).toMatchObject({ lossPct: 13, withinExpected: false, lossPosition: 'below', developmentWithinTarget: false });
  });

  it('asks for the total time with a first-crack time, and rejects impossible weights', () => {
    const noTotal = batchMetrics({ roastLevel: 'medium', greenGramsIn: 1000, roastedGramsOut: 850, firstCrackSeconds: 400 }, defaultLossModel);
    expect(!noTotal.ok && noTotal.fields.totalSeconds).toMatch(/total roast time/);
    const heavier = batchMetrics({ roastLevel: 'medium', greenGramsIn: 1000, roastedGramsOut: 1000 }, defaultLossModel);
    expect(!heavier.ok && heavier.fields.roastedGramsOut).toMatch(/less than the green weight/);
    const plain = batchMetrics({ roastLevel: 'light', greenGramsIn: 1000, roastedGramsOut: 870 }, defaultLossModel);
    expect(plain).toEqual({ ok: true, value: { lossPct: 13, withinExpected: true, lossPosition: 'within' } });
  });
});
