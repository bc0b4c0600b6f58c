import { compileSheet, reachable, type CompiledSheet } from '@/shared/engine/compile';
import type { FormulaNode } from '@/shared/engine/formula-parser';
import { ALLOWANCE_FUNCTIONS } from '@/shared/engine/functions';
import { fromSI, sameDimension, type ParsedUnit } from '@/shared/engine/units';
import type {
  FieldChange,
  HeaderChange,
  InputShare,
  MovedOutput,
  OutputChange,
  RowChange,
  RowDiff,
  SheetComparison,
  UpstreamChange,
} from '@/shared/schemas/compare';
import type { Parameter, Sheet } from '@/shared/schemas/sheet';

/**
 * Two sheets compared: which rows were added, removed and changed, every computed row's old and new value,
 * and what moved one output. Each side is compiled and evaluated once (shared/engine/compile.ts); what moved
 * an output re-runs the compiled functions of `to` once per changed input upstream of it, generating no code.
 */

/** One side of a comparison: the sheet, and the sheet compiled and evaluated at its own inputs. */
export interface EvaluatedSide {
  readonly sheet: Sheet;
  readonly compiled: CompiledSheet;
}

/** Both sides of a comparison. */
export interface EvaluatedPair {
  readonly from: EvaluatedSide;
  readonly to: EvaluatedSide;
}

/**
 * Compiles and evaluates both sheets, each once. `reuse`, another version of the sheet compiled (the last one
 * compiled, say), saves analysing again the rows it holds unchanged, and generating code again when the
 * formulas are all the same; the side compiled second reuses the first the same way. Reuse never changes a
 * result: each side is evaluated at its own inputs, and a row's analysis is reused only where its definition
 * and everything its analysis read are the same (see analyseSheet and compileSheet).
 */
export function evaluatePair(from: Sheet, to: Sheet, reuse?: CompiledSheet): EvaluatedPair {
  const compiledFrom = compileSheet(from, { reuse });
  const compiledTo = compileSheet(to, { reuse: compiledFrom });
  return { from: { sheet: from, compiled: compiledFrom }, to: { sheet: to, compiled: compiledTo } };
}

/** One row of a side, found by key, with its SI value (NaN when it has none) and unit. */
interface SideRow {
  readonly index: number;
  readonly parameter: Parameter;
  readonly unit: ParsedUnit | undefined;
  readonly si: number;
}

function rowAt(side: EvaluatedSide, index: number): SideRow | undefined {
  const parameter = side.sheet.parameters[index];
  const row = side.compiled.analysis.rows[index];
  if (parameter === undefined || row === undefined) return undefined;
  return { index, parameter, unit: row.unit, si: side.compiled.base[index] ?? Number.NaN };
}

/** The row of this key (its first, as the engine reads a key used twice). */
function rowOf(side: EvaluatedSide, key: string): SideRow | undefined {
  const index = side.compiled.analysis.indexOf.get(key);
  return index === undefined ? undefined : rowAt(side, index);
}

/** A row's value in its own unit: an input as typed (no round trip through SI), else converted from SI. */
function ownValue(row: SideRow): number {
  if (row.parameter.value !== undefined) return row.parameter.value;
  return row.unit === undefined ? Number.NaN : fromSI(row.si, row.unit);
}

/** A `from` row's value in the `to` row's unit (as typed when the unit text is the same); NaN when the dimensions differ. */
function valueInUnitOf(from: SideRow, to: SideRow): number {
  if (from.parameter.unit === to.parameter.unit) return ownValue(from);
  if (from.unit === undefined || to.unit === undefined || !sameDimension(from.unit.dimension, to.unit.dimension)) return Number.NaN;
  return fromSI(from.si, to.unit);
}

function sameDimensionOf(from: SideRow, to: SideRow): boolean {
  return from.unit !== undefined && to.unit !== undefined && sameDimension(from.unit.dimension, to.unit.dimension);
}

function headerChanges(from: Sheet, to: Sheet): HeaderChange[] {
  const fields: [HeaderChange['field'], string | number | null, string | number | null][] = [
    ['name', from.name, to.name],
    ['budgetPreset', from.budget?.preset ?? null, to.budget?.preset ?? null],
    ['requiredMarginPercent', from.budget?.requiredMarginPercent ?? null, to.budget?.requiredMarginPercent ?? null],
  ];
  return fields.filter(([, before, after]) => before !== after).map(([field, before, after]) => ({ field, from: before, to: after }));
}

const textOf: Record<Exclude<FieldChange['field'], 'value'>, (parameter: Parameter) => string | null> = {
  formula: (parameter) => parameter.formula ?? null,
  material: (parameter) => (parameter.material === undefined ? null : `${parameter.material.id} ${parameter.material.property}`),
  unit: (parameter) => parameter.unit,
  maturity: (parameter) => parameter.mass?.maturity ?? null,
  category: (parameter) => parameter.mass?.category ?? null,
  subsystem: (parameter) => parameter.subsystem,
  label: (parameter) => parameter.label,
  note: (parameter) => parameter.note ?? null,
  source: (parameter) => parameter.source ?? null,
  role: (parameter) => parameter.role ?? null,
  protected: (parameter) => String(parameter.protected === true),
};
const textFieldsRead = Object.entries(textOf) as [keyof typeof textOf, (parameter: Parameter) => string | null][];

/** What changed in a row present in both sheets, in a fixed order of fields; empty when nothing did. */
export function fieldChanges(from: Parameter, to: Parameter): FieldChange[] {
  const changes: FieldChange[] = [];
  if (from.value !== to.value) {
    changes.push({ field: 'value', from: from.value ?? null, fromUnit: from.unit, to: to.value ?? null, toUnit: to.unit });
  }
  for (const [field, read] of textFieldsRead) {
    const before = read(from);
    const after = read(to);
    if (before !== after) changes.push({ field, from: before, to: after });
  }
  return changes;
}

/** The rows of a side that the engine reads: the first of each key. */
function firstOfEachKey(side: EvaluatedSide): Parameter[] {
  const { indexOf } = side.compiled.analysis;
  return side.sheet.parameters.filter((parameter, index) => indexOf.get(parameter.key) === index);
}

/** Rows added (in `to`'s order), removed (in `from`'s order) and changed (in `to`'s order). */
function rowDiff(pair: EvaluatedPair): RowDiff {
  const before = pair.from.compiled.analysis.indexOf;
  const after = pair.to.compiled.analysis.indexOf;
  const rows = firstOfEachKey(pair.to);
  const changed: RowChange[] = [];
  for (const parameter of rows) {
    const old = pair.from.sheet.parameters[before.get(parameter.key) ?? -1];
    if (old === undefined) continue;
    const changes = fieldChanges(old, parameter);
    if (changes.length > 0) changed.push({ key: parameter.key, label: parameter.label, subsystem: parameter.subsystem, changes });
  }
  return {
    added: rows.filter((parameter) => !before.has(parameter.key)),
    removed: firstOfEachKey(pair.from).filter((parameter) => !after.has(parameter.key)),
    changed,
  };
}

/** Why a side has no value for a row: the engine's error, or a result that is not finite. */
function problemOf(side: EvaluatedSide, row: SideRow, which: 'from' | 'to'): string | undefined {
  if (Number.isFinite(row.si)) return undefined;
  const error = side.compiled.errors.find((candidate) => candidate.key === row.parameter.key);
  return `no value in "${which}": ${error?.message ?? `${row.parameter.key}: the result is not a finite number`}`;
}

function known(value: number): number | null {
  return Number.isFinite(value) ? value : null;
}

/** The change of one computed row, in its unit in `to`. */
function outputChange(pair: EvaluatedPair, from: SideRow, to: SideRow): OutputChange {
  const dimensionChanged = !sameDimensionOf(from, to) && from.unit !== undefined && to.unit !== undefined;
  const before = dimensionChanged ? ownValue(from) : valueInUnitOf(from, to);
  const after = ownValue(to);
  const change = dimensionChanged ? Number.NaN : after - before;
  const problem =
    Number.isFinite(from.si) && Number.isFinite(to.si)
      ? ''
      : [problemOf(pair.from, from, 'from'), problemOf(pair.to, to, 'to')].filter((text) => text !== undefined).join('; ');
  return {
    key: to.parameter.key,
    label: to.parameter.label,
    subsystem: to.parameter.subsystem,
    unit: to.parameter.unit,
    from: known(before),
    fromUnit: dimensionChanged ? from.parameter.unit : to.parameter.unit,
    to: known(after),
    change: known(change),
    changePercent: before === 0 ? null : known((change / Math.abs(before)) * 100),
    dimensionChanged,
    ...(problem === '' ? {} : { problem }),
  };
}

/** Every computed row (a formula on either side) present in both sheets, in `to`'s order. */
function outputChanges(pair: EvaluatedPair): OutputChange[] {
  const { indexOf } = pair.to.compiled.analysis;
  return pair.to.sheet.parameters.flatMap((parameter, index) => {
    // A key used twice counts once, at its first row (as the engine reads it).
    if (indexOf.get(parameter.key) !== index) return [];
    const to = rowAt(pair.to, index);
    const from = rowOf(pair.from, parameter.key);
    if (to === undefined || from === undefined) return [];
    if (to.parameter.formula === undefined && from.parameter.formula === undefined) return [];
    return [outputChange(pair, from, to)];
  });
}

/** The comparison of the two sheets of a pair: settings, rows and every output. */
export function compareSheets(pair: EvaluatedPair): SheetComparison {
  return {
    header: headerChanges(pair.from.sheet, pair.to.sheet),
    rows: rowDiff(pair),
    outputs: outputChanges(pair),
  };
}

/** Keys a formula reads with their growth allowance (PREDICTED, TOTAL_PREDICTED). */
function allowanceReads(node: FormulaNode | undefined, into: Set<string>): void {
  if (node === undefined) return;
  switch (node.kind) {
    case 'number':
    case 'ref':
      return;
    case 'unary':
    case 'percent':
      allowanceReads(node.operand, into);
      return;
    case 'binary':
      allowanceReads(node.left, into);
      allowanceReads(node.right, into);
      return;
    case 'call':
      for (const arg of node.args) {
        if (ALLOWANCE_FUNCTIONS.has(node.name) && arg.kind === 'ref') into.add(arg.key);
        else allowanceReads(arg, into);
      }
  }
}

/** Why what moved an output cannot be worked out: the output is in neither sheet, or has no comparable values. */
export type WhatMovedProblem = { readonly kind: 'unknown_output' } | { readonly kind: 'not_comparable'; readonly message: string };

/**
 * What moved an output between the two sheets: each changed input upstream of it in `to` with its share
 * (the output in `to` minus the output in `to` with only that input at its `from` value), largest share
 * first; the upstream changes that are not an input's value (formulas, allowances, new rows), and the
 * remainder, the change minus every share. For an output linear in its inputs the shares add up to the change.
 */
export function whatMoved(
  pair: EvaluatedPair,
  outputKey: string,
): { ok: true; moved: MovedOutput } | { ok: false; problem: WhatMovedProblem } {
  const output = rowOf(pair.to, outputKey);
  const old = rowOf(pair.from, outputKey);
  if (output === undefined) return { ok: false, problem: { kind: 'unknown_output' } };
  const notComparable = (message: string) => ({ ok: false as const, problem: { kind: 'not_comparable' as const, message } });
  if (old === undefined) return notComparable(`${outputKey} is new in "to": it has no old value`);
  const change = outputChange(pair, old, output);
  if (change.dimensionChanged)
    return notComparable(`${outputKey} changed from ${old.parameter.unit} to ${output.parameter.unit}, another dimension`);
  if (change.from === null || change.to === null || change.change === null || output.unit === undefined) {
    return notComparable(change.problem ?? `${outputKey} has no value on one side`);
  }

  const { analysis, base } = pair.to.compiled;
  const upstream = reachable([output.index], analysis.graph.dependencies);
  const readWithAllowance = new Set<string>();
  for (const index of upstream) allowanceReads(analysis.rows[index]?.formula, readWithAllowance);

  const reverted: { row: SideRow; old: SideRow }[] = [];
  const otherChanges: UpstreamChange[] = [];
  for (const index of [...upstream].sort((a, b) => a - b)) {
    const now = rowAt(pair.to, index);
    if (now === undefined) continue;
    const key = now.parameter.key;
    const then = rowOf(pair.from, key);
    if (then === undefined) {
      otherChanges.push({ key, reason: 'new in "to"' });
      continue;
    }
    if (readWithAllowance.has(key) && analysis.rows[index]?.allowance !== pair.from.compiled.analysis.rows[then.index]?.allowance) {
      otherChanges.push({ key, reason: 'its growth allowance changed (maturity, category or allowance preset)' });
    }
    if (now.parameter.formula !== undefined) {
      if (now.parameter.formula !== then.parameter.formula) otherChanges.push({ key, reason: 'its formula changed' });
    } else if (!sameDimensionOf(then, now)) {
      otherChanges.push({ key, reason: `its unit changed from ${then.parameter.unit} to ${now.parameter.unit}, another dimension` });
    } else if (!Number.isFinite(then.si)) {
      otherChanges.push({ key, reason: 'it has no value in "from"' });
    } else if (then.si !== now.si) {
      reverted.push({ row: now, old: then });
    }
  }

  // Each input back at its old value on its own. The whole sheet is recomputed with the functions compiled
  // for it: generating a narrower program would cost more than it saves unless few rows are downstream.
  const inputs: InputShare[] = [];
  const values = new Float64Array(base.length);
  for (const { row, old: input } of reverted) {
    values.set(base);
    values[row.index] = input.si;
    pair.to.compiled.evaluate(values);
    const share = change.to - fromSI(values[output.index] ?? Number.NaN, output.unit);
    if (!Number.isFinite(share)) {
      otherChanges.push({ key: row.parameter.key, reason: `${outputKey} has no value with it at its old value` });
      continue;
    }
    const { key, label, subsystem, unit } = row.parameter;
    inputs.push({ key, label, subsystem, unit, from: valueInUnitOf(input, row), to: ownValue(row), share });
  }
  inputs.sort((a, b) => Math.abs(b.share) - Math.abs(a.share) || a.key.localeCompare(b.key));
  const shared = inputs.reduce((sum, input) => sum + input.share, 0);
  return {
    ok: true,
    moved: {
      key: outputKey,
      unit: output.parameter.unit,
      from: change.from,
      to: change.to,
      change: change.change,
      inputs,
      otherChanges,
      remainder: change.change - shared,
    },
  };
}
