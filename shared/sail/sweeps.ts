import { ASTRONOMICAL_UNIT } from '@/shared/sail/constants';
import { maximise } from '@/shared/sail/numeric';
import { sailForce, type SailForceComponents, type SailForceModel } from '@/shared/sail/sail-force';
import { requirePositive } from '@/shared/sail/validate';

/** One point of a force/acceleration series: forces in N, accelerations in m/s^2, angles in rad. */
export interface SailSeriesPoint extends SailForceComponents {
  /** Cone angle (rad). */
  readonly coneAngle: number;
  /** Heliocentric distance (m). */
  readonly distance: number;
  /** Magnitude of the acceleration, force / mass (m/s^2). */
  readonly acceleration: number;
  /** Acceleration along the sun line, away from the sun (m/s^2). */
  readonly radialAcceleration: number;
  /** Acceleration across the sun line (m/s^2). */
  readonly circumferentialAcceleration: number;
}

/** The craft a series is computed for. */
export interface SailCraft {
  readonly model: SailForceModel;
  /** Sail area (m^2). */
  readonly area: number;
  /** Craft mass (kg), > 0. */
  readonly mass: number;
}

function seriesPoint(craft: SailCraft, coneAngle: number, distance: number): SailSeriesPoint {
  const force = sailForce(craft.model, craft.area, coneAngle, distance);
  return {
    ...force,
    coneAngle,
    distance,
    acceleration: force.magnitude / craft.mass,
    radialAcceleration: force.radial / craft.mass,
    circumferentialAcceleration: force.circumferential / craft.mass,
  };
}

/**
 * Force and acceleration of a sail at one distance over a range of cone angles.
 * @param craft force model, sail area (m^2) and mass (kg)
 * @param distance heliocentric distance (m), > 0
 * @param coneAngles cone angles (rad), each in [-π/2, π/2]
 * @returns one point per cone angle, in the given order
 */
export function performanceVersusConeAngle(
  craft: SailCraft,
  distance: number,
  coneAngles: readonly number[],
): SailSeriesPoint[] {
  requirePositive('performanceVersusConeAngle', 'mass', craft.mass);
  return coneAngles.map((coneAngle) => seriesPoint(craft, coneAngle, distance));
}

/**
 * Force and acceleration of a sail at one cone angle over a range of heliocentric distances.
 * @param craft force model, sail area (m^2) and mass (kg)
 * @param coneAngle cone angle (rad), in [-π/2, π/2]
 * @param distances heliocentric distances (m), each > 0
 * @returns one point per distance, in the given order
 */
export function performanceVersusDistance(
  craft: SailCraft,
  coneAngle: number,
  distances: readonly number[],
): SailSeriesPoint[] {
  requirePositive('performanceVersusDistance', 'mass', craft.mass);
  return distances.map((distance) => seriesPoint(craft, coneAngle, distance));
}

/** Cone angle of the largest force across the sun line for an ideal sail: tan α = 1/√2, α ≈ 35.26° (rad). */
export const IDEAL_BEST_TRANSVERSE_CONE_ANGLE = Math.atan(Math.SQRT1_2);

/**
 * Cone angle giving the largest force component across the sun line (the one that changes
 * orbital energy), found numerically; for the ideal model it equals IDEAL_BEST_TRANSVERSE_CONE_ANGLE.
 * The result does not depend on area or distance, which only scale the force.
 * @param model ideal or optical force model
 * @returns cone angle in (0, π/2) (rad)
 * @throws RangeError for an ideal model of zero efficiency, which has no force to maximise
 */
export function bestTransverseConeAngle(model: SailForceModel): number {
  if (model.kind === 'ideal') {
    requirePositive('bestTransverseConeAngle', 'efficiency', model.efficiency);
  }
  return maximise(
    (coneAngle) => sailForce(model, 1, coneAngle, ASTRONOMICAL_UNIT.value).circumferential,
    0,
    Math.PI / 2,
  );
}
