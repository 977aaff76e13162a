/**
 * Net-quantity statements for bag labels, in US customary and metric units together
 * (FPLA as amended 1992; FDA 21 CFR 101.105).
 *
 * - `netWeightLabel(quantity)`: "Net Wt 12 oz (340 g)", "Net Wt 1 lb (454 g)",
 *   "Net Wt 1 lb 8 oz (680 g)"; a quantity declared in grams reads "Net Wt 8.8 oz (250 g)".
 * - `bagNetWeightLabel(size)`: the same for a bag size code.
 *
 * The metric figure is the exact mass to the nearest gram, which never exceeds the fill weight
 * (the declared mass rounded up), so the label never promises more than the bag holds. US figures
 * converted from grams are truncated for the same reason.
 */
import { bagSizeDeclarations, GRAMS_PER_OUNCE, GRAMS_PER_POUND, toGrams, type Quantity } from './units';
import type { BagSize } from './vocabulary';

const OUNCES_PER_POUND = 16;

function formatTruncated(value: number, decimals: number): string {
  const factor = 10 ** decimals;
  // The small epsilon keeps values like 17.6 (stored as 17.59999…) from losing a digit.
  const truncated = Math.floor(value * factor + 1e-9) / factor;
  return truncated.toFixed(decimals).replace(/\.?0+$/, '');
}

function usCustomaryText(quantity: Quantity): string {
  if (quantity.unit === 'oz' || quantity.unit === 'lb') {
    const ounces = quantity.unit === 'oz' ? quantity.amount : quantity.amount * OUNCES_PER_POUND;
    if (ounces < OUNCES_PER_POUND) return `${formatTruncated(ounces, 2)} oz`;
    const pounds = Math.floor(ounces / OUNCES_PER_POUND);
    const remainder = ounces - pounds * OUNCES_PER_POUND;
    return remainder === 0 ? `${pounds} lb` : `${pounds} lb ${formatTruncated(remainder, 2)} oz`;
  }
  const grams = toGrams(quantity);
  if (grams < GRAMS_PER_POUND) return `${formatTruncated(grams / GRAMS_PER_OUNCE, 1)} oz`;
  return `${formatTruncated(grams / GRAMS_PER_POUND, 2)} lb`;
}

function metricText(quantity: Quantity): string {
  if (quantity.unit === 'g' || quantity.unit === 'kg') {
    return quantity.unit === 'kg' ? `${quantity.amount} kg` : `${quantity.amount} g`;
  }
  return `${Math.round(toGrams(quantity))} g`;
}

/** US customary first, metric in parentheses. */
export function netWeightLabel(quantity: Quantity): string {
  return `Net Wt ${usCustomaryText(quantity)} (${metricText(quantity)})`;
}

export function bagNetWeightLabel(size: BagSize): string {
  return netWeightLabel(bagSizeDeclarations[size]);
}
