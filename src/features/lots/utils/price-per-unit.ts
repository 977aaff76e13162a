import { ceilDiv, floorDiv, roundHalfUpDiv } from '@shared/domain/integer-math';
import { exactGrams } from '@shared/domain/units';

/** The weight a visitor reads prices by; the API always speaks cents per kg. */
export const priceUnits = ['kg', 'lb'] as const;
export type PriceUnit = (typeof priceUnits)[number];

export function isPriceUnit(value: string | null): value is PriceUnit {
  return value === 'kg' || value === 'lb';
}

// 1 lb = 453.59237 g exactly (NIST SP 811 App. B), as a fraction so no float error moves a bound.
const pound = exactGrams({ amount: 1, unit: 'lb' });
const GRAMS_PER_KG = 1000n;

/**
 * A price bound typed per `unit` (in cents) as cents per kg, rounded so the bound never takes in
 * a lot the visitor's own figure would leave out: a lower bound rounds up, an upper bound down.
 */
export function boundToCentsPerKg(cents: number, unit: PriceUnit, bound: 'min' | 'max'): number {
  if (unit === 'kg') return cents;
  const numerator = BigInt(cents) * GRAMS_PER_KG * pound.denominator;
  return bound === 'min' ? ceilDiv(numerator, pound.numerator) : floorDiv(numerator, pound.numerator);
}

/** Cents per kg shown per `unit`, to the nearest cent. */
export function centsPerKgToUnit(centsPerKg: number, unit: PriceUnit): number {
  if (unit === 'kg') return centsPerKg;
  return roundHalfUpDiv(BigInt(centsPerKg) * pound.numerator, GRAMS_PER_KG * pound.denominator);
}

/** "22.5" or "22.50" or "$22" → 2250 cents; anything else (or nothing) → undefined. */
export function parseDollars(text: string): number | undefined {
  const match = /^\s*\$?\s*(\d{1,6})(?:\.(\d{1,2}))?\s*$/.exec(text);
  if (!match) return undefined;
  return Number(match[1]) * 100 + Number((match[2] ?? '').padEnd(2, '0'));
}

/** 2250 → "22.50", for a price input's value. */
export function centsToDollarText(cents: number): string {
  return (cents / 100).toFixed(2);
}
