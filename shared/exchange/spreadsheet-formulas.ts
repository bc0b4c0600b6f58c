import type { Parsed } from '@/shared/engine/units';
import { BINARY_PRECEDENCE, FormulaSyntaxError, parseFormula, type FormulaNode } from '@/shared/engine/formula-parser';
import { sheetFunctions } from '@/shared/engine/functions';
import { MASS_BUDGET_COLUMNS, MASS_BUDGET_SHEET, MASS_BUDGET_FIRST_ROW, quotedSheet } from '@/shared/exchange/layout';

/**
 * Sheet formulas in a spreadsheet program's syntax and back. Outgoing, a formula is written over defined names
 * (one per key, naming the row's SI value), fully parenthesised from the parsed tree; our own functions become
 * plain arithmetic over the mass-budget sheet: PREDICTED(k) is k × (1 + k's allowance cell), TOTAL_CBE() and
 * TOTAL_PREDICTED() are sums of that sheet's columns. Incoming, those shapes are recognised and turned back into
 * our functions, so a formula a partner did not touch reads as unchanged.
 */

const COMPARISONS: ReadonlySet<string> = new Set(['=', '<>', '<', '>', '<=', '>=']);

/** Where the mass-budget sheet holds each mass row: its row number there, and the last row of its lines. */
export interface MassBudgetPlaces {
  rowOf(key: string): number | undefined;
  readonly lastRow: number;
}

const allowanceCell = (row: number) => `${quotedSheet(MASS_BUDGET_SHEET)}!$${MASS_BUDGET_COLUMNS.allowance}$${row}`;
const columnRange = (column: string, lastRow: number) =>
  `${quotedSheet(MASS_BUDGET_SHEET)}!$${column}$${MASS_BUDGET_FIRST_ROW}:$${column}$${lastRow}`;

/** A number as a spreadsheet reads it back to the same double. */
function numberText(value: number): string {
  return String(value).replace('e+', 'E').replace('e-', 'E-');
}

/** Writes a parsed formula (mass totals not expanded) as a spreadsheet formula, without its leading "=". */
export function toSpreadsheetFormula(node: FormulaNode, mass: MassBudgetPlaces): string {
  const write = (current: FormulaNode): string => {
    switch (current.kind) {
      case 'number':
        return numberText(current.value);
      case 'ref':
        return current.key;
      case 'unary':
        return `${current.op}(${write(current.operand)})`;
      case 'percent':
        return `(${write(current.operand)})%`;
      case 'binary': {
        const text = `(${write(current.left)}${current.op}${write(current.right)})`;
        // A comparison gives 1 or 0 in a row, as in the engine.
        return COMPARISONS.has(current.op) ? `IF(${text},1,0)` : text;
      }
      case 'call': {
        const first = current.args[0];
        if (current.name === 'PREDICTED' && first?.kind === 'ref') {
          const row = mass.rowOf(first.key);
          return row === undefined ? 'NA()' : `(${first.key}*(1+${allowanceCell(row)}))`;
        }
        if (current.name === 'TOTAL_CBE' || current.name === 'TOTAL_PREDICTED') {
          if (mass.lastRow < MASS_BUDGET_FIRST_ROW) return '0';
          const column = current.name === 'TOTAL_CBE' ? MASS_BUDGET_COLUMNS.cbe : MASS_BUDGET_COLUMNS.predicted;
          return `SUM(${columnRange(column, mass.lastRow)})`;
        }
        return `${current.name}(${current.args.map(write).join(',')})`;
      }
    }
  };
  return write(node);
}

/**
 * Writes a parsed formula in our syntax with the brackets its operators need ("=a * (b + c)"): how a formula read
 * from a workbook is stored. Parsing the text gives the same tree.
 */
export function printFormula(node: FormulaNode): string {
  const write = (current: FormulaNode, parentPrecedence: number, rightSide: boolean): string => {
    switch (current.kind) {
      case 'number':
        return numberText(current.value);
      case 'ref':
        return current.key;
      case 'unary':
        return `${current.op}${write(current.operand, 6, false)}`;
      case 'percent':
        return `${write(current.operand, 5, false)}%`;
      case 'call':
        return `${current.name}(${current.args.map((arg) => write(arg, 0, false)).join(', ')})`;
      case 'binary': {
        const precedence = BINARY_PRECEDENCE[current.op] ?? 0;
        const text = `${write(current.left, precedence, false)} ${current.op} ${write(current.right, precedence, true)}`;
        // Operators are left-associative: a right operand of equal precedence keeps its brackets.
        const bracket = precedence < parentPrecedence || (rightSide && precedence === parentPrecedence);
        return bracket ? `(${text})` : text;
      }
    }
  };
  return `=${write(node, 0, false)}`;
}

/** Whether two parsed formulas are the same tree. */
export function sameFormula(a: FormulaNode, b: FormulaNode): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

/** Names that references to the mass-budget sheet stand in as while an imported formula is parsed as ours. */
const ALLOWANCE_STAND_IN = '__allowance_row_';
const TOTAL_STAND_IN = { cbe: '__total_cbe', predicted: '__total_predicted' } as const;

/** What a formula read back from a workbook says, or why it cannot be read. */
export type ReadFormula = Parsed<FormulaNode>;

const budgetSheet = `'?${MASS_BUDGET_SHEET.replace(' ', '\\s')}'?!`;
const budgetRange = (column: string) => new RegExp(`${budgetSheet}\\$?${column}\\$?\\d+:\\$?${column}\\$?\\d+`, 'g');
/** How the export writes an allowance cell and the budget's CBE and predicted columns, as a spreadsheet may write them back. */
const BUDGET_REFERENCES = {
  allowance: new RegExp(`${budgetSheet}\\$?${MASS_BUDGET_COLUMNS.allowance}\\$?(\\d+)(?![0-9:])`, 'g'),
  cbe: budgetRange(MASS_BUDGET_COLUMNS.cbe),
  predicted: budgetRange(MASS_BUDGET_COLUMNS.predicted),
};

/** A cell reference such as D7 or $K$12 where a key belongs. */
const CELL_REFERENCE = /^\$?[A-Za-z]{1,3}\$?[0-9]+$/;

/**
 * Reads a spreadsheet formula (with or without "=") back into our tree: allowance cells and budget sums become
 * PREDICTED, TOTAL_CBE and TOTAL_PREDICTED again, IF(comparison,1,0) the comparison. `keyAtBudgetRow` names the
 * mass row the workbook's mass-budget sheet holds at a row. References to cells, sheets or other files are refused.
 */
export function fromSpreadsheetFormula(text: string, keyAtBudgetRow: (row: number) => string | undefined): ReadFormula {
  const trimmed = text
    .trim()
    .replace(/^=?/, '=')
    .replace(/\b_xlfn\./gi, '');
  // Most formulas name no other sheet: only those go through the mass-budget patterns.
  const substituted = !trimmed.includes('!')
    ? trimmed
    : trimmed
        .replace(BUDGET_REFERENCES.allowance, (_all, row: string) => `${ALLOWANCE_STAND_IN}${row}`)
        .replace(BUDGET_REFERENCES.cbe, TOTAL_STAND_IN.cbe)
        .replace(BUDGET_REFERENCES.predicted, TOTAL_STAND_IN.predicted);
  if (/[!$:[\]]/.test(substituted)) {
    return { ok: false, message: 'it refers to cells or other sheets; formulas name parameter keys (the defined names), not cells' };
  }
  let tree: FormulaNode;
  try {
    tree = parseFormula(substituted);
  } catch (error) {
    if (error instanceof FormulaSyntaxError) return { ok: false, message: `it does not parse: ${error.message}` };
    throw error;
  }
  let problem: string | undefined;
  const restore = (node: FormulaNode): FormulaNode => {
    switch (node.kind) {
      case 'number':
        return node;
      case 'ref':
        if (node.key.startsWith('__')) problem ??= 'it uses a mass-budget cell outside PREDICTED, TOTAL_CBE or TOTAL_PREDICTED';
        else if (CELL_REFERENCE.test(node.key)) problem ??= `it refers to the cell ${node.key}; name parameter keys instead`;
        return node;
      case 'unary':
      case 'percent':
        return { ...node, operand: restore(node.operand) };
      case 'binary': {
        const predicted = predictedOf(node, keyAtBudgetRow);
        return predicted ?? { ...node, left: restore(node.left), right: restore(node.right) };
      }
      case 'call': {
        const [first, second, third] = node.args;
        if (
          node.name === 'IF' &&
          node.args.length === 3 &&
          first?.kind === 'binary' &&
          COMPARISONS.has(first.op) &&
          second?.kind === 'number' &&
          second.value === 1 &&
          third?.kind === 'number' &&
          third.value === 0
        )
          return restore(first);
        if (node.name === 'SUM' && node.args.length === 1 && first?.kind === 'ref') {
          if (first.key === TOTAL_STAND_IN.cbe) return { kind: 'call', name: 'TOTAL_CBE', args: [] };
          if (first.key === TOTAL_STAND_IN.predicted) return { kind: 'call', name: 'TOTAL_PREDICTED', args: [] };
        }
        if (node.name === 'NA' && node.args.length === 0) problem ??= 'it is NA(): the row it read is no longer a mass row';
        return { ...node, args: node.args.map(restore) };
      }
    }
  };
  const restored = restore(tree);
  return problem === undefined ? { ok: true, value: restored } : { ok: false, message: problem };
}

/** k × (1 + allowance cell of k's budget line), as the export writes PREDICTED(k). */
function predictedOf(node: Extract<FormulaNode, { kind: 'binary' }>, keyAtBudgetRow: (row: number) => string | undefined) {
  const { left, right } = node;
  if (node.op !== '*' || left.kind !== 'ref' || right.kind !== 'binary' || right.op !== '+') return undefined;
  const one = right.left;
  const allowance = right.right;
  if (one.kind !== 'number' || one.value !== 1 || allowance.kind !== 'ref' || !allowance.key.startsWith(ALLOWANCE_STAND_IN))
    return undefined;
  const row = Number(allowance.key.slice(ALLOWANCE_STAND_IN.length));
  return keyAtBudgetRow(row) === left.key ? ({ kind: 'call', name: 'PREDICTED', args: [left] } as const) : undefined;
}

/** Functions the workbook's own sheets use beside the sheet functions (the budget's allowance look-up and sums). */
const LAYOUT_FUNCTIONS: ReadonlySet<string> = new Set(['INDEX', 'MATCH', 'NA']);

/**
 * The first function a formula calls that neither a sheet formula nor the workbook's layout uses (WEBSERVICE,
 * INDIRECT, HYPERLINK...), or undefined. Text in quotes is skipped.
 */
export function foreignFunction(formula: string): string | undefined {
  const code = formula.replace(/"[^"]*"/g, '""');
  for (const match of code.matchAll(/([A-Za-z_][A-Za-z0-9_.]*)\s*\(/g)) {
    const name = (match[1] ?? '').toUpperCase().replace(/^_XLFN\.|^_XLWS\./, '');
    if (sheetFunctions[name] === undefined && !LAYOUT_FUNCTIONS.has(name)) return name;
  }
  return undefined;
}

/** Whether a formula refers to another file: "[1]Sheet!A1", "'[prices.xlsx]Sheet'!A1" or a DDE link. */
export function refersToOtherFile(formula: string): boolean {
  const code = formula.replace(/"[^"]*"/g, '""');
  return /\[[^\]]*\]/.test(code) || /\|/.test(code);
}
