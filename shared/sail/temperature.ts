import { ASTRONOMICAL_UNIT, SOLAR_IRRADIANCE_1AU, STEFAN_BOLTZMANN } from '@/shared/sail/constants';
import { checkOptics, type OpticalCoefficients } from '@/shared/sail/optics';
import { solarIrradiance } from '@/shared/sail/radiation-pressure';
import { requireInRange, requirePositive } from '@/shared/sail/validate';

/** Cone angles the equilibrium formula accepts: the sun must light the front, (−π/2, π/2) rad. */
function checkLitConeAngle(where: string, coneAngle: number): number {
  const limit = Math.PI / 2;
  return requireInRange(where, 'coneAngle', coneAngle, -limit, limit, {
    minExclusive: true,
    maxExclusive: true,
    unit: 'rad',
  });
}

/** (1 − r) cos α / (σ_SB (ε_f + ε_b)): absorbed over emitted per unit irradiance, m^2 K^4 / W. */
function absorbedOverEmitted(coneAngle: number, optics: OpticalCoefficients): number {
  return (
    ((1 - optics.reflectivity) * Math.cos(coneAngle)) /
    (STEFAN_BOLTZMANN.value * (optics.emissivityFront + optics.emissivityBack))
  );
}

/**
 * Equilibrium temperature of an opaque sail film radiating from both faces (McInnes 1999, ch. 2):
 * T = [ (1 − r) S0 (1 AU / r)^2 cos α / (σ_SB (ε_f + ε_b)) ]^(1/4).
 * @param distance heliocentric distance r (m), > 0
 * @param coneAngle cone angle α (rad), |α| < π/2
 * @param optics optical coefficients (r, ε_f, ε_b are used)
 * @returns film temperature (K)
 */
export function sailTemperature(distance: number, coneAngle: number, optics: OpticalCoefficients): number {
  const where = 'sailTemperature';
  checkLitConeAngle(where, coneAngle);
  checkOptics(where, optics);
  return Math.pow(solarIrradiance(distance) * absorbedOverEmitted(coneAngle, optics), 0.25);
}

/** One point of a temperature-versus-distance series. */
export interface TemperaturePoint {
  /** Heliocentric distance (m). */
  readonly distance: number;
  /** Film temperature (K). */
  readonly temperature: number;
}

/**
 * Sail film temperature at each of the given distances (see sailTemperature).
 * @param distances heliocentric distances (m), each > 0
 * @param coneAngle cone angle (rad), |α| < π/2
 * @param optics optical coefficients
 * @returns one point per distance, in the given order
 */
export function temperatureVersusDistance(
  distances: readonly number[],
  coneAngle: number,
  optics: OpticalCoefficients,
): TemperaturePoint[] {
  return distances.map((distance) => ({
    distance,
    temperature: sailTemperature(distance, coneAngle, optics),
  }));
}

/**
 * Closest heliocentric distance at which the film stays at or below a temperature limit,
 * the equilibrium formula solved for r: r = 1 AU √( (1 − r) S0 cos α / (σ_SB (ε_f + ε_b) T^4) ).
 * @param temperatureLimit film temperature limit (K), > 0
 * @param coneAngle cone angle α held during the approach (rad), |α| < π/2
 * @param optics optical coefficients
 * @returns closest safe distance (m)
 */
export function closestSafeDistance(
  temperatureLimit: number,
  coneAngle: number,
  optics: OpticalCoefficients,
): number {
  const where = 'closestSafeDistance';
  requirePositive(where, 'temperatureLimit', temperatureLimit);
  checkLitConeAngle(where, coneAngle);
  checkOptics(where, optics);
  const t2 = temperatureLimit * temperatureLimit;
  return (
    ASTRONOMICAL_UNIT.value *
    Math.sqrt((SOLAR_IRRADIANCE_1AU.value * absorbedOverEmitted(coneAngle, optics)) / (t2 * t2))
  );
}
