import { growthAllowance } from '@/shared/budget/allowance';
import { allowancePresets, findPreset } from '@/shared/budget/presets';
import type { AllowancePreset } from '@/shared/budget/types';
import { materialProperty } from '@/shared/sail/materials';
import type { Parameter, Sheet } from '@/shared/schemas/sheet';
import { parameterKeyProblem } from '@/shared/schemas/sheet';
import { rowError, type EngineError, type EngineErrorCode } from '@/shared/engine/errors';
import { FormulaSyntaxError, parseFormula, referencedKeys, type FormulaNode } from '@/shared/engine/formula-parser';
import { MASS_TOTAL_FUNCTIONS, powerDimension, sheetFunctions } from '@/shared/engine/functions';
import {
  DIMENSIONLESS,
  formatDimension,
  parseUnit,
  sameDimension,
  toSI,
  type Dimension,
  type Parsed,
  type ParsedUnit,
} from '@/shared/engine/units';

/**
 * Static analysis of a sheet: each row's unit, parsed formula, SI input value and dimension
 * check, then the dependency graph with its cycles and an evaluation order. Nothing here
 * evaluates formulas; it decides what may be evaluated and what each row depends on.
 */

/** One analysed row. `error` is the row's own problem, before looking at its dependencies. */
export interface AnalysedRow {
  readonly parameter: Parameter;
  readonly unit: ParsedUnit | undefined;
  readonly formula: FormulaNode | undefined;
  /** SI value of an input or material row. */
  readonly siValue: number | undefined;
  /** Growth allowance (fraction) of a mass row, when the sheet's preset gives one. */
  readonly allowance: number | undefined;
  readonly dependencies: readonly string[];
  readonly error: EngineError | undefined;
}

/** What analysing one row needs to know about the rest of the sheet. */
export interface RowContext {
  parameterOf(key: string): Parameter | undefined;
  /** Keys of the sheet's mass rows (rows with a maturity and category), in sheet order: what TOTAL_CBE() sums. */
  massKeys(): readonly string[];
  readonly budget: Sheet['budget'];
}

class RowProblem extends Error {
  constructor(
    readonly code: EngineErrorCode,
    message: string,
  ) {
    super(message);
  }
}

/** The allowance preset of a sheet: the craft's own table when it carries one, else the preset it names; or why there is none. */
export function sheetPreset(budget: Sheet['budget']): Parsed<AllowancePreset> {
  if (budget === undefined) return { ok: false, message: 'the sheet names no allowance preset (budget.preset)' };
  if (budget.table !== undefined) return { ok: true, value: budget.table };
  const preset = findPreset(budget.preset);
  if (preset === undefined) {
    const known = allowancePresets.map((candidate) => candidate.id).join(', ');
    return { ok: false, message: `unknown allowance preset "${budget.preset}" (known: ${known})` };
  }
  return { ok: true, value: preset };
}

/** The growth allowance of a mass row under the sheet's preset, or why there is none. */
export function rowAllowance(parameter: Parameter, budget: Sheet['budget']): Parsed<number> {
  if (parameter.mass === undefined) {
    return { ok: false, message: `${parameter.key} is not a mass row (it has no maturity and category)` };
  }
  const preset = sheetPreset(budget);
  if (!preset.ok) return preset;
  try {
    return { ok: true, value: growthAllowance(preset.value, parameter.mass.maturity, parameter.mass.category) };
  } catch (error) {
    return { ok: false, message: `${parameter.key}: ${error instanceof Error ? error.message : String(error)}` };
  }
}

function mismatch(what: string, left: Dimension, right: Dimension): RowProblem {
  return new RowProblem('dimension_mismatch', `${what} ${formatDimension(left)} and ${formatDimension(right)}`);
}

/**
 * Dimension of a formula's result from the declared units of the rows it reads.
 * Undefined when a row it reads has no usable unit (that row carries the error).
 * Throws RowProblem for unknown functions, wrong argument counts and inconsistent dimensions.
 */
function inferDimension(node: FormulaNode, context: RowContext): Dimension | undefined {
  switch (node.kind) {
    case 'number':
      return DIMENSIONLESS;
    case 'ref': {
      const parameter = context.parameterOf(node.key);
      if (parameter === undefined) throw new RowProblem('unknown_key', `unknown key "${node.key}" in the formula`);
      const unit = parseUnit(parameter.unit);
      return unit.ok ? unit.value.dimension : undefined;
    }
    case 'unary':
    case 'percent':
      return inferDimension(node.operand, context);
    case 'binary': {
      const left = inferDimension(node.left, context);
      const right = inferDimension(node.right, context);
      if (left === undefined || right === undefined) return undefined;
      switch (node.op) {
        case '*':
          return left.map((value, index) => value + (right[index] ?? 0));
        case '/':
          return left.map((value, index) => value - (right[index] ?? 0));
        case '^': {
          const power = powerDimension(left, right, node.right);
          if (typeof power === 'string') throw new RowProblem('dimension_mismatch', power);
          return power;
        }
        case '+':
        case '-':
          if (!sameDimension(left, right)) throw mismatch(`cannot ${node.op === '+' ? 'add' : 'subtract'}`, left, right);
          return left;
        default:
          if (!sameDimension(left, right)) throw mismatch(`cannot compare (${node.op})`, left, right);
          return DIMENSIONLESS;
      }
    }
    case 'call':
      return inferCallDimension(node, context);
  }
}

function inferCallDimension(node: Extract<FormulaNode, { kind: 'call' }>, context: RowContext): Dimension | undefined {
  const fn = sheetFunctions[node.name];
  if (fn === undefined) {
    const known = Object.keys(sheetFunctions).join(', ');
    throw new RowProblem('unknown_function', `unknown or unsupported function ${node.name} (supported: ${known})`);
  }
  if (node.args.length < fn.minArgs || node.args.length > fn.maxArgs) {
    const expected = fn.minArgs === fn.maxArgs ? `${fn.minArgs}` : `${fn.minArgs} to ${fn.maxArgs}`;
    throw new RowProblem('wrong_argument_count', `${node.name} takes ${expected} argument(s), got ${node.args.length}`);
  }
  if (node.name === 'PREDICTED') checkPredictedArgument(node.args[0], context);
  if (node.name === 'TOTAL_PREDICTED') node.args.forEach((arg) => checkPredictedArgument(arg, context, 'TOTAL_PREDICTED()'));
  const args = node.args.map((arg) => inferDimension(arg, context));
  if (args.some((arg) => arg === undefined)) return undefined;
  const result = fn.dimension(
    args.map((arg) => arg ?? DIMENSIONLESS),
    node.args,
  );
  if (typeof result === 'string') throw new RowProblem('dimension_mismatch', result);
  return result;
}

function checkPredictedArgument(arg: FormulaNode | undefined, context: RowContext, call?: string): void {
  if (arg?.kind !== 'ref') throw new RowProblem('invalid_argument', 'PREDICTED takes the key of a mass row, e.g. PREDICTED(bus_mass)');
  const target = context.parameterOf(arg.key);
  if (target === undefined) throw new RowProblem('unknown_key', `unknown key "${arg.key}" in the formula`);
  const allowance = rowAllowance(target, context.budget);
  if (!allowance.ok) {
    throw new RowProblem(
      target.mass === undefined ? 'invalid_argument' : 'budget_error',
      `${call ?? `PREDICTED(${arg.key})`}: ${allowance.message}`,
    );
  }
}

/**
 * Writes TOTAL_CBE() and TOTAL_PREDICTED() out as calls on a reference to every mass row, so the
 * dependency graph, incremental recompute, HyperFormula and the compiled path all see those rows.
 * Throws RowProblem when either is given arguments: the sheet's mass rows are the arguments.
 */
function expandMassTotals(node: FormulaNode, context: RowContext): FormulaNode {
  switch (node.kind) {
    case 'number':
    case 'ref':
      return node;
    case 'unary':
    case 'percent':
      return { ...node, operand: expandMassTotals(node.operand, context) };
    case 'binary':
      return { ...node, left: expandMassTotals(node.left, context), right: expandMassTotals(node.right, context) };
    case 'call': {
      if (!MASS_TOTAL_FUNCTIONS.has(node.name)) return { ...node, args: node.args.map((arg) => expandMassTotals(arg, context)) };
      if (node.args.length > 0) {
        throw new RowProblem('wrong_argument_count', `${node.name}() takes no arguments: it sums every mass row of the sheet`);
      }
      return { ...node, args: context.massKeys().map((key) => ({ kind: 'ref', key })) };
    }
  }
}

/** Whether a formula's text calls TOTAL_CBE or TOTAL_PREDICTED (also when it has an error), so its references follow the mass rows. */
export function mentionsMassTotals(formula: string | undefined): boolean {
  return formula !== undefined && /\bTOTAL_(?:CBE|PREDICTED)\s*\(/i.test(formula);
}

function inputValue(parameter: Parameter, unit: ParsedUnit): number {
  if (parameter.material !== undefined) {
    const { id, property } = parameter.material;
    const found = materialProperty(id, property);
    if (found === undefined)
      throw new RowProblem('unknown_material', `the materials library has no property "${property}" for material "${id}"`);
    const materialUnit = parseUnit(found.unit);
    if (!materialUnit.ok) throw new RowProblem('unknown_unit', `material "${id}" ${property}: ${materialUnit.message}`);
    if (!sameDimension(materialUnit.value.dimension, unit.dimension)) {
      throw new RowProblem(
        'dimension_mismatch',
        `unit "${parameter.unit}" expects ${formatDimension(unit.dimension)} but material "${id}" ${property} is ${formatDimension(materialUnit.value.dimension)} (${found.unit})`,
      );
    }
    return toSI(found.value, materialUnit.value);
  }
  const value = parameter.value;
  if (value === undefined || !Number.isFinite(value)) {
    throw new RowProblem('invalid_value', `value must be a finite number, got ${String(value)}`);
  }
  return toSI(value, unit);
}

/** A row's formula parsed and its mass totals expanded, or the problem (a RowProblem when the totals are misused). */
function parseRowFormula(formulaText: string, context: RowContext): Parsed<FormulaNode> | RowProblem {
  try {
    return { ok: true, value: expandMassTotals(parseFormula(formulaText), context) };
  } catch (error) {
    if (error instanceof FormulaSyntaxError) return { ok: false, message: `syntax error in "${formulaText}": ${error.message}` };
    if (error instanceof RowProblem) return error;
    throw error;
  }
}

function checkFormula(parameter: Parameter, formula: Parsed<FormulaNode> | RowProblem, unit: ParsedUnit, context: RowContext): FormulaNode {
  if (formula instanceof RowProblem) throw formula;
  if (!formula.ok) throw new RowProblem('syntax_error', formula.message);
  const found = inferDimension(formula.value, context);
  if (found !== undefined && !sameDimension(found, unit.dimension)) {
    throw new RowProblem(
      'dimension_mismatch',
      `unit "${parameter.unit}" expects ${formatDimension(unit.dimension)} but the formula gives ${formatDimension(found)}`,
    );
  }
  return formula.value;
}

/** Analyses one row against the rest of the sheet. Never throws: problems go into `error`. */
export function analyseRow(parameter: Parameter, context: RowContext): AnalysedRow {
  const allowance = parameter.mass === undefined ? undefined : rowAllowance(parameter, context.budget);
  const formula = parameter.formula === undefined ? undefined : parseRowFormula(parameter.formula, context);
  const base = {
    parameter,
    unit: undefined,
    formula: undefined,
    siValue: undefined,
    allowance: allowance?.ok === true ? allowance.value : undefined,
    dependencies: formula !== undefined && !(formula instanceof RowProblem) && formula.ok ? referencedKeys(formula.value) : [],
    error: undefined,
  };
  const keyProblem = parameterKeyProblem(parameter.key);
  if (keyProblem !== undefined) return { ...base, error: rowError(parameter.key, 'invalid_key', `key ${keyProblem}`) };
  const unit = parseUnit(parameter.unit);
  if (!unit.ok) return { ...base, error: rowError(parameter.key, 'unknown_unit', unit.message) };
  try {
    const given = [parameter.value, parameter.formula, parameter.material].filter((field) => field !== undefined);
    if (given.length !== 1) throw new RowProblem('invalid_value', 'needs exactly one of a value, a formula or a material');
    if (formula !== undefined) return { ...base, unit: unit.value, formula: checkFormula(parameter, formula, unit.value, context) };
    return { ...base, unit: unit.value, siValue: inputValue(parameter, unit.value) };
  } catch (error) {
    if (!(error instanceof RowProblem)) throw error;
    return { ...base, unit: unit.value, error: rowError(parameter.key, error.code, error.message) };
  }
}

/** The dependency graph: indices of each row's dependencies, cycle messages, and an evaluation order. */
export interface DependencyGraph {
  readonly dependencies: readonly (readonly number[])[];
  readonly dependents: readonly (readonly number[])[];
  /** For rows on a cycle, the keys of the cycle. */
  readonly cycles: ReadonlyMap<number, readonly string[]>;
  /** Every row, each after the rows it depends on (rows on one cycle in any order). */
  readonly order: readonly number[];
}

/** Builds the dependency graph of analysed rows (Tarjan's strongly connected components, iterative). */
export function buildGraph(rows: readonly AnalysedRow[], indexOf: ReadonlyMap<string, number>): DependencyGraph {
  const dependencies = rows.map((row) =>
    row.dependencies.flatMap((key) => {
      const index = indexOf.get(key);
      return index === undefined ? [] : [index];
    }),
  );
  const dependents: number[][] = rows.map(() => []);
  dependencies.forEach((list, index) => list.forEach((dependency) => dependents[dependency]?.push(index)));

  const lowLink = new Int32Array(rows.length).fill(-1);
  const visitIndex = new Int32Array(rows.length).fill(-1);
  const onStack = new Uint8Array(rows.length);
  const stack: number[] = [];
  const order: number[] = [];
  const cycles = new Map<number, readonly string[]>();
  let counter = 0;

  const keyAt = (index: number): string => rows[index]?.parameter.key ?? '';
  for (let root = 0; root < rows.length; root += 1) {
    if (visitIndex[root] !== -1) continue;
    const work: { node: number; next: number }[] = [{ node: root, next: 0 }];
    visitIndex[root] = lowLink[root] = counter++;
    stack.push(root);
    onStack[root] = 1;
    while (work.length > 0) {
      const frame = work[work.length - 1];
      if (frame === undefined) break;
      const edges = dependencies[frame.node] ?? [];
      const target = edges[frame.next];
      if (target !== undefined) {
        frame.next += 1;
        if (visitIndex[target] === -1) {
          visitIndex[target] = lowLink[target] = counter++;
          stack.push(target);
          onStack[target] = 1;
          work.push({ node: target, next: 0 });
        } else if (onStack[target] === 1) {
          lowLink[frame.node] = Math.min(lowLink[frame.node] ?? 0, visitIndex[target] ?? 0);
        }
        continue;
      }
      work.pop();
      const parent = work[work.length - 1];
      if (parent !== undefined) lowLink[parent.node] = Math.min(lowLink[parent.node] ?? 0, lowLink[frame.node] ?? 0);
      if (lowLink[frame.node] !== visitIndex[frame.node]) continue;
      const component: number[] = [];
      for (;;) {
        const member = stack.pop();
        if (member === undefined) break;
        onStack[member] = 0;
        component.push(member);
        if (member === frame.node) break;
      }
      component.sort((a, b) => a - b);
      order.push(...component);
      const selfLoop = component.length === 1 && edges.includes(frame.node);
      if (component.length > 1 || selfLoop) {
        const keys = component.map(keyAt);
        component.forEach((member) => cycles.set(member, keys));
      }
    }
  }
  return { dependencies, dependents, cycles, order };
}

/** A whole sheet analysed: rows in sheet order, where each key is, and the dependency graph. */
export interface SheetAnalysis {
  readonly parameters: Parameter[];
  readonly rows: AnalysedRow[];
  readonly indexOf: ReadonlyMap<string, number>;
  graph: DependencyGraph;
  readonly context: RowContext;
  /** Rows whose key an earlier row already uses. */
  readonly duplicates: ReadonlySet<number>;
}

/** (Re-)analyses the row at `index` from `analysis.parameters[index]`. */
export function reanalyseRow(analysis: SheetAnalysis, index: number): void {
  const parameter = analysis.parameters[index];
  if (parameter === undefined) return;
  const row = analyseRow(parameter, analysis.context);
  analysis.rows[index] = analysis.duplicates.has(index)
    ? { ...row, error: rowError(parameter.key, 'duplicate_key', `key is used by more than one row (row ${index + 1})`) }
    : row;
}

/** Whether two versions of a row read the same to the rows whose formulas refer to it: unit, mass category and maturity. */
function sameAsRead(a: Parameter, b: Parameter): boolean {
  return a.unit === b.unit && a.mass?.maturity === b.mass?.maturity && a.mass?.category === b.mass?.category;
}

/**
 * The rows of `previous`, an analysis of another version of the sheet (another revision), that `analysis` may
 * take as they are: same definition, and nothing the analysis of the row read elsewhere changed (the unit,
 * mass category and maturity of the rows it refers to, whether they exist, the allowance preset, and the
 * list of mass rows when it sums them). Undefined for a row to analyse afresh.
 */
function reusableRows(previous: SheetAnalysis, analysis: SheetAnalysis): (index: number) => AnalysedRow | undefined {
  if (previous.context.budget?.preset !== analysis.context.budget?.preset || previous.context.budget?.table !== analysis.context.budget?.table)
    return () => undefined;
  // Keys whose unit or mass changed, or that only one version has.
  const changed = new Set<string>();
  for (const [key, index] of previous.indexOf) {
    const before = previous.parameters[index];
    const after = analysis.context.parameterOf(key);
    if (before === undefined || after === undefined || !sameAsRead(before, after)) changed.add(key);
  }
  for (const key of analysis.indexOf.keys()) if (!previous.indexOf.has(key)) changed.add(key);
  const massBefore = previous.context.massKeys();
  const massAfter = analysis.context.massKeys();
  const sameMassRows = massBefore.length === massAfter.length && massBefore.every((key, index) => key === massAfter[index]);
  return (index) => {
    const parameter = analysis.parameters[index];
    if (parameter === undefined || analysis.duplicates.has(index) || changed.has(parameter.key)) return undefined;
    const row = previous.rows[previous.indexOf.get(parameter.key) ?? -1];
    const before = row?.parameter;
    if (row === undefined || before === undefined) return undefined;
    if (before.value !== parameter.value || before.formula !== parameter.formula) return undefined;
    if (before.material?.id !== parameter.material?.id || before.material?.property !== parameter.material?.property) return undefined;
    if (row.dependencies.some((key) => changed.has(key))) return undefined;
    if (!sameMassRows && mentionsMassTotals(parameter.formula)) return undefined;
    return { ...row, parameter };
  };
}

/** Whether two analyses have the same keys in the same order, each row with the same references: then the same dependency graph. */
function sameGraph(previous: SheetAnalysis, analysis: SheetAnalysis): boolean {
  if (previous.rows.length !== analysis.rows.length || previous.duplicates.size > 0 || analysis.duplicates.size > 0) return false;
  return analysis.rows.every((row, index) => {
    const before = previous.rows[index];
    if (before === undefined || before.parameter.key !== row.parameter.key) return false;
    // Reused rows share their list of references.
    return before.dependencies === row.dependencies || before.dependencies.join(',') === row.dependencies.join(',');
  });
}

/**
 * Analyses every row of a sheet and builds its dependency graph. With `previous`, an analysis of another
 * version of the sheet, rows nothing changed for are taken from it instead of being parsed and checked again,
 * and so is the graph when no reference changed.
 */
export function analyseSheet(sheet: Sheet, previous?: SheetAnalysis): SheetAnalysis {
  const indexOf = new Map<string, number>();
  const duplicates = new Set<number>();
  sheet.parameters.forEach((parameter, index) => {
    if (indexOf.has(parameter.key)) duplicates.add(index);
    else indexOf.set(parameter.key, index);
  });
  const parameters = [...sheet.parameters];
  const context: RowContext = {
    budget: sheet.budget,
    parameterOf: (key) => {
      const index = indexOf.get(key);
      return index === undefined ? undefined : parameters[index];
    },
    // Read from the live parameter list: a session edits it in place.
    massKeys: () =>
      parameters.flatMap((parameter, index) => (parameter.mass !== undefined && !duplicates.has(index) ? [parameter.key] : [])),
  };
  const analysis: SheetAnalysis = { parameters, rows: [], indexOf, graph: buildGraph([], indexOf), context, duplicates };
  const reusable = previous === undefined ? undefined : reusableRows(previous, analysis);
  parameters.forEach((_, index) => {
    const reused = reusable?.(index);
    if (reused === undefined) reanalyseRow(analysis, index);
    else analysis.rows[index] = reused;
  });
  analysis.graph = previous !== undefined && sameGraph(previous, analysis) ? previous.graph : buildGraph(analysis.rows, indexOf);
  return analysis;
}

/** The shortest cycle of references from a row back to itself, as keys ("a -> b -> a": a refers to b). */
function cyclePath(analysis: SheetAnalysis, start: number, component: readonly string[]): string[] {
  const members = new Set(component);
  const { rows, graph } = analysis;
  const keyAt = (index: number): string => rows[index]?.parameter.key ?? '';
  const parent = new Map<number, number>();
  const queue = [start];
  for (let head = 0; head < queue.length; head += 1) {
    const current = queue[head] ?? start;
    for (const next of graph.dependencies[current] ?? []) {
      if (!members.has(keyAt(next))) continue;
      if (next === start) {
        const chain: number[] = [];
        for (let step: number | undefined = current; step !== undefined && step !== start; step = parent.get(step)) chain.push(step);
        return [start, ...chain.reverse(), start].map(keyAt);
      }
      if (parent.has(next)) continue;
      parent.set(next, current);
      queue.push(next);
    }
  }
  return [...component, keyAt(start)];
}

/**
 * Each row's error, in sheet order: its own, its cycle, a dependency's, or (from `result`) one found
 * while evaluating it. Undefined for a row that has a value.
 */
export function rowStates(
  analysis: SheetAnalysis,
  result: (index: number) => number | EngineError | undefined,
): (EngineError | undefined)[] {
  const { rows, graph } = analysis;
  const states: (EngineError | undefined)[] = rows.map(() => undefined);
  for (const index of graph.order) {
    const row = rows[index];
    if (row === undefined) continue;
    const key = row.parameter.key;
    const cycle = graph.cycles.get(index);
    const failedDependency = (graph.dependencies[index] ?? []).find((dependency) => states[dependency] !== undefined);
    const value = result(index);
    if (row.error !== undefined) states[index] = row.error;
    else if (cycle !== undefined)
      states[index] = rowError(key, 'cycle', `is on a cycle of formulas: ${cyclePath(analysis, index, cycle).join(' -> ')}`);
    else if (failedDependency !== undefined) {
      const upstream = rows[failedDependency]?.parameter.key ?? '';
      states[index] = rowError(key, 'dependency_error', `depends on ${upstream}, which has an error`);
    } else if (typeof value === 'object') states[index] = value;
  }
  return states;
}
