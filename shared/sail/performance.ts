import { ASTRONOMICAL_UNIT } from '@/shared/sail/constants';
import type { OpticalCoefficients } from '@/shared/sail/optics';
import { radiationPressure, solarGravity } from '@/shared/sail/radiation-pressure';
import { opticalSailForce } from '@/shared/sail/sail-force';
import { requireInRange, requireNonNegative, requirePositive } from '@/shared/sail/validate';

/**
 * Sail loading (areal density) σ = m / A.
 * @param mass mass basis m (kg), >= 0: the whole craft, or the stated basis
 * @param area sail area A (m^2), > 0
 * @returns sail loading (kg/m^2)
 */
export function sailLoading(mass: number, area: number): number {
  requireNonNegative('sailLoading', 'mass', mass);
  requirePositive('sailLoading', 'area', area);
  return mass / area;
}

/**
 * Solar gravitational acceleration at 1 AU, g0 = GM_sun / AU^2 (≈ 5.93e-3 m/s^2).
 * @returns g0 (m/s^2)
 */
export function solarGravityAt1AU(): number {
  return solarGravity(ASTRONOMICAL_UNIT.value);
}

/**
 * Characteristic acceleration a_c = 2 η P(1 AU) / σ: the acceleration at 1 AU facing the sun
 * (McInnes 1999, ch. 2).
 * @param loading sail loading σ (kg/m^2), > 0
 * @param efficiency overall efficiency η, in [0, 1]; default 1
 * @returns a_c (m/s^2)
 */
export function characteristicAcceleration(loading: number, efficiency = 1): number {
  requirePositive('characteristicAcceleration', 'loading', loading);
  requireInRange('characteristicAcceleration', 'efficiency', efficiency, 0, 1);
  return (2 * efficiency * radiationPressure(ASTRONOMICAL_UNIT.value)) / loading;
}

/**
 * Characteristic acceleration of a non-ideal sail: the optical model's normal force per unit area
 * at 1 AU facing the sun, over the sail loading, a_c = F_n(0) / (A σ) (McInnes 1999, ch. 2).
 * @param loading sail loading σ (kg/m^2), > 0
 * @param optics optical coefficients
 * @returns a_c (m/s^2)
 */
export function opticalCharacteristicAcceleration(loading: number, optics: OpticalCoefficients): number {
  requirePositive('opticalCharacteristicAcceleration', 'loading', loading);
  return opticalSailForce(1, 0, ASTRONOMICAL_UNIT.value, optics).normal / loading;
}

/**
 * Lightness number β = a_c / g0: solar radiation over solar gravity (McInnes 1999, ch. 2).
 * @param acceleration characteristic acceleration a_c (m/s^2), >= 0
 * @returns β (dimensionless)
 */
export function lightnessNumber(acceleration: number): number {
  requireNonNegative('lightnessNumber', 'acceleration', acceleration);
  return acceleration / solarGravityAt1AU();
}

/**
 * Characteristic acceleration from a lightness number, a_c = β GM_sun / AU^2.
 * @param beta lightness number β, >= 0
 * @returns a_c (m/s^2)
 */
export function characteristicAccelerationFromLightness(beta: number): number {
  requireNonNegative('characteristicAccelerationFromLightness', 'beta', beta);
  return beta * solarGravityAt1AU();
}

/**
 * Critical sail loading σ* = 2 η P(1 AU) / g0: the loading at which β = 1
 * (McInnes 1999 quotes 1.53 g/m^2 for an ideal sail).
 * @param efficiency overall efficiency η, in (0, 1]; default 1
 * @returns σ* (kg/m^2)
 */
export function criticalSailLoading(efficiency = 1): number {
  requireInRange('criticalSailLoading', 'efficiency', efficiency, 0, 1, { minExclusive: true });
  return (2 * efficiency * radiationPressure(ASTRONOMICAL_UNIT.value)) / solarGravityAt1AU();
}
