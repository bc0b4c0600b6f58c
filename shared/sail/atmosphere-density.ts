/**
 * Atmospheric density tables as data, each with its source. Altitudes in m above the reference
 * ellipsoid, densities in kg/m^3, ascending altitude.
 */

/** One row of a density table. */
export interface DensityPoint {
  /** Geometric altitude (m). */
  readonly altitude: number;
  /** Mass density (kg/m^3). */
  readonly density: number;
}

/** A density table with its source and the solar conditions it stands for. */
export interface DensityTable {
  readonly id: string;
  readonly name: string;
  readonly source: string;
  readonly solarActivity: string;
  readonly points: readonly DensityPoint[];
}

function kmTable(rows: readonly (readonly [number, number])[]): DensityPoint[] {
  return rows.map(([km, density]) => ({ altitude: km * 1000, density }));
}

/**
 * Exponential atmosphere model, base altitudes and nominal densities (scale heights not needed
 * for log interpolation). From memory: Vallado, Fundamentals of Astrodynamics and Applications,
 * 4th ed., 2013, Table 8-4 (U.S. Standard Atmosphere 1976 below 25 km, CIRA-72 above).
 */
export const VALLADO_EXPONENTIAL_TABLE: DensityTable = {
  id: 'vallado-exponential',
  name: 'Exponential atmosphere model (base densities)',
  source: 'Vallado, Fundamentals of Astrodynamics and Applications, 4th ed., 2013, Table 8-4 (from memory)',
  solarActivity: 'mean solar activity (CIRA-72 based)',
  points: kmTable([
    [0, 1.225],
    [25, 3.899e-2],
    [30, 1.774e-2],
    [40, 3.972e-3],
    [50, 1.057e-3],
    [60, 3.206e-4],
    [70, 8.77e-5],
    [80, 1.905e-5],
    [90, 3.396e-6],
    [100, 5.297e-7],
    [110, 9.661e-8],
    [120, 2.438e-8],
    [130, 8.484e-9],
    [140, 3.845e-9],
    [150, 2.07e-9],
    [180, 5.464e-10],
    [200, 2.789e-10],
    [250, 7.248e-11],
    [300, 2.418e-11],
    [350, 9.518e-12],
    [400, 3.725e-12],
    [450, 1.585e-12],
    [500, 6.967e-13],
    [600, 1.454e-13],
    [700, 3.614e-14],
    [800, 1.17e-14],
    [900, 5.245e-15],
    [1000, 3.019e-15],
  ]),
};

/**
 * U.S. Standard Atmosphere 1976 densities above 150 km. From memory: NOAA-S/T 76-1562,
 * tabulated for moderate solar activity.
 */
export const US_STANDARD_1976_TABLE: DensityTable = {
  id: 'us-standard-1976',
  name: 'U.S. Standard Atmosphere 1976 (150–1000 km)',
  source: 'U.S. Standard Atmosphere 1976, NOAA-S/T 76-1562 (from memory)',
  solarActivity: 'moderate solar activity',
  points: kmTable([
    [150, 2.076e-9],
    [200, 2.541e-10],
    [250, 6.073e-11],
    [300, 1.916e-11],
    [350, 7.014e-12],
    [400, 2.803e-12],
    [450, 1.184e-12],
    [500, 5.215e-13],
    [600, 1.137e-13],
    [700, 3.07e-14],
    [800, 1.136e-14],
    [900, 5.759e-15],
    [1000, 3.561e-15],
  ]),
};
