import { ASTRONOMICAL_UNIT, EARTH_GM, EARTH_RADIUS } from '@/shared/sail/constants';
import { VALLADO_EXPONENTIAL_TABLE, atmosphericDensity, checkDensityTable, type DensityTable } from '@/shared/sail/atmosphere-density';
import { bisect } from '@/shared/sail/numeric';
import { radiationPressure } from '@/shared/sail/radiation-pressure';
import { requireInRange, requireNonNegative, requirePositive } from '@/shared/sail/validate';

/**
 * Drag coefficient of a flat plate or compact satellite in free-molecular flow, 2.2: Cook 1965, "Satellite drag
 * coefficients", Planetary and Space Science 13 (from memory), the value in common use since.
 */
export const COMMON_DRAG_COEFFICIENT = 2.2;

/** Shown with every crossover result: the density, and so the crossover, follows the Sun. */
export const DRAG_CROSSOVER_CAVEAT =
  'Thermospheric density varies by one to two orders of magnitude over the solar cycle, so the altitude where radiation pressure overtakes drag moves by a few hundred km. The rule of thumb of about 800 km corresponds to high solar activity (common practice). The result holds only for the conditions of the density table used. The speed is the inertial circular-orbit speed: the co-rotation of the atmosphere with the Earth is ignored, which overstates the drag pressure by up to about 13 % in a prograde equatorial orbit (about 0.5 km/s of co-rotation against 7.6 km/s).';

/**
 * Speed of a circular Earth orbit, v = √(GM_earth / (R_earth + h)).
 * @param altitude altitude above the equatorial radius (m), >= 0
 * @returns orbital speed (m/s)
 */
export function circularOrbitSpeed(altitude: number): number {
  requireNonNegative('circularOrbitSpeed', 'altitude', altitude);
  return Math.sqrt(EARTH_GM.value / (EARTH_RADIUS.value + altitude));
}

/**
 * Aerodynamic pressure on a plate facing the flow in a circular orbit, q = ½ ρ v^2 C_D.
 * @param altitude altitude (m), within the table
 * @param table density table
 * @param dragCoefficient C_D, > 0; default 2.2 (common practice)
 * @returns pressure (N/m^2)
 */
export function dragPressure(
  altitude: number,
  table: DensityTable = VALLADO_EXPONENTIAL_TABLE,
  dragCoefficient = COMMON_DRAG_COEFFICIENT,
): number {
  requirePositive('dragPressure', 'dragCoefficient', dragCoefficient);
  const v = circularOrbitSpeed(altitude);
  return 0.5 * atmosphericDensity(altitude, table) * v * v * dragCoefficient;
}

/** Options of the crossover analysis. */
export interface DragCrossoverOptions {
  /** Density table; default the exponential model table (Vallado 2013, from memory). */
  readonly table?: DensityTable;
  /** Drag coefficient C_D; default 2.2 (common practice). */
  readonly dragCoefficient?: number;
  /** Sail efficiency η scaling the ideal reflector's 2 P(1 AU); default 1. */
  readonly efficiency?: number;
}

/** The crossover altitude with the figures at it, or why there is none within the table. */
export type DragCrossoverResult =
  | {
      readonly ok: true;
      /** Altitude above which radiation pressure exceeds drag (m). */
      readonly altitude: number;
      /** Density there (kg/m^3). */
      readonly density: number;
      /** Circular orbital speed there (m/s). */
      readonly orbitalSpeed: number;
      /** Radiation pressure on the sail, 2 η P(1 AU), equal to the drag pressure there (N/m^2). */
      readonly radiationPressure: number;
      readonly tableId: string;
      readonly tableSource: string;
      readonly caveat: string;
    }
  | { readonly ok: false; readonly reason: string; readonly caveat: string };

/**
 * Earth-orbit altitude above which solar radiation pressure on a sun-facing sail, 2 η P(1 AU),
 * exceeds aerodynamic pressure q = ½ ρ v^2 C_D in a circular orbit.
 * @param options density table, drag coefficient, efficiency
 * @returns the altitude (m) with the caveat, or a reason when the crossover lies outside the table
 */
export function dragCrossoverAltitude(options: DragCrossoverOptions = {}): DragCrossoverResult {
  const table = checkDensityTable(options.table ?? VALLADO_EXPONENTIAL_TABLE);
  const dragCoefficient = requirePositive('dragCrossoverAltitude', 'dragCoefficient', options.dragCoefficient ?? COMMON_DRAG_COEFFICIENT);
  const efficiency = requireInRange('dragCrossoverAltitude', 'efficiency', options.efficiency ?? 1, 0, 1, {
    minExclusive: true,
  });
  const pressure = 2 * efficiency * radiationPressure(ASTRONOMICAL_UNIT.value);
  const low = Math.max(0, table.points[0]?.altitude ?? 0);
  const high = table.points[table.points.length - 1]?.altitude ?? low;
  const excess = (h: number): number => Math.log(dragPressure(h, table, dragCoefficient) / pressure);
  const km = (m: number): string => `${(m / 1000).toFixed(0)} km`;
  if (excess(high) > 0) {
    return {
      ok: false,
      reason: `drag exceeds radiation pressure up to the top of table '${table.id}' (${km(high)})`,
      caveat: DRAG_CROSSOVER_CAVEAT,
    };
  }
  if (excess(low) < 0) {
    return {
      ok: false,
      reason: `radiation pressure exceeds drag already at the bottom of table '${table.id}' (${km(low)})`,
      caveat: DRAG_CROSSOVER_CAVEAT,
    };
  }
  const altitude = bisect(excess, low, high);
  return {
    ok: true,
    altitude,
    density: atmosphericDensity(altitude, table),
    orbitalSpeed: circularOrbitSpeed(altitude),
    radiationPressure: pressure,
    tableId: table.id,
    tableSource: table.source,
    caveat: DRAG_CROSSOVER_CAVEAT,
  };
}
