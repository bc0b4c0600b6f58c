import { compileSheet } from '@/shared/engine/compile';
import { evaluatePair } from '@/shared/revisions/compare';
import type { Parameter, Sheet } from '@/shared/schemas/sheet';
import { squareSailTemplate } from '@/shared/templates';

/**
 * The side compiled second reuses the analysis of the rows that did not change (analyseSheet's `previous`):
 * it must evaluate exactly as the same sheet compiled afresh, whatever changed between the two.
 */

const template = squareSailTemplate();

function withRow(sheet: Sheet, key: string, change: (parameter: Parameter) => Parameter): Sheet {
  return { ...sheet, parameters: sheet.parameters.map((parameter) => (parameter.key === key ? change(parameter) : parameter)) };
}

function expectSameAsFresh(from: Sheet, to: Sheet): void {
  const fresh = compileSheet(to);
  const { compiled } = evaluatePair(from, to).to;
  expect(Array.from(compiled.base)).toEqual(Array.from(fresh.base));
  expect(compiled.errors).toEqual(fresh.errors);
  expect(compiled.analysis.rows.map((row) => row.allowance)).toEqual(fresh.analysis.rows.map((row) => row.allowance));
  expect(compiled.analysis.graph.order).toEqual(fresh.analysis.graph.order);
  // The reused rows carry the new sheet's own parameters (labels, notes, subsystems).
  expect(compiled.analysis.rows.map((row) => row.parameter)).toEqual(to.parameters);
}

const cases: [string, Sheet][] = [
  ['an input value', withRow(template, 'sail_side', (row) => ({ ...row, value: 45 }))],
  ['a formula that reads the same rows', withRow(template, 'sail_area', (row) => ({ ...row, formula: '=sail_side * sail_side * 1.5' }))],
  ['the unit of a row formulas read, to another dimension', withRow(template, 'sail_side', (row) => ({ ...row, unit: 's' }))],
  ['the unit of a row formulas read, same dimension', withRow(template, 'sail_side', (row) => ({ ...row, unit: 'km', value: 0.04 }))],
  [
    'the maturity of a mass row read with its allowance',
    withRow(template, 'bus_mass', (row) => ({ ...row, mass: { maturity: 'estimated', category: 'structure' } })),
  ],
  ['a row leaving the mass budget', withRow(template, 'payload_mass', ({ mass: _mass, ...row }) => row)],
  ['the allowance preset', { ...template, budget: { preset: 'esa-margin' } }],
  [
    'a label, note and subsystem only',
    withRow(template, 'film_thickness', (row) => ({ ...row, label: 'Film', note: 'n', subsystem: 'Optics' })),
  ],
  [
    'a new row that a formula was missing',
    {
      ...withRow(template, 'sail_area', (row) => ({ ...row, formula: '=sail_side^2 * area_factor' })),
      parameters: [
        ...withRow(template, 'sail_area', (row) => ({ ...row, formula: '=sail_side^2 * area_factor' })).parameters,
        { key: 'area_factor', label: 'Area factor', subsystem: 'Sail membrane', unit: '', value: 0.9 },
      ],
    },
  ],
  [
    'a new mass row, which the mass totals now sum',
    {
      ...template,
      parameters: [
        ...template.parameters,
        {
          key: 'harness_mass',
          label: 'Harness',
          subsystem: 'Spacecraft',
          unit: 'kg',
          value: 0.4,
          mass: { maturity: 'estimated', category: 'harness' },
        },
      ],
    },
  ],
  ['a removed row that formulas read', { ...template, parameters: template.parameters.filter((row) => row.key !== 'distance') }],
];

describe('evaluatePair reusing the analysis of unchanged rows', () => {
  it.each(cases)('evaluates as a fresh compile after a change of %s', (_change, to) => {
    expectSameAsFresh(template, to);
  });

  it('reuses the compiled functions when only inputs changed, and evaluates each side at its own inputs', () => {
    const pair = evaluatePair(
      template,
      withRow(template, 'sail_side', (row) => ({ ...row, value: 45 })),
    );
    expect(pair.to.compiled.evaluate).toBe(pair.from.compiled.evaluate);
    const area = template.parameters.findIndex((row) => row.key === 'sail_area');
    // 40^2 and 45^2.
    expect([pair.from.compiled.base[area], pair.to.compiled.base[area]]).toEqual([1600, 2025]);
  });

  it('generates code again when a formula changed', () => {
    const pair = evaluatePair(template, cases[1]?.[1] ?? template);
    expect(pair.to.compiled.evaluate).not.toBe(pair.from.compiled.evaluate);
  });

  it('evaluates as a fresh compile when the first side had the errors and the second fixes them', () => {
    const broken = withRow(template, 'sail_area', (row) => ({ ...row, formula: '=sail_side^2 * area_factor' }));
    expectSameAsFresh(broken, template);
    expect(evaluatePair(broken, template).from.compiled.errors.map((error) => error.key)).toContain('sail_area');
  });
});
