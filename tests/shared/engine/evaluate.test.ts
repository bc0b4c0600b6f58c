import type { Parameter, Sheet } from '@/shared/schemas/sheet';
import { evaluateSheet } from '@/shared/engine/evaluate';

function sheetOf(...parameters: Parameter[]): Sheet {
  return { name: 'test', parameters };
}

function input(key: string, unit: string, value: number, extra: Partial<Parameter> = {}): Parameter {
  return { key, label: key, subsystem: 'test', unit, value, ...extra };
}

function formula(key: string, unit: string, text: string, extra: Partial<Parameter> = {}): Parameter {
  return { key, label: key, subsystem: 'test', unit, formula: text, ...extra };
}

const side = input('side', 'km', 0.8);

describe('evaluateSheet', () => {
  it('converts inputs to SI, evaluates in SI and converts results to the declared unit', () => {
    const result = evaluateSheet(
      sheetOf(
        side,
        formula('area', 'km^2', '=side^2'),
        formula('area_m', 'm^2', '=side^2'),
        input('thickness', 'um', 2.5),
        formula('volume', 'cm^3', '=area * thickness'),
      ),
    );
    expect(result.errors).toEqual([]);
    expect(result.values.side).toEqual({ value: 0.8, unit: 'km' });
    expect(result.values.area?.value).toBeCloseTo(0.64, 12);
    expect(result.values.area_m?.value).toBeCloseTo(640_000, 6);
    // 0.64 km^2 x 2.5 um = 1.6 m^3 = 1.6e6 cm^3
    expect(result.values.volume?.value).toBeCloseTo(1.6e6, 3);
  });

  it('accepts what engineers type for units: micro signs, superscripts, AU', () => {
    const result = evaluateSheet(
      sheetOf(input('t', 'µm', 3), formula('t_m', 'm', '=t'), input('a', 'm²', 2), input('d', 'AU', 1), formula('d_m', 'm', '=d')),
    );
    expect(result.errors).toEqual([]);
    expect(result.values.t_m?.value).toBeCloseTo(3e-6, 18);
    // IAU 2012 Resolution B2: 1 AU = 149 597 870 700 m exactly.
    expect(result.values.d_m?.value).toBe(149_597_870_700);
  });

  it('reports a dimension mismatch naming the parameter, the expected and the found dimension', () => {
    const result = evaluateSheet(sheetOf(side, formula('area', 'kg', '=side^2')));
    expect(result.errors).toEqual([
      { key: 'area', code: 'dimension_mismatch', message: 'area: unit "kg" expects kg but the formula gives m^2' },
    ]);
  });

  it('reports adding quantities of different dimensions', () => {
    const result = evaluateSheet(sheetOf(side, input('mass', 'kg', 1), formula('sum', 'm', '=side + mass')));
    expect(result.errors).toEqual([{ key: 'sum', code: 'dimension_mismatch', message: 'sum: cannot add m and kg' }]);
  });

  it('reports an unknown key', () => {
    const result = evaluateSheet(sheetOf(side, formula('area', 'm^2', '=side * sied')));
    expect(result.errors).toEqual([{ key: 'area', code: 'unknown_key', message: 'area: unknown key "sied" in the formula' }]);
  });

  it('reports a cycle naming the keys on it, and the rows that depend on it', () => {
    const result = evaluateSheet(
      sheetOf(formula('a', 'm', '=b'), formula('b', 'm', '=x * 2'), formula('x', 'm', '=a'), formula('d', 'm', '=x'), side),
    );
    expect(result.errors.map((error) => [error.key, error.code])).toEqual([
      ['a', 'cycle'],
      ['b', 'cycle'],
      ['x', 'cycle'],
      ['d', 'dependency_error'],
    ]);
    expect(result.errors[0]?.message).toBe('a: is on a cycle of formulas: a -> b -> x -> a');
    expect(result.values.side?.value).toBe(0.8);
  });

  it('reports a row that refers to itself as a cycle', () => {
    expect(evaluateSheet(sheetOf(formula('a', 'm', '=a + 1 * a'))).errors).toEqual([
      { key: 'a', code: 'cycle', message: 'a: is on a cycle of formulas: a -> a' },
    ]);
  });

  it('reports an unknown unit', () => {
    const result = evaluateSheet(sheetOf(input('length', 'furlongs', 3)));
    expect(result.errors).toHaveLength(1);
    expect(result.errors[0]).toMatchObject({ key: 'length', code: 'unknown_unit' });
    expect(result.errors[0]?.message).toMatch(/^length: unknown unit "furlongs"/);
  });

  it('reports a syntax error with the place', () => {
    const result = evaluateSheet(sheetOf(side, formula('area', 'm^2', '=side * * side')));
    expect(result.errors).toEqual([
      {
        key: 'area',
        code: 'syntax_error',
        message:
          'area: syntax error in "=side * * side": expected a number, a parameter key, a function or "(" but found "*" at character 9',
      },
    ]);
    expect(evaluateSheet(sheetOf(side, formula('b', 'm', '=(side'))).errors[0]?.code).toBe('syntax_error');
    expect(evaluateSheet(sheetOf(side, formula('b', 'm', 'side'))).errors[0]?.code).toBe('syntax_error');
  });

  it('reports a division by zero, and its dependents', () => {
    const result = evaluateSheet(
      sheetOf(side, input('zero', 'm', 0), formula('ratio', '', '=side / zero'), formula('twice', '', '=2 * ratio')),
    );
    expect(result.errors).toEqual([
      { key: 'ratio', code: 'division_by_zero', message: 'ratio: division by zero' },
      { key: 'twice', code: 'dependency_error', message: 'twice: depends on ratio, which has an error' },
    ]);
  });

  it('reports a value that is not a finite number', () => {
    const result = evaluateSheet(sheetOf(input('x', '', -4), formula('root', '', '=SQRT(x)')));
    expect(result.errors).toEqual([expect.objectContaining({ key: 'root', code: 'invalid_value' })]);
  });

  it('reports unknown functions and wrong argument counts', () => {
    const result = evaluateSheet(sheetOf(side, formula('a', 'm', '=VLOOKUP(side)'), formula('b', 'm', '=SQRT(side, side)')));
    expect(result.errors.map((error) => [error.key, error.code])).toEqual([
      ['a', 'unknown_function'],
      ['b', 'wrong_argument_count'],
    ]);
  });

  it('keeps evaluating the other rows when one row is bad', () => {
    const result = evaluateSheet(
      sheetOf(
        side,
        formula('bad', 'kg', '=side'),
        formula('area', 'm^2', '=side^2'),
        input('weird', 'parsecs per fortnight', 1),
        formula('perimeter', 'm', '=4 * side'),
      ),
    );
    expect(result.errors.map((error) => error.key)).toEqual(['bad', 'weird']);
    expect(result.values.area?.value).toBeCloseTo(640_000, 6);
    expect(result.values.perimeter?.value).toBeCloseTo(3200, 9);
    expect(result.values.bad).toBeUndefined();
  });

  it('checks trigonometry, powers and comparisons dimensionally', () => {
    const rows = [
      input('angle', 'deg', 60),
      input('l', 'm', 2),
      formula('cosine', '', '=COS(angle)'),
      formula('root', 'm^0.5', '=SQRT(l)'),
      formula('quartic', 'm', '=(l^4)^(1/4)'),
    ];
    const result = evaluateSheet(sheetOf(...rows));
    expect(result.errors).toEqual([]);
    expect(result.values.cosine?.value).toBeCloseTo(0.5, 12);
    expect(result.values.quartic?.value).toBeCloseTo(2, 12);
    const bad = evaluateSheet(
      sheetOf(input('l', 'm', 2), formula('p', 'm', '=l^l'), formula('s', '', '=SIN(l)'), formula('q', '', '=IF(l > 1, 1, 0)')),
    );
    expect(bad.errors.map((error) => [error.key, error.code])).toEqual([
      ['p', 'dimension_mismatch'],
      ['s', 'dimension_mismatch'],
      ['q', 'dimension_mismatch'],
    ]);
  });

  it('takes a value from the materials library', () => {
    const result = evaluateSheet(
      sheetOf({ key: 'density', label: 'd', subsystem: 's', unit: 'g/cm^3', material: { id: 'polyimide', property: 'density' } }),
    );
    // Polyimide film datasheet (from memory), as the materials library gives it: 1420 kg/m^3.
    expect(result.values.density?.value).toBeCloseTo(1.42, 12);
    const missing = evaluateSheet(
      sheetOf({ key: 'density', label: 'd', subsystem: 's', unit: 'kg/m^3', material: { id: 'unobtainium', property: 'density' } }),
    );
    expect(missing.errors).toEqual([expect.objectContaining({ key: 'density', code: 'unknown_material' })]);
  });

  it('applies overrides in the row unit or with a unit of their own', () => {
    const sheet = sheetOf(side, formula('area', 'm^2', '=side^2'));
    expect(evaluateSheet(sheet, { side: 1 }).values.area?.value).toBeCloseTo(1e6, 6);
    expect(evaluateSheet(sheet, { side: '60 m' }).values.area?.value).toBeCloseTo(3600, 9);
    expect(evaluateSheet(sheet, { side: '60 m' }).values.side).toEqual({ value: 0.06, unit: 'km' });
    expect(evaluateSheet(sheet, { side: '60 kg' }).errors).toEqual([
      { key: 'side', code: 'dimension_mismatch', message: 'side: unit "km" expects m but "60 kg" is kg' },
    ]);
    expect(evaluateSheet(sheet, { nope: 1 }).errors).toEqual([
      { key: 'nope', code: 'unknown_key', message: 'nope: no row has this key, so it cannot be set' },
    ]);
  });

  it('refuses to override a protected row', () => {
    const sheet = sheetOf(input('speed_of_light', 'm/s', 299_792_458, { protected: true }));
    expect(evaluateSheet(sheet, { speed_of_light: 3e8 }).errors).toEqual([
      { key: 'speed_of_light', code: 'protected', message: 'speed_of_light: the row is protected and cannot be set' },
    ]);
  });

  it('reports PREDICTED on a row that is not a mass row, and a missing preset', () => {
    const mass = input('bus', 'kg', 10, { mass: { maturity: 'layout', category: 'structure' } });
    const noPreset = evaluateSheet(sheetOf(mass, formula('p', 'kg', '=PREDICTED(bus)')));
    expect(noPreset.errors).toEqual([expect.objectContaining({ key: 'p', code: 'budget_error' })]);
    const withPreset = evaluateSheet({
      ...sheetOf(mass, input('plain', 'kg', 1), formula('p', 'kg', '=PREDICTED(bus)'), formula('q', 'kg', '=PREDICTED(plain)')),
      budget: { preset: 'esa-margin' },
    });
    expect(withPreset.errors).toEqual([
      expect.objectContaining({ key: 'p', code: 'budget_error' }),
      expect.objectContaining({ key: 'q', code: 'invalid_argument' }),
    ]);
    // ESA SRE-PA/2011.097: 10 % on modified equipment.
    const esa = evaluateSheet({
      ...sheetOf({ ...mass, mass: { maturity: 'modified', category: 'structure' } }, formula('p', 'kg', '=PREDICTED(bus)')),
      budget: { preset: 'esa-margin' },
    });
    expect(esa.values.p?.value).toBeCloseTo(11, 12);
  });

  it('reports duplicate keys', () => {
    const result = evaluateSheet(sheetOf(side, input('side', 'm', 3)));
    expect(result.errors).toEqual([expect.objectContaining({ key: 'side', code: 'duplicate_key' })]);
    expect(result.values.side?.value).toBe(0.8);
  });
});
