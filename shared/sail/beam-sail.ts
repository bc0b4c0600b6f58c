import { SPEED_OF_LIGHT } from '@/shared/sail/constants';

/**
 * Force on a receding flat sail under a beam of constant emitted power, over its force at rest: the beam
 * reaches the sail Doppler-thinned by (1 - β) and the reflected part returns a further 2/(1 + β) of its
 * momentum: F/F0 = (1 - β)[(1 - R) + 2R/(1 + β)] / (1 + R), from F = (P/c)(1 - β)[(1 - R) + 2R/(1 + β)]
 * (a relativistic light sail under a constant-power beam; Forward 1984 for F0 = (1 + R)P/c, from memory).
 */
function forceRatio(beta: number, reflectivity: number): number {
  return ((1 - beta) * (1 - reflectivity + (2 * reflectivity) / (1 + beta))) / (1 + reflectivity);
}

/** dx/dβ over c²/a0: with u = γβ, du/dt = (a0/c) F/F0 and dx/dt = βc, so dx = (c²/a0) β γ³ dβ / (F/F0). */
function distancePerBeta(beta: number, reflectivity: number): number {
  const gamma = 1 / Math.sqrt(1 - beta * beta);
  return (beta * gamma * gamma * gamma) / forceRatio(beta, reflectivity);
}

function simpson(f: (x: number) => number, from: number, to: number): number {
  return ((to - from) / 6) * (f(from) + 4 * f((from + to) / 2) + f(to));
}

const MAX_STEPS = 1_000_000;

/**
 * Speed, as a fraction of c, of a flat sail pushed from rest along the beam by a beam of constant power, when
 * it has travelled `distance` (m). `restAcceleration` is the acceleration the beam gives the sail at rest,
 * (1 + R) P / (m c) (m/s²), and `reflectivity` R the sail's (0 to 1). The equation of motion above is
 * integrated in β (Simpson's rule, steps of at most 0.001 and finer near c) until the distance is reached,
 * then the last step is bisected; the speed never reaches c. NaN for a negative distance or acceleration or a
 * reflectivity outside 0 to 1.
 */
export function beamSailBeta(restAcceleration: number, distance: number, reflectivity: number): number {
  if (!(restAcceleration >= 0 && distance >= 0 && reflectivity >= 0 && reflectivity <= 1)) return Number.NaN;
  const c = SPEED_OF_LIGHT.value;
  // The distance in units of c²/a0: what the integral of dx/dβ must reach.
  const target = (restAcceleration * distance) / (c * c);
  if (target === 0) return 0;
  if (!Number.isFinite(target)) return Number.NaN;
  const f = (beta: number) => distancePerBeta(beta, reflectivity);
  let beta = 0;
  let travelled = 0;
  for (let step = 0; step < MAX_STEPS; step += 1) {
    const next = beta + Math.min(1e-3, (1 - beta) / 8);
    const piece = simpson(f, beta, next);
    if (travelled + piece >= target) {
      let low = beta;
      let high = next;
      for (let k = 0; k < 60; k += 1) {
        const middle = (low + high) / 2;
        if (travelled + simpson(f, beta, middle) < target) low = middle;
        else high = middle;
      }
      return (low + high) / 2;
    }
    travelled += piece;
    beta = next;
  }
  return Number.NaN;
}
