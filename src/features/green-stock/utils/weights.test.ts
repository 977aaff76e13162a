import { describe, expect, it } from 'vitest';
import { formatGramsAndPounds, formatGramsChange, formatPounds, typedAmountToGrams } from './weights';

describe('stock weights typed and shown', () => {
  it('takes grams as typed and pounds to the nearest gram', () => {
    expect(typedAmountToGrams('2500', 'g')).toBe(2500);
    expect(typedAmountToGrams('-250', 'g')).toBe(-250);
    // 1 lb = 453.59237 g exactly (NIST SP 811, Appendix B): 5 lb = 2267.96 g → 2268; 0.5 lb = 226.80 g → 227; 132.2774 lb (a 60 kg sack) = 60 000.02 g → 60 000.
    expect(typedAmountToGrams('5', 'lb')).toBe(2268);
    expect(typedAmountToGrams('−0.5', 'lb')).toBe(-227);
    expect(typedAmountToGrams('132.2774', 'lb')).toBe(60_000);
  });

  it('leaves a fraction of a gram for the schema to refuse, and makes anything else NaN', () => {
    expect(typedAmountToGrams('12.5', 'g')).toBe(12.5);
    for (const text of ['', ' ', '5 lb', '1,000', 'ten', '--5']) expect(typedAmountToGrams(text, 'g')).toBeNaN();
  });

  it('shows grams with pounds beside them, and changes with their sign', () => {
    // 18 144 g ÷ 453.59237 g/lb = 40.0 lb (NIST SP 811, Appendix B).
    expect(formatPounds(18_144)).toBe('40 lb');
    expect(formatGramsAndPounds(18_144)).toBe('18.1 kg · 40 lb');
    expect(formatGramsChange(2268)).toBe('+2.3 kg');
    expect(formatGramsChange(-250)).toBe('−250 g');
  });
});
