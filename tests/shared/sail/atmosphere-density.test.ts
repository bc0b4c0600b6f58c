import {
  US_STANDARD_1976_TABLE,
  VALLADO_EXPONENTIAL_TABLE,
  atmosphericDensity,
  checkDensityTable,
  densityModels,
  type DensityTable,
} from '@/shared/sail/atmosphere-density';

const km = 1000;

describe('the exponential model (Vallado 2013, Table 8-4)', () => {
  // Vallado 2013, Table 8-4 (from memory), typed here from the table: base altitude (km), nominal density (kg/m^3),
  // scale height (km).
  const published: readonly (readonly [number, number, number])[] = [
    [0, 1.225, 7.249],
    [100, 5.297e-7, 5.877],
    [150, 2.07e-9, 22.523],
    [300, 2.418e-11, 53.628],
    [400, 3.725e-12, 58.515],
    [500, 6.967e-13, 63.822],
    [700, 3.614e-14, 88.667],
    [900, 5.245e-15, 181.05],
  ];

  it.each(published)('gives the nominal density at the %s km base', (base, density) => {
    expect(atmosphericDensity(base * km) / density).toBeCloseTo(1, 12);
  });

  it.each(published)('falls off with the layer scale height above the %s km base', (base, density, scaleHeight) => {
    // Vallado 2013, §8.6: rho = rho0 exp(-(h - h0) / H) within the layer.
    const h = base + 3;
    expect(atmosphericDensity(h * km) / (density * Math.exp(-3 / scaleHeight))).toBeCloseTo(1, 12);
  });

  it('is nearly continuous at the layer boundaries, as the table was fitted to be', () => {
    // Each layer's scale height carries its base density to within a few per cent of the next base.
    const points = VALLADO_EXPONENTIAL_TABLE.points;
    points.slice(1).forEach((upper, index) => {
      const lower = points[index];
      if (lower?.scaleHeight === undefined) throw new Error('a layer without a scale height');
      const reached = lower.density * Math.exp(-(upper.altitude - lower.altitude) / lower.scaleHeight);
      expect(Math.abs(Math.log(reached / upper.density))).toBeLessThan(0.05);
    });
  });
});

describe('the U.S. Standard Atmosphere 1976', () => {
  // NOAA-S/T 76-1562 (from memory), typed here from the published table: altitude (km), density (kg/m^3).
  const published: readonly (readonly [number, number])[] = [
    [86, 6.958e-6],
    [100, 5.604e-7],
    [150, 2.076e-9],
    [200, 2.541e-10],
    [300, 1.916e-11],
    [400, 2.803e-12],
    [500, 5.215e-13],
    [600, 1.137e-13],
    [800, 1.136e-14],
    [1000, 3.561e-15],
  ];

  it.each(published)('gives the published density at %s km', (altitude, density) => {
    expect(atmosphericDensity(altitude * km, US_STANDARD_1976_TABLE) / density).toBeCloseTo(1, 12);
  });

  it('interpolates log-linearly between the tabulated heights', () => {
    // NOAA-S/T 76-1562 (from memory): 2.803e-12 at 400 km, 1.184e-12 at 450 km; log-linear midway is their geometric mean.
    expect(atmosphericDensity(425 * km, US_STANDARD_1976_TABLE) / Math.sqrt(2.803e-12 * 1.184e-12)).toBeCloseTo(1, 12);
  });

  it('stays within about 15 % of the exponential model from 200 to 700 km, both being mean-activity models', () => {
    // Vallado 2013 Table 8-4 and USSA 1976 (from memory) differ mostly in the solar activity they assume.
    for (let altitude = 200; altitude <= 700; altitude += 50) {
      const ratio = atmosphericDensity(altitude * km, US_STANDARD_1976_TABLE) / atmosphericDensity(altitude * km);
      expect(Math.abs(Math.log(ratio))).toBeLessThan(Math.log(1.4));
    }
  });
});

describe('densityModels', () => {
  it('numbers the models as the drag-sail row chooses them', () => {
    expect(densityModels[1]).toBe(VALLADO_EXPONENTIAL_TABLE);
    expect(densityModels[2]).toBe(US_STANDARD_1976_TABLE);
    expect(densityModels[3]).toBeUndefined();
  });
});

describe('atmosphericDensity and checkDensityTable', () => {
  it('refuses an altitude outside the table', () => {
    expect(() => atmosphericDensity(1_200_000)).toThrow(/atmosphericDensity: altitude must be in \[0, 1000000\] m/);
    expect(() => atmosphericDensity(80_000, US_STANDARD_1976_TABLE)).toThrow(/altitude must be in \[86000/);
  });

  it('names an out-of-order row, a non-positive density and a non-positive scale height', () => {
    const table = (points: DensityTable['points']): DensityTable => ({ ...US_STANDARD_1976_TABLE, points });
    expect(() =>
      checkDensityTable(
        table([
          { altitude: 2, density: 1 },
          { altitude: 1, density: 1 },
        ]),
      ),
    ).toThrow(/density table 'us-standard-1976': points\[1\].altitude must be above/);
    expect(() =>
      checkDensityTable(
        table([
          { altitude: 1, density: 1 },
          { altitude: 2, density: 0 },
        ]),
      ),
    ).toThrow(/points\[1\].density must be greater than 0/);
    expect(() =>
      checkDensityTable(
        table([
          { altitude: 1, density: 1, scaleHeight: 0 },
          { altitude: 2, density: 1 },
        ]),
      ),
    ).toThrow(/points\[0\].scaleHeight must be greater than 0/);
  });
});
