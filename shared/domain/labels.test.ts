import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bagNetWeightLabel, netWeightLabel } from './labels';
import { fillGrams, toGrams } from './units';

describe('net weight labels in both units (FPLA; 21 CFR 101.105)', () => {
  it('matches the dual-unit forms the product prints', () => {
    expect(bagNetWeightLabel('12oz')).toBe('Net Wt 12 oz (340 g)'); // PRODUCT.md / TRADE.md, 21 CFR 101.105 form (from memory)
    expect(bagNetWeightLabel('1lb')).toBe('Net Wt 1 lb (454 g)'); // TRADE.md, 21 CFR 101.105 example (from memory)
    expect(bagNetWeightLabel('2lb')).toBe('Net Wt 2 lb (907 g)'); // issue text; 907.18 g to the nearest gram
    expect(bagNetWeightLabel('8oz')).toBe('Net Wt 8 oz (227 g)'); // 226.80 g to the nearest gram (NIST SP 811)
    expect(bagNetWeightLabel('5lb')).toBe('Net Wt 5 lb (2268 g)'); // 2267.96 g to the nearest gram (NIST SP 811)
  });

  it('states pounds with an ounce remainder and metric-declared weights in ounces or pounds', () => {
    expect(netWeightLabel({ amount: 24, unit: 'oz' })).toBe('Net Wt 1 lb 8 oz (680 g)'); // 680.39 g (NIST SP 811)
    expect(netWeightLabel({ amount: 250, unit: 'g' })).toBe('Net Wt 8.8 oz (250 g)'); // 8.818 oz truncated (NIST SP 811)
    expect(netWeightLabel({ amount: 500, unit: 'g' })).toBe('Net Wt 1.1 lb (500 g)'); // 1.1023 lb truncated (NIST SP 811)
    expect(netWeightLabel({ amount: 1, unit: 'kg' })).toBe('Net Wt 2.2 lb (1 kg)'); // 2.2046 lb truncated (NIST SP 811)
  });

  it('never declares more metric grams than the bag is filled with', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2000 }), fc.constantFrom<'oz' | 'lb'>('oz', 'lb'), (amount, unit) => {
        const label = netWeightLabel({ amount, unit });
        const grams = Number(/\((\d+) g\)$/.exec(label)?.[1]);
        expect(grams).toBeLessThanOrEqual(fillGrams({ amount, unit }));
        expect(Math.abs(grams - toGrams({ amount, unit }))).toBeLessThanOrEqual(0.5);
      }),
    );
  });

  it('never declares more ounces than a metric-declared bag holds', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 453 }), (grams) => {
        const ounces = Number(/^Net Wt ([\d.]+) oz/.exec(netWeightLabel({ amount: grams, unit: 'g' }))?.[1]);
        expect(ounces * 28.349523125).toBeLessThanOrEqual(grams + 1e-9); // NIST SP 811 (exact ounce)
        expect(grams - ounces * 28.349523125).toBeLessThan(0.1 * 28.349523125);
      }),
    );
  });
});
