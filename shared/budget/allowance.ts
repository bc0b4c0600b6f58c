import { BudgetInputError, type AllowancePreset } from '@/shared/budget/types';

function listIds(items: readonly { id: string }[]): string {
  return items.map((item) => item.id).join(', ');
}

/**
 * Growth allowance of one maturity × category cell of a preset.
 * @param preset allowance preset
 * @param maturity maturity id of that preset (e.g. 'layout')
 * @param category hardware category id of that preset (e.g. 'harness')
 * @returns allowance as a fraction (0.3 = 30 %)
 * @throws BudgetInputError naming the unknown maturity or category and the preset
 */
export function growthAllowance(preset: AllowancePreset, maturity: string, category: string): number {
  if (!preset.maturities.some((m) => m.id === maturity)) {
    throw new BudgetInputError(
      'maturity',
      `unknown maturity '${maturity}' in preset '${preset.id}' (known: ${listIds(preset.maturities)})`,
    );
  }
  if (!preset.categories.some((c) => c.id === category)) {
    throw new BudgetInputError(
      'category',
      `unknown category '${category}' in preset '${preset.id}' (known: ${listIds(preset.categories)})`,
    );
  }
  const value = preset.table[maturity]?.[category];
  if (value === undefined || !Number.isFinite(value)) {
    throw new BudgetInputError(
      `table.${maturity}.${category}`,
      `preset '${preset.id}' has no allowance for maturity '${maturity}' × category '${category}'`,
    );
  }
  return value;
}

/**
 * Predicted mass = basic mass × (1 + allowance) (AIAA S-120A-2015; "basic mass" is its term for the unmargined
 * estimate, called the current best estimate elsewhere).
 * @param cbe basic mass (kg), finite and >= 0
 * @param allowance growth allowance (fraction), finite and >= 0
 * @returns predicted mass (kg)
 * @throws BudgetInputError for a negative or non-finite input
 */
export function predictedMass(cbe: number, allowance: number): number {
  if (!Number.isFinite(cbe) || cbe < 0) {
    throw new BudgetInputError('cbe', `must be a finite mass >= 0 kg, got ${String(cbe)}`);
  }
  if (!Number.isFinite(allowance) || allowance < 0) {
    throw new BudgetInputError('allowance', `must be a finite fraction >= 0, got ${String(allowance)}`);
  }
  return cbe * (1 + allowance);
}
