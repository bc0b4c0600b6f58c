import { sheetSchema, type Sheet } from '@/shared/schemas/sheet';
import squareSail from '@/shared/templates/square-sail.json';

/** The standard square-sail sheet, validated: the starting sheet of a new craft. */
export function squareSailTemplate(): Sheet {
  return sheetSchema.parse(squareSail);
}
