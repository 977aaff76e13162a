// Prints the Roast List benchmark (a script, not a test): npx tsx shared/domain/bench/run-roast-list-benchmark.ts
import { describeBenchmark, measureRoastListBenchmark } from '../roast-list-benchmark';

process.stdout.write(`${describeBenchmark(measureRoastListBenchmark(() => performance.now()))}\n`);
