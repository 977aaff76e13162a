/**
 * Metrics of one roast, for the customer's Roast Journal and the roastery's batch records.
 *
 * - `developmentSeconds(firstCrackSeconds, endSeconds)`: first crack → end (drop).
 * - `developmentTimeRatioPct(firstCrackSeconds, endSeconds)`: development ÷ total roast time, %
 *   to two decimals (S. Rao, "Development Time Ratio", 2016).
 * - `DRUM_DTR_TARGET_PCT`: the common drum-roaster target, 20–25 % (S. Rao, 2016).
 * - `journalEntryProblems(entry)`: field-level messages for an impossible journal entry.
 * - `journalMetrics(entry, lossModel, suggestedLevel?)`: loss %, development time and ratio, the
 *   level estimated from the loss, and how it compares with the lot's suggestion; or field-level
 *   messages for an impossible entry.
 * - `batchMetrics(batch, lossModel)`: loss %, whether it is inside the level's range, development
 *   time ratio; or field-level messages. Shape of `POST /api/roastery/batches`.
 */
import { roundHalfUpDiv } from './integer-math';
import { assessBatchLoss, estimateLevelFromLoss, lossPctOf, type LossModel } from './roast-loss';
import { roastLevels, type RoastLevel } from './vocabulary';

export const DRUM_DTR_TARGET_PCT = { min: 20, max: 25 } as const;

// Roasting drives off water (about 10–12 % of green mass) and some organic matter; losing more
// than half the mass means a weighing or typing mistake.
const MAX_PLAUSIBLE_LOSS_PCT = 50;

export type FieldErrors = Record<string, string>;
export type MetricsResult<T> = { ok: true; value: T } | { ok: false; fields: FieldErrors };

export function developmentSeconds(firstCrackSeconds: number, endSeconds: number): number {
  return endSeconds - firstCrackSeconds;
}

export function developmentTimeRatioPct(firstCrackSeconds: number, endSeconds: number): number {
  if (endSeconds <= 0) throw new RangeError('the roast must last more than zero seconds');
  return roundHalfUpDiv(developmentSeconds(firstCrackSeconds, endSeconds) * 10_000, endSeconds) / 100;
}

interface WeightFields {
  green: { name: string; value: number };
  roasted: { name: string; value: number };
}

interface TimeFields {
  yellow?: { name: string; value: number | undefined };
  firstCrack: { name: string; value: number | undefined };
  end: { name: string; value: number | undefined };
}

function isWholeAtLeast(value: number, min: number): boolean {
  return Number.isSafeInteger(value) && value >= min;
}

function checkWeights({ green, roasted }: WeightFields, fields: FieldErrors): void {
  if (!isWholeAtLeast(green.value, 1)) fields[green.name] = 'Enter the green weight in whole grams, more than 0.';
  if (!isWholeAtLeast(roasted.value, 1)) fields[roasted.name] = 'Enter the roasted weight in whole grams, more than 0.';
  if (fields[green.name] || fields[roasted.name]) return;
  if (roasted.value >= green.value) {
    fields[roasted.name] = 'The roasted weight must be less than the green weight: roasting always loses mass.';
  } else if ((green.value - roasted.value) * 100 > MAX_PLAUSIBLE_LOSS_PCT * green.value) {
    fields[roasted.name] = `That is a loss of more than ${MAX_PLAUSIBLE_LOSS_PCT} %; check both weights.`;
  }
}

function checkTimes({ yellow, firstCrack, end }: TimeFields, fields: FieldErrors): void {
  for (const field of [yellow, firstCrack, end]) {
    if (field?.value !== undefined && !isWholeAtLeast(field.value, 0)) {
      fields[field.name] = 'Enter a time in whole seconds, 0 or more.';
    }
  }
  if (end.value !== undefined && !fields[end.name] && end.value === 0) {
    fields[end.name] = 'The roast must last more than 0 seconds.';
  }
  const ordered = [yellow, firstCrack, end].filter((field): field is { name: string; value: number } => field?.value !== undefined && !fields[field.name]);
  for (let index = 1; index < ordered.length; index += 1) {
    const earlier = ordered[index - 1] as { name: string; value: number };
    const later = ordered[index] as { name: string; value: number };
    if (earlier.value >= later.value && !fields[earlier.name]) {
      fields[earlier.name] = `${describe(earlier.name)} must come before ${describe(later.name).toLowerCase()}.`;
    }
  }
}

function describe(fieldName: string): string {
  if (fieldName.startsWith('yellow')) return 'Yellow';
  if (fieldName.startsWith('firstCrack')) return 'First crack';
  return 'The end of the roast';
}

export interface JournalEntryInput {
  greenGrams: number;
  roastedGrams: number;
  yellowSeconds?: number;
  firstCrackSeconds?: number;
  endSeconds: number;
}

export interface JournalMetrics {
  lossPct: number;
  developmentSeconds?: number;
  developmentTimeRatio?: number;
  estimatedLevel: RoastLevel;
  /** False when the loss is outside every level's range. */
  estimateWithinRange: boolean;
  /** The estimated level against the lot's suggested level. */
  comparedWithSuggestion?: 'lighter' | 'same' | 'darker';
}

/** Field-level messages for a journal entry that cannot be a real roast (empty when it can). */
export function journalEntryProblems(entry: JournalEntryInput): FieldErrors {
  const fields: FieldErrors = {};
  checkWeights({ green: { name: 'greenGrams', value: entry.greenGrams }, roasted: { name: 'roastedGrams', value: entry.roastedGrams } }, fields);
  checkTimes(
    {
      yellow: { name: 'yellowSeconds', value: entry.yellowSeconds },
      firstCrack: { name: 'firstCrackSeconds', value: entry.firstCrackSeconds },
      end: { name: 'endSeconds', value: entry.endSeconds },
    },
    fields,
  );
  return fields;
}

export function journalMetrics(entry: JournalEntryInput, lossModel: LossModel, suggestedLevel?: RoastLevel): MetricsResult<JournalMetrics> {
  const fields = journalEntryProblems(entry);
  if (Object.keys(fields).length > 0) return { ok: false, fields };
  const lossPct = lossPctOf(entry.greenGrams, entry.roastedGrams);
  const estimate = estimateLevelFromLoss(lossPct, lossModel);
  const metrics: JournalMetrics = {
    lossPct,
    estimatedLevel: estimate.level,
    estimateWithinRange: estimate.withinRange,
  };
  if (entry.firstCrackSeconds !== undefined) {
    metrics.developmentSeconds = developmentSeconds(entry.firstCrackSeconds, entry.endSeconds);
    metrics.developmentTimeRatio = developmentTimeRatioPct(entry.firstCrackSeconds, entry.endSeconds);
  }
  if (suggestedLevel) {
    const difference = roastLevels.indexOf(estimate.level) - roastLevels.indexOf(suggestedLevel);
    metrics.comparedWithSuggestion = difference < 0 ? 'lighter' : difference > 0 ? 'darker' : 'same';
  }
  return { ok: true, value: metrics };
}

export interface BatchInput {
  roastLevel: RoastLevel;
  greenGramsIn: number;
  roastedGramsOut: number;
  totalSeconds?: number;
  firstCrackSeconds?: number;
}

export interface BatchMetrics {
  lossPct: number;
  withinExpected: boolean;
  lossPosition: 'below' | 'within' | 'above';
  developmentSeconds?: number;
  developmentTimeRatio?: number;
  /** Inside the common drum target of 20–25 %. */
  developmentWithinTarget?: boolean;
}

export function batchMetrics(batch: BatchInput, lossModel: LossModel): MetricsResult<BatchMetrics> {
  const fields: FieldErrors = {};
  checkWeights(
    {
      green: { name: 'greenGramsIn', value: batch.greenGramsIn },
      roasted: { name: 'roastedGramsOut', value: batch.roastedGramsOut },
    },
    fields,
  );
  checkTimes(
    {
      firstCrack: { name: 'firstCrackSeconds', value: batch.firstCrackSeconds },
      end: { name: 'totalSeconds', value: batch.totalSeconds },
    },
    fields,
  );
  if (batch.firstCrackSeconds !== undefined && batch.totalSeconds === undefined && !fields.firstCrackSeconds) {
    fields.totalSeconds = 'Enter the total roast time too, to go with the first-crack time.';
  }
  if (Object.keys(fields).length > 0) return { ok: false, fields };
  const assessment = assessBatchLoss(batch.roastLevel, batch.greenGramsIn, batch.roastedGramsOut, lossModel);
  const metrics: BatchMetrics = {
    lossPct: assessment.lossPct,
    withinExpected: assessment.withinExpected,
    lossPosition: assessment.position,
  };
  if (batch.firstCrackSeconds !== undefined && batch.totalSeconds !== undefined) {
    const ratio = developmentTimeRatioPct(batch.firstCrackSeconds, batch.totalSeconds);
    metrics.developmentSeconds = developmentSeconds(batch.firstCrackSeconds, batch.totalSeconds);
    metrics.developmentTimeRatio = ratio;
    metrics.developmentWithinTarget = ratio >= DRUM_DTR_TARGET_PCT.min && ratio <= DRUM_DTR_TARGET_PCT.max;
  }
  return { ok: true, value: metrics };
}
