import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { boundToCentsPerKg, centsPerKgToUnit, centsToDollarText, parseDollars } from './price-per-unit';

describe('price bounds per kg and per lb', () => {
  it('converts $10.00/lb to cents per kg with 1 lb = 453.59237 g (NIST SP 811 App. B): 2204.62…, up for a minimum, down for a maximum', () => {
    // 1000 cents ÷ 0.45359237 kg = 2204.6226… cents/kg (NIST SP 811 App. B factor).
    expect(boundToCentsPerKg(1000, 'lb', 'min')).toBe(2205);
    expect(boundToCentsPerKg(1000, 'lb', 'max')).toBe(2204);
    expect(boundToCentsPerKg(2450, 'kg', 'min')).toBe(2450);
  });

  it('shows $22.05/kg as $10.00/lb (2205 × 0.45359237 = 1000.17 cents; NIST SP 811 App. B)', () => {
    expect(centsPerKgToUnit(2205, 'lb')).toBe(1000);
    expect(centsPerKgToUnit(2205, 'kg')).toBe(2205);
  });

  it('never lets a converted bound take in a lot the per-lb bound would leave out', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 1_000_000 }), fc.integer({ min: 1, max: 2_000_000 }), (centsPerLb, lotCentsPerKg) => {
        // The lot's exact price per lb, compared in integers: lotCentsPerKg × 0.45359237 against centsPerLb.
        const lotPerLbTimes1e8 = BigInt(lotCentsPerKg) * 45_359_237n;
        const boundTimes1e8 = BigInt(centsPerLb) * 100_000_000n;
        if (lotCentsPerKg >= boundToCentsPerKg(centsPerLb, 'lb', 'min')) expect(lotPerLbTimes1e8 >= boundTimes1e8).toBe(true);
        if (lotCentsPerKg <= boundToCentsPerKg(centsPerLb, 'lb', 'max')) expect(lotPerLbTimes1e8 <= boundTimes1e8).toBe(true);
      }),
    );
  });

  it('reads dollars as typed and writes them back with two decimals', () => {
    expect(parseDollars('22.5')).toBe(2250);
    expect(parseDollars(' $18 ')).toBe(1800);
    expect(parseDollars('9.05')).toBe(905);
    expect(parseDollars('')).toBeUndefined();
    expect(parseDollars('-3')).toBeUndefined();
    expect(parseDollars('1.234')).toBeUndefined();
    expect(centsToDollarText(905)).toBe('9.05');
  });
});
