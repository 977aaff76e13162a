import type { RoastLevel } from '@shared/domain/vocabulary';

/** One roasted order line to fill: `bags` bags of `fillGrams` each, of one lot at one level. */
export interface LineToFill {
  orderItemId: string;
  lotId: string;
  roastLevel: RoastLevel;
  bags: number;
  fillGrams: number;
}

/** A recorded batch and the roasted grams it still has that no bag has taken. */
export interface BatchRoom {
  batchId: string;
  lotId: string;
  roastLevel: RoastLevel;
  freeGrams: number;
}

export interface BagAllocation {
  orderItemId: string;
  batchId: string;
  bags: number;
  grams: number;
}

export interface Shortfall {
  lotId: string;
  roastLevel: RoastLevel;
  neededGrams: number;
  freeGrams: number;
}

export type AllocationPlan = { ok: true; allocations: BagAllocation[] } | { ok: false; shortfalls: Shortfall[] };

const keyOf = (lotId: string, roastLevel: RoastLevel) => `${lotId}|${roastLevel}`;

/**
 * Fills each bag whole from one batch of the same lot and level, taking the batches in the order
 * given (oldest first) and the largest bags first, so small bags use up the ends of batches.
 * A bag is never split between batches: its label names one. When the batches cannot hold every
 * bag, nothing is allocated and the plan names each lot and level that comes up short.
 */
export function allocateBags(lines: readonly LineToFill[], batches: readonly BatchRoom[]): AllocationPlan {
  const room = new Map(batches.map((batch) => [batch.batchId, Math.max(0, batch.freeGrams)]));
  const allocations: BagAllocation[] = [];
  const shortKeys = new Map<string, Pick<Shortfall, 'lotId' | 'roastLevel'>>();
  const largestFirst = [...lines].sort((a, b) => b.fillGrams - a.fillGrams);

  for (const line of largestFirst) {
    let remaining = line.bags;
    for (const batch of batches) {
      if (remaining === 0) break;
      if (batch.lotId !== line.lotId || batch.roastLevel !== line.roastLevel) continue;
      const free = room.get(batch.batchId) ?? 0;
      const bags = Math.min(remaining, Math.floor(free / line.fillGrams));
      if (bags === 0) continue;
      room.set(batch.batchId, free - bags * line.fillGrams);
      allocations.push({ orderItemId: line.orderItemId, batchId: batch.batchId, bags, grams: bags * line.fillGrams });
      remaining -= bags;
    }
    if (remaining > 0) shortKeys.set(keyOf(line.lotId, line.roastLevel), { lotId: line.lotId, roastLevel: line.roastLevel });
  }

  if (shortKeys.size === 0) return { ok: true, allocations };
  // Each short lot and level: what the order needs of it in all, and what its batches had left.
  const shortfalls = [...shortKeys].map(([key, { lotId, roastLevel }]) => ({
    lotId,
    roastLevel,
    neededGrams: lines.filter((line) => keyOf(line.lotId, line.roastLevel) === key).reduce((sum, line) => sum + line.bags * line.fillGrams, 0),
    freeGrams: batches.filter((batch) => keyOf(batch.lotId, batch.roastLevel) === key).reduce((sum, batch) => sum + Math.max(0, batch.freeGrams), 0),
  }));
  return { ok: false, shortfalls };
}
