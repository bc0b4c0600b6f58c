import { EARTH_GM, EARTH_RADIUS } from '@/shared/sail/constants';
import { checkDensityTable, layerDensity, type DensityTable } from '@/shared/sail/atmosphere-density';
import { requireInRange, requirePositive } from '@/shared/sail/validate';

/** Shown with every lifetime: the tables are static, the Sun is not. */
export const SOLAR_CYCLE_CAVEAT =
  'The density tables are static models of mean or moderate solar activity; real thermospheric density, and so the lifetime, swings by a factor of 2–3 over the 11-year solar cycle. Treat the lifetime as the middle of a wide band and keep margin on the rules.';

/** Shown with every lifetime: what the circular-decay model leaves out above about 600 km. */
export const RADIATION_PRESSURE_CAVEAT =
  "Radiation pressure on the sail is ignored. Above about 600 km it exceeds drag on a sail and, with the Earth's oblateness (J2), pumps the orbit's eccentricity, which can shorten or lengthen the decay: this circular-decay estimate does not hold there without a propagation that includes it.";

/** Abscissae and weights of 8-point Gauss–Legendre quadrature on [−1, 1] (Abramowitz & Stegun 1964, Table 25.4). */
const GAUSS_LEGENDRE_8: readonly (readonly [number, number])[] = [
  [-0.9602898564975363, 0.1012285362903763],
  [-0.7966664774136267, 0.2223810344533745],
  [-0.525532409916329, 0.3137066458778873],
  [-0.1834346424956498, 0.362683783378362],
  [0.1834346424956498, 0.362683783378362],
  [0.525532409916329, 0.3137066458778873],
  [0.7966664774136267, 0.2223810344533745],
  [0.9602898564975363, 0.1012285362903763],
];

/** Sub-intervals per table layer: the integrand grows by at most about e^2 across a layer, so 4 × 8 points resolve it to 1e-12. */
const PIECES_PER_LAYER = 4;

/**
 * Time for a circular orbit to decay between two altitudes under drag alone (Vallado 2013, §8.6; King-Hele 1987,
 * Satellite Orbits in an Atmosphere, from memory): da/dt = −ρ(h) √(μ a) / B with B = m / (C_D A) the ballistic
 * coefficient, so t = B ∫ dh / (ρ(h) √(μ (R_E + h))) from the end altitude up to the start altitude. The integral
 * is taken layer by layer of the density table with Gauss–Legendre quadrature, where the density is smooth.
 * @param startAltitude altitude of the circular orbit at the start (m), within the table
 * @param endAltitude altitude where the decay counts as done (m), within the table; at or above the start gives 0
 * @param ballisticCoefficient B = m / (C_D A) (kg/m^2), > 0
 * @param table density table
 * @returns decay time (s)
 * @throws RangeError for an altitude outside the table or a non-positive ballistic coefficient
 */
export function orbitalDecayTime(startAltitude: number, endAltitude: number, ballisticCoefficient: number, table: DensityTable): number {
  const where = 'orbitalDecayTime';
  const { points } = checkDensityTable(table);
  const bottom = points[0]?.altitude ?? 0;
  const top = points[points.length - 1]?.altitude ?? 0;
  requireInRange(where, 'startAltitude', startAltitude, bottom, top, { unit: 'm' });
  requireInRange(where, 'endAltitude', endAltitude, bottom, top, { unit: 'm' });
  requirePositive(where, 'ballisticCoefficient', ballisticCoefficient);
  if (startAltitude <= endAltitude) return 0;
  const mu = EARTH_GM.value;
  let integral = 0;
  for (let index = 1; index < points.length; index += 1) {
    const lower = points[index - 1];
    const upper = points[index];
    if (lower === undefined || upper === undefined) continue;
    const from = Math.max(lower.altitude, endAltitude);
    const to = Math.min(upper.altitude, startAltitude);
    if (to <= from) continue;
    const step = (to - from) / PIECES_PER_LAYER;
    for (let piece = 0; piece < PIECES_PER_LAYER; piece += 1) {
      const centre = from + (piece + 0.5) * step;
      for (const [node, weight] of GAUSS_LEGENDRE_8) {
        const altitude = centre + (node * step) / 2;
        const rate = layerDensity(lower, upper, altitude) * Math.sqrt(mu * (EARTH_RADIUS.value + altitude));
        integral += (weight * step) / 2 / rate;
      }
    }
  }
  return ballisticCoefficient * integral;
}
