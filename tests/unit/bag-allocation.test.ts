import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { roastLevels } from '@shared/domain/vocabulary';
import { allocateBags, type BatchRoom, type LineToFill } from '../../server/modules/packing/bag-allocation';

const line = (overrides: Partial<LineToFill> = {}): LineToFill => ({
  orderItemId: 'line-1',
  lotId: 'lot-a',
  roastLevel: 'medium',
  bags: 1,
  fillGrams: 341,
  ...overrides,
});
const batch = (overrides: Partial<BatchRoom> = {}): BatchRoom => ({ batchId: 'batch-1', lotId: 'lot-a', roastLevel: 'medium', freeGrams: 1000, ...overrides });

describe('allocateBags', () => {
  it('fills whole bags from the first batch and carries the rest to the next', () => {
    // 700 g holds two 341 g bags (682 g); the third goes to the second batch.
    const plan = allocateBags([line({ bags: 3 })], [batch({ batchId: 'older', freeGrams: 700 }), batch({ batchId: 'newer', freeGrams: 2000 })]);
    expect(plan).toEqual({
      ok: true,
      allocations: [
        { orderItemId: 'line-1', batchId: 'older', bags: 2, grams: 682 },
        { orderItemId: 'line-1', batchId: 'newer', bags: 1, grams: 341 },
      ],
    });
  });

  it('never fills from a batch of another lot or level', () => {
    const plan = allocateBags(
      [line({ bags: 1 })],
      [batch({ lotId: 'lot-b', freeGrams: 9000 }), batch({ batchId: 'dark', roastLevel: 'dark', freeGrams: 9000 })],
    );
    expect(plan).toEqual({ ok: false, shortfalls: [{ lotId: 'lot-a', roastLevel: 'medium', neededGrams: 341, freeGrams: 0 }] });
  });

  it('fills the larger bags first so small bags use the ends of batches', () => {
    // 1,000 g: a 908 g bag first leaves 92 g; smallest-first would have taken 341 g and left the 2 lb bag short.
    const plan = allocateBags(
      [line({ orderItemId: 'small', bags: 1, fillGrams: 341 }), line({ orderItemId: 'large', bags: 1, fillGrams: 908 })],
      [batch({ batchId: 'a', freeGrams: 1000 }), batch({ batchId: 'b', freeGrams: 400 })],
    );
    expect(plan).toEqual({
      ok: true,
      allocations: [
        { orderItemId: 'large', batchId: 'a', bags: 1, grams: 908 },
        { orderItemId: 'small', batchId: 'b', bags: 1, grams: 341 },
      ],
    });
  });

  it('reports what the lot and level needs and what its batches have when they come up short, allocating nothing', () => {
    // Two batches of 300 g hold 600 g, yet no whole 341 g bag fits in either.
    const plan = allocateBags([line({ bags: 1 })], [batch({ batchId: 'a', freeGrams: 300 }), batch({ batchId: 'b', freeGrams: 300 })]);
    expect(plan).toEqual({ ok: false, shortfalls: [{ lotId: 'lot-a', roastLevel: 'medium', neededGrams: 341, freeGrams: 600 }] });
  });

  it('never takes more from a batch than it has, and fills every bag exactly once when it succeeds', () => {
    const lots = ['lot-a', 'lot-b'];
    const lineArb = fc.record({
      lotId: fc.constantFrom(...lots),
      roastLevel: fc.constantFrom(...roastLevels.slice(0, 2)),
      bags: fc.integer({ min: 1, max: 6 }),
      fillGrams: fc.constantFrom(341, 454, 908),
    });
    const batchArb = fc.record({
      lotId: fc.constantFrom(...lots),
      roastLevel: fc.constantFrom(...roastLevels.slice(0, 2)),
      freeGrams: fc.integer({ min: 0, max: 6000 }),
    });
    fc.assert(
      fc.property(fc.array(lineArb, { minLength: 1, maxLength: 5 }), fc.array(batchArb, { maxLength: 6 }), (rawLines, rawBatches) => {
        const lines = rawLines.map((entry, n) => ({ ...entry, orderItemId: `line-${n}` }));
        const batches = rawBatches.map((entry, n) => ({ ...entry, batchId: `batch-${n}` }));
        const plan = allocateBags(lines, batches);
        if (!plan.ok) return;
        for (const room of batches) {
          const taken = plan.allocations.filter((allocation) => allocation.batchId === room.batchId).reduce((sum, allocation) => sum + allocation.grams, 0);
          expect(taken).toBeLessThanOrEqual(room.freeGrams);
        }
        for (const wanted of lines) {
          const given = plan.allocations.filter((allocation) => allocation.orderItemId === wanted.orderItemId);
          expect(given.reduce((sum, allocation) => sum + allocation.bags, 0)).toBe(wanted.bags);
          for (const allocation of given) {
            const source = batches.find((room) => room.batchId === allocation.batchId)!;
            expect([source.lotId, source.roastLevel]).toEqual([wanted.lotId, wanted.roastLevel]);
            expect(allocation.grams).toBe(allocation.bags * wanted.fillGrams);
          }
        }
      }),
    );
  });
});
