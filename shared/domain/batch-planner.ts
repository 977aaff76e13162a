/**
 * Splitting green coffee into roaster batches.
 *
 * - `planBatches(greenGrams, roaster, lossPct)`: the fewest batches whose loads stay within the
 *   roaster's maximum load, as even as whole grams allow (loads differ by at most 1 g), with
 *   warnings below the preferred minimum load and, below the hard floor, a proposal to raise the
 *   batches to the floor and the roasted grams that extra green adds to stock.
 * - `loadLimits(roaster)`: maximum, preferred minimum and hard-floor loads in grams.
 * - `checkDayCapacity(plannedGreenGrams, dayCapacityGrams)`: whether a day's green fits.
 * - `HARD_FLOOR_LOAD_PCT`: 25 % of rated capacity (S. Rao, The Coffee Roaster's Companion, 2014:
 *   smaller batches are hard to control).
 */
import { ceilDiv, floorDiv, toHundredths } from './integer-math';
import { roastedYieldFromGreen } from './roast-loss';

export interface RoasterSettings {
  /** Rated batch capacity in green grams. */
  capacityGrams: number;
  /** Preferred load range, % of rated capacity. */
  minLoadPct: number;
  maxLoadPct: number;
}

export const HARD_FLOOR_LOAD_PCT = 25;

export interface LoadLimits {
  maxLoadGrams: number;
  preferredMinGrams: number;
  floorGrams: number;
}

const WHOLE = 10_000;

/** Maximum rounds down and minimums round up, so every limit is honoured in whole grams. */
export function loadLimits(roaster: RoasterSettings): LoadLimits {
  const { capacityGrams } = roaster;
  if (!Number.isSafeInteger(capacityGrams) || capacityGrams <= 0) {
    throw new RangeError(`capacityGrams must be whole grams > 0, got ${capacityGrams}`);
  }
  const limits = {
    maxLoadGrams: floorDiv(capacityGrams * toHundredths(roaster.maxLoadPct), WHOLE),
    preferredMinGrams: ceilDiv(capacityGrams * toHundredths(roaster.minLoadPct), WHOLE),
    floorGrams: ceilDiv(capacityGrams * toHundredths(HARD_FLOOR_LOAD_PCT), WHOLE),
  };
  if (limits.maxLoadGrams < limits.floorGrams) {
    throw new RangeError('the maximum load is below the hard floor of 25 % of capacity');
  }
  return limits;
}

export interface FloorProposal {
  /** Load per batch once raised to the floor. */
  batchGreenGrams: number;
  extraGreenGrams: number;
  /** Roasted grams the extra green yields, which go to stock. */
  extraRoastedGrams: number;
}

export interface BatchPlan {
  greenGrams: number;
  /** Green load of each batch, largest first. */
  batches: number[];
  limits: LoadLimits;
  belowPreferredLoad: boolean;
  belowFloor: boolean;
  floorProposal?: FloorProposal;
}

export function planBatches(greenGrams: number, roaster: RoasterSettings, lossPct: number): BatchPlan {
  if (!Number.isSafeInteger(greenGrams) || greenGrams < 0) {
    throw new RangeError(`greenGrams must be whole grams ≥ 0, got ${greenGrams}`);
  }
  const limits = loadLimits(roaster);
  if (greenGrams === 0) {
    return { greenGrams, batches: [], limits, belowPreferredLoad: false, belowFloor: false };
  }
  const count = ceilDiv(greenGrams, limits.maxLoadGrams);
  const smallLoad = Math.floor(greenGrams / count);
  const largeCount = greenGrams - smallLoad * count;
  const batches: number[] = [];
  for (let index = 0; index < count; index += 1) batches.push(index < largeCount ? smallLoad + 1 : smallLoad);
  const belowFloor = smallLoad < limits.floorGrams;
  const plan: BatchPlan = {
    greenGrams,
    batches,
    limits,
    belowPreferredLoad: smallLoad < limits.preferredMinGrams,
    belowFloor,
  };
  if (belowFloor) {
    const extraGreenGrams = limits.floorGrams * count - greenGrams;
    plan.floorProposal = {
      batchGreenGrams: limits.floorGrams,
      extraGreenGrams,
      extraRoastedGrams: roastedYieldFromGreen(extraGreenGrams, lossPct),
    };
  }
  return plan;
}

export interface DayCapacityCheck {
  withinCapacity: boolean;
  overByGrams: number;
}

export function checkDayCapacity(plannedGreenGrams: number, dayCapacityGrams: number): DayCapacityCheck {
  const overByGrams = Math.max(0, plannedGreenGrams - dayCapacityGrams);
  return { withinCapacity: overByGrams === 0, overByGrams };
}
