/**
 * Net-quantity statements for bag labels, in US customary and metric units together
 * (FPLA as amended 1992; FDA 21 CFR 101.105).
 *
 * - `netWeightLabel(quantity)`: under 1 lb "Net Wt 12 oz (340 g)"; from 1 lb to under 4 lb ounces
 *   first with pounds in parentheses, then metric: "Net Wt 16 oz (1 lb) 454 g",
 *   "Net Wt 24 oz (1 lb 8 oz) 680 g" (15 U.S.C. 1453(a)(3)(A)); from 4 lb pounds: "Net Wt 5 lb (2.26 kg)".
 *   A quantity declared in grams reads "Net Wt 8.8 oz (250 g)".
 * - `bagNetWeightLabel(size)`: the same for a bag size code.
 *
 * Metric figures never promise more than the bag holds: under 1 kg the exact mass to the nearest
 * gram (never above the fill weight, which is the declared mass rounded up); from 1 kg in kilograms
 * rounded down to two decimals (5 lb = 2.26796 kg → 2.26 kg). US figures converted from grams are
 * truncated for the same reason.
 */
import { bagSizeDeclarations, GRAMS_PER_OUNCE, GRAMS_PER_POUND, toGrams, type Quantity } from './units';
import type { BagSize } from './vocabulary';

const OUNCES_PER_POUND = 16;
/** From 1 lb up to (not including) 4 lb the ounces come first, pounds in parentheses. */
const DUAL_FROM_OUNCES = 16;
const DUAL_BELOW_OUNCES = 64;

function formatTruncated(value: number, decimals: number): string {
  const factor = 10 ** decimals;
  // The small epsilon keeps values like 17.6 (stored as 17.59999…) from losing a digit.
  const truncated = Math.floor(value * factor + 1e-9) / factor;
  return truncated.toFixed(decimals).replace(/\.?0+$/, '');
}

/** The US figures: ounces and pounds (with any remainder in ounces, or a decimal of the pound). */
function usCustomary(quantity: Quantity): { ounces: number; ouncesText: string; poundsText: string } {
  if (quantity.unit === 'oz' || quantity.unit === 'lb') {
    const ounces = quantity.unit === 'oz' ? quantity.amount : quantity.amount * OUNCES_PER_POUND;
    const pounds = Math.floor(ounces / OUNCES_PER_POUND);
    const remainder = ounces - pounds * OUNCES_PER_POUND;
    return {
      ounces,
      ouncesText: `${formatTruncated(ounces, 2)} oz`,
      poundsText: remainder === 0 ? `${pounds} lb` : `${pounds} lb ${formatTruncated(remainder, 2)} oz`,
    };
  }
  const grams = toGrams(quantity);
  const ounces = grams / GRAMS_PER_OUNCE;
  return { ounces, ouncesText: `${formatTruncated(ounces, 1)} oz`, poundsText: `${formatTruncated(grams / GRAMS_PER_POUND, 2)} lb` };
}

function metricText(quantity: Quantity): string {
  if (quantity.unit === 'kg') return `${quantity.amount} kg`;
  const grams = toGrams(quantity);
  if (grams < 1000) return `${quantity.unit === 'g' ? quantity.amount : Math.min(Math.round(grams), 999)} g`;
  return `${formatTruncated(grams / 1000, 2)} kg`;
}

export function netWeightLabel(quantity: Quantity): string {
  const { ounces, ouncesText, poundsText } = usCustomary(quantity);
  const metric = metricText(quantity);
  if (ounces < DUAL_FROM_OUNCES) return `Net Wt ${ouncesText} (${metric})`;
  if (ounces < DUAL_BELOW_OUNCES) return `Net Wt ${ouncesText} (${poundsText}) ${metric}`;
  return `Net Wt ${poundsText} (${metric})`;
}

export function bagNetWeightLabel(size: BagSize): string {
  return netWeightLabel(bagSizeDeclarations[size]);
}
