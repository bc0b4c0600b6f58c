import type { Sheet } from '@/shared/schemas/sheet';
import { rowError, type EngineError } from '@/shared/engine/errors';
import type { FormulaNode } from '@/shared/engine/formula-parser';
import { ALLOWANCE_FUNCTIONS, applyArithmetic, sheetFunctions } from '@/shared/engine/functions';
import { analyseSheet, rowStates, type SheetAnalysis } from '@/shared/engine/sheet-model';
import { applyOverrides, type Evaluation, type Overrides } from '@/shared/engine/evaluate';
import { fromSI } from '@/shared/engine/units';

/**
 * Compiled evaluation for sweeps and solving for a target. Each formula's parsed tree is turned into one
 * JavaScript statement `v[i] = …;` over an array of SI values. The generated code is built only
 * from the tree: row indices, numbers re-printed by the engine, fixed operators and indices into
 * a fixed table of functions. No text the user typed ever reaches the generated source.
 * Statements are split into functions of at most STATEMENTS_PER_CHUNK, because V8 does not
 * optimise one huge function. Where a content security policy forbids generated code (no
 * 'unsafe-eval'), the same trees are evaluated through closures instead: slower, same results.
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
      const args = ALLOWANCE_FUNCTIONS.has(node.name)
        ? node.args.flatMap((arg) => {
            const index = arg.kind === 'ref' ? (indexOf.get(arg.key) ?? -1) : -1;
            return [`v[${index}]`, `a[${index}]`];
          })
        : node.args.map((arg) => expression(arg, indexOf));
      const inline = sheetFunctions[node.name]?.inline;
      return inline === undefined ? `f[${fn}](${args.join(',')})` : inline(args);
    }
  }
}

function compileChunks(statements: readonly string[], allowances: Float64Array): Runner {
  const chunks: Chunk[] = [];
  for (let start = 0; start < statements.length; start += STATEMENTS_PER_CHUNK) {
    const body = `"use strict";${statements.slice(start, start + STATEMENTS_PER_CHUNK).join('\n')}`;
    // The body is generated from parsed trees only (see the note at the top of this file).
    chunks.push(new Function('v', 'f', 'a', body) as Chunk);
  }
  return (values) => {
    for (const chunk of chunks) chunk(values, FUNCTION_TABLE, allowances);
  };
}

type Closure = (values: Float64Array) => number;
type Runner = (values: Float64Array) => void;

function closureOf(node: FormulaNode, indexOf: ReadonlyMap<string, number>, allowances: Float64Array): Closure {
  switch (node.kind) {
    case 'number': {
      const value = node.value;
      return () => value;
    }
    case 'ref': {
      const index = indexOf.get(node.key) ?? -1;
      return (values) => values[index] ?? Number.NaN;
    }
    case 'unary': {
      const operand = closureOf(node.operand, indexOf, allowances);
      return node.op === '-' ? (values) => -operand(values) : operand;
    }
    case 'percent': {
      const operand = closureOf(node.operand, indexOf, allowances);
      return (values) => operand(values) / 100;
    }
    case 'binary': {
      const { op } = node;
      const left = closureOf(node.left, indexOf, allowances);
      const right = closureOf(node.right, indexOf, allowances);
      return (values) => applyArithmetic(op, left(values), right(values));
    }
    case 'call': {
      const evaluate = sheetFunctions[node.name]?.evaluate ?? (() => Number.NaN);
      if (ALLOWANCE_FUNCTIONS.has(node.name)) {
        const indices = node.args.map((arg) => (arg.kind === 'ref' ? (indexOf.get(arg.key) ?? -1) : -1));
        return (values) => evaluate(...indices.flatMap((index) => [values[index] ?? Number.NaN, allowances[index] ?? Number.NaN]));
      }
      const args = node.args.map((arg) => closureOf(arg, indexOf, allowances));
      return (values) => evaluate(...args.map((arg) => arg(values)));
    }
  }
}

let generatedCodeAllowed: boolean | undefined;

/** Whether this JavaScript environment runs generated functions (a strict content security policy forbids them). */
function generatedCodeAvailable(): boolean {
  if (generatedCodeAllowed === undefined) {
    try {
      generatedCodeAllowed = new Function('return true')() === true;
    } catch {
      generatedCodeAllowed = false;
    }
  }
  return generatedCodeAllowed;
}

/** How to compile: generated functions where the environment allows them (the default), else closures. */
export interface CompileOptions {
  readonly generatedCode?: boolean;
  /**
   * Another version of the sheet (another revision), compiled: its analysis of the rows that did not change is
   * reused (see analyseSheet), and its compiled functions when they would be generated the same.
   */
  readonly reuse?: CompiledSheet;
}

/** A sheet compiled to plain functions over SI values, indexed like the sheet's rows. */
export interface CompiledSheet {
  readonly analysis: SheetAnalysis;
  /** Rows that cannot be evaluated (static errors: syntax, units, dimensions, cycles and their dependents). */
  readonly errors: readonly EngineError[];
  /** SI values of every row at the sheet's own inputs (NaN where a row has an error). */
  readonly base: Float64Array;
  /**
   * Recomputes every formula row without an error, in place in an SI value array, from the inputs there:
   * with the functions `base` was computed with, so no code is generated again.
   */
  evaluate(values: Float64Array): void;
  /**
   * A function that recomputes, in place in an SI value array, the rows that depend on `inputs`
   * and that `outputs` need; other rows keep their value.
   */
  program(inputs: readonly number[], outputs: readonly number[]): (values: Float64Array) => void;
}

/** Row indices reachable from `start` (included) along `edges`: a graph's `dependencies` (upstream) or `dependents` (downstream). */
export function reachable(start: readonly number[], edges: readonly (readonly number[])[]): Set<number> {
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

/** The formula rows a runner computes, in order, and how its code was generated. */
interface GeneratedFrom {
  readonly rows: readonly { readonly index: number; readonly formula: FormulaNode }[];
  readonly generatedCode: boolean;
  readonly evaluate: Runner;
}

/** What each compiled sheet's `evaluate` was generated from, so that another version of the sheet can reuse it. */
const generatedFrom = new WeakMap<CompiledSheet, GeneratedFrom>();

/**
 * The `evaluate` of `previous` when `code` would generate the same: same dependency graph (so the same keys
 * in the same places) and the same formula trees in the same rows. Trees are the same objects only in rows
 * whose analysis was reused, so the growth allowances they read are the same too.
 */
function reusableRunner(previous: CompiledSheet | undefined, analysis: SheetAnalysis, code: Omit<GeneratedFrom, 'evaluate'>) {
  const before = previous === undefined ? undefined : generatedFrom.get(previous);
  if (before === undefined || previous?.analysis.graph !== analysis.graph || before.generatedCode !== code.generatedCode) return undefined;
  const sameRows =
    before.rows.length === code.rows.length &&
    code.rows.every((row, at) => row.index === before.rows[at]?.index && row.formula === before.rows[at]?.formula);
  return sameRows ? before.evaluate : undefined;
}

/**
 * Compiles a sheet. Rows with static errors are left out (their values stay NaN) and listed in
 * `errors`; inputs and material values are placed in `base`.
 */
export function compileSheet(sheet: Sheet, options: CompileOptions = {}): CompiledSheet {
  const analysis = analyseSheet(sheet, options.reuse?.analysis);
  const states = rowStates(analysis, () => undefined);
  const allowances = new Float64Array(analysis.rows.map((row) => row.allowance ?? Number.NaN));
  const generatedCode = options.generatedCode ?? generatedCodeAvailable();
  const formulaRows = (indices: readonly number[]) =>
    indices.flatMap((index) => {
      const formula = states[index] === undefined ? analysis.rows[index]?.formula : undefined;
      return formula === undefined ? [] : [{ index, formula }];
    });
  const build = (rows: GeneratedFrom['rows']): Runner => {
    if (generatedCode) {
      return compileChunks(
        rows.map(({ index, formula }) => `v[${index}]=${expression(formula, analysis.indexOf)};`),
        allowances,
      );
    }
    const closures = rows.map(({ index, formula }) => ({ index, closure: closureOf(formula, analysis.indexOf, allowances) }));
    return (values) => {
      for (const { index, closure } of closures) values[index] = closure(values);
    };
  };
  const base = new Float64Array(
    analysis.rows.map((row, index) => (states[index] === undefined ? (row.siValue ?? Number.NaN) : Number.NaN)),
  );
  const code = { rows: formulaRows(analysis.graph.order), generatedCode };
  const evaluate = reusableRunner(options.reuse, analysis, code) ?? build(code.rows);
  evaluate(base);
  const compiled: CompiledSheet = {
    analysis,
    errors: states.filter((state): state is EngineError => state !== undefined),
    base,
    evaluate,
    program: (inputs, outputs) => {
      const downstream = reachable(inputs, analysis.graph.dependents);
      const upstream = reachable(outputs, analysis.graph.dependencies);
      return build(
        formulaRows(analysis.graph.order.filter((index) => downstream.has(index) && upstream.has(index) && !inputs.includes(index))),
      );
    },
  };
  generatedFrom.set(compiled, { ...code, evaluate });
  return compiled;
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
export function evaluateCompiled(sheet: Sheet, overrides: Overrides = {}, options: CompileOptions = {}): Evaluation {
  const overridden = applyOverrides(sheet, overrides);
  const compiled = compileSheet(overridden.sheet, options);
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
    errors.push(
      upstreamKey === undefined
        ? nonFiniteError(key, value)
        : rowError(key, 'dependency_error', `depends on ${upstreamKey}, which has an error`),
    );
  }
  const order = new Map(rows.map((row, index) => [row.parameter.key, index]));
  errors.push(...compiled.errors);
  errors.sort((a, b) => (order.get(a.key) ?? -1) - (order.get(b.key) ?? -1));
  return { values, errors };
}
