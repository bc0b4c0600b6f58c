import {
  coneAngleSeries,
  filmThicknessTrade,
  roleSweep,
  sheetFilmLimitK,
  sizeToTarget,
  sizingChoices,
  temperatureVersusDistance,
} from '@/shared/analyses';
import { evaluateSheet } from '@/shared/engine/evaluate';
import type { Parameter, Sheet } from '@/shared/schemas/sheet';
import { squareSailTemplate } from '@/shared/templates';

const sheet = squareSailTemplate();
const idealConeDegrees = (Math.atan(Math.SQRT1_2) * 180) / Math.PI;

function replaceRows(source: Sheet, change: (parameter: Parameter) => Parameter): Sheet {
  return { ...source, parameters: source.parameters.map(change) };
}

/** The template with a perfect specular reflector (r = s = 1): the ideal flat sail of McInnes 1999 ch. 2. */
const idealSheet = replaceRows(sheet, (parameter) =>
  parameter.key === 'reflectivity' || parameter.key === 'specular_fraction'
    ? {
        key: parameter.key,
        label: parameter.label,
        subsystem: parameter.subsystem,
        unit: '',
        value: 1,
        ...(parameter.role === undefined ? {} : { role: parameter.role }),
      }
    : parameter,
);

describe('coneAngleSeries', () => {
  it('puts the largest force across the sun line of an ideal sail at 35.26 deg', () => {
    // McInnes 1999 ch. 2: tan(alpha) = 1/sqrt(2), alpha = 35.26 deg, for the ideal sail.
    const result = coneAngleSeries(idealSheet);
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    expect(result.result.best?.unit).toBe('deg');
    expect(result.result.best?.coneAngle).toBeCloseTo(35.26, 2);
    expect(result.result.best?.coneAngle).toBeCloseTo(idealConeDegrees, 6);
  });

  it('finds the optical sail close to the ideal angle, at a true maximum of the sheet row', () => {
    const result = coneAngleSeries(sheet);
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    const best = result.result.best;
    if (best === undefined) throw new Error('no best cone angle');
    // McInnes 1999 ch. 2 (optical model, coefficients after Wright 1992, from memory): within a degree of the ideal 35.26 deg.
    expect(Math.abs(best.coneAngle - idealConeDegrees)).toBeLessThan(1);
    const across = (angle: number) => evaluateSheet(sheet, { cone_angle: angle }).values.srp_force_circumferential?.value ?? Number.NaN;
    expect(best.force).toBeCloseTo(across(best.coneAngle), 15);
    expect(best.force).toBeGreaterThan(across(best.coneAngle + 0.05));
    expect(best.force).toBeGreaterThan(across(best.coneAngle - 0.05));
  });

  it('gives forces in their units and accelerations as force over predicted mass, from 0 to 90 deg', () => {
    const result = coneAngleSeries(sheet);
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    const { coneAngle, forces, accelerations } = result.result;
    expect(coneAngle.values[0]).toBe(0);
    expect(coneAngle.values[coneAngle.values.length - 1]).toBe(90);
    expect(forces.map((force) => force.role)).toEqual([
      'srp_force_normal',
      'srp_force_transverse',
      'srp_force_optical',
      'srp_force',
      'srp_force_circumferential',
    ]);
    const evaluation = evaluateSheet(sheet);
    const ideal = forces.find((force) => force.role === 'srp_force');
    expect(ideal?.values[0]).toBeCloseTo(evaluation.values.srp_force?.value ?? Number.NaN, 15);
    // McInnes 1999 ch. 2: F = 2 eta P A cos^2(alpha), a quarter at 60 deg.
    expect(ideal?.values[60]).toBeCloseTo((ideal?.values[0] ?? Number.NaN) / 4, 15);
    // Newton's second law: a = F / m, here in the characteristic acceleration row's mm/s^2.
    const acceleration = accelerations.find((line) => line.role === 'srp_force');
    expect(acceleration?.unit).toBe('mm/s^2');
    expect(acceleration?.values[0]).toBeCloseTo(
      ((evaluation.values.srp_force?.value ?? 0) / (evaluation.values.predicted_mass?.value ?? 1)) * 1000,
      12,
    );
    // The ideal sail's acceleration facing the sun at 1 AU is its characteristic acceleration (McInnes 1999 ch. 2).
    expect(acceleration?.values[0]).toBeCloseTo(evaluation.values.characteristic_acceleration?.value ?? Number.NaN, 12);
  });

  it('names the missing roles', () => {
    const bare: Sheet = {
      name: 'bare',
      parameters: [{ key: 'sail_side', label: 'side', subsystem: 's', unit: 'm', value: 20, role: 'sail_side' }],
    };
    const result = coneAngleSeries(bare);
    expect(result.ok ? [] : result.errors.map((error) => error.key)).toEqual(['cone_angle', 'srp_force_circumferential', 'predicted_mass']);
  });
});

describe('filmThicknessTrade', () => {
  it('gives the characteristic acceleration versus side for the sheet thickness and its neighbours', () => {
    const result = filmThicknessTrade(sheet);
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    expect(result.result.lines.map((line) => line.thicknessUm)).toEqual([1.25, 2.5, 5]);
    // The template's sizing range of the side, in its unit.
    expect(result.result.side.unit).toBe('m');
    expect(result.result.side.values[0]).toBe(5);
    expect(result.result.side.values[result.result.side.values.length - 1]).toBe(200);
    for (const line of result.result.lines) {
      const side = result.result.side.values[10] ?? Number.NaN;
      const back = evaluateSheet(sheet, { sail_side: side, film_thickness: `${line.thicknessUm} um` }).values.characteristic_acceleration;
      expect(line.acceleration.unit).toBe(back?.unit);
      expect(line.acceleration.values[10]).toBeCloseTo(back?.value ?? Number.NaN, 12);
    }
    // A thinner film is a lighter sail: at every side it accelerates more (McInnes 1999 ch. 2, a_c = 2 eta P / sigma).
    const [thin, own, thick] = result.result.lines;
    thin?.acceleration.values.forEach((value, index) => {
      expect(value).toBeGreaterThan(own?.acceleration.values[index] ?? Number.POSITIVE_INFINITY);
      expect(own?.acceleration.values[index]).toBeGreaterThan(thick?.acceleration.values[index] ?? Number.POSITIVE_INFINITY);
    });
  });

  it('takes thicknesses in um, whatever the unit of the sheet row', () => {
    const inNanometres = replaceRows(sheet, (parameter) =>
      parameter.key === 'film_thickness' ? { ...parameter, unit: 'nm', value: 2500 } : parameter,
    );
    const result = filmThicknessTrade(inNanometres, [2.5]);
    const reference = filmThicknessTrade(sheet, [2.5]);
    if (!result.ok || !reference.ok) throw new Error('trade failed');
    expect(result.result.lines[0]?.acceleration.values).toEqual(reference.result.lines[0]?.acceleration.values);
    expect(filmThicknessTrade(sheet, [0])).toMatchObject({ ok: false, errors: [{ key: 'film_thickness', code: 'invalid_value' }] });
  });
});

describe('temperatureVersusDistance', () => {
  it('reads the sheet temperature row from 0.1 to 2 AU', () => {
    const result = temperatureVersusDistance(sheet);
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    const { distance, temperature } = result.result;
    expect(distance.unit).toBe('AU');
    expect(distance.values[0]).toBeCloseTo(0.1, 12);
    expect(distance.values[38]).toBeCloseTo(2, 12);
    // McInnes 1999 ch. 2: about 263 K at 1 AU with the tabulated coefficients (from memory); T scales as r^(-1/2).
    expect(temperature.values[18]).toBeCloseTo(263, 0);
    expect(temperature.values[0]).toBeCloseTo((temperature.values[18] ?? 0) * Math.sqrt(10), 6);
  });

  it('finds the closest safe approach for the sheet film limit by solving for a target on the temperature row', () => {
    const result = temperatureVersusDistance(sheet);
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    // Polyimide film datasheet (from memory): long service up to about 250 degC. The template read the 400 degC
    // short-term maximum before, which is no limit for a sail in sunlight for years.
    expect(result.result.limit).toEqual({ kelvin: 523.15, from: 'sheet' });
    const closest = result.result.closestSafe;
    if (closest?.status !== 'found') throw new Error(JSON.stringify(closest));
    // Radiative equilibrium with the tabulated coefficients (McInnes 1999 ch. 2): (263.2 K / 523.15 K)^2 AU = 0.253 AU.
    expect(closest.distance).toBeCloseTo(0.253, 3);
    expect(closest.unit).toBe('AU');
    expect(closest.metres).toBeCloseTo(closest.distance * 149_597_870_700, 0);
    const back = evaluateSheet(sheet, { distance: closest.distance }).values.sail_temperature?.value;
    expect(back).toBeCloseTo(523.15, 6);
  });

  it('takes a given limit, and follows the cone angle', () => {
    const given = temperatureVersusDistance(sheet, { limitK: 500 });
    if (!given.ok || given.result.closestSafe?.status !== 'found') throw new Error('no closest approach');
    expect(given.result.limit).toEqual({ kelvin: 500, from: 'given' });
    expect(evaluateSheet(sheet, { distance: given.result.closestSafe.distance }).values.sail_temperature?.value).toBeCloseTo(500, 6);
    // McInnes 1999 ch. 2: T^4 is proportional to cos(alpha) / r^2, so at 60 deg the same T is reached sqrt(2) times closer.
    const at60 = temperatureVersusDistance(
      replaceRows(sheet, (parameter) => (parameter.key === 'cone_angle' ? { ...parameter, value: 60 } : parameter)),
      { limitK: 500 },
    );
    if (!at60.ok || at60.result.closestSafe?.status !== 'found') throw new Error('no approach at 60 deg');
    expect(at60.result.closestSafe.distance).toBeCloseTo(given.result.closestSafe.distance / Math.SQRT2, 6);
  });

  it('says why there is no safe approach for an impossible limit', () => {
    const result = temperatureVersusDistance(sheet, { limitK: 0 });
    expect(result.ok && result.result.closestSafe).toMatchObject({
      status: 'none',
      message: expect.stringContaining('above 0 K') as string,
    });
    const hot = temperatureVersusDistance(sheet, { limitK: 100_000 });
    expect(hot.ok && hot.result.closestSafe).toMatchObject({ status: 'none', message: expect.stringContaining('no solution') as string });
  });

  it('names a missing temperature role', () => {
    const bare: Sheet = { name: 'bare', parameters: [] };
    expect(temperatureVersusDistance(bare)).toMatchObject({ ok: false, errors: [{ key: 'distance' }, { key: 'sail_temperature' }] });
  });
});

describe('sizeToTarget and roleSweep', () => {
  it('solves for the side that gives a characteristic acceleration, by role and over the sizing range', () => {
    const result = sizeToTarget(sheet, { input: 'sail_side', output: 'characteristic_acceleration', target: '0.55 mm/s^2' });
    if (!result.ok || result.result.status !== 'solved') throw new Error(JSON.stringify(result));
    const back = evaluateSheet(sheet, { sail_side: result.result.input.value }).values.characteristic_acceleration?.value;
    expect(back).toBeCloseTo(0.55, 9);
    const out = sizeToTarget(sheet, { input: 'sail_side', output: 'characteristic_acceleration', target: 100 });
    expect(out).toMatchObject({
      ok: true,
      result: { status: 'no_solution', message: expect.stringContaining('sail_side from 5 to 200 m') as string },
    });
  });

  it('sweeps an input role and reads output roles in their units', () => {
    const result = roleSweep(sheet, { input: 'sail_side', outputs: ['sail_area', 'areal_density'], from: 10, to: 30, steps: 3 });
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    expect(result.result.input.values).toEqual([10, 20, 30]);
    // Geometry: the area of a square is its side squared.
    expect(result.result.outputs[0]?.values).toEqual([100, 400, 900]);
    expect(result.result.outputs[1]?.unit).toBe('g/m^2');
  });

  it('names missing roles and a role without a sizing range', () => {
    expect(roleSweep(sheet, { input: 'distance', outputs: ['sail_temperature'] })).toMatchObject({
      ok: false,
      errors: [{ key: 'distance', code: 'invalid_argument' }],
    });
    const bare: Sheet = { name: 'bare', parameters: [] };
    expect(sizeToTarget(bare, { input: 'sail_side', output: 'areal_density', target: 1 })).toMatchObject({
      ok: false,
      errors: [{ key: 'sail_side' }, { key: 'areal_density' }],
    });
  });

  it('offers the sheet rows the templates size, with their ranges', () => {
    expect(sizingChoices(sheet).map((choice) => [choice.key, choice.from, choice.to])).toEqual([
      ['sail_side', '5 m', '200 m'],
      ['film_thickness', '1 um', '12.5 um'],
    ]);
  });
});

describe('sheetFilmLimitK', () => {
  it('reads the film limit row in kelvin, whatever its unit', () => {
    // Polyimide film datasheet (from memory): long service up to about 250 degC (was the 400 degC short-term maximum).
    expect(sheetFilmLimitK(sheet)).toBeCloseTo(523.15, 10);
    const inCelsius = replaceRows(sheet, (parameter) =>
      parameter.key === 'film_temperature_limit'
        ? {
            key: parameter.key,
            label: parameter.label,
            subsystem: parameter.subsystem,
            unit: 'degC',
            value: 150,
            role: 'film_temperature_limit',
          }
        : parameter,
    );
    // SI: 150 degC = 423.15 K.
    expect(sheetFilmLimitK(inCelsius)).toBeCloseTo(423.15, 10);
    expect(sheetFilmLimitK({ name: 'bare', parameters: [] })).toBeUndefined();
  });
});
