import { sheetBudget } from '@/shared/engine/budget';
import { evaluateCompiled } from '@/shared/engine/compile';
import { evaluateSheet } from '@/shared/engine/evaluate';
import { createSheetSession } from '@/shared/engine/session';
import type { Parameter, Sheet } from '@/shared/schemas/sheet';
import { squareSailTemplate } from '@/shared/templates';

const template = squareSailTemplate();

/** A sixth mass row: a harness, new design work (S-120A "estimated" maturity). */
const harness: Parameter = {
  key: 'harness_mass',
  label: 'Harness mass',
  subsystem: 'Spacecraft',
  unit: 'g',
  value: 1500,
  mass: { maturity: 'estimated', category: 'harness' },
};

function withHarness(sheet: Sheet): Sheet {
  return { ...sheet, parameters: [...sheet.parameters, harness] };
}

/** A sheet on the S-120A preset with the given rows. */
function sheetOf(name: string, parameters: Parameter[]): Sheet {
  return { name, budget: { preset: 'aiaa-s120a' }, parameters };
}

function value(sheet: Sheet, key: string): number {
  const evaluation = evaluateSheet(sheet);
  expect(evaluation.errors).toEqual([]);
  const found = evaluation.values[key]?.value;
  if (found === undefined) throw new Error(`no value for ${key}`);
  return found;
}

describe('TOTAL_CBE() and TOTAL_PREDICTED()', () => {
  it('make the template totals equal the budget roll-up, also with a sixth mass row added', () => {
    for (const sheet of [template, withHarness(template)]) {
      const evaluation = evaluateSheet(sheet);
      const budget = sheetBudget(sheet, evaluation);
      if (!budget.ok) throw new Error(JSON.stringify(budget.errors));
      // AIAA S-120A-2015: total CBE = sum of the CBE of every mass item; predicted = sum of CBE x (1 + growth allowance).
      // One computation: the same sum in the same order, so equal to the last bit.
      expect(evaluation.values.total_mass?.value).toBe(budget.result.total.cbe);
      expect(evaluation.values.predicted_mass?.value).toBe(budget.result.total.predicted);
      expect(evaluation.values.system_margin?.value).toBeCloseTo(budget.result.systemMargin.kg, 12);
    }
  });

  it('count the sixth row with its own allowance', () => {
    const before = value(template, 'predicted_mass');
    const after = value(withHarness(template), 'predicted_mass');
    // The aiaa-s120a preset (AIAA S-120A pattern, from memory): an estimated harness carries a 50 % allowance.
    expect(after - before).toBeCloseTo(1.5 * 1.5, 10);
    expect(value(withHarness(template), 'total_mass') - value(template, 'total_mass')).toBeCloseTo(1.5, 10);
  });

  it('agree between HyperFormula and the compiled evaluator', () => {
    const sheet = withHarness(template);
    const hyperFormula = evaluateSheet(sheet).values;
    for (const generatedCode of [true, false]) {
      const compiled = evaluateCompiled(sheet, {}, { generatedCode });
      expect(compiled.errors).toEqual([]);
      expect(compiled.values.total_mass?.value).toBe(hyperFormula.total_mass?.value);
      expect(compiled.values.predicted_mass?.value).toBe(hyperFormula.predicted_mass?.value);
    }
  });

  it('give 0 kg on a sheet without mass rows', () => {
    const sheet = sheetOf('no masses', [
      { key: 'total', label: 'total', subsystem: 's', unit: 'kg', formula: '=TOTAL_CBE() + TOTAL_PREDICTED()' },
    ]);
    expect(evaluateSheet(sheet).values.total).toEqual({ value: 0, unit: 'kg' });
  });

  it('refuse arguments, a mass row that is not a mass, and a missing allowance, naming the row', () => {
    const sheet = sheetOf('arguments', [
      { key: 'bus', label: 'bus', subsystem: 's', unit: 'kg', value: 3, mass: { maturity: 'layout', category: 'structure' } },
      { key: 'with_argument', label: 'a', subsystem: 's', unit: 'kg', formula: '=TOTAL_CBE(bus)' },
    ]);
    expect(evaluateSheet(sheet).errors).toEqual([
      { key: 'with_argument', code: 'wrong_argument_count', message: expect.stringContaining('TOTAL_CBE() takes no arguments') as string },
    ]);
    const lengthRow = sheetOf('length', [
      { key: 'boom', label: 'boom', subsystem: 's', unit: 'm', value: 3, mass: { maturity: 'layout', category: 'boom' } },
      { key: 'total', label: 'total', subsystem: 's', unit: 'kg', formula: '=TOTAL_CBE()' },
    ]);
    expect(evaluateSheet(lengthRow).errors).toEqual([
      { key: 'total', code: 'dimension_mismatch', message: expect.stringContaining('the mass row boom is m, not a mass') as string },
    ]);
    const unknownMaturity = sheetOf('maturity', [
      { key: 'bus', label: 'bus', subsystem: 's', unit: 'kg', value: 3, mass: { maturity: 'guessed', category: 'structure' } },
      { key: 'cbe', label: 'cbe', subsystem: 's', unit: 'kg', formula: '=TOTAL_CBE()' },
      { key: 'predicted', label: 'predicted', subsystem: 's', unit: 'kg', formula: '=TOTAL_PREDICTED()' },
    ]);
    const evaluation = evaluateSheet(unknownMaturity);
    expect(evaluation.values.cbe).toEqual({ value: 3, unit: 'kg' });
    expect(evaluation.errors).toEqual([
      { key: 'predicted', code: 'budget_error', message: expect.stringContaining("unknown maturity 'guessed'") as string },
    ]);
  });

  it('sum thousands of mass rows without overflowing the formula engines', () => {
    // Keys in letters only: a key with digits would read as a cell reference.
    const letters = (index: number) => [...index.toString(26)].map((digit) => String.fromCharCode(97 + parseInt(digit, 26))).join('');
    const masses: Parameter[] = Array.from({ length: 4000 }, (_, index) => ({
      key: `item_${letters(index)}`,
      label: 'item',
      subsystem: 's',
      unit: 'kg',
      value: 1 + index / 7,
      mass: { maturity: 'layout', category: 'structure' },
    }));
    const sheet = sheetOf('many', [
      ...masses,
      { key: 'allocation', label: 'allocation', subsystem: 's', unit: 'kg', value: 1e9, role: 'mass_allocation' },
      { key: 'cbe', label: 'cbe', subsystem: 's', unit: 'kg', formula: '=TOTAL_CBE()' },
      { key: 'predicted', label: 'predicted', subsystem: 's', unit: 'kg', formula: '=TOTAL_PREDICTED()' },
    ]);
    const evaluation = evaluateSheet(sheet);
    expect(evaluation.errors).toEqual([]);
    const budget = sheetBudget(sheet, evaluation);
    if (!budget.ok) throw new Error(JSON.stringify(budget.errors));
    expect(evaluation.values.cbe?.value).toBe(budget.result.total.cbe);
    expect(evaluation.values.predicted?.value).toBe(budget.result.total.predicted);
    expect(evaluateCompiled(sheet).values.predicted?.value).toBe(budget.result.total.predicted);
  });

  it('follow a live session: a row that becomes a mass row, a new mass row, a removed one, and undo', () => {
    const session = createSheetSession(template);
    try {
      const cbe = () => session.values().total_mass?.value ?? Number.NaN;
      const start = cbe();
      const boomCount = template.parameters.find((parameter) => parameter.key === 'boom_linear_density');
      if (boomCount === undefined) throw new Error('template lost boom_linear_density');
      // A row in g/m is no mass: making it a mass row is refused by TOTAL_CBE's dimension check, naming the row.
      session.updateParameter('boom_linear_density', { ...boomCount, mass: { maturity: 'layout', category: 'boom' } });
      expect(session.errors().find((error) => error.key === 'total_mass')?.message).toContain('boom_linear_density');
      session.undo();
      expect(cbe()).toBe(start);

      const bus = template.parameters.find((parameter) => parameter.key === 'bus_mass');
      if (bus === undefined) throw new Error('template lost bus_mass');
      const { mass: _mass, ...notMass } = bus;
      const edit = session.updateParameter('bus_mass', notMass);
      expect(edit).toMatchObject({ ok: true, recomputed: expect.arrayContaining(['total_mass', 'predicted_mass']) as string[] });
      expect(cbe()).toBeCloseTo(start - 10, 10);
      session.updateParameter('bus_mass', bus);
      expect(cbe()).toBeCloseTo(start, 10);

      session.insertParameter(harness);
      expect(cbe()).toBeCloseTo(start + 1.5, 10);
      // The live session and a fresh evaluation of its sheet agree.
      expect(session.values().predicted_mass?.value).toBe(evaluateSheet(session.sheet()).values.predicted_mass?.value);
      session.removeParameter('harness_mass');
      expect(cbe()).toBeCloseTo(start, 10);
    } finally {
      session.destroy();
    }
  });
});
