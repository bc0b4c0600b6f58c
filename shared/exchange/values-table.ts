import type { Evaluation } from '@/shared/engine/evaluate';
import type { Parameter } from '@/shared/schemas/sheet';

/**
 * The values of a revision as a table for CSV: one line per row the reader sees, its computed value in the row's
 * unit, or the error that stops it. The server writes the cells with its CSV quoting (formula-looking text quoted).
 */
export function valuesTable(parameters: readonly Parameter[], evaluation: Evaluation): string[][] {
  const errors = new Map(evaluation.errors.map((error) => [error.key, error.message]));
  return [
    ['key', 'label', 'subsystem', 'value', 'unit', 'error'],
    ...parameters.map((parameter) => {
      const value = evaluation.values[parameter.key];
      return [
        parameter.key,
        parameter.label,
        parameter.subsystem,
        value === undefined ? '' : String(value.value),
        parameter.unit,
        value === undefined ? (errors.get(parameter.key) ?? '') : '',
      ];
    }),
  ];
}
