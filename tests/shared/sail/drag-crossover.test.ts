import { US_STANDARD_1976_TABLE, VALLADO_EXPONENTIAL_TABLE, type DensityTable } from '@/shared/sail/atmosphere-density';
import { circularOrbitSpeed, DRAG_CROSSOVER_CAVEAT, dragCrossoverAltitude, dragPressure } from '@/shared/sail/drag-crossover';

const scaled = (table: DensityTable, factor: number): DensityTable => ({
  ...table,
  id: `${table.id}-x${factor}`,
  points: table.points.map((p) => ({ altitude: p.altitude, density: p.density * factor })),
});

describe('circularOrbitSpeed and dragPressure', () => {
  it('give about 7.67 km/s at 400 km', () => {
    // common practice: a 400 km circular orbit moves at about 7.67 km/s
    expect(circularOrbitSpeed(400_000) / 1000).toBeCloseTo(7.67, 2);
  });

  it('is ½ ρ v^2 C_D', () => {
    const v = circularOrbitSpeed(500_000);
    // Vallado 2013, Table 8-4 (from memory): 6.967e-13 kg/m^3 at 500 km; C_D = 2.2 for a flat plate (common practice)
    expect(dragPressure(500_000) / (0.5 * 6.967e-13 * v * v * 2.2)).toBeCloseTo(1, 12);
    expect(dragPressure(500_000, VALLADO_EXPONENTIAL_TABLE, 1.1) / dragPressure(500_000)).toBeCloseTo(0.5, 12);
  });
});

describe('dragCrossoverAltitude', () => {
  it('lies in a plausible band for mean solar activity, with the caveat', () => {
    // common practice: a few hundred km below the high-activity rule of thumb of about 800 km
    const result = dragCrossoverAltitude();
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    expect(result.altitude).toBeGreaterThan(500_000);
    expect(result.altitude).toBeLessThan(900_000);
    expect(result.caveat).toBe(DRAG_CROSSOVER_CAVEAT);
    expect(result.caveat).toMatch(/solar cycle/);
    expect(result.caveat).toMatch(/co-rotation of the atmosphere with the Earth is ignored/);
    expect(result.tableSource).toMatch(/Vallado/);
    // At the crossover the drag pressure equals the reflector's 2 P(1 AU) = 9.08e-6 N/m^2 (McInnes 1999, ch. 2).
    expect(dragPressure(result.altitude)).toBeCloseTo(9.08e-6, 8);
  });

  it('moves up when the atmosphere is denser, as at high solar activity', () => {
    const mean = dragCrossoverAltitude();
    const dense = dragCrossoverAltitude({ table: scaled(VALLADO_EXPONENTIAL_TABLE, 10) });
    expect(mean.ok && dense.ok).toBe(true);
    if (!mean.ok || !dense.ok) return;
    // Density varying by an order of magnitude moves the crossover by about a hundred km or more.
    expect(dense.altitude - mean.altitude).toBeGreaterThan(100_000);
  });

  it('differs between the shipped tables', () => {
    const us = dragCrossoverAltitude({ table: US_STANDARD_1976_TABLE });
    expect(us.ok).toBe(true);
    if (!us.ok) return;
    expect(us.altitude).toBeGreaterThan(500_000);
    expect(us.altitude).toBeLessThan(900_000);
  });

  it('says why when the crossover is above the table', () => {
    const result = dragCrossoverAltitude({ table: scaled(VALLADO_EXPONENTIAL_TABLE, 1e4) });
    expect(result).toEqual({
      ok: false,
      reason: "drag exceeds radiation pressure up to the top of table 'vallado-exponential-x10000' (1000 km)",
      caveat: DRAG_CROSSOVER_CAVEAT,
    });
  });

  it('says why when the crossover is below the table', () => {
    const result = dragCrossoverAltitude({ table: scaled(US_STANDARD_1976_TABLE, 1e-9) });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.reason).toMatch(/radiation pressure exceeds drag already at the bottom of table .* \(86 km\)/);
  });

  it('names a bad drag coefficient or efficiency', () => {
    expect(() => dragCrossoverAltitude({ dragCoefficient: -1 })).toThrow(/dragCrossoverAltitude: dragCoefficient/);
    expect(() => dragCrossoverAltitude({ efficiency: 0 })).toThrow(/dragCrossoverAltitude: efficiency/);
  });
});
