/**
 * Trimsheet's workbook layout, shared by the export that writes it and the import that reads it back. A partner
 * edits the Parameters sheet: one row per parameter from row 2, the columns below. Formulas compute in SI units
 * over defined names (one per key, naming the row's "SI value" cell), so a spreadsheet program recalculates them
 * to Trimsheet's values.
 */

export const COVER_SHEET = 'Cover';
export const PARAMETERS_SHEET = 'Parameters';
export const MASS_BUDGET_SHEET = 'Mass budget';
export const ALLOWANCES_SHEET = 'Allowances';

/** Which layout a workbook follows, written on the cover. */
export const LAYOUT_VERSION = 'Trimsheet workbook layout 1';

/** The Parameters sheet's columns in order: header text and letter. */
export const PARAMETER_COLUMNS = {
  key: { letter: 'A', header: 'Key', width: 26 },
  label: { letter: 'B', header: 'Label', width: 34 },
  subsystem: { letter: 'C', header: 'Subsystem', width: 18 },
  value: { letter: 'D', header: 'Value', width: 14 },
  unit: { letter: 'E', header: 'Unit', width: 12 },
  formula: { letter: 'F', header: 'Formula (SI)', width: 44 },
  computed: { letter: 'G', header: 'Computed value', width: 16 },
  note: { letter: 'H', header: 'Note', width: 30 },
  source: { letter: 'I', header: 'Source', width: 30 },
  version: { letter: 'J', header: 'Row version', width: 11 },
  si: { letter: 'K', header: 'SI value', width: 16 },
  siUnit: { letter: 'L', header: 'SI unit', width: 14 },
} as const;

export type ParameterColumn = keyof typeof PARAMETER_COLUMNS;
export const PARAMETER_COLUMN_ORDER = Object.keys(PARAMETER_COLUMNS) as ParameterColumn[];

/** Row 1 holds the headers; parameters start on row 2. */
export const FIRST_DATA_ROW = 2;

/** The mass-budget sheet's columns: allowance and predicted mass are live formulas. */
export const MASS_BUDGET_COLUMNS = {
  key: 'A',
  label: 'B',
  subsystem: 'C',
  maturity: 'D',
  category: 'E',
  cbe: 'F',
  allowance: 'G',
  predicted: 'H',
} as const;
export const MASS_BUDGET_HEADERS = ['Key', 'Label', 'Subsystem', 'Maturity', 'Category', 'CBE (kg)', 'Growth allowance', 'Predicted (kg)'];
export const MASS_BUDGET_FIRST_ROW = 2;

/**
 * Limits of an uploaded workbook, checked before it is parsed: its size, what it unpacks to (declared and
 * counted while inflating), its number of zip entries, and the rows of any sheet.
 */
export const IMPORT_LIMITS = {
  maxFileBytes: 8 * 1024 * 1024,
  maxUnpackedBytes: 64 * 1024 * 1024,
  maxEntries: 2_000,
  maxSheetRows: 20_000,
} as const;

/** A sheet name as a formula writes it ('Mass budget'). */
export function quotedSheet(name: string): string {
  return /^[A-Za-z_][A-Za-z0-9_]*$/.test(name) ? name : `'${name.replace(/'/g, "''")}'`;
}

/** A cell's address for people and problems: "Parameters!D7". */
export function cellName(sheet: string, column: string, row: number): string {
  return `${sheet}!${column}${row}`;
}
