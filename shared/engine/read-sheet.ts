import { describeIssues } from '@/shared/schemas/common';
import { parameterSchema, sheetHeaderSchema, sheetSchema, type Parameter, type Sheet } from '@/shared/schemas/sheet';

/** A problem in a sheet file: the key of the row (or "" for the sheet itself), a code and a message. */
export interface SheetFileError {
  readonly key: string;
  readonly code: 'invalid_sheet' | 'invalid_parameter';
  readonly message: string;
}

/**
 * Reads a sheet from parsed JSON, row by row: a malformed row is reported with its key and left
 * out, so the other rows still evaluate (rows that read it then report an unknown key).
 * Only a file that is not a sheet at all (no name or no parameter list) gives no sheet.
 */
export function readSheet(data: unknown): { sheet: Sheet | undefined; errors: SheetFileError[] } {
  const whole = sheetSchema.safeParse(data);
  if (whole.success) return { sheet: whole.data, errors: [] };
  const outline = sheetHeaderSchema.safeParse(data);
  const rawParameters = typeof data === 'object' && data !== null && 'parameters' in data ? data.parameters : undefined;
  if (!outline.success || !Array.isArray(rawParameters)) {
    const detail = outline.success ? 'parameters: must be a list of parameters' : describeIssues(outline.error.issues);
    return { sheet: undefined, errors: [{ key: '', code: 'invalid_sheet', message: `not a sheet: ${detail}` }] };
  }
  const errors: SheetFileError[] = [];
  const parameters: Parameter[] = [];
  rawParameters.forEach((raw: unknown, index) => {
    const parsed = parameterSchema.safeParse(raw);
    if (parsed.success) {
      parameters.push(parsed.data);
      return;
    }
    const key = typeof raw === 'object' && raw !== null && 'key' in raw && typeof raw.key === 'string' ? raw.key : `parameters[${index}]`;
    errors.push({ key, code: 'invalid_parameter', message: `${key}: ${describeIssues(parsed.error.issues)}` });
  });
  return { sheet: { ...outline.data, parameters }, errors };
}
