import type { Distribution } from '@/shared/schemas/uncertainty';

/**
 * A seeded pseudo-random generator: the same seed gives the same numbers on every machine and in every
 * JavaScript engine (only 32-bit integer arithmetic), so a study can be run again and checked.
 * sfc32 (Chris Doty-Humphrey's Small Fast Counter, from the PractRand suite), its state filled from the
 * seed by splitmix32 (Steele, Lea and Flood 2014) and stepped 12 times, as its author advises.
 */
export interface RandomSource {
  /** A number in [0, 1), 32 bits of it random. */
  next(): number;
}

function splitmix32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x9e3779b9) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
    return (z ^ (z >>> 16)) >>> 0;
  };
}

/** The generator of a seed (a whole number from 0 to 2^32 − 1). */
export function seededRandom(seed: number): RandomSource {
  const fill = splitmix32(seed);
  let a = fill();
  let b = fill();
  let c = fill();
  let d = fill();
  const next = (): number => {
    const t = (((a + b) | 0) + d) | 0;
    d = (d + 1) | 0;
    a = b ^ (b >>> 9);
    b = (c + (c << 3)) | 0;
    c = (c << 21) | (c >>> 11);
    c = (c + t) | 0;
    return (t >>> 0) / 4294967296;
  };
  for (let warm = 0; warm < 12; warm += 1) next();
  return { next };
}

/** A distribution's parameters in SI, ready to draw from. */
export type SIDistribution =
  | { readonly kind: 'uniform'; readonly min: number; readonly max: number }
  | { readonly kind: 'triangular'; readonly min: number; readonly mode: number; readonly max: number }
  | { readonly kind: 'normal'; readonly mean: number; readonly sd: number };

/**
 * Draws one value. Each draw uses the same count of numbers from the generator (one, two for a normal),
 * so a study split into chunks draws exactly what it draws in one go.
 * Triangular: inverse of its distribution function (Johnson, Kotz and Balakrishnan, Continuous Univariate
 * Distributions vol. 2, ch. 26). Normal: Box–Muller (Box and Muller 1958), the cosine branch; 1 − u keeps the
 * logarithm's argument in (0, 1].
 */
export function draw(distribution: SIDistribution, random: RandomSource): number {
  switch (distribution.kind) {
    case 'uniform':
      return distribution.min + (distribution.max - distribution.min) * random.next();
    case 'triangular': {
      const { min, mode, max } = distribution;
      const u = random.next();
      const span = max - min;
      const split = (mode - min) / span;
      return u < split ? min + Math.sqrt(u * span * (mode - min)) : max - Math.sqrt((1 - u) * span * (max - mode));
    }
    case 'normal': {
      const u1 = 1 - random.next();
      const u2 = random.next();
      return distribution.mean + distribution.sd * Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
    }
  }
}

/** The distribution's parameters converted with `toSI` (a spread converts as a difference, so degC works). */
export function distributionInSI(distribution: Distribution, toSI: (value: number) => number): SIDistribution {
  switch (distribution.kind) {
    case 'uniform':
      return { kind: 'uniform', min: toSI(distribution.min), max: toSI(distribution.max) };
    case 'triangular':
      return { kind: 'triangular', min: toSI(distribution.min), mode: toSI(distribution.mode), max: toSI(distribution.max) };
    case 'normal': {
      const mean = toSI(distribution.mean);
      return { kind: 'normal', mean, sd: Math.abs(toSI(distribution.mean + distribution.sd) - mean) };
    }
  }
}
