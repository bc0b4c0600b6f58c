import type { AllowancePreset } from '@/shared/budget/types';
import type { Sheet } from '@/shared/schemas/sheet';

/**
 * The sheet with the craft's own allowance table in its budget settings, so that the roll-up and the predicted
 * masses read it in place of the preset the sheet names. A sheet without budget settings keeps none, and
 * without a table of the craft's the sheet is returned as it is.
 */
export function withAllowanceTable<S extends Pick<Sheet, 'budget'>>(sheet: S, table: AllowancePreset | null | undefined): S {
  if (table === null || table === undefined || sheet.budget === undefined) return sheet;
  return { ...sheet, budget: { ...sheet.budget, table } };
}
