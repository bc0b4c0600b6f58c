import { requireFinite, requireInRange, requirePositive } from '@/shared/sail/validate';

/**
 * Atmospheric density models as data, each with its source. Altitudes in m above the reference
 * ellipsoid's equatorial radius, densities in kg/m^3, ascending altitude.
 */

/** One row of a density table. */
export interface DensityPoint {
  /** Geometric altitude (m). */
  readonly altitude: number;
  /** Mass density (kg/m^3). */
  readonly density: number;
  /**
   * Scale height H (m) of the exponential layer that starts at this row: ρ(h) = ρ0 exp(−(h − h0)/H) up to the
   * next row. Without it the density is interpolated log-linearly between rows.
   */
  readonly scaleHeight?: number;
}

/** A density table with its source and the solar conditions it stands for. */
export interface DensityTable {
  readonly id: string;
  readonly name: string;
  readonly source: string;
  readonly solarActivity: string;
  readonly points: readonly DensityPoint[];
}

function kmTable(rows: readonly (readonly [number, number, number?])[]): DensityPoint[] {
  return rows.map(([km, density, scaleHeightKm]) =>
    scaleHeightKm === undefined ? { altitude: km * 1000, density } : { altitude: km * 1000, density, scaleHeight: scaleHeightKm * 1000 },
  );
}

/**
 * Exponential atmosphere model: base altitude, nominal density and scale height of each layer. From memory:
 * Vallado, Fundamentals of Astrodynamics and Applications, 4th ed., 2013, Table 8-4 (U.S. Standard
 * Atmosphere 1976 below 25 km, CIRA-72 above). The last layer (1000 km) is used up to the table's top row only.
 */
export const VALLADO_EXPONENTIAL_TABLE: DensityTable = {
  id: 'vallado-exponential',
  name: 'Exponential atmosphere model (Vallado)',
  source: 'Vallado, Fundamentals of Astrodynamics and Applications, 4th ed., 2013, Table 8-4 (from memory)',
  solarActivity: 'mean solar activity (CIRA-72 based)',
  points: kmTable([
    [0, 1.225, 7.249],
    [25, 3.899e-2, 6.349],
    [30, 1.774e-2, 6.682],
    [40, 3.972e-3, 7.554],
    [50, 1.057e-3, 8.382],
    [60, 3.206e-4, 7.714],
    [70, 8.77e-5, 6.549],
    [80, 1.905e-5, 5.799],
    [90, 3.396e-6, 5.382],
    [100, 5.297e-7, 5.877],
    [110, 9.661e-8, 7.263],
    [120, 2.438e-8, 9.473],
    [130, 8.484e-9, 12.636],
    [140, 3.845e-9, 16.149],
    [150, 2.07e-9, 22.523],
    [180, 5.464e-10, 29.74],
    [200, 2.789e-10, 37.105],
    [250, 7.248e-11, 45.546],
    [300, 2.418e-11, 53.628],
    [350, 9.518e-12, 53.298],
    [400, 3.725e-12, 58.515],
    [450, 1.585e-12, 60.828],
    [500, 6.967e-13, 63.822],
    [600, 1.454e-13, 71.835],
    [700, 3.614e-14, 88.667],
    [800, 1.17e-14, 124.64],
    [900, 5.245e-15, 181.05],
    [1000, 3.019e-15, 268],
  ]),
};

/**
 * U.S. Standard Atmosphere 1976 densities from 86 km (where its tables of the upper atmosphere start) to
 * 1000 km, interpolated log-linearly between rows. From memory: NOAA-S/T 76-1562, Table 1, moderate solar activity.
 */
export const US_STANDARD_1976_TABLE: DensityTable = {
  id: 'us-standard-1976',
  name: 'U.S. Standard Atmosphere 1976 (86–1000 km)',
  source: 'U.S. Standard Atmosphere 1976, NOAA-S/T 76-1562 (from memory)',
  solarActivity: 'moderate solar activity',
  points: kmTable([
    [86, 6.958e-6],
    [90, 3.416e-6],
    [100, 5.604e-7],
    [110, 9.708e-8],
    [120, 2.222e-8],
    [130, 8.152e-9],
    [140, 3.831e-9],
    [150, 2.076e-9],
    [160, 1.233e-9],
    [170, 7.815e-10],
    [180, 5.194e-10],
    [190, 3.581e-10],
    [200, 2.541e-10],
    [250, 6.073e-11],
    [300, 1.916e-11],
    [350, 7.014e-12],
    [400, 2.803e-12],
    [450, 1.184e-12],
    [500, 5.215e-13],
    [550, 2.384e-13],
    [600, 1.137e-13],
    [650, 5.712e-14],
    [700, 3.07e-14],
    [750, 1.788e-14],
    [800, 1.136e-14],
    [850, 7.824e-15],
    [900, 5.759e-15],
    [950, 4.453e-15],
    [1000, 3.561e-15],
  ]),
};

/**
 * The density models a sheet row chooses by number (the `density_model` row of the drag-sail template):
 * 1 the exponential model (Vallado 2013), 2 the U.S. Standard Atmosphere 1976.
 */
export const densityModels: Readonly<Record<number, DensityTable>> = {
  1: VALLADO_EXPONENTIAL_TABLE,
  2: US_STANDARD_1976_TABLE,
};

/**
 * Checks a density table: at least two rows, strictly ascending finite altitudes, densities and scale heights > 0.
 * @throws RangeError naming the table and the row
 */
export function checkDensityTable(table: DensityTable): DensityTable {
  const where = `density table '${table.id}'`;
  if (table.points.length < 2) throw new RangeError(`${where}: needs at least two rows, has ${table.points.length}`);
  table.points.forEach((point, index) => {
    requireFinite(where, `points[${index}].altitude`, point.altitude);
    requirePositive(where, `points[${index}].density`, point.density);
    if (point.scaleHeight !== undefined) requirePositive(where, `points[${index}].scaleHeight`, point.scaleHeight);
    const previous = table.points[index - 1];
    if (previous && point.altitude <= previous.altitude) {
      throw new RangeError(
        `${where}: points[${index}].altitude must be above the row before it, got ${point.altitude} m after ${previous.altitude} m`,
      );
    }
  });
  return table;
}

/** Density at `altitude` within the layer that starts at `lower` and ends at `upper`. */
export function layerDensity(lower: DensityPoint, upper: DensityPoint, altitude: number): number {
  if (lower.scaleHeight !== undefined) return lower.density * Math.exp(-(altitude - lower.altitude) / lower.scaleHeight);
  const fraction = (altitude - lower.altitude) / (upper.altitude - lower.altitude);
  return Math.exp(Math.log(lower.density) + fraction * (Math.log(upper.density) - Math.log(lower.density)));
}

/**
 * Atmospheric density at an altitude: in a layer with a scale height, ρ0 exp(−(h − h0)/H) from its base row
 * (Vallado 2013, §8.6); else log-linear between rows (ln ρ linear in altitude, an exponential atmosphere
 * between the tabulated points).
 * @param altitude geometric altitude (m), within the table's range
 * @param table density table; default the exponential model (Vallado 2013, from memory)
 * @returns density (kg/m^3)
 * @throws RangeError when the altitude is outside the table
 */
export function atmosphericDensity(altitude: number, table: DensityTable = VALLADO_EXPONENTIAL_TABLE): number {
  checkDensityTable(table);
  const { points } = table;
  const first = points[0];
  const last = points[points.length - 1];
  if (!first || !last) throw new RangeError(`density table '${table.id}': has no rows`);
  requireInRange('atmosphericDensity', 'altitude', altitude, first.altitude, last.altitude, { unit: 'm' });
  if (altitude === last.altitude) return last.density;
  for (let index = 1; index < points.length; index += 1) {
    const lower = points[index - 1];
    const upper = points[index];
    if (lower && upper && altitude < upper.altitude) return layerDensity(lower, upper, altitude);
  }
  return last.density;
}
