import { sheetBudget } from '@/shared/engine/budget';
import { evaluateSheet } from '@/shared/engine/evaluate';
import { squareSailTemplate } from '@/shared/templates';

const sheet = squareSailTemplate();

describe('sheetBudget', () => {
  it('rolls up the mass rows of the template with its preset and agrees with predicted_mass and system_margin', () => {
    const evaluation = evaluateSheet(sheet);
    const budget = sheetBudget(sheet, evaluation);
    if (!budget.ok) throw new Error(JSON.stringify(budget.errors));
    expect(budget.result.rows.map((row) => row.key)).toEqual(['membrane_mass', 'boom_mass', 'deployer_mass', 'bus_mass', 'payload_mass']);
    expect(budget.result.total.predicted).toBeCloseTo(evaluation.values.predicted_mass?.value ?? Number.NaN, 10);
    expect(budget.result.systemMargin.kg).toBeCloseTo(evaluation.values.system_margin?.value ?? Number.NaN, 10);
    expect(budget.result.systemMargin.requiredPercent).toBe(15);
    expect(budget.result.systemMargin.belowRequired).toBe(false);
    expect(budget.result.bySubsystem.map((total) => total.subsystem)).toEqual(['Sail membrane', 'Booms', 'Spacecraft']);
  });

  it('flags a margin below the required one', () => {
    const evaluation = evaluateSheet(sheet, { mass_allocation: 30 });
    const budget = sheetBudget(sheet, evaluation);
    if (!budget.ok) throw new Error(JSON.stringify(budget.errors));
    expect(budget.result.systemMargin.belowRequired).toBe(true);
  });

  it('converts mass rows given in grams to kilograms', () => {
    const grams = {
      ...sheet,
      parameters: sheet.parameters.map((parameter) =>
        parameter.key === 'payload_mass' ? { ...parameter, unit: 'g', value: 2000 } : parameter,
      ),
    };
    const budget = sheetBudget(grams, evaluateSheet(grams));
    if (!budget.ok) throw new Error(JSON.stringify(budget.errors));
    expect(budget.result.rows.find((row) => row.key === 'payload_mass')?.cbe).toBe(2);
  });

  it('names the rows that keep the budget from rolling up', () => {
    const broken = {
      ...sheet,
      parameters: sheet.parameters.map((parameter) =>
        parameter.key === 'bus_mass' ? { ...parameter, mass: { maturity: 'guessed', category: 'structure' } } : parameter,
      ),
    };
    const budget = sheetBudget(broken, evaluateSheet(broken));
    expect(budget).toMatchObject({ ok: false, errors: [{ key: 'bus_mass', code: 'budget_error' }] });
    const noAllocation = sheetBudget(sheet, evaluateSheet(sheet), 'nothing');
    expect(noAllocation).toMatchObject({ ok: false, errors: [{ key: 'nothing', code: 'unknown_key' }] });
  });
});
