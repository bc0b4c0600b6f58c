/**
 * Physical constants for sail sizing, each with its unit (Trimsheet notation, docs/units.md) and its source.
 * Values are SI.
 */

/** A published constant: SI value, its unit in Trimsheet notation, and where the value comes from. */
export interface PhysicalConstant {
  readonly value: number;
  readonly unit: string;
  readonly source: string;
}

/** Nominal total solar irradiance at 1 AU, S0 (W/m^2). */
export const SOLAR_IRRADIANCE_1AU: PhysicalConstant = {
  value: 1361,
  unit: 'W/m^2',
  source: 'IAU 2015 Resolution B3 (nominal total solar irradiance)',
};

/** Speed of light in vacuum, c (m/s), exact. */
export const SPEED_OF_LIGHT: PhysicalConstant = {
  value: 299_792_458,
  unit: 'm/s',
  source: 'SI definition of the metre (exact)',
};

/** Astronomical unit (m), exact. The unit list (shared/engine/units.ts) defines `AU` from this value. */
export const ASTRONOMICAL_UNIT: PhysicalConstant = {
  value: 149_597_870_700,
  unit: 'm',
  source: 'IAU 2012 Resolution B2 (exact)',
};

/** Nominal solar gravitational parameter GM_sun (m^3/s^2). */
export const SOLAR_GM: PhysicalConstant = {
  value: 1.3271244e20,
  unit: 'm^3/s^2',
  source: 'IAU 2015 Resolution B3 (nominal solar mass parameter)',
};

/** Stefan–Boltzmann constant σ_SB (W/(m^2 K^4)). */
export const STEFAN_BOLTZMANN: PhysicalConstant = {
  value: 5.670374419e-8,
  unit: 'W/(m^2 K^4)',
  source: 'CODATA 2018 (exact in the 2019 SI)',
};

/** Earth gravitational parameter GM_earth including the atmosphere (m^3/s^2). */
export const EARTH_GM: PhysicalConstant = {
  value: 3.986004418e14,
  unit: 'm^3/s^2',
  source: 'WGS 84 (NGA.STND.0036), as adopted by IERS Conventions 2010',
};

/** Earth equatorial radius (m). */
export const EARTH_RADIUS: PhysicalConstant = {
  value: 6_378_137,
  unit: 'm',
  source: 'WGS 84 semi-major axis',
};

/** Every constant above by its exported name, for listing in the app. */
export const physicalConstants: Readonly<Record<string, PhysicalConstant>> = {
  SOLAR_IRRADIANCE_1AU,
  SPEED_OF_LIGHT,
  ASTRONOMICAL_UNIT,
  SOLAR_GM,
  STEFAN_BOLTZMANN,
  EARTH_GM,
  EARTH_RADIUS,
};
