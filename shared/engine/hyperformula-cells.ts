import { DetailedCellError, HyperFormula, type CellValue, type RawCellContent } from 'hyperformula';
import { gridError, rowError, type EngineError } from '@/shared/engine/errors';
import type { FormulaNode } from '@/shared/engine/formula-parser';
import { registerOwnFunctions } from '@/shared/engine/hyperformula-functions';
import type { AnalysedRow } from '@/shared/engine/sheet-model';

/**
 * The HyperFormula side of the engine. Row i of the sheet is row i+1 of one HyperFormula sheet:
 * column A holds the SI value or the formula, column B the growth allowance of a mass row.
 * Formulas are written from the parsed tree with absolute cell references in place of keys,
 * fully parenthesised, so HyperFormula evaluates exactly the tree the engine checked.
 */

/** HyperFormula settings: no display rounding and no snapping of small differences to zero, so results are plain IEEE arithmetic. */
export function hyperFormulaConfig(rowCount: number) {
  return {
    licenseKey: 'gpl-v3',
    smartRounding: false,
    precisionEpsilon: 0,
    maxRows: Math.max(40_000, rowCount + 1),
    useStats: false,
  };
}

const COMPARISON_OPERATORS: ReadonlySet<string> = new Set(['=', '<>', '<', '>', '<=', '>=']);

function cell(column: 'A' | 'B', index: number): string {
  return `$${column}$${index + 1}`;
}

/** Writes a parsed formula in HyperFormula syntax, keys replaced by the cells that `indexOf` gives. */
export function toHyperFormulaText(node: FormulaNode, indexOf: (key: string) => number): string {
  switch (node.kind) {
    case 'number':
      return String(node.value);
    case 'ref':
      return cell('A', indexOf(node.key));
    case 'unary':
      return `${node.op}(${toHyperFormulaText(node.operand, indexOf)})`;
    case 'percent':
      return `(${toHyperFormulaText(node.operand, indexOf)})%`;
    case 'binary': {
      const text = `(${toHyperFormulaText(node.left, indexOf)}${node.op}${toHyperFormulaText(node.right, indexOf)})`;
      // A comparison gives 1 or 0, as in the compiled evaluator, so that a row may hold one.
      return COMPARISON_OPERATORS.has(node.op) ? `IF(${text},1,0)` : text;
    }
    case 'call': {
      const first = node.args[0];
      if (node.name === 'PREDICTED' && first?.kind === 'ref') {
        const index = indexOf(first.key);
        return `(${cell('A', index)}*(1+${cell('B', index)}))`;
      }
      // The mass totals, expanded to every mass row: SUM, not a chain of "+", which HyperFormula evaluates
      // recursively (thousands of mass rows would overflow the stack). SUM adds in order from 0, as the roll-up does.
      if (node.name === 'TOTAL_CBE') return `SUM(${['0', ...node.args.map((arg) => toHyperFormulaText(arg, indexOf))].join(',')})`;
      if (node.name === 'TOTAL_PREDICTED') {
        const terms = node.args.map((arg) =>
          arg.kind === 'ref' ? `${cell('A', indexOf(arg.key))}*(1+${cell('B', indexOf(arg.key))})` : 'NA()',
        );
        return `SUM(${['0', ...terms].join(',')})`;
      }
      return `${node.name}(${node.args.map((arg) => toHyperFormulaText(arg, indexOf)).join(',')})`;
    }
  }
}

/** What column A of a row holds: nothing for a row that cannot be evaluated, else its SI value or formula. */
export function cellContent(row: AnalysedRow, onCycle: boolean, indexOf: (key: string) => number): RawCellContent {
  if (row.error !== undefined || onCycle) return null;
  if (row.formula !== undefined) return `=${toHyperFormulaText(row.formula, indexOf)}`;
  return row.siValue ?? null;
}

/** A HyperFormula result as an SI number, or the error of the row that holds it. */
export function readCell(key: string, value: CellValue): number | EngineError {
  if (typeof value === 'number') return value;
  if (value instanceof DetailedCellError) return gridError(key, value.type, value.message);
  if (typeof value === 'boolean') return rowError(key, 'invalid_value', 'the formula gives a logical value (TRUE/FALSE), not a number');
  if (value === null) return rowError(key, 'invalid_value', 'the row has no value');
  return rowError(key, 'invalid_value', 'the formula gives text, not a number');
}

/** Builds the HyperFormula workbook for the given cell contents. */
export function buildWorkbook(columns: readonly (readonly [RawCellContent, RawCellContent])[]): HyperFormula {
  registerOwnFunctions();
  return HyperFormula.buildFromArray(
    columns.map(([a, b]) => [a, b]),
    hyperFormulaConfig(columns.length),
  );
}
