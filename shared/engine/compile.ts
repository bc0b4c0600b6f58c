import type { Sheet } from '@/shared/schemas/sheet';
import { rowError, type EngineError } from '@/shared/engine/errors';
import type { FormulaNode } from '@/shared/engine/formula-parser';
import { sheetFunctions } from '@/shared/engine/functions';
import { analyseSheet, rowStates, type SheetAnalysis } from '@/shared/engine/sheet-model';
import { applyOverrides, type Evaluation, type Overrides } from '@/shared/engine/evaluate';
import { fromSI } from '@/shared/engine/units';

/**
 * Compiled evaluation for sweeps and goal seek. Each formula's parsed tree is turned into one
 * JavaScript statement `v[i] = …;` over an array of SI values. The generated code is built only
 * from the tree: row indices, numbers re-printed by the engine, fixed operators and indices into
 * a fixed table of functions. No text the user typed ever reaches the generated source.
 * Statements are split into functions of at most STATEMENTS_PER_CHUNK, because V8 does not
 * optimise one huge function.
 */
const STATEMENTS_PER_CHUNK = 200;

const FUNCTION_NAMES = Object.keys(sheetFunctions);
const FUNCTION_TABLE = FUNCTION_NAMES.map((name) => sheetFunctions[name]?.evaluate ?? (() => Number.NaN));

type Chunk = (values: Float64Array, functions: typeof FUNCTION_TABLE, allowances: Float64Array) => void;

const COMPARISONS: Readonly<Record<string, string>> = { '=': '===', '<>': '!==', '<': '<', '>': '>', '<=': '<=', '>=': '>=' };

function numberLiteral(value: number): string {
  if (Number.isNaN(value)) return 'NaN';
  if (!Number.isFinite(value)) return value > 0 ? 'Infinity' : '-Infinity';
  return `(${String(value)})`;
}

function expression(node: FormulaNode, indexOf: ReadonlyMap<string, number>): string {
  switch (node.kind) {
    case 'number':
      return numberLiteral(node.value);
    case 'ref':
      return `v[${indexOf.get(node.key) ?? -1}]`;
    case 'unary':
      return `(${node.op}${expression(node.operand, indexOf)})`;
    case 'percent':
      return `(${expression(node.operand, indexOf)}/100)`;
    case 'binary': {
      const left = expression(node.left, indexOf);
      const right = expression(node.right, indexOf);
      if (node.op === '^') return `Math.pow(${left},${right})`;
      const comparison = COMPARISONS[node.op];
      return comparison === undefined ? `(${left}${node.op}${right})` : `(${left}${comparison}${right}?1:0)`;
    }
    case 'call': {
      const fn = FUNCTION_NAMES.indexOf(node.name);
      const first = node.args[0];
      const args =
        node.name === 'PREDICTED' && first?.kind === 'ref'
          ? [`v[${indexOf.get(first.key) ?? -1}]`, `a[${indexOf.get(first.key) ?? -1}]`]
          : node.args.map((arg) => expression(arg, indexOf));
      const inline = sheetFunctions[node.name]?.inline;
      return inline === undefined ? `f[${fn}](${args.join(',')})` : inline(args);
    }
  }
}

function compileChunks(statements: readonly string[]): Chunk[] {
  const chunks: Chunk[] = [];
  for (let start = 0; start < statements.length; start += STATEMENTS_PER_CHUNK) {
    const body = `"use strict";${statements.slice(start, start + STATEMENTS_PER_CHUNK).join('\n')}`;
    // The body is generated from parsed trees only (see the note at the top of this file).
    chunks.push(new Function('v', 'f', 'a', body) as Chunk);
  }
  return chunks;
}

/** A sheet compiled to plain functions over SI values, indexed like the sheet's rows. */
export interface CompiledSheet {
  readonly analysis: SheetAnalysis;
  /** Rows that cannot be evaluated (static errors: syntax, units, dimensions, cycles and their dependents). */
  readonly errors: readonly EngineError[];
  /** SI values of every row at the sheet's own inputs (NaN where a row has an error). */
  readonly base: Float64Array;
  /**
   * A function that recomputes, in place in an SI value array, the rows that depend on `inputs`
   * and that `outputs` need; other rows keep their value.
   */
  program(inputs: readonly number[], outputs: readonly number[]): (values: Float64Array) => void;
}

function closure(start: readonly number[], edges: readonly (readonly number[])[]): Set<number> {
  const seen = new Set<number>(start);
  const pending = [...start];
  for (let next = pending.pop(); next !== undefined; next = pending.pop()) {
    for (const neighbour of edges[next] ?? []) {
      if (seen.has(neighbour)) continue;
      seen.add(neighbour);
      pending.push(neighbour);
    }
  }
  return seen;
}

/**
 * Compiles a sheet. Rows with static errors are left out (their values stay NaN) and listed in
 * `errors`; inputs and material values are placed in `base`.
 */
export function compileSheet(sheet: Sheet): CompiledSheet {
  const analysis = analyseSheet(sheet);
  const states = rowStates(analysis, () => undefined);
  const allowances = new Float64Array(analysis.rows.map((row) => row.allowance ?? Number.NaN));
  const statementOf = (index: number): string | undefined => {
    const row = analysis.rows[index];
    if (row?.formula === undefined || states[index] !== undefined) return undefined;
    return `v[${index}]=${expression(row.formula, analysis.indexOf)};`;
  };
  const build = (indices: readonly number[]): ((values: Float64Array) => void) => {
    const chunks = compileChunks(indices.flatMap((index) => statementOf(index) ?? []));
    return (values) => {
      for (const chunk of chunks) chunk(values, FUNCTION_TABLE, allowances);
    };
  };
  const base = new Float64Array(analysis.rows.map((row, index) => (states[index] === undefined ? (row.siValue ?? Number.NaN) : Number.NaN)));
  build(analysis.graph.order)(base);
  return {
    analysis,
    errors: states.filter((state): state is EngineError => state !== undefined),
    base,
    program: (inputs, outputs) => {
      const downstream = closure(inputs, analysis.graph.dependents);
      const upstream = closure(outputs, analysis.graph.dependencies);
      return build(analysis.graph.order.filter((index) => downstream.has(index) && upstream.has(index) && !inputs.includes(index)));
    },
  };
}

/** Why a compiled evaluation gave no finite value for a row. */
function nonFiniteError(key: string, value: number): EngineError {
  return rowError(
    key,
    'invalid_value',
    Number.isNaN(value)
      ? 'the result is not a number (a division 0/0, or a root or logarithm of a negative number)'
      : 'the result is infinite (a division by zero or an overflow)',
  );
}

/**
 * Evaluates a sheet with the compiled functions instead of HyperFormula, in the shape of
 * evaluateSheet. Used to cross-check the compiled path against HyperFormula.
 */
export function evaluateCompiled(sheet: Sheet, overrides: Overrides = {}): Evaluation {
  const overridden = applyOverrides(sheet, overrides);
  const compiled = compileSheet(overridden.sheet);
  const errors: EngineError[] = [...overridden.errors];
  const failed = new Set(compiled.errors.map((error) => error.key));
  const values: Evaluation['values'] = {};
  const { rows, graph } = compiled.analysis;
  const invalid = new Set<number>();
  for (const index of graph.order) {
    const row = rows[index];
    const value = compiled.base[index] ?? Number.NaN;
    if (row === undefined || row.unit === undefined || failed.has(row.parameter.key)) continue;
    const key = row.parameter.key;
    if (Number.isFinite(value)) {
      values[key] = { value: row.parameter.value ?? fromSI(value, row.unit), unit: row.parameter.unit };
      continue;
    }
    invalid.add(index);
    const upstream = (graph.dependencies[index] ?? []).find((dependency) => invalid.has(dependency));
    const upstreamKey = upstream === undefined ? undefined : rows[upstream]?.parameter.key;
    errors.push(upstreamKey === undefined ? nonFiniteError(key, value) : rowError(key, 'dependency_error', `depends on ${upstreamKey}, which has an error`));
  }
  const order = new Map(rows.map((row, index) => [row.parameter.key, index]));
  errors.push(...compiled.errors);
  errors.sort((a, b) => (order.get(a.key) ?? -1) - (order.get(b.key) ?? -1));
  return { values, errors };
}
