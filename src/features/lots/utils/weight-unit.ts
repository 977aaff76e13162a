import { bagSizeDeclarations, gramsToOunces, gramsToPounds } from '@shared/domain/units';
import type { BagSize } from '@shared/domain/vocabulary';
import { formatGrams } from '@/lib/format';

/** How the lot page shows weights: metric grams or US ounces. */
export type WeightUnit = 'g' | 'oz';

const ounces = new Intl.NumberFormat('en-US', { minimumFractionDigits: 0, maximumFractionDigits: 1 });

/** 454, 'g' → "454 g"; 454, 'oz' → "16 oz" */
export function formatWeight(grams: number, unit: WeightUnit): string {
  return unit === 'g' ? formatGrams(grams) : `${ounces.format(gramsToOunces(grams))} oz`;
}

const pounds = new Intl.NumberFormat('en-US', { minimumFractionDigits: 0, maximumFractionDigits: 1 });

/** A bulk weight (a quantity break): 2268, 'g' → "2.3 kg"; 2268, 'oz' → "5 lb" (US bulk weights read in pounds). */
export function formatBulkWeight(grams: number, unit: WeightUnit): string {
  return unit === 'g' ? formatGrams(grams) : `${pounds.format(gramsToPounds(grams))} lb`;
}

/** '8oz' → "8 oz"; '1lb' → "1 lb": the quantity the label declares. */
export function bagSizeLabel(size: BagSize): string {
  const { amount, unit } = bagSizeDeclarations[size];
  return `${amount} ${unit}`;
}
