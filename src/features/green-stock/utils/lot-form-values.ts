import type { z } from 'zod';
import { toMinorUnits } from '@shared/domain/money';
import { parseQuantity, toGrams } from '@shared/domain/units';
import type { lotCreateSchema, LotDetail, LotUpdate } from '@shared/schemas/lots';

/** The lot form holds what `lotCreateSchema` reads, and gives what it returns. */
export type LotFormValues = z.input<typeof lotCreateSchema>;
export type LotFormOutput = z.output<typeof lotCreateSchema>;

/** A number box's text as a number; empty or not a number is NaN, which the schema refuses. */
export function numberFromText(text: unknown): number {
  if (typeof text === 'number') return text;
  return typeof text === 'string' && text.trim() !== '' ? Number(text.trim()) : Number.NaN;
}

/**
 * A reorder point typed in grams ("5000"), or with its unit ("5 kg", "11 lb", "0.5 kg"), as whole
 * grams to the nearest gram; anything else is NaN, which the schema refuses. 0 means none.
 */
export function gramsFromWeightText(text: unknown): number {
  if (typeof text === 'number') return text;
  if (typeof text !== 'string' || text.trim() === '') return Number.NaN;
  if (/^\s*\d+\s*$/.test(text)) return Number(text.trim());
  const parsed = parseQuantity(text);
  return parsed.ok ? Math.round(toGrams(parsed.value)) : Number.NaN;
}

/** As `numberFromText`, but an empty box means "not known" (null). */
export function numberOrNullFromText(text: unknown): number | null {
  if (text === null || (typeof text === 'string' && text.trim() === '')) return null;
  return numberFromText(text);
}

export function textOrNull(text: unknown): string | null {
  return typeof text === 'string' && text.trim() !== '' ? text : null;
}

/** Dollars typed ("24.50") as cents, exactly; anything else is NaN. */
export function centsFromDollars(text: string): number {
  const parsed = toMinorUnits(text, 'usd');
  return parsed.ok ? parsed.value : Number.NaN;
}

export function dollarsFromCents(cents: number): string {
  return Number.isFinite(cents) ? (cents / 100).toFixed(2) : '';
}

/** Tasting notes typed with commas between them; empty pieces are dropped. */
export function notesFromText(text: string): string[] {
  return text
    .split(',')
    .map((note) => note.trim())
    .filter((note) => note !== '');
}

export function textFromNotes(notes: string[]): string {
  return notes.join(', ');
}

/** A new lot's form before anything is typed: listed, no reorder point, no stock. */
export const emptyLotFormValues: LotFormValues = {
  code: '',
  name: '',
  origin: '',
  region: '',
  producer: '',
  variety: '',
  process: 'washed',
  altitudeM: Number.NaN,
  cropYear: Number.NaN,
  moisturePct: Number.NaN,
  densityGPerL: null,
  screenSize: null,
  cuppingScore: null,
  tastingNotes: [],
  description: '',
  suggestedLevel: 'medium',
  allowedLevels: ['light', 'medium', 'medium-dark'],
  pricePerKgCents: Number.NaN,
  priceBreaks: [],
  reorderPointGrams: 0,
  isListed: true,
};

/** An existing lot in the form; `settings` are the Roastery's own fields, edited elsewhere on the page. */
export function lotFormValuesOf(lot: LotDetail, settings: { reorderPointGrams: number; isListed: boolean }): LotFormValues {
  return {
    code: lot.code,
    name: lot.name,
    origin: lot.origin,
    region: lot.region,
    producer: lot.producer,
    variety: lot.variety,
    process: lot.process,
    altitudeM: lot.altitudeM,
    cropYear: lot.cropYear,
    moisturePct: lot.moisturePct,
    densityGPerL: lot.densityGPerL,
    screenSize: lot.screenSize,
    cuppingScore: lot.cuppingScore,
    tastingNotes: lot.tastingNotes,
    description: lot.description,
    suggestedLevel: lot.suggestedLevel,
    allowedLevels: lot.allowedLevels,
    pricePerKgCents: lot.pricePerKgCents,
    priceBreaks: lot.priceBreaks,
    ...settings,
  };
}

/**
 * The PATCH body: only the fields whose value differs from the lot as loaded (a list counts as
 * changed as a whole), never the code. Empty when nothing changed.
 */
export function lotPatchOf(values: LotFormOutput, original: LotFormValues): LotUpdate {
  const patch: Record<string, unknown> = {};
  for (const key of Object.keys(values) as (keyof LotFormOutput)[]) {
    if (key === 'code') continue;
    if (JSON.stringify(values[key]) !== JSON.stringify(original[key])) patch[key] = values[key];
  }
  return patch as LotUpdate;
}
