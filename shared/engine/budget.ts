import { rollUpBudget } from '@/shared/budget/rollup';
import { BudgetInputError, type BudgetRollUp, type BudgetRowInput } from '@/shared/budget/types';
import type { Parameter, Sheet } from '@/shared/schemas/sheet';
import { sheetRoles } from '@/shared/templates/roles';
import type { AnalysisResult } from '@/shared/engine/analyses';
import { rowError, type EngineError } from '@/shared/engine/errors';
import type { Evaluation } from '@/shared/engine/evaluate';
import { sheetPreset } from '@/shared/engine/sheet-model';
import { MASS, formatDimension, parseUnit, sameDimension, toSI } from '@/shared/engine/units';

/**
 * The mass budget of an evaluated sheet: every row with a maturity and category is a budget line
 * (its value as current best estimate, in kg), rolled up with the sheet's allowance preset
 * against the allocation row (the row whose role is `mass_allocation`), with the sheet's required
 * margin (or the preset's); a craft's own table in the sheet's budget settings brings its own margin.
 */
export function sheetBudget(sheet: Sheet, evaluation: Evaluation): AnalysisResult<BudgetRollUp> {
  const errors: EngineError[] = [];
  const allocationKey = sheetRoles(sheet).mass_allocation;
  if (allocationKey === undefined) {
    errors.push(
      rowError('', 'budget_error', 'no row has the role mass_allocation, so the budget has no allocation to hold a margin against'),
    );
  }
  const massRows = sheet.parameters.filter((parameter) => parameter.mass !== undefined);
  // The first row of each key the budget reads, as a sheet with duplicate keys is read everywhere else
  // (only those keys: an index of every key would cost a large sheet more than the roll-up itself).
  const wanted = new Set(massRows.map((parameter) => parameter.key));
  if (allocationKey !== undefined) wanted.add(allocationKey);
  const byKey = new Map<string, Parameter>();
  for (const parameter of sheet.parameters) {
    if (wanted.has(parameter.key) && !byKey.has(parameter.key)) byKey.set(parameter.key, parameter);
  }
  const inKilograms = (key: string): number | undefined => {
    const parameter = byKey.get(key);
    const value = evaluation.values[key];
    const unit = parameter === undefined ? undefined : parseUnit(parameter.unit);
    if (parameter === undefined) errors.push(rowError(key, 'unknown_key', 'no row has this key'));
    else if (value === undefined || unit === undefined || !unit.ok)
      errors.push(rowError(key, 'dependency_error', 'has no value, so the budget cannot be rolled up'));
    else if (!sameDimension(unit.value.dimension, MASS))
      errors.push(rowError(key, 'dimension_mismatch', `a budget row must be a mass, its unit is ${formatDimension(unit.value.dimension)}`));
    else return toSI(value.value, unit.value);
    return undefined;
  };
  const rows: BudgetRowInput[] = massRows.flatMap(({ key, subsystem, mass }) => {
    const cbe = inKilograms(key);
    return mass === undefined || cbe === undefined ? [] : [{ key, subsystem, cbe, ...mass }];
  });
  const allocation = allocationKey === undefined ? undefined : inKilograms(allocationKey);
  const preset = sheetPreset(sheet.budget);
  if (!preset.ok) errors.push(rowError('', 'budget_error', preset.message));
  if (errors.length > 0 || allocation === undefined || !preset.ok) return { ok: false, errors };
  try {
    // A craft's own allowance table states its own required margin; the sheet's figure qualifies a shipped preset.
    const requiredMarginPercent = sheet.budget?.table === undefined ? sheet.budget?.requiredMarginPercent : undefined;
    return {
      ok: true,
      result: rollUpBudget(
        rows,
        preset.value,
        requiredMarginPercent === undefined ? { allocation } : { allocation, requiredMarginPercent },
      ),
    };
  } catch (error) {
    if (!(error instanceof BudgetInputError)) throw error;
    const row = error.rowKey ?? (error.path === 'allocation' ? (allocationKey ?? '') : '');
    return { ok: false, errors: [rowError(row, 'budget_error', error.message)] };
  }
}
