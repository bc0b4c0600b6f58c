import { SIZING_CAUTION } from '@/shared/analyses/caution';
import type { Evaluation } from '@/shared/engine/evaluate';
import { analyseSheet, mentionsMassTotals, sheetPreset, type AnalysedRow } from '@/shared/engine/sheet-model';
import { formatDimension, fromSI, toSI } from '@/shared/engine/units';
import {
  ALLOWANCES_SHEET,
  COVER_SHEET,
  FIRST_DATA_ROW,
  LAYOUT_VERSION,
  MASS_BUDGET_COLUMNS,
  MASS_BUDGET_FIRST_ROW,
  MASS_BUDGET_HEADERS,
  MASS_BUDGET_SHEET,
  PARAMETERS_SHEET,
  PARAMETER_COLUMNS,
  PARAMETER_COLUMN_ORDER,
  type ParameterColumn,
} from '@/shared/exchange/layout';
import { toSpreadsheetFormula, type MassBudgetPlaces } from '@/shared/exchange/spreadsheet-formulas';
import type { Sheet } from '@/shared/schemas/sheet';
import { sheetRoles } from '@/shared/templates/roles';

/**
 * The workbook of a revision as plain data (sheets of cells, defined names), for the server to write with a
 * spreadsheet library. Text is always a text cell, never a formula, whatever it starts with (a label "=1+1" stays
 * text: the spreadsheet-injection guard); formulas are only those built here from parsed trees.
 */

/** A cell: text, a number, a live formula (without "="), or nothing. */
export type LayoutCell = string | number | { readonly formula: string } | null;

export interface LayoutSheet {
  readonly name: string;
  readonly widths: readonly number[];
  /** Row 1 first. */
  readonly rows: readonly (readonly LayoutCell[])[];
  /** Rows frozen at the top (the header). */
  readonly frozenRows: number;
}

export interface WorkbookLayout {
  readonly sheets: readonly LayoutSheet[];
  /** One defined name per key, naming the row's SI value cell. */
  readonly names: readonly { readonly name: string; readonly sheet: string; readonly cell: string }[];
}

/** What goes into a workbook: the whole sheet (formulas are analysed over it) and the rows the reader sees. */
export interface WorkbookInput {
  readonly craftName: string;
  readonly revision: { readonly label: string; readonly kind: string; readonly state: string };
  readonly exportedBy: string;
  readonly exportedAt: string;
  readonly sheet: Sheet;
  /** Each row's version, by key. */
  readonly versions: ReadonlyMap<string, number>;
  /** Keys of the rows the reader may see; every row when undefined. */
  readonly visibleKeys?: ReadonlySet<string>;
  /** The sheet evaluated: needed when some rows are hidden, for the values of formulas that read them. */
  readonly evaluation?: Evaluation;
}

const NA = { formula: 'NA()' } as const;

/** SI = value × factor + offset, as a formula over the value cell. */
function toSIFormula(valueCell: string, factor: number, offset: number): string {
  const scaled = factor === 1 ? valueCell : `${valueCell}*${String(factor)}`;
  return offset === 0 ? scaled : `${scaled}+${String(offset)}`;
}

/** Builds the workbook: cover, parameters, mass budget and the allowance table it looks up. */
export function buildWorkbookLayout(input: WorkbookInput): WorkbookLayout {
  const { sheet, visibleKeys } = input;
  const analysis = analyseSheet(sheet);
  const isVisible = (key: string) => visibleKeys === undefined || visibleKeys.has(key);
  const visibleRows = analysis.rows.filter((row) => isVisible(row.parameter.key));
  const massRows = visibleRows.filter((row) => row.parameter.mass !== undefined);
  const budgetRowByKey = new Map(massRows.map((row, index) => [row.parameter.key, MASS_BUDGET_FIRST_ROW + index]));
  const mass: MassBudgetPlaces = { rowOf: (key) => budgetRowByKey.get(key), lastRow: MASS_BUDGET_FIRST_ROW + massRows.length - 1 };
  const wholeSheet = visibleKeys === undefined || visibleRows.length === analysis.rows.length;

  const parameterRows = visibleRows.map((row, index) =>
    parameterRow(row, FIRST_DATA_ROW + index, mass, input, wholeSheet ? () => true : readsOnlyVisible(isVisible)),
  );
  const parameters: LayoutSheet = {
    name: PARAMETERS_SHEET,
    widths: PARAMETER_COLUMN_ORDER.map((column) => PARAMETER_COLUMNS[column].width),
    rows: [PARAMETER_COLUMN_ORDER.map((column) => PARAMETER_COLUMNS[column].header), ...parameterRows],
    frozenRows: 1,
  };
  const allowances = allowanceSheet(sheet);
  return {
    sheets: [
      coverSheet(input, visibleRows.length, analysis.rows.length),
      parameters,
      massBudgetSheet(sheet, massRows, allowances, wholeSheet),
      ...(allowances === undefined ? [] : [allowances.sheet]),
    ],
    names: visibleRows.map((row, index) => ({
      name: row.parameter.key,
      sheet: PARAMETERS_SHEET,
      cell: `$${PARAMETER_COLUMNS.si.letter}$${FIRST_DATA_ROW + index}`,
    })),
  };
}

/** A formula row may be live for a reader who does not see every row only when it reads rows they see. */
function readsOnlyVisible(isVisible: (key: string) => boolean) {
  return (row: AnalysedRow) => row.dependencies.every(isVisible) && !mentionsMassTotals(row.parameter.formula);
}

function parameterRow(
  row: AnalysedRow,
  rowNumber: number,
  mass: MassBudgetPlaces,
  input: WorkbookInput,
  mayBeLive: (row: AnalysedRow) => boolean,
): LayoutCell[] {
  const { parameter, unit } = row;
  const at = (column: ParameterColumn) => `${PARAMETER_COLUMNS[column].letter}${rowNumber}`;
  const siCell = at('si');
  const cells: Record<ParameterColumn, LayoutCell> = {
    key: parameter.key,
    label: parameter.label,
    subsystem: parameter.subsystem,
    value: null,
    unit: parameter.unit,
    formula: null,
    computed: null,
    note: parameter.note ?? null,
    source: parameter.source ?? null,
    version: input.versions.get(parameter.key) ?? null,
    si: NA,
    siUnit: unit === undefined ? null : formatDimension(unit.dimension),
  };
  const usable = unit !== undefined && row.error === undefined;
  if (parameter.formula !== undefined) {
    if (usable && row.formula !== undefined && mayBeLive(row)) {
      cells.formula = { formula: toSpreadsheetFormula(row.formula, mass) };
      cells.si = { formula: at('formula') };
    } else {
      // Not live: a formula with an error, or one that reads rows the reader does not see (its value comes from Trimsheet).
      cells.formula = parameter.formula;
      const value = input.evaluation?.values[parameter.key];
      if (usable && value !== undefined) cells.si = toSI(value.value, unit);
    }
    if (usable) cells.computed = { formula: fromSIFormula(siCell, unit.factor, unit.offset) };
  } else {
    // An input, or a material's value in the row's unit (Source names the material).
    const shown = parameter.value ?? (usable && row.siValue !== undefined ? fromSI(row.siValue, unit) : undefined);
    if (shown !== undefined && Number.isFinite(shown)) {
      cells.value = shown;
      cells.computed = { formula: at('value') };
      if (usable) cells.si = { formula: toSIFormula(at('value'), unit.factor, unit.offset) };
    }
    if (parameter.material !== undefined && parameter.source === undefined) {
      cells.source = `material: ${parameter.material.id} ${parameter.material.property}`;
    }
  }
  return PARAMETER_COLUMN_ORDER.map((column) => cells[column]);
}

function fromSIFormula(siCell: string, factor: number, offset: number): string {
  const shifted = offset === 0 ? siCell : `(${siCell}-${String(offset)})`;
  return factor === 1 ? shifted : `${shifted}/${String(factor)}`;
}

function coverSheet(input: WorkbookInput, shown: number, total: number): LayoutSheet {
  const rows: LayoutCell[][] = [
    ['Trimsheet export'],
    ['Craft', input.craftName],
    ['Revision', input.revision.label],
    ['Kind', `${input.revision.kind} (${input.revision.state})`],
    ['Exported by', input.exportedBy],
    ['Exported at', input.exportedAt],
    ['Rows', shown === total ? `${total}` : `${shown} of ${total} (the rows shared with you)`],
    ['Layout', LAYOUT_VERSION],
    [],
    ['Caution', SIZING_CAUTION],
    [],
    [
      'How to edit',
      `Change values, units, formulas, labels, notes and sources on the ${PARAMETERS_SHEET} sheet, then import the file into Trimsheet: nothing is written until you have seen the preview, and accepting it opens a study. Formulas name parameter keys and compute in SI units (the "SI value" column); keep the keys in column A.`,
    ],
  ];
  return { name: COVER_SHEET, widths: [16, 100], rows, frozenRows: 0 };
}

interface AllowanceTable {
  sheet: LayoutSheet;
  /** INDEX/MATCH of a maturity and category cell in the table. */
  lookUp(maturityCell: string, categoryCell: string): string;
}

/** The sheet's allowance preset as a table (fractions), maturities down, categories across. */
function allowanceSheet(sheet: Sheet): AllowanceTable | undefined {
  const preset = sheetPreset(sheet.budget);
  if (!preset.ok) return undefined;
  const { maturities, categories, table } = preset.value;
  const lastColumn = columnLetter(categories.length + 1);
  const lastRow = maturities.length + 1;
  const rows: LayoutCell[][] = [
    [`${preset.value.name}: growth allowance (fraction) by maturity and category`, ...categories.map((category) => category.id)],
    ...maturities.map((maturity) => [maturity.id, ...categories.map((category) => table[maturity.id]?.[category.id] ?? null)]),
  ];
  const sheetRef = ALLOWANCES_SHEET;
  return {
    sheet: { name: ALLOWANCES_SHEET, widths: [44, ...categories.map(() => 12)], rows, frozenRows: 1 },
    lookUp: (maturityCell, categoryCell) =>
      `INDEX(${sheetRef}!$B$2:$${lastColumn}$${lastRow},MATCH(${maturityCell},${sheetRef}!$A$2:$A$${lastRow},0),MATCH(${categoryCell},${sheetRef}!$B$1:$${lastColumn}$1,0))`,
  };
}

/** Column letters of a 1-based index (1 → A, 27 → AA). */
function columnLetter(index: number): string {
  let letters = '';
  for (let rest = index; rest > 0; rest = Math.floor((rest - 1) / 26)) letters = String.fromCharCode(65 + ((rest - 1) % 26)) + letters;
  return letters;
}

/** Where the mass budget's summary cells are: the rows after the lines, all in the predicted column. */
export function massBudgetSummaryRows(lineCount: number) {
  const total = MASS_BUDGET_FIRST_ROW + lineCount + 1;
  return { total, allocation: total + 1, marginKg: total + 2, marginPercent: total + 3, requiredPercent: total + 4 };
}

function massBudgetSheet(sheet: Sheet, massRows: readonly AnalysedRow[], allowances: AllowanceTable | undefined, wholeSheet: boolean) {
  const c = MASS_BUDGET_COLUMNS;
  const lines: LayoutCell[][] = massRows.map((row, index) => {
    const at = MASS_BUDGET_FIRST_ROW + index;
    const { parameter } = row;
    return [
      parameter.key,
      parameter.label,
      parameter.subsystem,
      parameter.mass?.maturity ?? null,
      parameter.mass?.category ?? null,
      { formula: parameter.key },
      allowances === undefined ? NA : { formula: allowances.lookUp(`${c.maturity}${at}`, `${c.category}${at}`) },
      { formula: `${c.cbe}${at}*(1+${c.allowance}${at})` },
    ];
  });
  const rows: LayoutCell[][] = [MASS_BUDGET_HEADERS, ...lines];
  const allocationKey = sheetRoles(sheet).mass_allocation;
  // Totals and margins sum every mass row: only for a reader of the whole sheet.
  if (wholeSheet) {
    const last = MASS_BUDGET_FIRST_ROW + lines.length - 1;
    const summary = massBudgetSummaryRows(lines.length);
    const sum = (column: string) => (lines.length === 0 ? 0 : { formula: `SUM(${column}${MASS_BUDGET_FIRST_ROW}:${column}${last})` });
    const preset = sheetPreset(sheet.budget);
    const required = sheet.budget?.requiredMarginPercent ?? (preset.ok ? preset.value.systemMarginPercent : null);
    const labelled = (label: string, value: LayoutCell): LayoutCell[] => [label, null, null, null, null, null, null, value];
    rows.push(
      [],
      ['Total', null, null, null, null, sum(c.cbe), null, sum(c.predicted)],
      labelled('Mass allocation (kg)', allocationKey === undefined ? NA : { formula: allocationKey }),
      labelled('System margin (kg)', { formula: `${c.predicted}${summary.allocation}-${c.predicted}${summary.total}` }),
      labelled('System margin (% of allocation)', {
        formula: `(${c.predicted}${summary.marginKg}/${c.predicted}${summary.allocation})*100`,
      }),
      labelled('Required margin (%)', required),
    );
  }
  return { name: MASS_BUDGET_SHEET, widths: [26, 30, 18, 22, 14, 14, 16, 16], rows, frozenRows: 1 };
}
