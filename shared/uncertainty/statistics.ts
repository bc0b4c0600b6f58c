import type { Histogram } from '@/shared/schemas/uncertainty';

/** Swaps two entries of an array. */
function swap(values: Float64Array, a: number, b: number): void {
  const held = values[a] ?? Number.NaN;
  values[a] = values[b] ?? Number.NaN;
  values[b] = held;
}

/**
 * Moves the k-th smallest of values[left..right] to index k, smaller ones before it and larger ones after
 * (Hoare's selection, "Find", 1961, with a median-of-three pivot): linear time on average, where sorting a
 * hundred thousand samples for three percentiles would cost ten times more.
 */
function select(values: Float64Array, k: number, left: number, right: number): void {
  let low = left;
  let high = right;
  while (high > low) {
    const middle = (low + high) >>> 1;
    if ((values[middle] ?? 0) < (values[low] ?? 0)) swap(values, middle, low);
    if ((values[high] ?? 0) < (values[low] ?? 0)) swap(values, high, low);
    if ((values[high] ?? 0) < (values[middle] ?? 0)) swap(values, high, middle);
    const pivot = values[middle] ?? 0;
    let i = low;
    let j = high;
    while (i <= j) {
      while ((values[i] ?? 0) < pivot) i += 1;
      while ((values[j] ?? 0) > pivot) j -= 1;
      if (i <= j) {
        swap(values, i, j);
        i += 1;
        j -= 1;
      }
    }
    if (k <= j) high = j;
    else if (k >= i) low = i;
    else return;
  }
}

/**
 * Percentiles (0 to 100, ascending) of finite values: linear interpolation between order statistics,
 * definition 7 of Hyndman and Fan (1996), "Sample quantiles in statistical packages" (the default of R and
 * NumPy): h = (n − 1)·p/100, Q = x(⌊h⌋) + (h − ⌊h⌋)(x(⌊h⌋+1) − x(⌊h⌋)), x(i) the i-th smallest from 0.
 * Reorders `values`; NaN for each percentile when there are none.
 */
export function percentilesOf(values: Float64Array, percentiles: readonly number[]): number[] {
  const n = values.length;
  if (n === 0) return percentiles.map(() => Number.NaN);
  let settled = 0;
  return percentiles.map((p) => {
    const h = ((n - 1) * p) / 100;
    const low = Math.floor(h);
    // Selections go left to right: everything before `settled` is already in its sorted place.
    if (low >= settled) select(values, low, settled, n - 1);
    const below = values[low] ?? Number.NaN;
    let above = below;
    if (low + 1 < n) {
      if (low + 1 >= settled) select(values, low + 1, Math.max(low + 1, settled), n - 1);
      above = values[low + 1] ?? below;
    }
    settled = Math.max(settled, Math.min(low + 2, n));
    return below + (h - low) * (above - below);
  });
}

/** Mean and (sample, n − 1) standard deviation by Welford's method (Welford 1962), stable for large n. */
export function meanAndDeviation(values: ArrayLike<number>): { mean: number; sd: number } {
  let mean = 0;
  let squares = 0;
  for (let i = 0; i < values.length; i += 1) {
    const x = values[i] ?? Number.NaN;
    const delta = x - mean;
    mean += delta / (i + 1);
    squares += delta * (x - mean);
  }
  return values.length === 0
    ? { mean: Number.NaN, sd: Number.NaN }
    : { mean, sd: values.length > 1 ? Math.sqrt(squares / (values.length - 1)) : 0 };
}

/** The smallest and largest of values (NaN for none). */
export function extentOf(values: ArrayLike<number>): { min: number; max: number } {
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < values.length; i += 1) {
    const x = values[i] ?? Number.NaN;
    if (x < min) min = x;
    if (x > max) max = x;
  }
  return values.length === 0 ? { min: Number.NaN, max: Number.NaN } : { min, max };
}

/** Counts of values in `bins` equal bins from the smallest to the largest (the last bin includes the largest; one bin holds all when they are equal). */
export function histogramOf(values: ArrayLike<number>, bins: number): Histogram {
  if (values.length === 0) return { from: 0, to: 0, counts: [] };
  const { min: from, max: to } = extentOf(values);
  const counts = new Array<number>(bins).fill(0);
  const width = (to - from) / bins;
  for (let i = 0; i < values.length; i += 1) {
    const x = values[i] ?? from;
    const bin = width > 0 ? Math.min(bins - 1, Math.floor((x - from) / width)) : 0;
    counts[bin] = (counts[bin] ?? 0) + 1;
  }
  return { from, to, counts };
}
