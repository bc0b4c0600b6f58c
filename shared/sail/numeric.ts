/** Small numerical helpers for the analyses: evenly spaced points, a maximiser and a root finder. */

/**
 * `count` evenly spaced values from `start` to `stop` inclusive.
 * @throws RangeError when count is not an integer >= 2 or a bound is not finite
 */
export function linspace(start: number, stop: number, count: number): number[] {
  if (!Number.isInteger(count) || count < 2) {
    throw new RangeError(`linspace: count must be an integer >= 2, got ${String(count)}`);
  }
  if (!Number.isFinite(start) || !Number.isFinite(stop)) {
    throw new RangeError(`linspace: start and stop must be finite, got ${String(start)} and ${String(stop)}`);
  }
  const step = (stop - start) / (count - 1);
  return Array.from({ length: count }, (_, i) => (i === count - 1 ? stop : start + i * step));
}

const GOLDEN = (Math.sqrt(5) - 1) / 2;
const MAX_ITERATIONS = 400;

/**
 * Golden-section search for the maximum of a unimodal function on [low, high].
 * @returns the argument of the maximum, to within `tolerance`
 */
export function maximise(f: (x: number) => number, low: number, high: number, tolerance = 1e-12): number {
  let a = low;
  let b = high;
  let c = b - GOLDEN * (b - a);
  let d = a + GOLDEN * (b - a);
  let fc = f(c);
  let fd = f(d);
  // The iteration cap ends the search should the tolerance be below what doubles can resolve.
  for (let iteration = 0; iteration < MAX_ITERATIONS && b - a > tolerance; iteration += 1) {
    if (fc > fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - GOLDEN * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + GOLDEN * (b - a);
      fd = f(d);
    }
  }
  return (a + b) / 2;
}

/**
 * Bisection for a root of f on [low, high], where f(low) and f(high) differ in sign.
 * @returns the root, to within `tolerance`
 * @throws RangeError when the bracket does not change sign
 */
export function bisect(f: (x: number) => number, low: number, high: number, tolerance = 1e-12): number {
  let a = low;
  let b = high;
  let fa = f(a);
  if (fa === 0) return a;
  if (Math.sign(fa) === Math.sign(f(b))) {
    throw new RangeError(`bisect: f does not change sign on [${low}, ${high}]`);
  }
  while (b - a > tolerance * Math.max(1, Math.abs(a))) {
    const m = (a + b) / 2;
    // The bracket cannot shrink below adjacent doubles.
    if (m === a || m === b) break;
    const fm = f(m);
    if (fm === 0) return m;
    if (Math.sign(fm) === Math.sign(fa)) {
      a = m;
      fa = fm;
    } else {
      b = m;
    }
  }
  return (a + b) / 2;
}
