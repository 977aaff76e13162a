const median = (times: number[]) => [...times].sort((a, b) => a - b)[Math.floor(times.length / 2)]!;

/**
 * Warms both up, then times them in alternation, so a busy moment on the machine lands on both
 * sides rather than on one; the median of each side's samples, in milliseconds.
 */
export async function medianMsInTurn(
  first: () => Promise<unknown>,
  second: () => Promise<unknown>,
  { warmUpRuns, samples }: { warmUpRuns: number; samples: number },
): Promise<[number, number]> {
  for (let warmUp = 0; warmUp < warmUpRuns; warmUp += 1) {
    await first();
    await second();
  }
  const times: [number[], number[]] = [[], []];
  for (let sample = 0; sample < samples; sample += 1) {
    for (const [index, run] of [first, second].entries()) {
      const started = performance.now();
      await run();
      times[index]!.push(performance.now() - started);
    }
  }
  return [median(times[0]), median(times[1])];
}
