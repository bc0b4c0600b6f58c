import type { SheetSnapshot } from '@/components/sizing/use-sheet-session';
import { evaluateSheet, sheetBudget } from '@/shared/engine';
import type { Sheet } from '@/shared/schemas/sheet';
import { squareSailTemplate } from '@/shared/templates';

/** The sheet evaluated by the engine as the sheet screen would hand it to its panels. */
export function snapshotOf(sheet: Sheet): SheetSnapshot {
  const evaluation = evaluateSheet(sheet);
  return {
    sheet,
    values: evaluation.values,
    errors: evaluation.errors,
    budget: sheetBudget(sheet, evaluation),
    canUndo: false,
    canRedo: false,
  };
}

/** The square-sail template with some inputs changed (numbers in each row's unit). */
export function templateWith(inputs: Record<string, number> = {}): Sheet {
  const sheet = squareSailTemplate();
  return {
    ...sheet,
    parameters: sheet.parameters.map((parameter) => {
      const value = inputs[parameter.key];
      return value === undefined ? parameter : { ...parameter, value };
    }),
  };
}
