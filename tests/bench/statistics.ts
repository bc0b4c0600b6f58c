/** The q-quantile (0..1) of samples, interpolating between the two nearest; NaN for no samples. */
export function quantile(samples: readonly number[], q: number): number {
  if (samples.length === 0) return Number.NaN;
  const sorted = [...samples].sort((a, b) => a - b);
  const position = (sorted.length - 1) * q;
  const below = sorted[Math.floor(position)] ?? Number.NaN;
  const above = sorted[Math.ceil(position)] ?? Number.NaN;
  return below + (above - below) * (position - Math.floor(position));
}

/** Times `work` `runs` times after one warm-up run and returns the median in milliseconds. */
export async function medianMilliseconds(runs: number, work: () => Promise<void>): Promise<number> {
  await work();
  const samples: number[] = [];
  for (let run = 0; run < runs; run += 1) {
    const start = performance.now();
    await work();
    samples.push(performance.now() - start);
  }
  return quantile(samples, 0.5);
}
