/**
 * Shipping priced on parcels a packer could really make: a parcel holds whole bags and weighs
 * their fill plus bag tare plus box tare (common practice).
 *
 * - `planShipping(contents, shipping)`: the cheapest packing of whole bags into parcels within the
 *   weight bands, each parcel listing its bags, weight, band and price.
 * - `firstFitPacking(contents, shipping)`: the plain packing a packer would make without thinking
 *   (heaviest bags first, each into the first box it fits); the upper bound of the search.
 * - `loneBagParcelGrams(fillGrams, shipping)` / `heaviestBandGrams(shipping)`: for checking, before
 *   planning, that each bag fits a parcel on its own; `BagTooHeavyForShipping` is thrown when one does not.
 *
 * How the cheapest packing is found (DEVELOPERS.md, decision log): bags of
 * the same fill weight are interchangeable, so the search works on counts per weight. It is an
 * exact search over "what goes in the parcel holding the heaviest bag left", memoised on the
 * counts left; it only tries parcels that are full for their band (no bag left over would still
 * fit), which loses nothing: moving a bag into a parcel with room never makes another parcel
 * dearer. For orders too large to search within a fixed budget of steps, it keeps first-fit's
 * fullest parcels and searches the rest, so a plan never costs more than first-fit's.
 */
import { sumMinor } from './money';

export interface ShippingBand {
  /** Heaviest parcel (contents and packaging) the band covers, grams. */
  maxGrams: number;
  cents: number;
}

export interface ShippingSettings {
  bands: readonly ShippingBand[];
  /** Bag, valve and label, per bag. */
  bagTareGrams: number;
  /** Box and padding, per parcel. */
  boxTareGrams: number;
}

/** Bags of one kind. `key` names them for whoever reads the plan (a line's description, an order item's id); one entry per key. */
export interface ParcelContent {
  key: string;
  fillGrams: number;
  quantity: number;
}

export interface PlannedParcel {
  bags: { key: string; quantity: number }[];
  /** Fill, bag tare and box tare. */
  grams: number;
  /** The lightest band that covers the parcel. */
  bandMaxGrams: number;
  cents: number;
}

export interface ShippingPlan {
  parcels: PlannedParcel[];
  cents: number;
}

export class BagTooHeavyForShipping extends RangeError {
  constructor(
    readonly key: string,
    /** One bag in its box. */
    readonly parcelGrams: number,
    readonly heaviestBandGrams: number,
  ) {
    super(`one bag of ${key} weighs ${parcelGrams} g in its box, over the heaviest shipping band (${heaviestBandGrams} g)`);
    this.name = 'BagTooHeavyForShipping';
  }
}

/** One bag alone in its box: fill, bag tare and box tare. */
export function loneBagParcelGrams(fillGrams: number, shipping: ShippingSettings): number {
  return fillGrams + shipping.bagTareGrams + shipping.boxTareGrams;
}

export function heaviestBandGrams(shipping: ShippingSettings): number {
  return Math.max(...shipping.bands.map((band) => band.maxGrams));
}

/** Steps (parcel contents tried) the exact search may take before it narrows to fewer parcels. */
const SEARCH_STEP_BUDGET = 200_000;

interface Packing {
  bands: ShippingBand[];
  bagTareGrams: number;
  boxTareGrams: number;
}

function sortedBands(shipping: ShippingSettings): Packing {
  const bands = [...shipping.bands].sort((a, b) => a.maxGrams - b.maxGrams);
  const heaviest = bands.at(-1);
  if (!heaviest || heaviest.maxGrams <= shipping.boxTareGrams) {
    throw new RangeError('shipping needs a band heavier than the empty box');
  }
  return { bands, bagTareGrams: shipping.bagTareGrams, boxTareGrams: shipping.boxTareGrams };
}

function bandFor(bands: readonly ShippingBand[], grams: number): ShippingBand {
  const band = bands.find((candidate) => candidate.maxGrams >= grams);
  if (!band) throw new RangeError(`no band covers a parcel of ${grams} g`);
  return band;
}

function checkEachBagFits(contents: readonly ParcelContent[], packing: Packing): void {
  const heaviest = packing.bands.at(-1)!.maxGrams;
  for (const item of contents) {
    if (!Number.isSafeInteger(item.quantity) || item.quantity < 0) throw new RangeError(`quantity must be a whole number ≥ 0, got ${item.quantity}`);
    const alone = loneBagParcelGrams(item.fillGrams, packing);
    if (item.quantity > 0 && alone > heaviest) throw new BagTooHeavyForShipping(item.key, alone, heaviest);
  }
}

/** A parcel as counts of bags per weight class (index into the classes, heaviest first). */
type Counts = number[];

interface WeightClass {
  /** Fill plus bag tare. */
  grams: number;
  members: ParcelContent[];
}

function weightClasses(contents: readonly ParcelContent[], packing: Packing): WeightClass[] {
  const byGrams = new Map<number, WeightClass>();
  for (const item of contents) {
    if (item.quantity === 0) continue;
    const grams = item.fillGrams + packing.bagTareGrams;
    const weightClass = byGrams.get(grams) ?? { grams, members: [] };
    weightClass.members.push(item);
    byGrams.set(grams, weightClass);
  }
  return [...byGrams.values()].sort((a, b) => b.grams - a.grams);
}

class SearchBudgetExceeded extends Error {}

/**
 * The cheapest list of parcels (as counts per class) for `left`, or throws SearchBudgetExceeded.
 * Deterministic: the same input always gives the same plan, so the cart and checkout agree.
 */
function cheapestParcels(classes: readonly WeightClass[], left: Counts, packing: Packing): Counts[] {
  const memo = new Map<string, { cents: number; parcel: Counts | null }>();
  let steps = 0;

  function solve(remaining: Counts): number {
    const key = remaining.join(',');
    const known = memo.get(key);
    if (known) return known.cents;
    const first = remaining.findIndex((count) => count > 0);
    if (first === -1) {
      memo.set(key, { cents: 0, parcel: null });
      return 0;
    }
    let best = { cents: Number.POSITIVE_INFINITY, parcel: null as Counts | null };
    for (const band of packing.bands) {
      const room = band.maxGrams - packing.boxTareGrams;
      if (classes[first]!.grams > room) continue;
      // Every parcel full for this band that holds at least one of the heaviest bags left.
      const parcel: Counts = remaining.map(() => 0);
      const fill = (index: number, roomLeft: number): void => {
        if (index === remaining.length) {
          steps += 1;
          if (steps > SEARCH_STEP_BUDGET) throw new SearchBudgetExceeded();
          const full = remaining.every((count, at) => count === parcel[at] || classes[at]!.grams > roomLeft);
          if (!full) return;
          const grams = room - roomLeft + packing.boxTareGrams;
          const rest = solve(remaining.map((count, at) => count - parcel[at]!));
          const cents = bandFor(packing.bands, grams).cents + rest;
          if (cents < best.cents) best = { cents, parcel: [...parcel] };
          return;
        }
        const most = Math.min(remaining[index]!, Math.floor(roomLeft / classes[index]!.grams));
        // The last class must take all it can, or the parcel would not be full.
        const least = index === remaining.length - 1 ? most : index === first ? 1 : 0;
        for (let count = most; count >= least; count -= 1) {
          parcel[index] = count;
          fill(index + 1, roomLeft - count * classes[index]!.grams);
        }
        parcel[index] = 0;
      };
      fill(first, room);
    }
    memo.set(key, best);
    return best.cents;
  }

  solve(left);
  const parcels: Counts[] = [];
  let remaining = left;
  for (;;) {
    const step = memo.get(remaining.join(','));
    if (!step?.parcel) return parcels;
    const parcel = step.parcel;
    parcels.push(parcel);
    remaining = remaining.map((count, at) => count - parcel[at]!);
  }
}

function priced(bags: PlannedParcel['bags'], grams: number, packing: Packing): PlannedParcel {
  const band = bandFor(packing.bands, grams);
  return { bags, grams, bandMaxGrams: band.maxGrams, cents: band.cents };
}

function planOf(parcels: PlannedParcel[]): ShippingPlan {
  const ordered = [...parcels].sort((a, b) => b.grams - a.grams);
  return { parcels: ordered, cents: sumMinor(ordered.map((parcel) => parcel.cents)) };
}

/** Adds a bag of `key` to a parcel's list, keeping one entry per key. */
function addBags(bags: PlannedParcel['bags'], key: string, quantity: number): void {
  const entry = bags.find((bag) => bag.key === key);
  if (entry) entry.quantity += quantity;
  else bags.push({ key, quantity });
}

/** Heaviest bags first, each into the first parcel with room under the heaviest band. */
function firstFitDecreasing(contents: readonly ParcelContent[], packing: Packing): PlannedParcel[] {
  const room = packing.bands.at(-1)!.maxGrams - packing.boxTareGrams;
  const open: { bags: PlannedParcel['bags']; contentGrams: number }[] = [];
  for (const weightClass of weightClasses(contents, packing)) {
    for (const member of weightClass.members) {
      for (let bag = 0; bag < member.quantity; bag += 1) {
        let parcel = open.find((candidate) => candidate.contentGrams + weightClass.grams <= room);
        if (!parcel) {
          parcel = { bags: [], contentGrams: 0 };
          open.push(parcel);
        }
        addBags(parcel.bags, member.key, 1);
        parcel.contentGrams += weightClass.grams;
      }
    }
  }
  return open.map((parcel) => priced(parcel.bags, parcel.contentGrams + packing.boxTareGrams, packing));
}

export function firstFitPacking(contents: readonly ParcelContent[], shipping: ShippingSettings): ShippingPlan {
  const packing = sortedBands(shipping);
  checkEachBagFits(contents, packing);
  return planOf(firstFitDecreasing(contents, packing));
}

/** Turns parcels of counts per class into parcels of named bags, taking each class's bags in order. */
function nameBags(classes: readonly WeightClass[], parcels: readonly Counts[], packing: Packing): PlannedParcel[] {
  const queues = classes.map((weightClass) => weightClass.members.map((member) => ({ key: member.key, left: member.quantity })));
  const gramsOf = (counts: Counts) => counts.reduce((sum, count, index) => sum + count * classes[index]!.grams, 0);
  // Heaviest parcels first take the first lots, so a lot stays together where it can.
  const heaviestFirst = [...parcels].sort((a, b) => gramsOf(b) - gramsOf(a));
  return heaviestFirst.map((counts) => {
    const bags: PlannedParcel['bags'] = [];
    let grams = packing.boxTareGrams;
    counts.forEach((count, index) => {
      let wanted = count;
      grams += count * classes[index]!.grams;
      for (const queued of queues[index]!) {
        if (wanted === 0) break;
        const taken = Math.min(wanted, queued.left);
        if (taken === 0) continue;
        queued.left -= taken;
        wanted -= taken;
        addBags(bags, queued.key, taken);
      }
    });
    return priced(bags, grams, packing);
  });
}

function countsOf(classes: readonly WeightClass[], contents: readonly ParcelContent[]): Counts {
  return classes.map((weightClass) => contents.filter((item) => weightClass.members.includes(item)).reduce((sum, item) => sum + item.quantity, 0));
}

export function planShipping(contents: readonly ParcelContent[], shipping: ShippingSettings): ShippingPlan {
  const packing = sortedBands(shipping);
  checkEachBagFits(contents, packing);
  const classes = weightClasses(contents, packing);
  if (classes.length === 0) return { parcels: [], cents: 0 };
  const all = countsOf(classes, contents);
  try {
    return planOf(nameBags(classes, cheapestParcels(classes, all, packing), packing));
  } catch (error) {
    if (!(error instanceof SearchBudgetExceeded)) throw error;
  }
  // Too many bags to search at once: keep first-fit's fullest parcels, search the bags of the rest.
  const firstFit = planOf(firstFitDecreasing(contents, packing)).parcels;
  for (let searched = Math.floor(firstFit.length / 2); searched >= 1; searched = Math.floor(searched / 2)) {
    const kept = firstFit.slice(0, firstFit.length - searched);
    const rest = firstFit.slice(firstFit.length - searched);
    const restContents = rest.flatMap((parcel) => parcel.bags.map((bag) => ({ ...contents.find((item) => item.key === bag.key)!, quantity: bag.quantity })));
    const restClasses = weightClasses(restContents, packing);
    try {
      const counts = cheapestParcels(restClasses, countsOf(restClasses, restContents), packing);
      return planOf([...kept, ...nameBags(restClasses, counts, packing)]);
    } catch (error) {
      if (!(error instanceof SearchBudgetExceeded)) throw error;
    }
  }
  return planOf(firstFit);
}
