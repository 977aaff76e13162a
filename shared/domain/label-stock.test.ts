import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { labelSlot, labelStockIds, labelStocks } from './label-stock';

const stockArb = fc.constantFrom(...labelStockIds).map((id) => labelStocks[id]);
const EPSILON = 1e-6;

describe('label stock', () => {
  it('states the sheets in points: US Letter 8.5 × 11 in of 4 × 2 in labels, A4 210 × 297 mm of 99.1 × 57 mm labels', () => {
    // 1 in = 72 pt (PDF 32000-1, 8.3.2.3: default user space unit is 1/72 in); 1 in = 25.4 mm exactly (NIST SP 811, App. B).
    expect(labelStocks['letter-10'].page).toEqual({ width: 612, height: 792 });
    expect(labelStocks['letter-10'].label).toEqual({ width: 288, height: 144 });
    expect(labelStocks['a4-10'].page.width).toBeCloseTo(595.28, 2);
    expect(labelStocks['a4-10'].page.height).toBeCloseTo(841.89, 2);
    expect(labelStocks['a4-10'].label.width).toBeCloseTo(280.91, 2);
    expect(labelStocks.single.page).toEqual({ width: 288, height: 216 });
  });

  it('the labels and their margins fill each sheet exactly, symmetric left to right and top to bottom', () => {
    for (const id of labelStockIds) {
      const stock = labelStocks[id];
      const last = labelSlot(stock, stock.columns * stock.rows - 1);
      expect(last.sheet).toBe(0);
      expect(stock.page.width - (last.x + stock.label.width)).toBeCloseTo(stock.origin.x, 6);
      expect(stock.page.height - (last.y + stock.label.height)).toBeCloseTo(stock.origin.y, 6);
    }
  });

  it('every label lies inside its sheet and no two labels on a sheet overlap', () => {
    fc.assert(
      fc.property(stockArb, fc.nat({ max: 200 }), fc.nat({ max: 200 }), (stock, a, b) => {
        const one = labelSlot(stock, a);
        expect(one.x).toBeGreaterThanOrEqual(-EPSILON);
        expect(one.y).toBeGreaterThanOrEqual(-EPSILON);
        expect(one.x + stock.label.width).toBeLessThanOrEqual(stock.page.width + EPSILON);
        expect(one.y + stock.label.height).toBeLessThanOrEqual(stock.page.height + EPSILON);
        if (a === b) return;
        const other = labelSlot(stock, b);
        if (one.sheet !== other.sheet) return;
        const apart =
          one.x + stock.label.width <= other.x + EPSILON ||
          other.x + stock.label.width <= one.x + EPSILON ||
          one.y + stock.label.height <= other.y + EPSILON ||
          other.y + stock.label.height <= one.y + EPSILON;
        expect(apart).toBe(true);
      }),
    );
  });

  it('fills a sheet across each row, then down, before starting the next sheet', () => {
    fc.assert(
      fc.property(stockArb, fc.nat({ max: 500 }), (stock, index) => {
        const perSheet = stock.columns * stock.rows;
        expect(labelSlot(stock, index).sheet).toBe(Math.floor(index / perSheet));
      }),
    );
    const letter = labelStocks['letter-10'];
    expect(labelSlot(letter, 1).y).toBe(labelSlot(letter, 0).y);
    expect(labelSlot(letter, 2).x).toBe(labelSlot(letter, 0).x);
    expect(() => labelSlot(letter, -1)).toThrow(RangeError);
  });
});
