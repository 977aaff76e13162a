import { describe, expect, it } from 'vitest';
import { lotCreateSchema } from '@shared/schemas/lots';
import { makeLotDetail } from '@/testing/test-utils';
import {
  centsFromDollars,
  dollarsFromCents,
  gramsFromWeightText,
  lotFormValuesOf,
  lotPatchOf,
  notesFromText,
  numberFromText,
  numberOrNullFromText,
} from './lot-form-values';

describe('lot form values', () => {
  it('reads a reorder point in grams, kg or lb as whole grams', () => {
    // 1 lb = 453.59237 g exactly (NIST SP 811, App. B): 10 lb = 4,535.9237 g → 4,536 g; 11 lb → 4,989.5 g → 4,990 g.
    expect(gramsFromWeightText('5000')).toBe(5000);
    expect(gramsFromWeightText('5 kg')).toBe(5000);
    expect(gramsFromWeightText('10 lb')).toBe(4536);
    expect(gramsFromWeightText(' 11 lbs ')).toBe(4990);
    expect(gramsFromWeightText('0')).toBe(0);
    expect(gramsFromWeightText('lots')).toBeNaN();
    expect(gramsFromWeightText('')).toBeNaN();
  });

  it('reads dollars as exact cents and refuses anything else', () => {
    expect(centsFromDollars('24.50')).toBe(2450);
    expect(centsFromDollars('0.29')).toBe(29);
    expect(centsFromDollars('1,024')).toBe(102_400);
    for (const text of ['', '24.505', '$24', 'abc']) expect(centsFromDollars(text)).toBeNaN();
    expect(dollarsFromCents(2450)).toBe('24.50');
    expect(dollarsFromCents(Number.NaN)).toBe('');
  });

  it('reads number boxes, with empty as NaN or as not known', () => {
    expect(numberFromText(' 1850 ')).toBe(1850);
    expect(numberFromText('')).toBeNaN();
    expect(numberOrNullFromText('')).toBeNull();
    expect(numberOrNullFromText('86.25')).toBe(86.25);
  });

  it('splits tasting notes on commas and drops empty ones', () => {
    expect(notesFromText(' bergamot, apricot ,, cane sugar, ')).toEqual(['bergamot', 'apricot', 'cane sugar']);
  });

  it('sends only changed fields, never the code, and nothing when nothing changed', () => {
    const original = lotFormValuesOf(makeLotDetail(), { reorderPointGrams: 0, isListed: true });
    const unchanged = lotCreateSchema.parse(original);
    expect(lotPatchOf(unchanged, original)).toEqual({});
    const changed = lotCreateSchema.parse({ ...original, code: 'RD-OTHER', name: 'Renamed', priceBreaks: [] });
    expect(lotPatchOf(changed, original)).toEqual({ name: 'Renamed', priceBreaks: [] });
  });
});
