import { describe, expect, it } from 'vitest';
import { benchmarkOrderLines, describeBenchmark, measureRoastListBenchmark } from './roast-list-benchmark';

describe('Roast List benchmark', () => {
  it('builds the same day of lines every time, over every lot', () => {
    const lines = benchmarkOrderLines(2000, 20);
    expect(lines).toEqual(benchmarkOrderLines(2000, 20));
    expect(new Set(lines.map((line) => line.lotCode)).size).toBe(20);
    expect(new Set(lines.map((line) => `${line.lotCode} ${line.roastLevel}`)).size).toBe(100);
  });

  it('reports the median of each timing and their ratio, read from the clock it is given', () => {
    // A fake clock that advances 1 ms per reading: every timed run then lasts exactly 1 ms.
    let now = 0;
    const result = measureRoastListBenchmark(() => (now += 1), { lineCount: 500, lotCount: 5, rounds: 5 });
    expect(result).toMatchObject({ lineCount: 500, lotCount: 5, roastListMs: 1, baselineMs: 1, ratio: 1 });
    // Both sides worked on the same lines: the green planned covers the roasted grams summed.
    const roasted = benchmarkOrderLines(500, 5).reduce((sum, line) => sum + line.fillGrams * line.quantity, 0);
    expect(result.roastedGrams).toBe(roasted);
    expect(result.greenGrams).toBeGreaterThan(roasted);
    expect(describeBenchmark({ ...result, roastListMs: 0.5, baselineMs: 0.1, ratio: 5 })).toBe(
      'Roast List from 500 order lines over 5 lots: 0.500 ms; baseline loop 0.100 ms; ratio 5.0× (target ≤ 10×)',
    );
  });

  it('reports an infinite ratio when the baseline is too fast for the clock', () => {
    // One round each: the Roast List reads 0 then 5; the baseline reads 5 and 5.
    const readings = [0, 5, 5, 5];
    const result = measureRoastListBenchmark(() => readings.shift() as number, { lineCount: 100, lotCount: 2, rounds: 1 });
    expect(result).toMatchObject({ roastListMs: 5, baselineMs: 0, ratio: Number.POSITIVE_INFINITY });
  });
});
