import type { AnalysisResult, Evaluation } from '@/shared/engine';
import { rowError, type EngineError } from '@/shared/engine/errors';
import { parseUnit, toSI } from '@/shared/engine/units';
import type { Parameter, Sheet } from '@/shared/schemas/sheet';
import { rowRoleDefinitions, sheetRoles, type RowRole } from '@/shared/templates/roles';

/** A row found by its role: its key, its definition and the label screens show for the role. */
export interface RoleRow {
  readonly role: RowRole;
  readonly key: string;
  readonly parameter: Parameter;
  readonly label: string;
}

/** The error for a role no row of the sheet plays; its key is the role's name, as no row exists to name. */
export function missingRole(role: RowRole): EngineError {
  return rowError(role, 'unknown_key', `no row of the sheet has the role "${role}" (${rowRoleDefinitions[role].label})`);
}

/** The rows playing each of the roles, or one error per role no row plays. */
export function findRoleRows<R extends RowRole>(sheet: Sheet, roles: readonly R[]): AnalysisResult<Record<R, RoleRow>> {
  const keys = sheetRoles(sheet);
  const found: Partial<Record<R, RoleRow>> = {};
  const errors: EngineError[] = [];
  for (const role of roles) {
    const key = keys[role];
    const parameter = key === undefined ? undefined : sheet.parameters.find((candidate) => candidate.key === key);
    if (key === undefined || parameter === undefined) errors.push(missingRole(role));
    else found[role] = { role, key, parameter, label: rowRoleDefinitions[role].label };
  }
  return errors.length > 0 ? { ok: false, errors } : { ok: true, result: found as Record<R, RoleRow> };
}

/**
 * Every evaluated row's value in SI (a row shown in `percent` gives 0.9, never 90; `mm/s^2` gives
 * m/s^2): what analyses and the server read, so they compute exactly what a screen shows.
 */
export function siValues(sheet: Sheet, evaluation: Evaluation): Record<string, number> {
  const values: Record<string, number> = {};
  for (const parameter of sheet.parameters) {
    const evaluated = evaluation.values[parameter.key];
    if (evaluated === undefined || parameter.key in values) continue;
    const unit = parseUnit(evaluated.unit);
    if (unit.ok) values[parameter.key] = toSI(evaluated.value, unit.value);
  }
  return values;
}

/**
 * The SI values of the rows playing the roles, or the errors that keep each from having one: the
 * role is missing, or its row has an error (the engine's, which names the row).
 */
export function roleValuesSI<R extends RowRole>(
  sheet: Sheet,
  evaluation: Evaluation,
  roles: readonly R[],
): AnalysisResult<Record<R, number>> {
  const rows = findRoleRows(sheet, roles);
  if (!rows.ok) return rows;
  const si = siValues(sheet, evaluation);
  const values: Partial<Record<R, number>> = {};
  const errors: EngineError[] = [];
  for (const role of roles) {
    const { key } = rows.result[role];
    const value = si[key];
    if (value !== undefined) values[role] = value;
    else errors.push(evaluation.errors.find((error) => error.key === key) ?? rowError(key, 'invalid_value', 'has no value'));
  }
  return errors.length > 0 ? { ok: false, errors } : { ok: true, result: values as Record<R, number> };
}
