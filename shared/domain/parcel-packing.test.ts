import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { defaultShopSettings } from '../schemas/settings';
import { BagTooHeavyForShipping, planShipping, type ParcelContent, type ShippingPlan } from './parcel-packing';

// Restday's default bands (shared/schemas/settings.ts; invented prices, no carrier's): ≤500 g $6.95,
// ≤1 kg $8.95, ≤2 kg $11.95, ≤5 kg $16.95, ≤10 kg $24.95; bag tare 20 g, box tare 180 g.
// A parcel weighs its bags' fill + 20 g a bag + 180 g for the box (common practice).
// Fill weights: 8 oz 227 g, 12 oz 341 g, 1 lb 454 g, 2 lb 908 g, 5 lb 2,268 g (the product's rule).
const shipping = defaultShopSettings.shipping;

describe('shipping on real parcels of whole bags', () => {
  it('prices one bag by the lightest band that covers its parcel', () => {
    // 12 oz: 341 + 20 + 180 = 541 g: over 500 g, within 1 kg → $8.95.
    expect(planShipping([{ key: '12oz', fillGrams: 341, quantity: 1 }], shipping)).toEqual({
      parcels: [{ bags: [{ key: '12oz', quantity: 1 }], grams: 541, bandMaxGrams: 1000, cents: 895 }],
      cents: 895,
    });
    expect(planShipping([], shipping)).toEqual({ parcels: [], cents: 0 });
  });

  it('ships 17 × 5 lb green in five parcels of whole bags, $116.75', () => {
    // A 5 lb bag with its tare: 2,268 + 20 = 2,288 g. The 10 kg band leaves 10,000 − 180 = 9,820 g for bags:
    // 4 bags (9,152 g; 5 would be 11,440 g). 17 bags need at least ⌈17 / 4⌉ = 5 parcels.
    // 1–2 bags fit the 5 kg band (2 × 2,288 + 180 = 4,756 g, $16.95); 3–4 bags need the 10 kg band ($24.95).
    // Five parcels, k of them with ≤ 2 bags: 2k + 4(5 − k) ≥ 17 → k ≤ 1, so the cheapest is
    // 4 × $24.95 + 1 × $16.95 = $116.75, as 4 + 4 + 4 + 4 + 1 or 4 + 4 + 4 + 3 + 2 bags (the same price).
    // Six parcels: k ≤ 3 → 3 × $24.95 + 3 × $16.95 = $125.70; seven or more ≥ 7 × $16.95 = $118.65.
    // (Splitting the weight evenly, 4 parcels of 4.25 bags at 9,904 g, would charge $99.80: bags cut in pieces.)
    const plan = planShipping([{ key: 'RD-101, green, 5lb', fillGrams: 2268, quantity: 17 }], shipping);
    expect(plan.cents).toBe(11_675);
    const bagsPerParcel = plan.parcels.map((parcel) => parcel.bags.reduce((sum, bag) => sum + bag.quantity, 0));
    expect([
      [4, 4, 4, 4, 1],
      [4, 4, 4, 3, 2],
    ]).toContainEqual(bagsPerParcel);
    // 4 bags: 9,332 g; 3 bags: 3 × 2,288 + 180 = 7,044 g; 2 bags: 4,756 g; 1 bag: 2,468 g.
    const gramsFor = { 4: 9332, 3: 7044, 2: 4756, 1: 2468 } as Record<number, number>;
    expect(plan.parcels.map((parcel) => parcel.grams)).toEqual(bagsPerParcel.map((bags) => gramsFor[bags]));
    expect(plan.parcels.map((parcel) => parcel.cents)).toEqual([2495, 2495, 2495, 2495, 1695]);
  });

  it('ships 21 × 1 lb as twenty bags and one, $33.90', () => {
    // A 1 lb bag with its tare: 454 + 20 = 474 g. Bags per band: 1 kg: ⌊820 / 474⌋ = 1; 2 kg: ⌊1,820 / 474⌋ = 3;
    // 5 kg: ⌊4,820 / 474⌋ = 10; 10 kg: ⌊9,820 / 474⌋ = 20. One parcel cannot take 21 (9,954 + 180 g).
    // Two parcels: one holds ≥ 11 bags ($24.95), the other ≥ $8.95 → at least $33.90, reached by 20 + 1:
    // 20 × 474 + 180 = 9,660 g ($24.95) + 474 + 180 = 654 g ($8.95). Others: 11 + 10 = $41.90, 10 + 10 + 1 = $42.85.
    // (Two even halves of 10.5 bags, 5,157 g each, would charge $49.90.)
    const plan = planShipping([{ key: '1lb', fillGrams: 454, quantity: 21 }], shipping);
    expect(plan).toEqual({
      parcels: [
        { bags: [{ key: '1lb', quantity: 20 }], grams: 9660, bandMaxGrams: 10_000, cents: 2495 },
        { bags: [{ key: '1lb', quantity: 1 }], grams: 654, bandMaxGrams: 1000, cents: 895 },
      ],
      cents: 3390,
    });
  });

  it('finds a cheaper packing than filling the heaviest box first', () => {
    // 5 × 8 oz (247 g with tare) + 4 × 2 lb (928 g): 1,235 + 3,712 + 180 = 5,127 g in one box, over 5 kg → $24.95.
    // Take one 8 oz bag out: 247 + 180 = 427 g ≤ 500 g ($6.95) and 4,700 + 180 = 4,880 g ≤ 5 kg ($16.95) = $23.90.
    const plan = planShipping(
      [
        { key: '8oz', fillGrams: 227, quantity: 5 },
        { key: '2lb', fillGrams: 908, quantity: 4 },
      ],
      shipping,
    );
    expect(plan.cents).toBe(2390);
    expect(plan.parcels.map((parcel) => [parcel.grams, parcel.cents])).toEqual([
      [4880, 1695],
      [427, 695],
    ]);
  });

  it('lists bags of different lots of one weight by name, keeping each lot together where it can', () => {
    // 3 × 5 lb of each of two lots: 6 bags → 4 + 2 (9,332 g $24.95 + 4,756 g $16.95 = $41.90; 3 + 3 would be $49.90).
    const plan = planShipping(
      [
        { key: 'RD-101', fillGrams: 2268, quantity: 3 },
        { key: 'RD-102', fillGrams: 2268, quantity: 3 },
      ],
      shipping,
    );
    expect(plan.cents).toBe(4190);
    expect(plan.parcels.map((parcel) => parcel.bags)).toEqual([
      [
        { key: 'RD-101', quantity: 3 },
        { key: 'RD-102', quantity: 1 },
      ],
      [{ key: 'RD-102', quantity: 2 }],
    ]);
  });

  it('refuses a bag that is over the heaviest band on its own, naming it', () => {
    // 5 lb in its box: 2,268 + 20 + 180 = 2,468 g, over a 2 kg top band.
    const small = { ...shipping, bands: [{ maxGrams: 2000, cents: 1195 }] };
    expect(() => planShipping([{ key: 'RD-101, green, 5lb', fillGrams: 2268, quantity: 1 }], small)).toThrow(BagTooHeavyForShipping);
    expect(() => planShipping([{ key: 'RD-101, green, 5lb', fillGrams: 2268, quantity: 1 }], small)).toThrow(/RD-101, green, 5lb.*2468 g.*2000 g/);
    expect(() => planShipping([{ key: 'x', fillGrams: 10, quantity: 1 }], { ...shipping, bands: [{ maxGrams: 100, cents: 1 }] })).toThrow(
      /heavier than the empty box/,
    );
  });
});

/** A packer's plain first-fit: heaviest bags first, each into the first box with room under the top band. */
function plainFirstFitCents(contents: readonly ParcelContent[]): number {
  const bags = contents.flatMap((item) => Array.from({ length: item.quantity }, () => item.fillGrams + 20)).sort((a, b) => b - a);
  const boxes: number[] = [];
  for (const bag of bags) {
    const at = boxes.findIndex((grams) => grams + bag <= 10_000 - 180);
    if (at === -1) boxes.push(bag);
    else boxes[at]! += bag;
  }
  const bandCents = (grams: number) =>
    [
      [500, 695],
      [1000, 895],
      [2000, 1195],
      [5000, 1695],
      [10_000, 2495],
    ].find(([max]) => grams <= max!)![1]!;
  return boxes.reduce((sum, grams) => sum + bandCents(grams + 180), 0);
}

function bagsIn(plan: ShippingPlan): Map<string, number> {
  const counts = new Map<string, number>();
  for (const parcel of plan.parcels) for (const bag of parcel.bags) counts.set(bag.key, (counts.get(bag.key) ?? 0) + bag.quantity);
  return counts;
}

describe('any order', () => {
  it('holds every bag whole, keeps every parcel within the heaviest band, and costs no more than first-fit', () => {
    const fill = fc.constantFrom(227, 341, 454, 908, 2268);
    const contents = fc.uniqueArray(
      fc.record({ key: fc.constantFrom<string>('a', 'b', 'c', 'd', 'e', 'f'), fillGrams: fill, quantity: fc.integer({ min: 1, max: 12 }) }),
      {
        maxLength: 6,
        selector: (item) => item.key,
      },
    );
    fc.assert(
      fc.property(contents, (items) => {
        const plan = planShipping(items, shipping);
        expect(bagsIn(plan)).toEqual(new Map(items.map((item) => [item.key, item.quantity])));
        const fillOf = new Map(items.map((item) => [item.key, item.fillGrams]));
        for (const parcel of plan.parcels) {
          const grams = parcel.bags.reduce((sum, bag) => sum + bag.quantity * (fillOf.get(bag.key)! + 20), 180);
          expect(parcel.grams).toBe(grams);
          expect(parcel.grams).toBeLessThanOrEqual(10_000);
          expect(parcel.grams).toBeLessThanOrEqual(parcel.bandMaxGrams);
          for (const bag of parcel.bags) expect(Number.isInteger(bag.quantity) && bag.quantity > 0).toBe(true);
        }
        expect(plan.cents).toBe(plan.parcels.reduce((sum, parcel) => sum + parcel.cents, 0));
        expect(plan.cents).toBeLessThanOrEqual(plainFirstFitCents(items));
      }),
      { numRuns: 300 },
    );
  });
});
