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
  });

  it('finds the allocation by its role, so a renamed allocation row still holds the margin', () => {
    const renamed = {
      ...sheet,
      parameters: sheet.parameters.map((parameter) =>
        parameter.key === 'mass_allocation' ? { ...parameter, key: 'launch_allocation', value: 30 } : parameter,
      ),
    };
    const budget = sheetBudget(renamed, evaluateSheet(renamed));
    if (!budget.ok) throw new Error(JSON.stringify(budget.errors));
    // AIAA S-120A-2015: margin = allocation - predicted mass, against the 30 kg of the renamed row.
    expect(budget.result.systemMargin.kg).toBeCloseTo(30 - budget.result.total.predicted, 10);
  });

  it('says so when no row has the mass_allocation role', () => {
    const noRole = {
      ...sheet,
      parameters: sheet.parameters.map((parameter) => {
        if (parameter.key !== 'mass_allocation') return parameter;
        const { role: _role, ...rest } = parameter;
        return rest;
      }),
    };
    const budget = sheetBudget(noRole, evaluateSheet(noRole));
    expect(budget).toMatchObject({ ok: false, errors: [{ code: 'budget_error' }] });
    if (!budget.ok) expect(budget.errors[0]?.message).toContain('mass_allocation');
  });
});
