import { BELOW_REQUIRED_MARGIN, headlineFigures, roleValuesSI, sheetMassBudget, siValues } from '@/shared/analyses';
import { evaluateSheet } from '@/shared/engine/evaluate';
import type { Sheet } from '@/shared/schemas/sheet';
import { squareSailTemplate } from '@/shared/templates';

const sheet = squareSailTemplate();

function rename(source: Sheet, from: string, to: string): Sheet {
  return {
    ...source,
    parameters: source.parameters.map((parameter) => {
      const renamed = parameter.key === from ? { ...parameter, key: to } : parameter;
      return renamed.formula === undefined
        ? renamed
        : { ...renamed, formula: renamed.formula.replace(new RegExp(`\\b${from}\\b`, 'g'), to) };
    }),
  };
}

describe('siValues', () => {
  it('gives every evaluated row in SI, so a percent row is a fraction and mm/s^2 is m/s^2', () => {
    const evaluation = evaluateSheet(sheet);
    const si = siValues(sheet, evaluation);
    const percent = evaluation.values.system_margin_percent?.value ?? Number.NaN;
    // SI: 1 percent = 0.01.
    expect(si.system_margin_percent).toBeCloseTo(percent / 100, 15);
    expect(si.system_margin_percent).toBeLessThan(1);
    expect(si.characteristic_acceleration).toBeCloseTo((evaluation.values.characteristic_acceleration?.value ?? Number.NaN) / 1000, 15);
    // SI: 1 AU = 149 597 870 700 m (IAU 2012 Resolution B2).
    expect(si.distance).toBe(149_597_870_700);
    expect(Object.keys(si).sort()).toEqual(Object.keys(evaluation.values).sort());
  });

  it('reads a percent row by role as a fraction too', () => {
    const percentSheet: Sheet = {
      ...sheet,
      parameters: sheet.parameters.map((parameter) =>
        parameter.key === 'sail_efficiency' ? { ...parameter, unit: 'percent', value: 90 } : parameter,
      ),
    };
    const evaluation = evaluateSheet(percentSheet);
    expect(evaluation.errors).toEqual([]);
    expect(roleValuesSI(percentSheet, evaluation, ['sail_efficiency'])).toEqual({ ok: true, result: { sail_efficiency: 0.9 } });
    // The figures do not change with the unit the efficiency is shown in.
    expect(evaluation.values.characteristic_acceleration?.value).toBeCloseTo(
      evaluateSheet(sheet).values.characteristic_acceleration?.value ?? 0,
      12,
    );
  });

  it('names the missing role or the row in error', () => {
    const evaluation = evaluateSheet(sheet, { sail_side: 0 });
    const read = roleValuesSI(sheet, evaluation, ['areal_density', 'sail_area']);
    expect(read.ok ? [] : read.errors.map((error) => error.key)).toEqual(['areal_density']);
    const noRole: Sheet = { name: 'bare', parameters: [{ key: 'x', label: 'x', subsystem: 's', unit: '', value: 1 }] };
    const missing = roleValuesSI(noRole, evaluateSheet(noRole), ['sail_efficiency']);
    expect(missing).toMatchObject({ ok: false, errors: [{ key: 'sail_efficiency', code: 'unknown_key' }] });
  });
});

describe('headlineFigures', () => {
  it('gives the headline in the contract order, each from its role row, in the row unit', () => {
    const evaluation = evaluateSheet(sheet);
    const figures = headlineFigures(sheet, evaluation);
    expect(figures.map((figure) => figure.role)).toEqual([
      'areal_density',
      'characteristic_acceleration',
      'lightness_number',
      'srp_force',
      'sail_temperature',
      'predicted_mass',
      'system_margin',
    ]);
    for (const figure of figures) {
      expect(figure.problem).toBeUndefined();
      expect({ value: figure.value, unit: figure.unit }).toEqual(evaluation.values[figure.key]);
    }
    // McInnes 1999 ch. 2: about 263 K at 1 AU facing the sun with the tabulated coefficients (from memory).
    expect(figures.find((figure) => figure.role === 'sail_temperature')?.value).toBeCloseTo(263, 0);
    expect(figures.find((figure) => figure.role === 'system_margin')?.flag).toBeUndefined();
  });

  it('follows a renamed row by its role', () => {
    const renamed = rename(sheet, 'areal_density', 'sail_loading');
    const figure = headlineFigures(renamed, evaluateSheet(renamed))[0];
    expect(figure).toMatchObject({ role: 'areal_density', key: 'sail_loading', unit: 'g/m^2' });
    expect(figure?.value).toBeCloseTo(evaluateSheet(sheet).values.areal_density?.value ?? 0, 12);
  });

  it('flags the margin from the budget roll-up when it is below the required one', () => {
    // AIAA S-120A-2015: margin = allocation - predicted mass; about 1.76 kg of 30 kg is under the 15 % required
    // (1.75 before chromium took the CRC Handbook's 7150 kg/m^3 in place of 7190).
    const evaluation = evaluateSheet(sheet, { mass_allocation: 30 });
    const margin = headlineFigures(sheet, evaluation).find((figure) => figure.role === 'system_margin');
    expect(margin?.flag).toBe(BELOW_REQUIRED_MARGIN);
    expect(margin?.value).toBeCloseTo(1.755, 3);
  });

  it('reads the flag from the roll-up a caller has made already, and gives the same figures as rolling it up itself', () => {
    const tight = evaluateSheet(sheet, { mass_allocation: 30 });
    const rolledUp = sheetMassBudget(sheet, tight);
    expect(headlineFigures(sheet, tight, undefined, rolledUp)).toEqual(headlineFigures(sheet, tight));
    // The roll-up passed in is the one read: a roomy sheet's margin carries the flag of the tight roll-up.
    const roomy = evaluateSheet(sheet);
    const margin = headlineFigures(sheet, roomy, undefined, rolledUp).find((figure) => figure.role === 'system_margin');
    expect(margin?.flag).toBe(BELOW_REQUIRED_MARGIN);
  });

  it('says why a figure has no value: the row error, or the missing role', () => {
    const evaluation = evaluateSheet(sheet, { sail_side: 0 });
    const areal = headlineFigures(sheet, evaluation)[0];
    expect(areal?.value).toBeUndefined();
    expect(areal?.problem).toContain('areal_density');
    const bare: Sheet = { name: 'bare', parameters: [] };
    expect(headlineFigures(bare, evaluateSheet(bare))[0]).toMatchObject({
      key: 'areal_density',
      value: undefined,
      problem: expect.stringContaining('areal_density') as string,
    });
  });
});

describe('sheetMassBudget', () => {
  it('is the roll-up the TOTAL_PREDICTED() row computes', () => {
    const evaluation = evaluateSheet(sheet);
    const budget = sheetMassBudget(sheet, evaluation);
    if (!budget.ok) throw new Error(JSON.stringify(budget.errors));
    expect(budget.result.total.predicted).toBe(evaluation.values.predicted_mass?.value);
    expect(budget.result.total.cbe).toBe(evaluation.values.total_mass?.value);
  });
});
