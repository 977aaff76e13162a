/**
 * Green stock cover: how many days the grams on hand last at the recent pace of use.
 *
 * Use is what left the shelf for customers and the roaster ('sale' and 'roast' movements) over the
 * last `coverWindowDays` days; samples, losses and count corrections are not demand, and refunds
 * are not negative use. Days of cover = stock ÷ (use ÷ window), rounded down to whole days so the
 * figure never promises a day the stock cannot cover; null when nothing was used in the window.
 */
import { floorDiv } from './integer-math';
import type { StockMovementReason } from './vocabulary';

/** Four weeks: long enough to smooth a week's swing, short enough to follow a change of pace. */
export const coverWindowDays = 28;

/** The movement reasons that count as use. */
export const useReasons: readonly StockMovementReason[] = ['sale', 'roast'];

/** Whole days the stock lasts at the window's average daily use; null when the window saw no use. */
export function daysOfCover(stockGrams: number, usedGramsInWindow: number, windowDays: number = coverWindowDays): number | null {
  if (!Number.isSafeInteger(stockGrams) || stockGrams < 0) throw new RangeError('stockGrams must be whole grams, zero or more');
  if (!Number.isSafeInteger(usedGramsInWindow) || usedGramsInWindow < 0) throw new RangeError('usedGramsInWindow must be whole grams, zero or more');
  if (!Number.isSafeInteger(windowDays) || windowDays <= 0) throw new RangeError('windowDays must be a whole number of days above zero');
  if (usedGramsInWindow === 0) return null;
  return floorDiv(stockGrams * windowDays, usedGramsInWindow);
}

/** Average grams used per day over the window, rounded down (display only; cover is computed exactly). */
export function averageDailyUseGrams(usedGramsInWindow: number, windowDays: number = coverWindowDays): number {
  return floorDiv(usedGramsInWindow, windowDays);
}

/** A lot needs reordering once its stock is at or below a reorder point that staff have set (0 means none). */
export function isAtReorderPoint(stockGrams: number, reorderPointGrams: number): boolean {
  return reorderPointGrams > 0 && stockGrams <= reorderPointGrams;
}
