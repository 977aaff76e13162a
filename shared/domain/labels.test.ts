import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bagNetWeightLabel, netWeightLabel } from './labels';
import { fillGrams } from './units';

// Sources. Units: 1 oz = 28.349523125 g, 1 lb = 453.59237 g exactly (NIST SP 811, App. B).
// Dual units on US packaged food: FPLA as amended 1992; 21 CFR 101.105; "Net Wt 12 oz (340 g)" form
// (21 CFR 101.105 examples, from memory).
// From 1 lb up to 4 lb, ounces first and pounds in parentheses (15 U.S.C. 1453(a)(3)(A)). The statute's
// text itself was not in the reference search; what it found agrees: an excerpt of 21 CFR Chapter I
// speaks of "the initial statement of ounces in the dual declaration of net quantity" (§ 101.7(j)), and a
// package quoted on a metric-usage mailing list reads "21 OZ (1 LB 5 OZ) 595 g". Followed on that basis.
// From 1 kg up the metric figure in kilograms, rounded down (NIST metric labelling guidance, from memory).

describe('net weight labels in both units (FPLA; 21 CFR 101.105)', () => {
  it('states bags under 1 lb in ounces with grams in parentheses', () => {
    expect(bagNetWeightLabel('12oz')).toBe('Net Wt 12 oz (340 g)'); // 12 × 28.3495 = 340.19 g → 340 g (the product's rule)
    expect(bagNetWeightLabel('8oz')).toBe('Net Wt 8 oz (227 g)'); // 8 × 28.3495 = 226.80 g → 227 g (NIST SP 811)
  });

  it('states bags from 1 lb up to 4 lb in ounces first, pounds in parentheses, then grams', () => {
    expect(bagNetWeightLabel('1lb')).toBe('Net Wt 16 oz (1 lb) 454 g'); // 453.59 g → 454 g; 16 oz = 1 lb
    expect(bagNetWeightLabel('2lb')).toBe('Net Wt 32 oz (2 lb) 907 g'); // 907.18 g → 907 g; 32 oz = 2 lb
    expect(netWeightLabel({ amount: 24, unit: 'oz' })).toBe('Net Wt 24 oz (1 lb 8 oz) 680 g'); // 680.39 g; 24 oz = 1 lb 8 oz
    // 3 lb = 1,360.78 g: from 1 kg in kilograms, rounded down → 1.36 kg.
    expect(netWeightLabel({ amount: 3, unit: 'lb' })).toBe('Net Wt 48 oz (3 lb) 1.36 kg');
  });

  it('states bags from 4 lb in pounds with kilograms rounded down', () => {
    // 5 lb = 2,267.96 g = 2.26796 kg → 2.26 kg, never rounded up to 2.27 (5 lb → 2.26 kg).
    expect(bagNetWeightLabel('5lb')).toBe('Net Wt 5 lb (2.26 kg)');
    // 4 lb = 1,814.37 g → 1.81 kg; the ounce-first form stops below 4 lb.
    expect(netWeightLabel({ amount: 4, unit: 'lb' })).toBe('Net Wt 4 lb (1.81 kg)');
  });

  it('states metric-declared weights with truncated ounces and pounds', () => {
    expect(netWeightLabel({ amount: 250, unit: 'g' })).toBe('Net Wt 8.8 oz (250 g)'); // 250 ÷ 28.3495 = 8.818 oz → 8.8
    // 500 g = 17.637 oz → 17.6, = 1.1023 lb → 1.1 (truncated, never over).
    expect(netWeightLabel({ amount: 500, unit: 'g' })).toBe('Net Wt 17.6 oz (1.1 lb) 500 g');
    // 1 kg = 35.274 oz → 35.2, = 2.2046 lb → 2.2.
    expect(netWeightLabel({ amount: 1, unit: 'kg' })).toBe('Net Wt 35.2 oz (2.2 lb) 1 kg');
    // 2,000 g = 4.409 lb → 4.4 lb; 2 kg.
    expect(netWeightLabel({ amount: 2000, unit: 'g' })).toBe('Net Wt 4.4 lb (2 kg)');
  });

  it('never declares more metric weight than the bag is filled with', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 2000 }), fc.constantFrom<'oz' | 'lb'>('oz', 'lb'), (amount, unit) => {
        const label = netWeightLabel({ amount, unit });
        const metric = /(?:\(| )([\d.]+) (g|kg)\)?$/.exec(label);
        expect(metric).not.toBeNull();
        const declaredGrams = metric![2] === 'kg' ? Math.round(Number(metric![1]) * 1000) : Number(metric![1]);
        expect(declaredGrams).toBeLessThanOrEqual(fillGrams({ amount, unit }));
        // Kilograms to two decimals are at most 10 g under the fill; grams at most 1 g.
        expect(fillGrams({ amount, unit }) - declaredGrams).toBeLessThanOrEqual(metric![2] === 'kg' ? 11 : 1);
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
