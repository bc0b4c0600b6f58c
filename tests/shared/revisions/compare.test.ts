import { compareSheets, evaluatePair, whatMoved } from '@/shared/revisions/compare';
import type { OutputChange } from '@/shared/schemas/compare';
import type { Parameter, Sheet } from '@/shared/schemas/sheet';
import { squareSailTemplate } from '@/shared/templates';

// Every expected number in this file is worked out by hand from the sheets written here.

const template = squareSailTemplate();

/** The sheet with the rows of these keys replaced (a function of the old row), rows added at the end and rows removed. */
function edited(
  sheet: Sheet,
  changes: Record<string, (parameter: Parameter) => Parameter>,
  extra: { add?: Parameter[]; remove?: string[] } = {},
): Sheet {
  const parameters = sheet.parameters
    .filter((parameter) => !(extra.remove ?? []).includes(parameter.key))
    .map((parameter) => changes[parameter.key]?.(parameter) ?? parameter);
  return { ...sheet, parameters: [...parameters, ...(extra.add ?? [])] };
}

function input(key: string, value: number, unit = 'm'): Parameter {
  return { key, label: key, subsystem: 'Test', unit, value };
}

function formula(key: string, text: string, unit = 'm'): Parameter {
  return { key, label: key, subsystem: 'Test', unit, formula: text };
}

function outputOf(outputs: readonly OutputChange[], key: string): OutputChange {
  const found = outputs.find((output) => output.key === key);
  if (found === undefined) throw new Error(`no output ${key}`);
  return found;
}

function moved(from: Sheet, to: Sheet, key: string) {
  const result = whatMoved(evaluatePair(from, to), key);
  if (!result.ok) throw new Error(JSON.stringify(result.problem));
  return result.moved;
}

const sailSide45 = edited(template, { sail_side: (row) => ({ ...row, value: 45 }) });

describe('compareSheets on the square-sail template, sail side 40 m -> 45 m', () => {
  const comparison = compareSheets(evaluatePair(template, sailSide45));

  it('lists the one changed row with its old and new value in its unit', () => {
    expect(comparison.rows).toEqual({
      added: [],
      removed: [],
      changed: [
        {
          key: 'sail_side',
          label: expect.any(String),
          subsystem: 'Sail membrane',
          changes: [{ field: 'value', from: 40, fromUnit: 'm', to: 45, toUnit: 'm' }],
        },
      ],
    });
    expect(comparison.header).toEqual([]);
  });

  it('gives sail_area 1600 m^2 -> 2025 m^2: +425 m^2, +26.5625 %', () => {
    // 40^2 = 1600, 45^2 = 2025, 2025 - 1600 = 425, 425 / 1600 = 0.265625.
    expect(outputOf(comparison.outputs, 'sail_area')).toEqual({
      key: 'sail_area',
      label: expect.any(String),
      subsystem: 'Sail membrane',
      unit: 'm^2',
      from: 1600,
      fromUnit: 'm^2',
      to: 2025,
      change: 425,
      changePercent: 26.5625,
      dimensionChanged: false,
    });
  });

  it('gives boom_length +12.5 % (it is proportional to the side) and lists unchanged outputs with no change', () => {
    // boom_length = side * sqrt(2) / 2: 28.2843 m -> 31.8198 m, +3.5355 m, 45 / 40 - 1 = 12.5 %.
    const boom = outputOf(comparison.outputs, 'boom_length');
    expect(boom.from).toBeCloseTo(28.284271, 5);
    expect(boom.to).toBeCloseTo(31.819805, 5);
    expect(boom.change).toBeCloseTo(3.535534, 5);
    expect(boom.changePercent).toBeCloseTo(12.5, 10);
    expect(outputOf(comparison.outputs, 'solar_pressure_1au')).toEqual(expect.objectContaining({ change: 0, changePercent: 0 }));
  });

  it('lists every formula row as an output and no input', () => {
    const formulas = template.parameters.filter((parameter) => parameter.formula !== undefined).map((parameter) => parameter.key);
    expect(comparison.outputs.map((output) => output.key)).toEqual(formulas);
  });

  it("puts all of sail_area's change on sail_side", () => {
    expect(moved(template, sailSide45, 'sail_area')).toEqual({
      key: 'sail_area',
      unit: 'm^2',
      from: 1600,
      to: 2025,
      change: 425,
      inputs: [{ key: 'sail_side', label: expect.any(String), subsystem: 'Sail membrane', unit: 'm', from: 40, to: 45, share: 425 }],
      otherChanges: [],
      remainder: 0,
    });
  });
});

describe('compareSheets rows', () => {
  it('lists rows added, removed and changed, naming each changed field with old and new', () => {
    const from: Sheet = {
      name: 'Before',
      parameters: [
        input('a', 2),
        { ...formula('b', '=a * 2'), mass: { maturity: 'estimated', category: 'boom' }, note: 'old note' },
        input('gone', 1),
        { key: 'density', label: 'Density', subsystem: 'Test', unit: 'kg/m^3', material: { id: 'polyimide', property: 'density' } },
      ],
    };
    const to: Sheet = {
      name: 'After',
      parameters: [
        { ...input('a', 0.004, 'km'), label: 'A in km' },
        { ...formula('b', '=a * 3'), mass: { maturity: 'layout', category: 'boom' }, subsystem: 'Other' },
        { key: 'density', label: 'Density', subsystem: 'Test', unit: 'kg/m^3', value: 1400 },
        input('new_row', 7),
      ],
    };
    const comparison = compareSheets(evaluatePair(from, to));
    expect(comparison.rows).toEqual({
      added: [input('new_row', 7)],
      removed: [input('gone', 1)],
      changed: [
        {
          key: 'a',
          label: 'A in km',
          subsystem: 'Test',
          changes: [
            { field: 'value', from: 2, fromUnit: 'm', to: 0.004, toUnit: 'km' },
            { field: 'unit', from: 'm', to: 'km' },
            { field: 'label', from: 'a', to: 'A in km' },
          ],
        },
        {
          key: 'b',
          label: 'b',
          subsystem: 'Other',
          changes: [
            { field: 'formula', from: '=a * 2', to: '=a * 3' },
            { field: 'maturity', from: 'estimated', to: 'layout' },
            { field: 'subsystem', from: 'Test', to: 'Other' },
            { field: 'note', from: 'old note', to: null },
          ],
        },
        {
          key: 'density',
          label: 'Density',
          subsystem: 'Test',
          changes: [
            { field: 'value', from: null, fromUnit: 'kg/m^3', to: 1400, toUnit: 'kg/m^3' },
            { field: 'material', from: 'polyimide density', to: null },
          ],
        },
      ],
    });
    expect(comparison.header).toEqual([{ field: 'name', from: 'Before', to: 'After' }]);
  });
});

describe('outputs across unit changes', () => {
  it("converts the old value to the row's new unit when the dimension is the same", () => {
    const to = edited(sailSide45, { sail_area: (row) => ({ ...row, unit: 'km^2' }) });
    // 1600 m^2 = 0.0016 km^2, 2025 m^2 = 0.002025 km^2: +0.000425 km^2, still +26.5625 %.
    const area = outputOf(compareSheets(evaluatePair(template, to)).outputs, 'sail_area');
    expect(area).toEqual(expect.objectContaining({ unit: 'km^2', fromUnit: 'km^2', dimensionChanged: false }));
    expect(area.from).toBeCloseTo(0.0016, 12);
    expect(area.to).toBeCloseTo(0.002025, 12);
    expect(area.change).toBeCloseTo(0.000425, 12);
    expect(area.changePercent).toBeCloseTo(26.5625, 9);
  });

  it('reports a change of dimension without converting', () => {
    const from: Sheet = { name: 'S', parameters: [input('side', 3), formula('size', '=side')] };
    const to: Sheet = { name: 'S', parameters: [input('side', 3), formula('size', '=side^2', 'm^2')] };
    expect(outputOf(compareSheets(evaluatePair(from, to)).outputs, 'size')).toEqual(
      expect.objectContaining({ unit: 'm^2', from: 3, fromUnit: 'm', to: 9, change: null, changePercent: null, dimensionChanged: true }),
    );
  });

  it('gives no relative change when the old value is 0, and says why a side has no value', () => {
    const from: Sheet = {
      name: 'S',
      parameters: [input('a', 2), input('b', 2), formula('gap', '=a - b'), formula('ratio', '=a / (a - b)', '')],
    };
    const to = edited(from, { a: (row) => ({ ...row, value: 5 }) });
    const { outputs } = compareSheets(evaluatePair(from, to));
    // gap: 2 - 2 = 0 -> 5 - 2 = 3.
    expect(outputOf(outputs, 'gap')).toEqual(expect.objectContaining({ from: 0, to: 3, change: 3, changePercent: null }));
    // ratio: 2 / 0 has no value; 5 / 3 does.
    const ratio = outputOf(outputs, 'ratio');
    expect(ratio).toEqual(
      expect.objectContaining({ from: null, change: null, changePercent: null, problem: expect.stringContaining('"from"') }),
    );
    expect(ratio.to).toBeCloseTo(5 / 3, 12);
  });
});

describe('whatMoved', () => {
  const linear: Sheet = { name: 'Linear', parameters: [input('a', 1), input('b', 2), input('c', 4), formula('total', '=a + b + c')] };

  it('shares a linear output exactly among its changed inputs, largest first, with no remainder', () => {
    const to = edited(linear, { a: (row) => ({ ...row, value: 3 }), b: (row) => ({ ...row, value: 5 }) });
    // total: 1 + 2 + 4 = 7 -> 3 + 5 + 4 = 12, change 5; a moved it by 3 - 1 = 2, b by 5 - 2 = 3.
    const result = moved(linear, to, 'total');
    expect(result).toEqual(expect.objectContaining({ from: 7, to: 12, change: 5, otherChanges: [], remainder: 0 }));
    expect(result.inputs.map(({ key, from, to: now, share }) => [key, from, now, share])).toEqual([
      ['b', 2, 5, 3],
      ['a', 1, 3, 2],
    ]);
    expect(result.inputs.reduce((sum, share) => sum + share.share, 0)).toBe(result.change);
  });

  it('leaves the interaction of a product in the remainder, so shares and remainder add up to the change', () => {
    const from: Sheet = { name: 'Product', parameters: [input('a', 2, ''), input('b', 5, ''), formula('p', '=a * b', '')] };
    const to = edited(from, { a: (row) => ({ ...row, value: 3 }), b: (row) => ({ ...row, value: 7 }) });
    // p: 2 * 5 = 10 -> 3 * 7 = 21, change 11. Reverting a: 21 - 2 * 7 = 7; reverting b: 21 - 3 * 5 = 6.
    // Remainder 11 - 7 - 6 = -2, which is -(3 - 2) * (7 - 5).
    const result = moved(from, to, 'p');
    expect(result.inputs.map((share) => [share.key, share.share])).toEqual([
      ['a', 7],
      ['b', 6],
    ]);
    expect(result.remainder).toBe(-2);
    expect(result.inputs.reduce((sum, share) => sum + share.share, 0) + result.remainder).toBe(result.change);
  });

  it('lists only the changed inputs upstream of the output, through intermediate rows', () => {
    const from: Sheet = {
      name: 'Chain',
      parameters: [
        input('a', 1, ''),
        input('b', 1, ''),
        formula('double_a', '=a * 2', ''),
        formula('out', '=double_a + 10', ''),
        formula('other', '=b', ''),
      ],
    };
    const to = edited(from, { a: (row) => ({ ...row, value: 4 }), b: (row) => ({ ...row, value: 9 }) });
    // out: 1 * 2 + 10 = 12 -> 4 * 2 + 10 = 18; b is not upstream of out.
    const result = moved(from, to, 'out');
    expect(result.inputs.map((share) => [share.key, share.share])).toEqual([['a', 6]]);
    expect(result.remainder).toBe(0);
  });

  it('reverts an input whose unit changed to its old value in the new unit', () => {
    const to = edited(linear, { a: () => input('a', 0.003, 'km') });
    // a: 1 m = 0.001 km -> 0.003 km = 3 m; total 7 m -> 9 m.
    const result = moved(linear, to, 'total');
    expect(result.change).toBeCloseTo(2, 12);
    expect(result.inputs).toHaveLength(1);
    expect(result.inputs[0]).toEqual(expect.objectContaining({ key: 'a', unit: 'km', to: 0.003 }));
    expect(result.inputs[0]?.from).toBeCloseTo(0.001, 15);
    expect(result.inputs[0]?.share).toBeCloseTo(2, 12);
  });

  it('names formula changes and new rows upstream as other changes, whose effect is in the remainder', () => {
    const from: Sheet = { name: 'S', parameters: [input('a', 1, ''), formula('scaled', '=a * 2', ''), formula('out', '=scaled + 1', '')] };
    const to: Sheet = {
      name: 'S',
      parameters: [input('a', 2, ''), input('extra', 5, ''), formula('scaled', '=a * 3', ''), formula('out', '=scaled + extra', '')],
    };
    // out: 1 * 2 + 1 = 3 -> 2 * 3 + 5 = 11, change 8. Reverting a: 11 - (1 * 3 + 5) = 3. Remainder 8 - 3 = 5.
    const result = moved(from, to, 'out');
    expect(result.inputs.map((share) => [share.key, share.share])).toEqual([['a', 3]]);
    expect(result.otherChanges).toEqual([
      { key: 'extra', reason: 'new in "to"' },
      { key: 'scaled', reason: 'its formula changed' },
      { key: 'out', reason: 'its formula changed' },
    ]);
    expect(result.remainder).toBe(5);
  });

  it('names a changed growth allowance of a row the output reads with its allowance', () => {
    const to = edited(sailSide45, { bus_mass: (row) => ({ ...row, mass: { maturity: 'estimated', category: 'structure' } }) });
    const reasons = moved(template, to, 'predicted_mass').otherChanges;
    expect(reasons).toEqual([{ key: 'bus_mass', reason: expect.stringContaining('growth allowance') }]);
    // total_mass sums current best estimates only: the allowance does not move it.
    expect(moved(template, to, 'total_mass').otherChanges).toEqual([]);
  });

  it('refuses an output in neither sheet, and one that is new', () => {
    const to = { ...linear, parameters: [...linear.parameters, formula('twice', '=total * 2')] };
    const pair = evaluatePair(linear, to);
    expect(whatMoved(pair, 'nothing')).toEqual({ ok: false, problem: { kind: 'unknown_output' } });
    expect(whatMoved(pair, 'twice')).toEqual({ ok: false, problem: { kind: 'not_comparable', message: expect.stringContaining('new') } });
  });
});
