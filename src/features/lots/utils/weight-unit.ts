import { bagSizeDeclarations, gramsToOunces } from '@shared/domain/units';
import type { BagSize } from '@shared/domain/vocabulary';
import { formatGrams } from '@/lib/format';

/** How the lot page shows weights: metric grams or US ounces. */
export type WeightUnit = 'g' | 'oz';

const ounces = new Intl.NumberFormat('en-US', { minimumFractionDigits: 0, maximumFractionDigits: 1 });

/** 454, 'g' → "454 g"; 454, 'oz' → "16 oz" */
export function formatWeight(grams: number, unit: WeightUnit): string {
  return unit === 'g' ? formatGrams(grams) : `${ounces.format(gramsToOunces(grams))} oz`;
}

/** '8oz' → "8 oz"; '1lb' → "1 lb": the quantity the label declares. */
export function bagSizeLabel(size: BagSize): string {
  const { amount, unit } = bagSizeDeclarations[size];
  return `${amount} ${unit}`;
}
