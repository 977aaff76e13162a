import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { homeRoastCautions, homeRoastGuide, isRoastGuideDevice, roastGuideDevices } from './home-roast-guide';
import { defaultLossModel } from './roast-loss';
import { bagFillGrams } from './units';
import { roastLevels } from './vocabulary';

describe('Home Roast Guide for a hot-air popper', () => {
  it('guides a 1 lb bag to medium', () => {
    // 454 g fill (the product's rule) in batches of at most 80 g (popper 75–80 g, common practice): ceil(454 ÷ 80) = 6.
    const guide = homeRoastGuide({ device: 'popper', level: 'medium', greenGrams: bagFillGrams('1lb'), suggestedLevel: 'light' }, defaultLossModel);
    expect(guide.batchGrams).toEqual({ min: 75, max: 80 }); // popper batch (common practice)
    expect(guide.batches).toBe(6);
    expect(guide.batchLoads).toEqual([76, 76, 76, 76, 75, 75]);
    expect(guide.firstCrackSeconds).toBe(180); // first crack at roughly 3 minutes (common practice)
    expect(guide.afterFirstCrackSeconds).toEqual({ min: 20, max: 30 }); // medium +20–30 s (common practice)
    expect(guide.expectedLossPct).toEqual({ min: 14, max: 16, default: 15 }); // medium 14–16 % (from memory)
    // 454 × 0.84 = 381.36 → 381; 454 × 0.86 = 390.44 → 390; 454 × 0.85 = 385.9 → 385 (yields round down).
    expect(guide.expectedRoastedGrams).toEqual({ min: 381, max: 390, default: 385 });
    expect(guide.levels.find((entry) => entry.suggested)?.level).toBe('light');
    expect(guide.notes.some((note) => /under the usual/.test(note))).toBe(false);
  });

  it('gives time after first crack for every level', () => {
    const after = (level: (typeof roastLevels)[number]) =>
      homeRoastGuide({ device: 'popper', level, greenGrams: 227 }, defaultLossModel).afterFirstCrackSeconds;
    expect(after('light').max).toBe(10); // light +10 s (common practice)
    expect(after('medium-dark')).toEqual({ min: 30, max: 40 }); // medium-dark +30–40 s (common practice)
    expect(after('dark')).toEqual({ min: 60, max: 60 }); // dark +60 s (common practice)
    expect(after('french')).toEqual({ min: 90, max: 90 }); // French +90 s (common practice)
  });

  it('walks through the phases with their cues, adding second crack only for dark roasts', () => {
    const names = (level: (typeof roastLevels)[number]) =>
      homeRoastGuide({ device: 'popper', level, greenGrams: 80 }, defaultLossModel).phases.map((phase) => phase.name);
    expect(names('light')).toEqual(['Drying', 'Browning', 'First crack', 'Development', 'Cooling']);
    expect(names('french')).toEqual(['Drying', 'Browning', 'First crack', 'Development', 'Second crack', 'Cooling']);
    const phases = homeRoastGuide({ device: 'popper', level: 'french', greenGrams: 80 }, defaultLossModel).phases;
    expect(phases.find((phase) => phase.name === 'Browning')?.cue).toMatch(/bread-like/); // roast phases (common practice)
    expect(phases.find((phase) => phase.name === 'Development')?.cue).toMatch(/about 90 s .* French roast/);
  });

  it('carries the safety cautions', () => {
    const guide = homeRoastGuide({ device: 'popper', level: 'light', greenGrams: 80 }, defaultLossModel);
    expect(guide.cautions).toBe(homeRoastCautions);
    for (const topic of [/unattended/, /ventilation/, /[Cc]haff is flammable/, /mitt/, /Cool the beans/, /intended purpose/]) {
      expect(homeRoastCautions.some((caution) => topic.test(caution))).toBe(true); // the product's safety cautions
    }
  });

  it('notes small batches and refuses devices without a profile', () => {
    const guide = homeRoastGuide({ device: 'popper', level: 'medium', greenGrams: 100 }, defaultLossModel);
    expect(guide.batchLoads).toEqual([50, 50]);
    expect(guide.notes[0]).toMatch(/Batches of 50 g are under the usual 75–80 g/);
    expect(roastGuideDevices).toEqual(['popper']);
    expect(isRoastGuideDevice('popper')).toBe(true);
    expect(isRoastGuideDevice('oven')).toBe(false);
    expect(isRoastGuideDevice('toString')).toBe(false);
    expect(() => homeRoastGuide({ device: 'oven', level: 'medium', greenGrams: 100 }, defaultLossModel)).toThrow(RangeError);
    expect(() => homeRoastGuide({ device: 'popper', level: 'medium', greenGrams: 0 }, defaultLossModel)).toThrow(RangeError);
  });

  it('splits any weight into the fewest popper batches of at most 80 g', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 5000 }), fc.constantFrom(...roastLevels), (greenGrams, level) => {
        const guide = homeRoastGuide({ device: 'popper', level, greenGrams }, defaultLossModel);
        expect(guide.batchLoads.reduce((sum, load) => sum + load, 0)).toBe(greenGrams);
        expect(Math.max(...guide.batchLoads)).toBeLessThanOrEqual(80);
        expect(Math.max(...guide.batchLoads) - Math.min(...guide.batchLoads)).toBeLessThanOrEqual(1);
        expect((guide.batches - 1) * 80).toBeLessThan(greenGrams);
        expect(guide.expectedRoastedGrams.min).toBeLessThanOrEqual(guide.expectedRoastedGrams.max);
      }),
    );
  });
});
