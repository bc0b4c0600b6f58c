import { bisect, linspace, maximise } from '@/shared/sail/numeric';
import type { Sheet } from '@/shared/schemas/sheet';
import { compileSheet, type CompiledSheet } from '@/shared/engine/compile';
import { rowError, type EngineError } from '@/shared/engine/errors';
import { evaluateSheet } from '@/shared/engine/evaluate';
import { valueInRowUnit } from '@/shared/engine/session';
import { fromSI, toSI, type ParsedUnit } from '@/shared/engine/units';

/**
 * Analyses on the compiled sheet: sweeps of one or two inputs reading outputs, and solving for a target.
 * Values given and returned are in each row's declared unit (text such as "600 m" is converted).
 */

/** One swept input: from and to (inclusive) in `steps` evenly spaced points. */
export interface SweepAxis {
  readonly key: string;
  readonly from: number | string;
  readonly to: number | string;
  readonly steps: number;
}

/** A series of values of one row, in its declared unit. */
export interface Series {
  readonly key: string;
  readonly unit: string;
  readonly values: Float64Array;
}

/** Result of an analysis, or the errors (each naming a key) that prevent it. */
export type AnalysisResult<T> = { ok: true; result: T } | { ok: false; errors: EngineError[] };

/** A sweep of one input: outputs[k].values[i] is output k at input.values[i]; NaN where no finite value exists. */
export interface SweepResult {
  readonly input: Series;
  readonly outputs: Series[];
  /** Points at which at least one output has no finite value. */
  readonly invalidPoints: number;
}

/** A sweep of two inputs: outputs[k].values[iy * x.values.length + ix]. */
export interface Sweep2Result {
  readonly x: Series;
  readonly y: Series;
  readonly outputs: Series[];
  readonly invalidPoints: number;
}

interface Row {
  readonly key: string;
  readonly index: number;
  readonly unit: ParsedUnit;
  readonly unitText: string;
}

interface Prepared {
  readonly compiled: CompiledSheet;
  readonly inputs: Row[];
  readonly outputs: Row[];
}

function prepare(sheet: Sheet, inputKeys: readonly string[], outputKeys: readonly string[]): AnalysisResult<Prepared> {
  const compiled = compileSheet(sheet);
  const failed = new Map(compiled.errors.map((error) => [error.key, error]));
  const errors: EngineError[] = [];
  const find = (key: string, role: 'input' | 'output'): Row | undefined => {
    const index = compiled.analysis.indexOf.get(key);
    const row = index === undefined ? undefined : compiled.analysis.rows[index];
    const problem = failed.get(key);
    if (index === undefined || row === undefined)
      errors.push(rowError(key, 'unknown_key', `no row has this key, so it cannot be an ${role}`));
    else if (problem !== undefined) errors.push(problem);
    else if (role === 'input' && row.formula !== undefined)
      errors.push(rowError(key, 'invalid_argument', 'is a formula, not an input, so it cannot be swept'));
    else if (role === 'input' && row.parameter.protected === true)
      errors.push(rowError(key, 'protected', 'the row is protected, so it cannot be swept'));
    else if (row.unit !== undefined) return { key, index, unit: row.unit, unitText: row.parameter.unit };
    return undefined;
  };
  const inputs = inputKeys.flatMap((key) => find(key, 'input') ?? []);
  const outputs = outputKeys.flatMap((key) => find(key, 'output') ?? []);
  if (outputKeys.length === 0) errors.push(rowError('', 'invalid_argument', 'name at least one output'));
  return errors.length > 0 ? { ok: false, errors } : { ok: true, result: { compiled, inputs, outputs } };
}

function axisPoints(sheet: Sheet, axis: SweepAxis): { ok: true; values: Float64Array } | { ok: false; error: EngineError } {
  const parameter = sheet.parameters.find((candidate) => candidate.key === axis.key);
  if (parameter === undefined) return { ok: false, error: rowError(axis.key, 'unknown_key', 'no row has this key') };
  if (!Number.isInteger(axis.steps) || axis.steps < 2) {
    return {
      ok: false,
      error: rowError(axis.key, 'invalid_argument', `a sweep needs a whole number of at least 2 steps, got ${axis.steps}`),
    };
  }
  const from = valueInRowUnit(parameter, axis.from);
  if (!from.ok) return from;
  const to = valueInRowUnit(parameter, axis.to);
  if (!to.ok) return to;
  return { ok: true, values: Float64Array.from(linspace(from.value, to.value, axis.steps)) };
}

/** Runs a compiled sheet over `points` points; `setInputs` places the SI inputs of each point. Outputs come back in their units. */
function run(
  prepared: Prepared,
  points: number,
  setInputs: (values: Float64Array, point: number) => void,
): { outputs: Float64Array[]; invalid: number } {
  const { compiled, inputs, outputs } = prepared;
  const program = compiled.program(
    inputs.map((input) => input.index),
    outputs.map((output) => output.index),
  );
  const values = compiled.base.slice();
  const series = outputs.map(() => new Float64Array(points));
  let invalid = 0;
  for (let point = 0; point < points; point += 1) {
    setInputs(values, point);
    program(values);
    let valid = true;
    outputs.forEach((output, k) => {
      const value = fromSI(values[output.index] ?? Number.NaN, output.unit);
      const target = series[k];
      if (target !== undefined) target[point] = Number.isFinite(value) ? value : Number.NaN;
      if (!Number.isFinite(value)) valid = false;
    });
    if (!valid) invalid += 1;
  }
  return { outputs: series, invalid };
}

function series(row: Row, values: Float64Array): Series {
  return { key: row.key, unit: row.unitText, values };
}

/** Sweeps one input over an axis and reads the outputs at each point, with the compiled sheet. */
export function sweep(sheet: Sheet, axis: SweepAxis, outputKeys: readonly string[]): AnalysisResult<SweepResult> {
  const points = axisPoints(sheet, axis);
  const prepared = prepare(sheet, [axis.key], outputKeys);
  if (!points.ok) return { ok: false, errors: [points.error, ...(prepared.ok ? [] : prepared.errors)] };
  if (!prepared.ok) return prepared;
  const [input] = prepared.result.inputs;
  if (input === undefined) return { ok: false, errors: [rowError(axis.key, 'unknown_key', 'no row has this key')] };
  const ran = run(prepared.result, points.values.length, (values, point) => {
    values[input.index] = toSI(points.values[point] ?? Number.NaN, input.unit);
  });
  return {
    ok: true,
    result: {
      input: series(input, points.values),
      outputs: prepared.result.outputs.map((output, k) => series(output, ran.outputs[k] ?? new Float64Array())),
      invalidPoints: ran.invalid,
    },
  };
}

/** Sweeps two inputs over a grid (x varies fastest) and reads the outputs at each point. */
export function sweep2(sheet: Sheet, x: SweepAxis, y: SweepAxis, outputKeys: readonly string[]): AnalysisResult<Sweep2Result> {
  const xPoints = axisPoints(sheet, x);
  const yPoints = axisPoints(sheet, y);
  const prepared = prepare(sheet, [x.key, y.key], outputKeys);
  const axisErrors = [xPoints, yPoints].flatMap((points) => (points.ok ? [] : [points.error]));
  if (x.key === y.key) axisErrors.push(rowError(x.key, 'invalid_argument', 'the two swept inputs must be different rows'));
  if (axisErrors.length > 0 || !prepared.ok || !xPoints.ok || !yPoints.ok) {
    return { ok: false, errors: [...axisErrors, ...(prepared.ok ? [] : prepared.errors)] };
  }
  const [xInput, yInput] = prepared.result.inputs;
  if (xInput === undefined || yInput === undefined) return { ok: false, errors: [rowError(x.key, 'unknown_key', 'no row has this key')] };
  const width = xPoints.values.length;
  const ran = run(prepared.result, width * yPoints.values.length, (values, point) => {
    values[xInput.index] = toSI(xPoints.values[point % width] ?? Number.NaN, xInput.unit);
    values[yInput.index] = toSI(yPoints.values[Math.floor(point / width)] ?? Number.NaN, yInput.unit);
  });
  return {
    ok: true,
    result: {
      x: series(xInput, xPoints.values),
      y: series(yInput, yPoints.values),
      outputs: prepared.result.outputs.map((output, k) => series(output, ran.outputs[k] ?? new Float64Array())),
      invalidPoints: ran.invalid,
    },
  };
}

/** One input scanned over a range for one output: the points, both rows, and the output (SI) at an input value (row unit). */
interface Scan {
  readonly points: Float64Array;
  readonly input: Row;
  readonly output: Row;
  readonly outputAt: (x: number) => number;
}

function scanOf(
  sheet: Sheet,
  request: {
    readonly input: string;
    readonly from: number | string;
    readonly to: number | string;
    readonly output: string;
    readonly samples: number;
  },
): AnalysisResult<Scan> {
  const points = axisPoints(sheet, { key: request.input, from: request.from, to: request.to, steps: request.samples });
  const prepared = prepare(sheet, [request.input], [request.output]);
  if (!points.ok || !prepared.ok)
    return { ok: false, errors: [...(points.ok ? [] : [points.error]), ...(prepared.ok ? [] : prepared.errors)] };
  const [input] = prepared.result.inputs;
  const [output] = prepared.result.outputs;
  if (input === undefined || output === undefined)
    return { ok: false, errors: [rowError(request.output, 'unknown_key', 'no row has this key')] };
  const program = prepared.result.compiled.program([input.index], [output.index]);
  const values = prepared.result.compiled.base.slice();
  const outputAt = (x: number): number => {
    values[input.index] = toSI(x, input.unit);
    program(values);
    return values[output.index] ?? Number.NaN;
  };
  return { ok: true, result: { points: points.values, input, output, outputAt } };
}

/** Solving for a target: find the value of `input` in [from, to] at which `output` equals `target`. */
export interface TargetSolveRequest {
  readonly input: string;
  readonly from: number | string;
  readonly to: number | string;
  readonly output: string;
  readonly target: number | string;
  /** Points scanned for a sign change before refining (default 200). */
  readonly samples?: number;
}

/** A value with its row and unit. */
export interface RowValue {
  readonly key: string;
  readonly value: number;
  readonly unit: string;
}

export type TargetSolveResult =
  | { readonly status: 'solved'; readonly input: RowValue; readonly output: RowValue }
  | { readonly status: 'no_solution'; readonly message: string };

/**
 * Solving for a target by scanning the range for a sign change of output − target, then bisecting.
 * The answer is checked by evaluating the sheet with HyperFormula at the value found; the output
 * reported is HyperFormula's. When the range holds no solution, says what the output spans there.
 */
export function solveForTarget(sheet: Sheet, request: TargetSolveRequest): AnalysisResult<TargetSolveResult> {
  const scan = scanOf(sheet, { ...request, samples: request.samples ?? 200 });
  const outputParameter = sheet.parameters.find((candidate) => candidate.key === request.output);
  const target = outputParameter === undefined ? undefined : valueInRowUnit(outputParameter, request.target);
  if (!scan.ok || target?.ok !== true) {
    return { ok: false, errors: [...(scan.ok ? [] : scan.errors), ...(target?.ok === false ? [target.error] : [])] };
  }
  const { points, input, output, outputAt } = scan.result;
  const residual = (x: number): number => fromSI(outputAt(x), output.unit) - target.value;
  const residuals = Array.from(points, residual);
  const solution = findRoot(points, residuals, residual);
  if (solution === undefined) {
    return {
      ok: true,
      result: { status: 'no_solution', message: noSolutionMessage(request, points, residuals, target.value, input, output) },
    };
  }
  const checked = evaluateSheet(sheet, { [input.key]: solution }).values[output.key];
  if (checked === undefined) {
    return { ok: false, errors: [rowError(output.key, 'invalid_value', `has no value at ${input.key} = ${solution} ${input.unitText}`)] };
  }
  return {
    ok: true,
    result: { status: 'solved', input: { key: input.key, value: solution, unit: input.unitText }, output: { key: output.key, ...checked } },
  };
}

/** The first root in a bracket of the scanned points; `residuals` are the residuals at `points`. */
function findRoot(points: Float64Array, residuals: readonly number[], residual: (x: number) => number): number | undefined {
  for (let index = 0; index < points.length; index += 1) {
    const here = residuals[index] ?? Number.NaN;
    const x = points[index] ?? Number.NaN;
    if (here === 0) return x;
    const next = residuals[index + 1] ?? Number.NaN;
    const nextX = points[index + 1] ?? Number.NaN;
    if (!Number.isFinite(here) || !Number.isFinite(next) || Math.sign(here) === Math.sign(next)) continue;
    // Tolerance 0: refine down to adjacent doubles.
    const root = bisect(residual, x, nextX, 0);
    // A sign change across a pole is no root: the residual there stays large.
    const scale = Math.max(Math.abs(here), Math.abs(next));
    const left = Math.abs(residual(root));
    if (left <= 1e-9 * scale || left < 1e-12) return root;
  }
  return undefined;
}

function noSolutionMessage(
  request: TargetSolveRequest,
  points: Float64Array,
  residuals: readonly number[],
  target: number,
  input: Row,
  output: Row,
): string {
  const reached = residuals.map((value) => value + target).filter(Number.isFinite);
  const range = `${input.key} from ${points[0]} to ${points[points.length - 1]} ${input.unitText}`;
  if (reached.length === 0) return `${output.key} has no finite value for ${range}`;
  const low = Math.min(...reached);
  const high = Math.max(...reached);
  return `no solution: for ${range}, ${output.key} stays between ${low} and ${high} ${output.unitText} and never reaches ${target} ${output.unitText} (asked: ${String(request.target)})`;
}

/** Find the value of `input` in [from, to] at which `output` is largest. */
export interface MaximumRequest {
  readonly input: string;
  readonly from: number | string;
  readonly to: number | string;
  readonly output: string;
  /** Points scanned before refining around the largest (default 181). */
  readonly samples?: number;
}

/** The input value (its row's unit) where the output is largest, and the output there (HyperFormula's value). */
export type MaximumResult =
  | { readonly status: 'found'; readonly input: RowValue; readonly output: RowValue }
  | { readonly status: 'no_value'; readonly message: string };

/**
 * The largest value of an output row over an input row, on the compiled sheet: the range is scanned
 * and the largest sample refined by golden-section search between its neighbours, so a curve with
 * several humps gives its highest one. The output at the answer is checked with HyperFormula.
 */
export function findMaximum(sheet: Sheet, request: MaximumRequest): AnalysisResult<MaximumResult> {
  const scan = scanOf(sheet, { ...request, samples: request.samples ?? 181 });
  if (!scan.ok) return scan;
  const { points, input, output } = scan.result;
  const outputAt = (x: number): number => {
    const value = scan.result.outputAt(x);
    return Number.isFinite(value) ? value : Number.NEGATIVE_INFINITY;
  };
  const samples = Array.from(points, outputAt);
  let top = -1;
  samples.forEach((value, index) => {
    if (value > Number.NEGATIVE_INFINITY && (top < 0 || value > (samples[top] ?? Number.NEGATIVE_INFINITY))) top = index;
  });
  if (top < 0) {
    const range = `${input.key} from ${points[0]} to ${points[points.length - 1]} ${input.unitText}`;
    return { ok: true, result: { status: 'no_value', message: `${output.key} has no finite value for ${range}` } };
  }
  const low = points[Math.max(0, top - 1)] ?? Number.NaN;
  const high = points[Math.min(points.length - 1, top + 1)] ?? Number.NaN;
  const best = maximise(outputAt, Math.min(low, high), Math.max(low, high), 1e-12 * Math.max(1, Math.abs(high - low)));
  const checked = evaluateSheet(sheet, { [input.key]: best }).values[output.key];
  if (checked === undefined) {
    return { ok: false, errors: [rowError(output.key, 'invalid_value', `has no value at ${input.key} = ${best} ${input.unitText}`)] };
  }
  return {
    ok: true,
    result: { status: 'found', input: { key: input.key, value: best, unit: input.unitText }, output: { key: output.key, ...checked } },
  };
}
