import { describe, expect, it } from 'vitest';
import { formatAltitude, formatGrams, formatPercent, formatScore } from './format';

describe('display formatting', () => {
  it('shows grams below a kilogram, kilograms to one decimal above', () => {
    expect(formatGrams(0)).toBe('0 g');
    expect(formatGrams(454)).toBe('454 g');
    expect(formatGrams(1000)).toBe('1 kg');
    expect(formatGrams(2268)).toBe('2.3 kg');
    expect(formatGrams(18_400)).toBe('18.4 kg');
  });

  it('shows altitude, percentages and cupping scores', () => {
    expect(formatAltitude(1850)).toBe('1,850 m');
    expect(formatPercent(10.8)).toBe('10.8%');
    expect(formatPercent(11)).toBe('11%');
    expect(formatScore(86.25)).toBe('86.25');
    expect(formatScore(87)).toBe('87');
  });
});
