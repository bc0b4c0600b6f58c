import type { Sheet } from '@/shared/schemas/sheet';
import { rowError, type EngineError } from '@/shared/engine/errors';
import { createSheetSession, valueInRowUnit, type EvaluatedValue } from '@/shared/engine/session';

/** Values to put in place of a sheet's own: a number in the row's unit, or text with a unit ("60 m"). */
export type Overrides = Readonly<Record<string, number | string>>;

/** The evaluated sheet: every row's value in its declared unit, and the errors of the rows that have none. */
export interface Evaluation {
  readonly values: Record<string, EvaluatedValue>;
  readonly errors: EngineError[];
}

/**
 * Replaces rows by input values. An override of a formula or material row turns it into an input.
 * Returns the new sheet and one error per override that names no row, a protected row, or has a bad value.
 */
export function applyOverrides(sheet: Sheet, overrides: Overrides): { sheet: Sheet; errors: EngineError[] } {
  const errors: EngineError[] = [];
  const values = new Map<string, number>();
  for (const [key, value] of Object.entries(overrides)) {
    const parameter = sheet.parameters.find((candidate) => candidate.key === key);
    if (parameter === undefined) {
      errors.push(rowError(key, 'unknown_key', 'no row has this key, so it cannot be set'));
      continue;
    }
    if (parameter.protected === true) {
      errors.push(rowError(key, 'protected', 'the row is protected and cannot be set'));
      continue;
    }
    const converted = valueInRowUnit(parameter, value);
    if (converted.ok) values.set(key, converted.value);
    else errors.push(converted.error);
  }
  const parameters = sheet.parameters.map((parameter) => {
    const value = values.get(parameter.key);
    if (value === undefined) return parameter;
    const { formula: _formula, material: _material, ...rest } = parameter;
    return { ...rest, value };
  });
  return { sheet: { ...sheet, parameters }, errors };
}

/**
 * Evaluates a sheet with HyperFormula: inputs converted to SI, formulas evaluated in SI, results
 * converted to each row's declared unit. Pure: builds a workbook, reads it and frees it.
 * A row with an error is absent from `values` and has one entry in `errors`; other rows still evaluate.
 */
export function evaluateSheet(sheet: Sheet, overrides: Overrides = {}): Evaluation {
  const overridden = applyOverrides(sheet, overrides);
  const session = createSheetSession(overridden.sheet);
  try {
    return { values: session.values(), errors: [...overridden.errors, ...session.errors()] };
  } finally {
    session.destroy();
  }
}
