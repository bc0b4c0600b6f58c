import type { BudgetRollUp } from '@/shared/budget';
import { sheetBudget, type AnalysisResult, type Evaluation } from '@/shared/engine';
import type { Parameter, Sheet } from '@/shared/schemas/sheet';
import { sheetTemplate } from '@/shared/templates';
import { rowRoleDefinitions, sheetRoles, type RowRole, type TemplateCheck } from '@/shared/templates/roles';

/** One headline figure: the row playing the role and its value in the row's own unit. */
export interface HeadlineFigure {
  readonly role: RowRole;
  /** The row's key; the role's name when no row plays it. */
  readonly key: string;
  readonly label: string;
  /** In the row's unit; undefined when the row is missing or has an error (see `problem`). */
  readonly value: number | undefined;
  readonly unit: string;
  /** Why there is no value: the engine's error for the row, or the missing role. */
  readonly problem?: string;
  /** A warning about the value: "below the required margin" on the system margin. */
  readonly flag?: string;
}

/** The flag of a system margin below the one the sheet requires. */
export const BELOW_REQUIRED_MARGIN = 'below the required margin';

/**
 * The mass-budget roll-up of an evaluated sheet, the allocation found by its role: the same
 * computation as the sheet's TOTAL_CBE() and TOTAL_PREDICTED() rows.
 */
export function sheetMassBudget(sheet: Sheet, evaluation: Evaluation): AnalysisResult<BudgetRollUp> {
  return sheetBudget(sheet, evaluation);
}

/**
 * The headline figures of an evaluated sheet in the headline's order (by default that of the template the
 * sheet follows; the square sail's: areal density, characteristic acceleration, lightness number, force,
 * temperature, predicted mass, margin). Each reads the row of its role; the margin is flagged from the budget
 * roll-up, which a caller that has rolled the sheet's budget up already (a live sheet does on every edit) passes in.
 */
export function headlineFigures(
  sheet: Sheet,
  evaluation: Evaluation,
  headline: readonly RowRole[] = sheetTemplate(sheet).roles.headline,
  rolledUp?: AnalysisResult<BudgetRollUp>,
): HeadlineFigure[] {
  const keys = sheetRoles(sheet);
  const budget = headline.includes('system_margin') ? (rolledUp ?? sheetMassBudget(sheet, evaluation)) : undefined;
  // The first row of each headline key, found in one pass over the sheet.
  const wanted = new Set(headline.flatMap((role) => keys[role] ?? []));
  const rowOf = new Map<string, Parameter>();
  for (const parameter of sheet.parameters) {
    if (wanted.has(parameter.key) && !rowOf.has(parameter.key)) rowOf.set(parameter.key, parameter);
  }
  return headline.map((role) => {
    const label = rowRoleDefinitions[role].label;
    const key = keys[role];
    const parameter = key === undefined ? undefined : rowOf.get(key);
    if (key === undefined || parameter === undefined) {
      return { role, key: role, label, value: undefined, unit: '', problem: `no row of the sheet has the role "${role}"` };
    }
    const evaluated = evaluation.values[key];
    if (evaluated === undefined) {
      const problem = evaluation.errors.find((error) => error.key === key)?.message ?? `${key}: has no value`;
      return { role, key, label, value: undefined, unit: parameter.unit, problem };
    }
    const flagged = role === 'system_margin' && budget?.ok === true && budget.result.systemMargin.belowRequired;
    return { role, key, label, value: evaluated.value, unit: evaluated.unit, ...(flagged ? { flag: BELOW_REQUIRED_MARGIN } : {}) };
  });
}

/**
 * The mass allocation a roll-up holds its margin against: the label of the row playing the role, and the
 * allocation in kg as the roll-up used it (its predicted total plus its margin).
 */
export function massAllocation(sheet: Sheet, rolledUp: BudgetRollUp): { label: string; kg: number } {
  const key = sheetRoles(sheet).mass_allocation;
  const row = key === undefined ? undefined : sheet.parameters.find((parameter) => parameter.key === key);
  return { label: row?.label ?? rowRoleDefinitions.mass_allocation.label, kg: rolledUp.total.predicted + rolledUp.systemMargin.kg };
}

/** A template's check read on an evaluated sheet: whether its row says the assumption or requirement holds. */
export interface CheckResult {
  readonly role: RowRole;
  /** The row's key; the role's name when no row plays it. */
  readonly key: string;
  readonly status: 'holds' | 'fails' | 'unknown';
  /** The contract's words for the status, or why the row has no answer. */
  readonly message: string;
  /** The headline figure the check qualifies. */
  readonly beside?: RowRole;
}

/**
 * The checks of the template the sheet follows (or those given), each read from its row: 1 holds, 0 fails;
 * a row with an error, another value or no row at all is `unknown`, with the reason.
 */
export function templateChecks(
  sheet: Sheet,
  evaluation: Evaluation,
  checks: readonly TemplateCheck[] = sheetTemplate(sheet).roles.checks,
): CheckResult[] {
  const keys = sheetRoles(sheet);
  return checks.map((check) => {
    const key = keys[check.role];
    const beside = check.beside === undefined ? {} : { beside: check.beside };
    if (key === undefined) {
      return {
        role: check.role,
        key: check.role,
        status: 'unknown',
        message: `no row of the sheet has the role "${check.role}"`,
        ...beside,
      };
    }
    const value = evaluation.values[key]?.value;
    if (value === 1) return { role: check.role, key, status: 'holds', message: check.holds, ...beside };
    if (value === 0) return { role: check.role, key, status: 'fails', message: check.fails, ...beside };
    const problem =
      value === undefined
        ? (evaluation.errors.find((error) => error.key === key)?.message ?? `${key}: has no value`)
        : `${key}: is ${value}, neither 1 (holds) nor 0 (fails)`;
    return { role: check.role, key, status: 'unknown', message: `${rowRoleDefinitions[check.role].label}: ${problem}`, ...beside };
  });
}
