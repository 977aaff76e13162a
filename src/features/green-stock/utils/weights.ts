import { gramsToPounds, toGrams } from '@shared/domain/units';
import { formatGrams } from '@/lib/format';

/** The units staff type stock changes in. */
export const stockUnits = ['g', 'lb'] as const;
export type StockUnit = (typeof stockUnits)[number];

const pounds = new Intl.NumberFormat('en-US', { minimumFractionDigits: 0, maximumFractionDigits: 1 });

/** 18_144 → "40 lb" (to a tenth of a pound, for reading; grams stay the record). */
export function formatPounds(grams: number): string {
  return `${pounds.format(gramsToPounds(grams))} lb`;
}

/** 18_144 → "18.1 kg · 40 lb" */
export function formatGramsAndPounds(grams: number): string {
  return `${formatGrams(grams)} · ${formatPounds(grams)}`;
}

/** A signed change: "+2.3 kg", "−250 g". */
export function formatGramsChange(grams: number): string {
  return grams > 0 ? `+${formatGrams(grams)}` : `−${formatGrams(-grams)}`;
}

const AMOUNT = /^[+\-−]?\d+(\.\d+)?$/;

/**
 * What a person typed, in grams: pounds become the nearest whole gram (NIST SP 811: 1 lb =
 * 453.59237 g); grams are taken as typed, so a fraction of a gram is left for the schema to refuse.
 * Anything that is not a number is NaN.
 */
export function typedAmountToGrams(text: string, unit: StockUnit): number {
  const trimmed = text.trim().replace('−', '-');
  if (!AMOUNT.test(trimmed)) return Number.NaN;
  const amount = Number(trimmed);
  if (unit === 'g') return amount;
  const grams = Math.round(toGrams({ amount: Math.abs(amount), unit: 'lb' }));
  return amount < 0 ? -grams : grams;
}
