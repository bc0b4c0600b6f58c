import { ASTRONOMICAL_UNIT, SOLAR_IRRADIANCE_1AU, SPEED_OF_LIGHT } from '@/shared/sail/constants';
import { requirePositive } from '@/shared/sail/validate';

/**
 * Solar radiation pressure on a perfect absorber facing the sun, P(r) = (S0 / c) (1 AU / r)^2
 * (McInnes 1999, ch. 2). A perfect reflector feels twice this.
 * @param distance heliocentric distance r (m), > 0
 * @returns pressure (N/m^2 = Pa)
 */
export function radiationPressure(distance: number): number {
  requirePositive('radiationPressure', 'distance', distance);
  const ratio = ASTRONOMICAL_UNIT.value / distance;
  return (SOLAR_IRRADIANCE_1AU.value / SPEED_OF_LIGHT.value) * ratio * ratio;
}
