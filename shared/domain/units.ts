/**
 * Mass units, exact to the definition (NIST SP 811 App. B: 1 lb = 453.59237 g, 1 oz = 1/16 lb).
 *
 * - `GRAMS_PER_POUND`, `GRAMS_PER_OUNCE`: the exact factors.
 * - `toGrams(quantity)`: a quantity in g, kg, oz or lb as (float) grams.
 * - `gramsToOunces(grams)`, `gramsToPounds(grams)`: the other way.
 * - `fillGrams(quantity)`: the declared quantity rounded UP to a whole gram, computed exactly, so
 *   a bag filled to it is never short of its label.
 * - `bagSizeDeclarations`, `bagFillGrams(size)`: size codes → declared quantity / fill grams
 *   (`12oz` → 341 g).
 * - `parseQuantity(text)`: what people type ("1 lb", "340 g", "12oz", "0.5 kg") → a quantity, or a
 *   message saying what is accepted.
 */
import { ceilDiv } from './integer-math';
import type { BagSize } from './vocabulary';

export const massUnits = ['g', 'kg', 'oz', 'lb'] as const;
export type MassUnit = (typeof massUnits)[number];

export interface Quantity {
  amount: number;
  unit: MassUnit;
}

export const GRAMS_PER_POUND = 453.59237;
export const GRAMS_PER_OUNCE = GRAMS_PER_POUND / 16;

// Nanograms per unit are whole numbers for all four units, which makes exact rounding possible.
const NANOGRAMS_PER_GRAM = 1_000_000_000n;
const nanogramsPerUnit: Record<MassUnit, bigint> = {
  g: NANOGRAMS_PER_GRAM,
  kg: 1000n * NANOGRAMS_PER_GRAM,
  oz: 28_349_523_125n,
  lb: 453_592_370_000n,
};

// Amounts are accepted with up to six decimals, enough for anything a person types.
const AMOUNT_SCALE = 6;
const AMOUNT_DENOMINATOR = 10n ** BigInt(AMOUNT_SCALE);

function amountAsScaledInteger(amount: number): bigint {
  const scaled = Math.round(amount * Number(AMOUNT_DENOMINATOR));
  if (!Number.isSafeInteger(scaled) || scaled < 0) {
    throw new RangeError(`amount out of range: ${amount}`);
  }
  return BigInt(scaled);
}

/** Exact mass in nanograms, as a fraction numerator over 10^6 (the amount's scale). */
function scaledNanograms(quantity: Quantity): bigint {
  return amountAsScaledInteger(quantity.amount) * nanogramsPerUnit[quantity.unit];
}

export function toGrams(quantity: Quantity): number {
  return (quantity.amount * Number(nanogramsPerUnit[quantity.unit])) / Number(NANOGRAMS_PER_GRAM);
}

export function gramsToOunces(grams: number): number {
  return grams / GRAMS_PER_OUNCE;
}

export function gramsToPounds(grams: number): number {
  return grams / GRAMS_PER_POUND;
}

/** Declared quantity rounded up to a whole gram, exactly (8 oz → 227, 12 oz → 341, 1 lb → 454). */
export function fillGrams(quantity: Quantity): number {
  return ceilDiv(scaledNanograms(quantity), AMOUNT_DENOMINATOR * NANOGRAMS_PER_GRAM);
}

/**
 * Exact mass as a fraction of a gram, for callers that must round once at the end (prices).
 * Returns numerator and denominator with grams = numerator / denominator.
 */
export function exactGrams(quantity: Quantity): { numerator: bigint; denominator: bigint } {
  return { numerator: scaledNanograms(quantity), denominator: AMOUNT_DENOMINATOR * NANOGRAMS_PER_GRAM };
}

export const bagSizeDeclarations: Record<BagSize, Quantity> = {
  '8oz': { amount: 8, unit: 'oz' },
  '12oz': { amount: 12, unit: 'oz' },
  '1lb': { amount: 1, unit: 'lb' },
  '2lb': { amount: 2, unit: 'lb' },
  '5lb': { amount: 5, unit: 'lb' },
};

export function bagFillGrams(size: BagSize): number {
  return fillGrams(bagSizeDeclarations[size]);
}

export type ParseResult<T> = { ok: true; value: T } | { ok: false; message: string };

const unitAliases: Record<string, MassUnit> = {
  g: 'g',
  gr: 'g',
  gram: 'g',
  grams: 'g',
  gramme: 'g',
  grammes: 'g',
  kg: 'kg',
  kgs: 'kg',
  kilo: 'kg',
  kilos: 'kg',
  kilogram: 'kg',
  kilograms: 'kg',
  oz: 'oz',
  ounce: 'oz',
  ounces: 'oz',
  lb: 'lb',
  lbs: 'lb',
  pound: 'lb',
  pounds: 'lb',
};

const ACCEPTED = 'Write a weight as a number and a unit, like "340 g", "12 oz", "1 lb" or "0.5 kg".';
const QUANTITY_PATTERN = /^(\d{1,3}(?:,\d{3})+|\d+)?(\.\d+)?\s*([a-z]+)\.?$/;

/** Parses a typed weight. Thousands separators ("1,000 g") are allowed; decimal commas are not. */
export function parseQuantity(text: string): ParseResult<Quantity> {
  const normalized = text.trim().toLowerCase();
  if (normalized === '') return { ok: false, message: `The weight is empty. ${ACCEPTED}` };
  const match = QUANTITY_PATTERN.exec(normalized);
  if (!match || (match[1] === undefined && match[2] === undefined)) {
    if (/^\d+,\d{1,2}\s*[a-z]/.test(normalized)) {
      return { ok: false, message: `Use a point for decimals ("0.5 kg", not "0,5 kg"). ${ACCEPTED}` };
    }
    if (/^[\d.,]+$/.test(normalized)) return { ok: false, message: `The weight needs a unit. ${ACCEPTED}` };
    return { ok: false, message: `"${text.trim()}" is not a weight. ${ACCEPTED}` };
  }
  const [, whole = '0', fraction = '', unitText = ''] = match;
  const unit = unitAliases[unitText];
  if (!unit) return { ok: false, message: `"${unitText}" is not a unit Restday knows. ${ACCEPTED}` };
  if (fraction.length - 1 > AMOUNT_SCALE) {
    return { ok: false, message: `Use at most ${AMOUNT_SCALE} decimals. ${ACCEPTED}` };
  }
  const amount = Number(`${whole.replaceAll(',', '')}${fraction}`);
  if (amount <= 0) return { ok: false, message: `The weight must be more than zero. ${ACCEPTED}` };
  if (toGrams({ amount, unit }) > 1_000_000) {
    return { ok: false, message: 'That is more than a tonne; enter a smaller weight.' };
  }
  return { ok: true, value: { amount, unit } };
}
