import { findMaximum, solveForTarget, sweep, sweep2 } from '@/shared/engine/analyses';
import { evaluateSheet } from '@/shared/engine/evaluate';
import { squareSailTemplate } from '@/shared/templates';

const sheet = squareSailTemplate();

describe('sweep', () => {
  it('sweeps one input and reads outputs that agree with HyperFormula at each point', () => {
    const result = sweep(sheet, { key: 'sail_side', from: 20, to: '0.1 km', steps: 5 }, [
      'srp_force',
      'characteristic_acceleration',
      'sail_temperature',
    ]);
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    expect(Array.from(result.result.input.values)).toEqual([20, 40, 60, 80, 100]);
    expect(result.result.invalidPoints).toBe(0);
    result.result.input.values.forEach((side, point) => {
      const { values } = evaluateSheet(sheet, { sail_side: side });
      for (const output of result.result.outputs) {
        expect(output.values[point]).toBeCloseTo(values[output.key]?.value ?? Number.NaN, 10);
        expect(output.unit).toBe(values[output.key]?.unit);
      }
    });
  });

  it('marks points with no finite value', () => {
    const result = sweep(sheet, { key: 'sail_side', from: 0, to: 10, steps: 3 }, ['areal_density']);
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    expect(result.result.invalidPoints).toBe(1);
    expect(Number.isNaN(result.result.outputs[0]?.values[0])).toBe(true);
  });

  it('refuses unknown keys, formula rows as inputs and bad steps, naming the key', () => {
    const result = sweep(sheet, { key: 'sail_area', from: 1, to: 2, steps: 1 }, ['nothing']);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.errors.map((error) => [error.key, error.code])).toEqual([
      ['sail_area', 'invalid_argument'],
      ['sail_area', 'invalid_argument'],
      ['nothing', 'unknown_key'],
    ]);
  });

  it('refuses to sweep a protected constant', () => {
    expect(sweep(sheet, { key: 'speed_of_light', from: 1, to: 2, steps: 2 }, ['srp_force'])).toMatchObject({
      ok: false,
      errors: [{ key: 'speed_of_light', code: 'protected' }],
    });
  });

  it('sweeps two inputs over a grid', () => {
    const result = sweep2(sheet, { key: 'distance', from: 1, to: 2, steps: 2 }, { key: 'cone_angle', from: 0, to: 60, steps: 2 }, [
      'srp_force',
    ]);
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    const [force] = result.result.outputs;
    const at1 = force?.values[0] ?? Number.NaN;
    // Ideal flat sail, McInnes 1999 ch. 2: F ~ cos^2(alpha) / r^2.
    expect(force?.values[1]).toBeCloseTo(at1 / 4, 12);
    expect(force?.values[2]).toBeCloseTo(at1 / 4, 12);
    expect(force?.values[3]).toBeCloseTo(at1 / 16, 12);
  });
});

describe('solveForTarget', () => {
  it('finds the sail side that gives a characteristic acceleration, checked with HyperFormula', () => {
    const result = solveForTarget(sheet, {
      input: 'sail_side',
      from: 10,
      to: 300,
      output: 'characteristic_acceleration',
      target: '0.1 mm/s^2',
    });
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    expect(result.result.status).toBe('solved');
    if (result.result.status !== 'solved') return;
    expect(result.result.output.value).toBeCloseTo(0.1, 9);
    const check = evaluateSheet(sheet, { sail_side: result.result.input.value });
    expect(check.values.characteristic_acceleration?.value).toBeCloseTo(0.1, 9);
  });

  it('finds the closest distance at which the film reaches a temperature limit', () => {
    const result = solveForTarget(sheet, { input: 'distance', from: 0.05, to: 1, output: 'sail_temperature', target: '400 degC' });
    if (!result.ok || result.result.status !== 'solved') throw new Error(JSON.stringify(result));
    expect(result.result.output.value).toBeCloseTo(673.15, 6);
    // Radiative equilibrium (McInnes 1999 ch. 2): T ~ r^-1/2, so r = (263.22 / 673.15)^2 AU.
    expect(result.result.input.value).toBeCloseTo((263.2201280492291 / 673.15) ** 2, 6);
  });

  it('says clearly when the range holds no solution', () => {
    const result = solveForTarget(sheet, { input: 'sail_side', from: 10, to: 100, output: 'characteristic_acceleration', target: 5 });
    if (!result.ok) throw new Error(JSON.stringify(result.errors));
    expect(result.result.status).toBe('no_solution');
    if (result.result.status !== 'no_solution') return;
    expect(result.result.message).toMatch(
      /^no solution: for sail_side from 10 to 100 m, characteristic_acceleration stays between [0-9.e-]+ and [0-9.e-]+ mm\/s\^2 and never reaches 5 mm\/s\^2/,
    );
  });

  it('refuses a target of the wrong dimension', () => {
    const result = solveForTarget(sheet, { input: 'sail_side', from: 10, to: 100, output: 'srp_force', target: '3 kg' });
    expect(result).toMatchObject({ ok: false, errors: [{ key: 'srp_force', code: 'dimension_mismatch' }] });
  });
});

describe('findMaximum', () => {
  it('finds the cone angle of the largest force across the sun line of an ideal sail at 35.26 deg', () => {
    // A perfect specular reflector (r = s = 1) is the ideal sail: McInnes 1999 ch. 2, largest force across the
    // sun line at tan(alpha) = 1/sqrt(2), alpha = 35.26 deg.
    const ideal = {
      ...sheet,
      parameters: sheet.parameters.map((parameter) =>
        parameter.key === 'reflectivity' || parameter.key === 'specular_fraction'
          ? { key: parameter.key, label: parameter.label, subsystem: parameter.subsystem, unit: '', value: 1 }
          : parameter,
      ),
    };
    const result = findMaximum(ideal, { input: 'cone_angle', from: 0, to: '90 deg', output: 'srp_force_circumferential' });
    if (!result.ok || result.result.status !== 'found') throw new Error(JSON.stringify(result));
    expect(result.result.input.unit).toBe('deg');
    expect(result.result.input.value).toBeCloseTo((Math.atan(Math.SQRT1_2) * 180) / Math.PI, 6);
    const at = (angle: number) => evaluateSheet(ideal, { cone_angle: angle }).values.srp_force_circumferential?.value ?? Number.NaN;
    expect(result.result.output.value).toBeCloseTo(at(result.result.input.value), 15);
    expect(result.result.output.value).toBeGreaterThan(at(result.result.input.value + 0.01));
    expect(result.result.output.value).toBeGreaterThan(at(result.result.input.value - 0.01));
  });

  it('says so when the output has no finite value over the range, and names bad rows', () => {
    const none = findMaximum(sheet, { input: 'sail_side', from: 0, to: 0, output: 'areal_density', samples: 2 });
    expect(none).toMatchObject({ ok: true, result: { status: 'no_value' } });
    const bad = findMaximum(sheet, { input: 'sail_area', from: 1, to: 2, output: 'nothing' });
    expect(bad.ok ? [] : bad.errors.map((error) => [error.key, error.code])).toEqual([
      ['sail_area', 'invalid_argument'],
      ['nothing', 'unknown_key'],
    ]);
  });
});
