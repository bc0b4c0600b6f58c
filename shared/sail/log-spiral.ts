import { SOLAR_GM } from '@/shared/sail/constants';
import { bisect } from '@/shared/sail/numeric';
import { requireInRange, requirePositive } from '@/shared/sail/validate';

/** Shown with every spiral result: a first-order estimate, not a trajectory design. */
export const LOG_SPIRAL_CAVEAT =
  'First-order estimate: the logarithmic spiral (ideal sail, constant cone angle) does not start or end on a circular orbit, so the time ignores the escape and capture phases and any rendezvous. Use it to compare designs, not to plan a mission.';

/**
 * Cone angle of the largest force across the sun line of an ideal sail, tan α = 1/√2, α ≈ 35.26°
 * (McInnes 1999, ch. 2 and 4): the cone angle a logarithmic spiral of an ideal sail is usually flown at (rad).
 */
export const IDEAL_BEST_TRANSVERSE_CONE_ANGLE = Math.atan(Math.SQRT1_2);

/** Spiral angle at which the lightness number of a spiral is largest: tan γ = √2, for any cone angle (rad). */
const LARGEST_LIGHTNESS_SPIRAL_ANGLE = Math.atan(Math.SQRT2);

function checkSpiralConeAngle(where: string, coneAngle: number): number {
  // At 0 the sail gives no transverse force and at π/2 no force at all: no spiral.
  return requireInRange(where, 'coneAngle', coneAngle, 0, Math.PI / 2, {
    minExclusive: true,
    maxExclusive: true,
    unit: 'rad',
  });
}

/**
 * Lightness number that holds an ideal sail on a logarithmic spiral of spiral (flight-path) angle γ
 * at cone angle α (McInnes 1999, ch. 4):
 * β = sin γ cos γ / [ cos^3 α sin γ cos γ + cos^2 α sin α (2 − sin^2 γ) ].
 * @param spiralAngle γ (rad), in [0, π/2]
 * @param coneAngle α (rad), in (0, π/2)
 * @returns β (dimensionless)
 */
export function spiralLightnessNumber(spiralAngle: number, coneAngle: number): number {
  requireInRange('spiralLightnessNumber', 'spiralAngle', spiralAngle, 0, Math.PI / 2, { unit: 'rad' });
  checkSpiralConeAngle('spiralLightnessNumber', coneAngle);
  const sg = Math.sin(spiralAngle);
  const cg = Math.cos(spiralAngle);
  const ca = Math.cos(coneAngle);
  return (sg * cg) / (ca * ca * ca * sg * cg + ca * ca * Math.sin(coneAngle) * (2 - sg * sg));
}

/**
 * Largest lightness number for which a logarithmic spiral exists at a cone angle; it is reached
 * at tan γ = √2 (from the spiral relation, McInnes 1999, ch. 4).
 * @param coneAngle α (rad), in (0, π/2)
 * @returns β_max (dimensionless)
 */
export function largestSpiralLightnessNumber(coneAngle: number): number {
  return spiralLightnessNumber(LARGEST_LIGHTNESS_SPIRAL_ANGLE, coneAngle);
}

/** Inputs of a spiral transfer: SI units, angles in rad. */
export interface LogSpiralTransferInput {
  /** Lightness number β, > 0. */
  readonly lightnessNumber: number;
  /** Magnitude of the cone angle α (rad), in (0, π/2); an inward spiral pitches the sail the other way. */
  readonly coneAngle: number;
  /** Heliocentric radius at departure (m), > 0. */
  readonly departureRadius: number;
  /** Heliocentric radius at arrival (m), > 0. */
  readonly arrivalRadius: number;
}

/** A spiral transfer time, or why there is no spiral for the inputs. */
export type LogSpiralTransferResult =
  | {
      readonly ok: true;
      /** Transfer time (s). */
      readonly time: number;
      /** Spiral (flight-path) angle γ (rad), on the slower branch, γ ≤ atan √2. */
      readonly spiralAngle: number;
      readonly direction: 'outward' | 'inward';
      readonly caveat: string;
    }
  | { readonly ok: false; readonly reason: string; readonly caveat: string };

const degrees = (rad: number): string => `${((rad * 180) / Math.PI).toFixed(2)}°`;

/**
 * Time to travel along a logarithmic spiral between two heliocentric radii (McInnes 1999, ch. 4):
 * γ is solved from β and α (the branch that grows from γ = 0 as β grows from 0), then
 * T = (√2 / 3) |r1^(3/2) − r0^(3/2)| / √(GM_sun β cos^2 α sin α tan γ).
 * @param input lightness number, cone angle (rad), departure and arrival radii (m)
 * @returns the time (s) and spiral angle (rad) with the caveat, or a reason when β is larger
 *   than any spiral at that cone angle allows
 * @throws RangeError for a negative or non-finite input, or a cone angle outside (0, π/2)
 */
export function logSpiralTransfer(input: LogSpiralTransferInput): LogSpiralTransferResult {
  const where = 'logSpiralTransfer';
  const beta = requirePositive(where, 'lightnessNumber', input.lightnessNumber);
  const alpha = checkSpiralConeAngle(where, input.coneAngle);
  const r0 = requirePositive(where, 'departureRadius', input.departureRadius);
  const r1 = requirePositive(where, 'arrivalRadius', input.arrivalRadius);
  const betaMax = largestSpiralLightnessNumber(alpha);
  if (beta > betaMax) {
    return {
      ok: false,
      reason: `lightness number ${beta} is above ${betaMax.toPrecision(4)}, the largest for which a logarithmic spiral exists at cone angle ${degrees(alpha)}`,
      caveat: LOG_SPIRAL_CAVEAT,
    };
  }
  const gamma =
    beta === betaMax
      ? LARGEST_LIGHTNESS_SPIRAL_ANGLE
      : bisect((g) => spiralLightnessNumber(g, alpha) - beta, 0, LARGEST_LIGHTNESS_SPIRAL_ANGLE);
  const cos = Math.cos(alpha);
  const rate = Math.sqrt(SOLAR_GM.value * beta * cos * cos * Math.sin(alpha) * Math.tan(gamma));
  const time = ((Math.SQRT2 / 3) * Math.abs(Math.pow(r1, 1.5) - Math.pow(r0, 1.5))) / rate;
  return {
    ok: true,
    time,
    spiralAngle: gamma,
    direction: r1 >= r0 ? 'outward' : 'inward',
    caveat: LOG_SPIRAL_CAVEAT,
  };
}
