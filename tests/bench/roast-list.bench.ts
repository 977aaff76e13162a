// Benchmark (a script, not a test): the Roast List builder on a large roast day, against a
// baseline measured in the same run — a plain loop summing the same lines' grams.
// Run: npm run bench
import { defaultLossModel } from '@shared/domain/roast-loss';
import { buildRoastList, type RoastListInput, type RoastOrderLine } from '@shared/domain/roast-list';
import { bagFillGrams } from '@shared/domain/units';
import { roastedBagSizes, roastLevels } from '@shared/domain/vocabulary';

const lineCount = 10_000;
const lotCount = 20;
const samples = 101;
/** Runs per sample, so each sample lasts well above the timer's resolution. */
const runsPerSample = 20;

/** A fixed, reproducible day of order lines (xorshift32). */
function orderLines(): RoastOrderLine[] {
  let state = 20_250_305;
  const next = (modulo: number) => {
    state ^= state << 13;
    state ^= state >>> 17;
    state ^= state << 5;
    return Math.floor(((state >>> 0) / 2 ** 32) * modulo);
  };
  const lotCodes = Array.from({ length: lotCount }, (_, index) => `RD-${String(index + 1).padStart(3, '0')}`);
  return Array.from({ length: lineCount }, () => ({
    lotCode: lotCodes[next(lotCount)]!,
    roastLevel: roastLevels[next(roastLevels.length)]!,
    fillGrams: bagFillGrams(roastedBagSizes[next(roastedBagSizes.length)]!),
    quantity: 1 + next(3),
  }));
}

function medianMsPerRun(run: () => number): number {
  let sink = 0;
  const times: number[] = [];
  for (let sample = 0; sample < samples; sample++) {
    const started = performance.now();
    for (let repeat = 0; repeat < runsPerSample; repeat++) sink += run();
    times.push((performance.now() - started) / runsPerSample);
  }
  if (sink === 0) throw new Error('nothing was computed');
  return times.sort((a, b) => a - b)[Math.floor(samples / 2)]!;
}

const lines = orderLines();
const input: RoastListInput = {
  date: '2026-12-03',
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
const buildList = () => buildRoastList(input).totals.greenGrams;
const sumGrams = () => {
  let total = 0;
  for (const line of lines) total += line.fillGrams * line.quantity;
  return total;
};

// Warm both up first, so the comparison is between optimised code.
for (let warmUp = 0; warmUp < 300; warmUp++) {
  buildList();
  sumGrams();
}
const roastListMs = medianMsPerRun(buildList);
const baselineMs = medianMsPerRun(sumGrams);
console.log(
  `Roast List from ${lineCount.toLocaleString('en-US')} order lines over ${lotCount} lots: ${roastListMs.toFixed(3)} ms per list; ` +
    `baseline loop ${baselineMs.toFixed(4)} ms; ratio ${(roastListMs / baselineMs).toFixed(1)}× (target ≤ 10×)`,
);
