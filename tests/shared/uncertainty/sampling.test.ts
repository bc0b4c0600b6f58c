import { distributionInSI, draw, seededRandom, type SIDistribution } from '@/shared/uncertainty/random';
import { histogramOf, meanAndDeviation, percentilesOf } from '@/shared/uncertainty/statistics';

const SAMPLES = 200_000;

function sample(distribution: SIDistribution, seed = 11): Float64Array {
  const random = seededRandom(seed);
  return Float64Array.from({ length: SAMPLES }, () => draw(distribution, random));
}

/** Three standard errors of a mean of SAMPLES draws of standard deviation sd: the test fails about once in 370 runs of another seed. */
const meanTolerance = (sd: number) => (3 * sd) / Math.sqrt(SAMPLES);

describe('seededRandom', () => {
  it('gives the same numbers for the same seed and other numbers for another seed', () => {
    const first = seededRandom(42);
    const again = seededRandom(42);
    const other = seededRandom(43);
    const a = Array.from({ length: 5 }, () => first.next());
    expect(Array.from({ length: 5 }, () => again.next())).toEqual(a);
    expect(Array.from({ length: 5 }, () => other.next())).not.toEqual(a);
  });

  it('stays in [0, 1) and fills it evenly (ten equal bins within 2 % of a tenth each)', () => {
    const random = seededRandom(0);
    const bins = new Array<number>(10).fill(0);
    for (let i = 0; i < SAMPLES; i += 1) {
      const u = random.next();
      expect(u >= 0 && u < 1).toBe(true);
      bins[Math.floor(u * 10)] = (bins[Math.floor(u * 10)] ?? 0) + 1;
    }
    for (const count of bins) expect(Math.abs(count / SAMPLES - 0.1)).toBeLessThan(0.002);
  });
});

// Moments of the uniform, triangular and normal distributions: Johnson, Kotz and Balakrishnan, Continuous
// Univariate Distributions (vol. 1 ch. 13 normal; vol. 2 ch. 26 uniform and triangular).
describe('draw', () => {
  it('draws a uniform within [min, max] with mean (min + max)/2 and variance (max − min)²/12', () => {
    const values = sample({ kind: 'uniform', min: 2, max: 8 });
    const { mean, sd } = meanAndDeviation(values);
    expect(values.reduce((a, b) => Math.min(a, b))).toBeGreaterThanOrEqual(2);
    expect(values.reduce((a, b) => Math.max(a, b))).toBeLessThan(8);
    expect(Math.abs(mean - 5)).toBeLessThan(meanTolerance(6 / Math.sqrt(12)));
    expect(sd).toBeCloseTo(6 / Math.sqrt(12), 2);
  });

  it('draws a triangular with mean (a + b + c)/3 and variance (a² + b² + c² − ab − ac − bc)/18, most often near the mode', () => {
    const [a, c, b] = [1, 2, 5];
    const values = sample({ kind: 'triangular', min: a, mode: c, max: b });
    const { mean, sd } = meanAndDeviation(values);
    const variance = (a * a + b * b + c * c - a * b - a * c - b * c) / 18;
    expect(values.reduce((a, b) => Math.min(a, b))).toBeGreaterThanOrEqual(a);
    expect(values.reduce((a, b) => Math.max(a, b))).toBeLessThanOrEqual(b);
    expect(Math.abs(mean - (a + b + c) / 3)).toBeLessThan(meanTolerance(Math.sqrt(variance)));
    expect(sd).toBeCloseTo(Math.sqrt(variance), 2);
    // F(c) = (c − a)/(b − a) = 1/4: a quarter of the draws fall below the mode.
    expect(values.filter((x) => x < c).length / SAMPLES).toBeCloseTo(0.25, 2);
    const histogram = histogramOf(values, 8);
    const busiest = histogram.counts.indexOf(Math.max(...histogram.counts));
    expect(histogram.from + (busiest + 0.5) * ((histogram.to - histogram.from) / 8)).toBeCloseTo(c, 0);
  });

  it('draws a normal with its mean and standard deviation, 68.27 % within one sd', () => {
    const values = sample({ kind: 'normal', mean: -3, sd: 0.5 });
    const { mean, sd } = meanAndDeviation(values);
    expect(Math.abs(mean + 3)).toBeLessThan(meanTolerance(0.5));
    expect(sd).toBeCloseTo(0.5, 2);
    // Φ(1) − Φ(−1) = 0.6827 (Abramowitz and Stegun, table 26.1).
    expect(values.filter((x) => Math.abs(x + 3) < 0.5).length / SAMPLES).toBeCloseTo(0.6827, 2);
  });

  it('converts a normal spread as a difference, so a distribution in °C keeps its width in kelvin', () => {
    const toKelvin = (celsius: number) => celsius + 273.15;
    expect(distributionInSI({ kind: 'normal', mean: 20, sd: 2 }, toKelvin)).toEqual({
      kind: 'normal',
      mean: 293.15,
      sd: expect.closeTo(2, 12),
    });
    expect(distributionInSI({ kind: 'triangular', min: 0, mode: 1, max: 2 }, (x) => x / 1000)).toEqual({
      kind: 'triangular',
      min: 0,
      mode: 0.001,
      max: 0.002,
    });
  });
});

describe('statistics', () => {
  it('interpolates percentiles between order statistics (Hyndman and Fan definition 7, as R and NumPy do)', () => {
    // R: quantile(c(1, 2, 3, 4), c(0.05, 0.5, 0.95)) = 1.15, 2.5, 3.85.
    const [p5, p50, p95] = percentilesOf(Float64Array.from([4, 1, 3, 2]), [5, 50, 95]);
    expect(p5).toBeCloseTo(1.15, 12);
    expect(p50).toBeCloseTo(2.5, 12);
    expect(p95).toBeCloseTo(3.85, 12);
    expect(percentilesOf(Float64Array.from([7]), [5, 95])).toEqual([7, 7]);
    expect(percentilesOf(new Float64Array(), [50])).toEqual([Number.NaN]);
  });

  it('selects the same percentiles as sorting all the values would, repeated values and neighbouring percentiles included', () => {
    const random = seededRandom(5);
    for (const n of [2, 3, 10, 101, 5000]) {
      const values = Float64Array.from({ length: n }, () => Math.round(random.next() * 50));
      const sorted = Float64Array.from(values).sort();
      const percentiles = [0.1, 5, 5.01, 10, 25, 50, 50, 75, 90, 95, 99.9];
      const expected = percentiles.map((p) => {
        const h = ((n - 1) * p) / 100;
        const low = Math.floor(h);
        const below = sorted[low] ?? Number.NaN;
        return below + (h - low) * ((sorted[Math.min(low + 1, n - 1)] ?? below) - below);
      });
      expect(percentilesOf(values, percentiles)).toEqual(expected);
    }
  });

  it('counts every value in a histogram, the largest in the last bin', () => {
    const histogram = histogramOf([1, 0.1, 0.5, 0.9, 0], 2);
    expect(histogram).toEqual({ from: 0, to: 1, counts: [2, 3] });
    expect(histogramOf([3, 3, 3], 4).counts).toEqual([3, 0, 0, 0]);
  });

  it('gives the sample standard deviation (n − 1)', () => {
    // 2, 4, 4, 4, 5, 5, 7, 9: mean 5, sample variance 32/7.
    const { mean, sd } = meanAndDeviation([2, 4, 4, 4, 5, 5, 7, 9]);
    expect(mean).toBeCloseTo(5, 12);
    expect(sd).toBeCloseTo(Math.sqrt(32 / 7), 12);
  });
});
