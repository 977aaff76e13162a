/**
 * Benchmark of the Roast List builder against a baseline measured in the same run: a plain loop
 * that sums the same order lines' grams. Pure: the clock is a parameter.
 *
 * - `benchmarkOrderLines(lineCount, lotCount)`: a fixed, reproducible day of order lines.
 * - `measureRoastListBenchmark(clock, options?)`: median time per run of each, and their ratio.
 * - `describeBenchmark(result)`: one line of text for the console.
 *
 * Run: `npx tsx shared/domain/bench/run-roast-list-benchmark.ts`.
 */
import { defaultLossModel } from './roast-loss';
import { buildRoastList, type RoastListInput, type RoastOrderLine } from './roast-list';
import { bagFillGrams } from './units';
import { roastedBagSizes, roastLevels } from './vocabulary';

export interface BenchmarkResult {
  lineCount: number;
  lotCount: number;
  roastListMs: number;
  baselineMs: number;
  ratio: number;
  /** What each side computed, returned so neither run can be optimised away. */
  greenGrams: number;
  roastedGrams: number;
}

/** Deterministic pseudo-random lines (xorshift32), so runs compare. */
export function benchmarkOrderLines(lineCount: number, lotCount: number): RoastOrderLine[] {
  let state = 20_250_305;
  const next = (modulo: number): number => {
    state ^= state << 13;
    state ^= state >>> 17;
    state ^= state << 5;
    return Math.floor(((state >>> 0) / 2 ** 32) * modulo);
  };
  const lotCodes = Array.from({ length: lotCount }, (_, index) => `RD-${String(index + 1).padStart(3, '0')}`);
  return Array.from({ length: lineCount }, () => ({
    lotCode: lotCodes[next(lotCount)] as string,
    roastLevel: roastLevels[next(roastLevels.length)] as RoastOrderLine['roastLevel'],
    fillGrams: bagFillGrams(roastedBagSizes[next(roastedBagSizes.length)] as (typeof roastedBagSizes)[number]),
    quantity: 1 + next(3),
  }));
}

function sumLineGrams(lines: readonly RoastOrderLine[]): number {
  let total = 0;
  for (const line of lines) total += line.fillGrams * line.quantity;
  return total;
}

function medianMs(clock: () => number, rounds: number, run: () => number): { ms: number; value: number } {
  const times: number[] = [];
  let value = 0;
  for (let round = 0; round < rounds; round += 1) {
    const start = clock();
    value = run();
    times.push(clock() - start);
  }
  times.sort((a, b) => a - b);
  return { ms: times[Math.floor(times.length / 2)] as number, value };
}

export function measureRoastListBenchmark(
  clock: () => number,
  options: { lineCount?: number; lotCount?: number; rounds?: number } = {},
): BenchmarkResult {
  const { lineCount = 10_000, lotCount = 20, rounds = 201 } = options;
  const lines = benchmarkOrderLines(lineCount, lotCount);
  const input: RoastListInput = {
    date: '2025-03-05',
    lines,
    settings: {
      overagePct: 2,
      roaster: { capacityGrams: 12_000, minLoadPct: 50, maxLoadPct: 80 },
      lossModel: defaultLossModel,
      lossModelMinBatches: 3,
    },
    stockGrams: {},
    dayCapacityGrams: 60_000,
  };
  const roastList = () => buildRoastList(input).totals.greenGrams;
  const baseline = () => sumLineGrams(lines);
  // Warm both paths up before timing, so the comparison is of optimised code.
  for (let warmUp = 0; warmUp < 200; warmUp += 1) {
    roastList();
    baseline();
  }
  const built = medianMs(clock, rounds, roastList);
  const summed = medianMs(clock, rounds, baseline);
  return {
    lineCount,
    lotCount,
    roastListMs: built.ms,
    baselineMs: summed.ms,
    ratio: summed.ms > 0 ? built.ms / summed.ms : Number.POSITIVE_INFINITY,
    greenGrams: built.value,
    roastedGrams: summed.value,
  };
}

export function describeBenchmark(result: BenchmarkResult): string {
  return (
    `Roast List from ${result.lineCount.toLocaleString('en-US')} order lines over ${result.lotCount} lots: ` +
    `${result.roastListMs.toFixed(3)} ms; baseline loop ${result.baselineMs.toFixed(3)} ms; ` +
    `ratio ${result.ratio.toFixed(1)}× (target ≤ 10×)`
  );
}
