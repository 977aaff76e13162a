import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { bagFillGrams, fillGrams, GRAMS_PER_OUNCE, GRAMS_PER_POUND, gramsToOunces, gramsToPounds, parseQuantity, toGrams, type MassUnit } from './units';

describe('exact conversion factors', () => {
  it('uses the defined pound and ounce', () => {
    expect(GRAMS_PER_POUND).toBe(453.59237); // NIST SP 811 App. B (exact)
    expect(GRAMS_PER_OUNCE).toBeCloseTo(28.349523125, 12); // NIST SP 811 App. B (exact)
  });

  it('converts the bag sizes by the NIST SP 811 factors', () => {
    expect(toGrams({ amount: 12, unit: 'oz' })).toBeCloseTo(340.19, 2); // NIST SP 811
    expect(toGrams({ amount: 1, unit: 'lb' })).toBeCloseTo(453.59, 2); // NIST SP 811
    expect(toGrams({ amount: 2, unit: 'lb' })).toBeCloseTo(907.18, 2); // NIST SP 811
    expect(toGrams({ amount: 5, unit: 'lb' })).toBeCloseTo(2267.96, 2); // NIST SP 811
    expect(toGrams({ amount: 0.5, unit: 'kg' })).toBe(500);
  });

  it('converts grams back to ounces and pounds', () => {
    expect(gramsToOunces(340.1942775)).toBeCloseTo(12, 10); // NIST SP 811 App. B
    expect(gramsToPounds(907.18474)).toBeCloseTo(2, 10); // NIST SP 811 App. B
  });
});

describe('fill grams: the declared quantity rounded up to a whole gram', () => {
  it('fills each bag size to at least its label', () => {
    expect(bagFillGrams('8oz')).toBe(227); // 226.80 g → 227
    expect(bagFillGrams('12oz')).toBe(341); // 340.19 g → 341
    expect(bagFillGrams('1lb')).toBe(454); // 453.59 g → 454
    expect(bagFillGrams('2lb')).toBe(908); // 907.18 g → 908
    expect(bagFillGrams('5lb')).toBe(2268); // 2267.96 g → 2268
  });

  it('rounds typed amounts up to the next whole gram, worked by hand', () => {
    // 1 oz = 28.349523125 g, 1 lb = 453.59237 g exactly (NIST SP 811 App. B); worked by hand:
    expect(fillGrams({ amount: 0.1, unit: 'oz' })).toBe(3); // 2.8349523125 g
    expect(fillGrams({ amount: 1, unit: 'oz' })).toBe(29); // 28.349523125 g
    expect(fillGrams({ amount: 3.5, unit: 'oz' })).toBe(100); // 99.2233309375 g
    expect(fillGrams({ amount: 10, unit: 'oz' })).toBe(284); // 283.49523125 g
    expect(fillGrams({ amount: 16, unit: 'oz' })).toBe(454); // 453.59237 g, the same as 1 lb
    expect(fillGrams({ amount: 0.25, unit: 'lb' })).toBe(114); // 113.3980925 g
    expect(fillGrams({ amount: 2.5, unit: 'lb' })).toBe(1134); // 1,133.980925 g
    expect(fillGrams({ amount: 10, unit: 'lb' })).toBe(4536); // 4,535.9237 g
    expect(fillGrams({ amount: 100, unit: 'lb' })).toBe(45_360); // 45,359.237 g
    expect(fillGrams({ amount: 22.046, unit: 'lb' })).toBe(10_000); // 9,999.897… g
    expect(fillGrams({ amount: 1.0005, unit: 'kg' })).toBe(1001); // 1,000.5 g
    expect(fillGrams({ amount: 340.19, unit: 'g' })).toBe(341);
    expect(fillGrams({ amount: 340, unit: 'g' })).toBe(340); // whole grams stay as they are
  });

  it('never fills a larger amount with fewer grams', () => {
    const unit = fc.constantFrom<MassUnit>('g', 'kg', 'oz', 'lb');
    const thousandths = fc.integer({ min: 1, max: 10_000_000 });
    fc.assert(
      fc.property(thousandths, thousandths, unit, (a, b, massUnit) => {
        const [small, large] = a <= b ? [a, b] : [b, a];
        expect(fillGrams({ amount: small / 1000, unit: massUnit })).toBeLessThanOrEqual(fillGrams({ amount: large / 1000, unit: massUnit }));
      }),
    );
  });

  it('keeps whole grams exact and agrees between pounds and ounces', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 100_000 }), (n) => {
        expect(fillGrams({ amount: n, unit: 'g' })).toBe(n);
        expect(fillGrams({ amount: n / 1000, unit: 'kg' })).toBe(n);
        expect(fillGrams({ amount: n, unit: 'lb' })).toBe(fillGrams({ amount: 16 * n, unit: 'oz' }));
      }),
    );
  });
});

describe('out-of-range amounts', () => {
  it('refuses negative and enormous amounts instead of rounding them', () => {
    expect(() => fillGrams({ amount: -1, unit: 'g' })).toThrow(RangeError);
    expect(() => fillGrams({ amount: 1e12, unit: 'kg' })).toThrow(RangeError);
  });
});

describe('parseQuantity', () => {
  it.each([
    ['1 lb', 1, 'lb'],
    ['340 g', 340, 'g'],
    ['12oz', 12, 'oz'],
    ['0.5 kg', 0.5, 'kg'],
    ['  2 Pounds ', 2, 'lb'],
    ['1.5lbs', 1.5, 'lb'],
    ['1,000 g', 1000, 'g'],
    ['.5 kg', 0.5, 'kg'],
    ['8 oz.', 8, 'oz'],
  ])('reads %j', (text, amount, unit) => {
    expect(parseQuantity(text)).toEqual({ ok: true, value: { amount, unit } });
  });

  it.each([
    ['', /empty/],
    ['twelve ounces', /not a weight/],
    ['12', /needs a unit/],
    ['12 stone', /"stone" is not a unit/],
    ['0 g', /more than zero/],
    ['0,5 kg', /point for decimals/],
    ['-1 lb', /not a weight/],
    ['1.1234567 kg', /at most 6 decimals/],
    ['2000 kg', /more than a tonne/],
  ])('explains what is wrong with %j', (text, message) => {
    const result = parseQuantity(text);
    expect(result.ok).toBe(false);
    if (!result.ok) {
      expect(result.message).toMatch(message);
      expect(result.message.length).toBeGreaterThan(20);
    }
  });

  it('reads back any amount it is given with a unit', () => {
    const unit = fc.constantFrom<MassUnit>('g', 'kg', 'oz', 'lb');
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 9_999_999 }), unit, (hundredths, massUnit) => {
        const amount = hundredths / 100;
        if (toGrams({ amount, unit: massUnit }) > 1_000_000) return;
        expect(parseQuantity(`${amount} ${massUnit}`)).toEqual({ ok: true, value: { amount, unit: massUnit } });
      }),
    );
  });
});
