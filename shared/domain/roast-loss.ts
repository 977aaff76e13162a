/**
 * Roast loss: the mass green coffee loses in the roaster, by roast level, and the loss model
 * that plans with it (level default first, then the lot's own measured loss).
 *
 * - `defaultLossModel`: loss ranges and defaults per level (usual trade ranges, from memory).
 * - `greenNeededForRoasted(roastedGrams, lossPct, overagePct?)`: ceil(roasted × (1 + overage) ÷ (1 − loss)).
 * - `roastedYieldFromGreen(greenGrams, lossPct)`: floor(green × (1 − loss)).
 * - `roastedYieldRange(greenGrams, range)`: {min, max, default} roasted grams for a level's range.
 * - `lossPctOf(greenGrams, roastedGrams)`: measured loss, % to two decimals (half-up).
 * - `resolveExpectedLoss(level, lossModel, lotRecord?, minBatches?)`: the loss to plan with and its
 *   source ("level" or "lot").
 * - `assessBatchLoss(level, greenGrams, roastedGrams, lossModel)`: measured loss and whether it is
 *   inside the level's range.
 * - `estimateLevelFromLoss(lossPct, lossModel)`: the level whose range is nearest a measured loss.
 *
 * Percentages carry at most two decimals; grams are whole. Planning rounds green up and yield
 * down, so the plan never falls short.
 */
import { ceilDiv, floorDiv, fromHundredths, roundHalfUpDiv, toHundredths } from './integer-math';
import { roastLevels, type RoastLevel } from './vocabulary';

export interface LossRange {
  minPct: number;
  maxPct: number;
  defaultPct: number;
}
export type LossModel = Record<RoastLevel, LossRange>;

/** Level ranges, midpoint as default (usual trade ranges, from memory). */
export const defaultLossModel: LossModel = {
  light: { minPct: 11, maxPct: 14, defaultPct: 12.5 },
  medium: { minPct: 14, maxPct: 16, defaultPct: 15 },
  'medium-dark': { minPct: 16, maxPct: 18, defaultPct: 17 },
  dark: { minPct: 18, maxPct: 20, defaultPct: 19 },
  french: { minPct: 20, maxPct: 25, defaultPct: 22 },
};

/** Batches a lot needs at a level before its measured loss replaces the level default. */
export const DEFAULT_LOSS_MIN_BATCHES = 3;

const WHOLE = 10_000; // 100 % in hundredths of a percent

function assertGrams(grams: number, name: string): void {
  if (!Number.isSafeInteger(grams) || grams < 0) throw new RangeError(`${name} must be whole grams ≥ 0, got ${grams}`);
}

function lossHundredths(lossPct: number): number {
  const hundredths = toHundredths(lossPct);
  if (hundredths < 0 || hundredths >= WHOLE) throw new RangeError(`loss must be in [0, 100) %, got ${lossPct}`);
  return hundredths;
}

export function greenNeededForRoasted(roastedGrams: number, lossPct: number, overagePct = 0): number {
  assertGrams(roastedGrams, 'roastedGrams');
  const overage = toHundredths(overagePct);
  if (overage < 0) throw new RangeError(`overage must be ≥ 0 %, got ${overagePct}`);
  return ceilDiv(roastedGrams * (WHOLE + overage), WHOLE - lossHundredths(lossPct));
}

export function roastedYieldFromGreen(greenGrams: number, lossPct: number): number {
  assertGrams(greenGrams, 'greenGrams');
  return floorDiv(greenGrams * (WHOLE - lossHundredths(lossPct)), WHOLE);
}

export function roastedYieldRange(greenGrams: number, range: LossRange): { min: number; max: number; default: number } {
  return {
    min: roastedYieldFromGreen(greenGrams, range.maxPct),
    max: roastedYieldFromGreen(greenGrams, range.minPct),
    default: roastedYieldFromGreen(greenGrams, range.defaultPct),
  };
}

function assertBatchWeights(greenGrams: number, roastedGrams: number): void {
  assertGrams(greenGrams, 'greenGrams');
  assertGrams(roastedGrams, 'roastedGrams');
  if (greenGrams === 0) throw new RangeError('greenGrams must be more than zero');
  if (roastedGrams > greenGrams) throw new RangeError('roastedGrams cannot exceed greenGrams');
}

export function lossPctOf(greenGrams: number, roastedGrams: number): number {
  assertBatchWeights(greenGrams, roastedGrams);
  return fromHundredths(roundHalfUpDiv((greenGrams - roastedGrams) * WHOLE, greenGrams));
}

/** What a lot's recorded batches at one level add up to. */
export interface LotLossRecord {
  batchCount: number;
  greenGramsIn: number;
  roastedGramsOut: number;
}

export interface ExpectedLoss {
  lossPct: number;
  source: 'level' | 'lot';
  range: LossRange;
}

/**
 * The loss to plan with. Once the lot has `minBatches` recorded batches at the level, its
 * mass-weighted measured loss (1 − Σ roasted ÷ Σ green) replaces the default, rounded UP to
 * 0.01 % so a measured figure never under-plans green.
 */
export function resolveExpectedLoss(level: RoastLevel, lossModel: LossModel, lotRecord?: LotLossRecord, minBatches = DEFAULT_LOSS_MIN_BATCHES): ExpectedLoss {
  const range = lossModel[level];
  if (!lotRecord || lotRecord.batchCount < minBatches || lotRecord.greenGramsIn <= 0) {
    return { lossPct: range.defaultPct, source: 'level', range };
  }
  assertBatchWeights(lotRecord.greenGramsIn, lotRecord.roastedGramsOut);
  const measured = ceilDiv((lotRecord.greenGramsIn - lotRecord.roastedGramsOut) * WHOLE, lotRecord.greenGramsIn);
  return { lossPct: fromHundredths(Math.min(measured, WHOLE - 1)), source: 'lot', range };
}

export interface BatchLossAssessment {
  lossPct: number;
  withinExpected: boolean;
  /** Where the measured loss falls against the level's range. */
  position: 'below' | 'within' | 'above';
}

/** Compares exactly (no rounding) against the range, so a batch on the edge is within it. */
export function assessBatchLoss(level: RoastLevel, greenGrams: number, roastedGrams: number, lossModel: LossModel): BatchLossAssessment {
  const lossPct = lossPctOf(greenGrams, roastedGrams);
  const range = lossModel[level];
  const lostScaled = (greenGrams - roastedGrams) * WHOLE;
  const position = lostScaled < toHundredths(range.minPct) * greenGrams ? 'below' : lostScaled > toHundredths(range.maxPct) * greenGrams ? 'above' : 'within';
  return { lossPct, withinExpected: position === 'within', position };
}

export interface LevelEstimate {
  level: RoastLevel;
  /** False when the loss lies outside every level's range (the nearest is still given). */
  withinRange: boolean;
}

/**
 * The level whose range is nearest the loss (distance 0 inside a range). Where ranges touch or
 * overlap, the level whose default is nearer wins; then the lighter level.
 */
export function estimateLevelFromLoss(lossPct: number, lossModel: LossModel): LevelEstimate {
  const loss = toHundredths(lossPct);
  let best: { level: RoastLevel; distance: number; defaultDistance: number } | undefined;
  for (const level of roastLevels) {
    const range = lossModel[level];
    const min = toHundredths(range.minPct);
    const max = toHundredths(range.maxPct);
    const distance = loss < min ? min - loss : loss > max ? loss - max : 0;
    const defaultDistance = Math.abs(loss - toHundredths(range.defaultPct));
    if (!best || distance < best.distance || (distance === best.distance && defaultDistance < best.defaultDistance)) {
      best = { level, distance, defaultDistance };
    }
  }
  // roastLevels is never empty, so `best` is set.
  const { level, distance } = best as NonNullable<typeof best>;
  return { level, withinRange: distance === 0 };
}
