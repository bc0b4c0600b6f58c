import { EARTH_GM, EARTH_RADIUS } from '@/shared/sail/constants';
import { US_STANDARD_1976_TABLE, VALLADO_EXPONENTIAL_TABLE } from '@/shared/sail/atmosphere-density';
import { RADIATION_PRESSURE_CAVEAT, SOLAR_CYCLE_CAVEAT, orbitalDecayTime } from '@/shared/sail/orbital-decay';

const km = 1000;
const year = 365.25 * 86_400;

// Vallado 2013, Table 8-4 (from memory), typed here from the table for an independent route: base altitude (km),
// nominal density (kg/m^3), scale height (km), from 100 km up.
const valladoRows: readonly (readonly [number, number, number])[] = [
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
];

function valladoDensity(altitudeKm: number): number {
  let layer = valladoRows[0] ?? [0, 0, 1];
  for (const row of valladoRows) if (altitudeKm >= row[0]) layer = row;
  return layer[1] * Math.exp(-(altitudeKm - layer[0]) / layer[2]);
}

/**
 * The independent route: march da/dt = -rho sqrt(mu a) / B forward in time with classical Runge-Kutta until the orbit reaches the end altitude, the last step cut to land on it.
 */
function marchedLifetime(startKm: number, endKm: number, ballisticCoefficient: number, density: (km: number) => number): number {
  const mu = 3.986004418e14; // WGS 84
  const radius = 6_378_137; // WGS 84
  const rate = (a: number) => (-density((a - radius) / km) * Math.sqrt(mu * a)) / ballisticCoefficient;
  const end = radius + endKm * km;
  let a = radius + startKm * km;
  let t = 0;
  // A stalled march (no decay) would never end: give up after a million steps.
  for (let steps = 0; a > end && steps < 1_000_000; steps += 1) {
    const k1 = rate(a);
    // Steps of at most 6 hours and about 200 m of altitude, so the low, fast end of the decay is resolved too.
    const dt = Math.min(6 * 3600, 200 / -k1);
    const k2 = rate(a + (dt / 2) * k1);
    const k3 = rate(a + (dt / 2) * k2);
    const k4 = rate(a + dt * k3);
    const step = (dt / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
    if (a + step <= end) return t + (dt * (a - end)) / -step;
    a += step;
    t += dt;
  }
  return t;
}

describe('orbitalDecayTime', () => {
  it('gives 5.24 years for 100 kg, C_D 2.2 and 10 m² from 700 km through the exponential model', () => {
    // Worked value (Vallado 2013 Table 8-4 exponential atmosphere, circular decay to 100 km; independent check of
    // the reference notes): 5.24 years.
    const lifetime = orbitalDecayTime(700 * km, 100 * km, 100 / (2.2 * 10), VALLADO_EXPONENTIAL_TABLE) / year;
    expect(lifetime).toBeCloseTo(5.24, 2);
  });

  it.each([300, 450, 600, 700, 850, 1000])('agrees from %s km with a Runge-Kutta march over the published table', (startKm) => {
    // Independent route: RK4 in time over Vallado 2013 Table 8-4 typed above, against quadrature in altitude.
    const ballistic = 100 / (2.2 * 10);
    const marched = marchedLifetime(startKm, 100, ballistic, valladoDensity);
    const integrated = orbitalDecayTime(startKm * km, 100 * km, ballistic, VALLADO_EXPONENTIAL_TABLE);
    expect(integrated / marched).toBeCloseTo(1, 3);
  });

  it('agrees with a march over the U.S. Standard Atmosphere 1976, interpolated log-linearly in the test', () => {
    // NOAA-S/T 76-1562 (from memory), rows from 100 km typed here: altitude (km), density (kg/m^3).
    const rows: readonly (readonly [number, number])[] = [
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
    ];
    const density = (altitudeKm: number): number => {
      const above = rows.findIndex(([h]) => h > altitudeKm);
      const upperIndex = above < 0 ? rows.length - 1 : Math.max(1, above);
      const [h0, d0] = rows[upperIndex - 1] ?? [0, 1];
      const [h1, d1] = rows[upperIndex] ?? [1, 1];
      return Math.exp(Math.log(d0) + ((altitudeKm - h0) / (h1 - h0)) * (Math.log(d1) - Math.log(d0)));
    };
    const marched = marchedLifetime(700, 100, 100 / 22, density);
    expect(orbitalDecayTime(700 * km, 100 * km, 100 / 22, US_STANDARD_1976_TABLE) / marched).toBeCloseTo(1, 3);
  });

  it('is proportional to the ballistic coefficient', () => {
    // da/dt = -rho sqrt(mu a) / B (Vallado 2013, §8.6): the time scales with B.
    const one = orbitalDecayTime(600 * km, 100 * km, 10, VALLADO_EXPONENTIAL_TABLE);
    expect(orbitalDecayTime(600 * km, 100 * km, 25, VALLADO_EXPONENTIAL_TABLE) / one).toBeCloseTo(2.5, 12);
  });

  it('is zero when the orbit starts at or below the end altitude', () => {
    expect(orbitalDecayTime(100 * km, 100 * km, 10, VALLADO_EXPONENTIAL_TABLE)).toBe(0);
    expect(orbitalDecayTime(90 * km, 100 * km, 10, VALLADO_EXPONENTIAL_TABLE)).toBe(0);
  });

  it('uses the WGS 84 figures the references give', () => {
    expect(EARTH_GM.value).toBe(3.986004418e14);
    expect(EARTH_RADIUS.value).toBe(6_378_137);
  });

  it('names an altitude outside the table and a ballistic coefficient that is not positive', () => {
    expect(() => orbitalDecayTime(1200 * km, 100 * km, 10, VALLADO_EXPONENTIAL_TABLE)).toThrow(
      /orbitalDecayTime: startAltitude must be in \[0, 1000000\] m, got 1200000 m/,
    );
    expect(() => orbitalDecayTime(700 * km, 80 * km, 10, US_STANDARD_1976_TABLE)).toThrow(/orbitalDecayTime: endAltitude/);
    expect(() => orbitalDecayTime(700 * km, 100 * km, 0, VALLADO_EXPONENTIAL_TABLE)).toThrow(
      /orbitalDecayTime: ballisticCoefficient must be greater than 0/,
    );
  });

  it('comes with the solar-cycle and radiation-pressure caveats', () => {
    // Vallado 2013 / reference notes: a factor of 2-3 over the solar cycle; radiation pressure beats drag above about 600 km.
    expect(SOLAR_CYCLE_CAVEAT).toMatch(/factor of 2–3 over the 11-year solar cycle/);
    expect(RADIATION_PRESSURE_CAVEAT).toMatch(/Above about 600 km/);
    expect(RADIATION_PRESSURE_CAVEAT).toMatch(/eccentricity/);
  });
});
