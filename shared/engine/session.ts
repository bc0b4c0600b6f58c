import { ExportedCellChange, type HyperFormula, type RawCellContent } from 'hyperformula';
import { parameterKeyProblem, type Parameter, type Sheet } from '@/shared/schemas/sheet';
import { rowError, type EngineError } from '@/shared/engine/errors';
import { buildWorkbook, cellContent, readCell } from '@/shared/engine/hyperformula-cells';
import {
  analyseSheet,
  buildGraph,
  mentionsMassTotals,
  reanalyseRow,
  rowStates,
  type AnalysedRow,
  type SheetAnalysis,
} from '@/shared/engine/sheet-model';
import { formatDimension, fromSI, parseQuantity, parseUnit, sameDimension, toSI } from '@/shared/engine/units';

/** A row's result in its declared unit. */
export interface EvaluatedValue {
  readonly value: number;
  readonly unit: string;
}

/** Outcome of an edit: the keys whose values were recomputed, or why the edit was refused. */
export type EditResult = { ok: true; recomputed: string[] } | { ok: false; error: EngineError };

/** A live sheet for the browser: edits recompute only their dependents and can be undone. */
export interface SheetSession {
  /** Every row that has a value, in its declared unit. Rows with errors are left out and listed in errors(). */
  values(): Record<string, EvaluatedValue>;
  /** One error per row that cannot be evaluated, in sheet order. */
  errors(): EngineError[];
  /** The sheet as it stands after the edits. */
  sheet(): Sheet;
  /** Sets an input: a number in the row's own unit, or text with a unit ("60 m"). A formula row becomes an input. */
  setInput(key: string, value: number | string): EditResult;
  /** Sets a row's formula ("=sail_side^2"). An input row becomes a formula row. */
  setFormula(key: string, formula: string): EditResult;
  /** Replaces a row's definition (unit, mass category, note, material, ...). The key must stay the same. */
  updateParameter(key: string, parameter: Parameter): EditResult;
  /** Adds a row before the row `beforeKey`, or at the end. Structural edits rebuild the workbook. */
  insertParameter(parameter: Parameter, beforeKey?: string): EditResult;
  /** Removes a row; rows that read it then report an unknown key. */
  removeParameter(key: string): EditResult;
  /** Changes the mass-budget settings (allowance preset, required margin). */
  setBudget(budget: Sheet['budget']): EditResult;
  /** Undoes the last edit; false when there is nothing to undo. */
  undo(): EditResult | false;
  /** Redoes the last undone edit; false when there is nothing to redo. */
  redo(): EditResult | false;
  canUndo(): boolean;
  canRedo(): boolean;
  /** Releases the HyperFormula workbook. */
  destroy(): void;
}

/** An edit of one row, replayed cell by cell, or of the sheet's structure, replayed by a rebuild. */
type Edit =
  | { readonly kind: 'row'; readonly index: number; readonly before: Parameter; readonly after: Parameter }
  | { readonly kind: 'sheet'; readonly before: Sheet; readonly after: Sheet };

/**
 * A value for a row in that row's own unit: a bare number is already in it, text may carry its
 * own unit ("60 m" for a row in km) and is converted, after checking the dimension.
 */
export function valueInRowUnit(
  parameter: Parameter,
  value: number | string,
): { ok: true; value: number } | { ok: false; error: EngineError } {
  const fail = (code: EngineError['code'], detail: string) => ({ ok: false as const, error: rowError(parameter.key, code, detail) });
  const quantity = typeof value === 'number' ? { ok: true as const, value: { value, unit: undefined } } : parseQuantity(value);
  if (!quantity.ok) return fail(quantity.message.startsWith('unknown unit') ? 'unknown_unit' : 'invalid_value', quantity.message);
  if (!Number.isFinite(quantity.value.value)) return fail('invalid_value', `value must be a finite number, got ${String(value)}`);
  const given = quantity.value.unit;
  if (given === undefined) return { ok: true, value: quantity.value.value };
  const own = parseUnit(parameter.unit);
  if (!own.ok) return fail('unknown_unit', own.message);
  if (!sameDimension(own.value.dimension, given.dimension)) {
    return fail(
      'dimension_mismatch',
      `unit "${parameter.unit}" expects ${formatDimension(own.value.dimension)} but "${String(value)}" is ${formatDimension(given.dimension)}`,
    );
  }
  const converted = fromSI(toSI(quantity.value.value, given), own.value);
  return Number.isFinite(converted)
    ? { ok: true, value: converted }
    : fail('invalid_value', `"${String(value)}" is out of range in ${parameter.unit}`);
}

function sameMass(a: Parameter['mass'], b: Parameter['mass']): boolean {
  return a?.maturity === b?.maturity && a?.category === b?.category;
}

function sameList(a: readonly string[], b: readonly string[]): boolean {
  return a.length === b.length && a.every((item, index) => item === b[index]);
}

class Session implements SheetSession {
  private readonly name: string;
  private budget: Sheet['budget'];
  private analysis: SheetAnalysis;
  private contents: (readonly [RawCellContent, RawCellContent])[];
  private workbook: HyperFormula;
  private results: (number | EngineError)[];
  /**
   * Each row's value as values() gives it (undefined for a row without one), kept between edits: an edit
   * renews the rows it recomputed and the rows whose error came or went, not all of them.
   */
  private shown: (EvaluatedValue | undefined)[] = [];
  /** Rows whose `shown` entry is out of date; undefined when all of them are. */
  private staleShown: Set<number> | undefined;
  private readonly undoStack: Edit[] = [];
  private readonly redoStack: Edit[] = [];

  constructor(sheet: Sheet) {
    this.name = sheet.name;
    this.budget = sheet.budget;
    this.analysis = analyseSheet(sheet);
    this.contents = this.analysis.rows.map((_, index) => this.contentOf(index));
    this.workbook = buildWorkbook(this.contents);
    this.results = this.readAll();
  }

  private readAll(): (number | EngineError)[] {
    const values = this.workbook.getSheetValues(0);
    return this.analysis.rows.map((row, index) => readCell(row.parameter.key, values[index]?.[0] ?? null));
  }

  /** Replaces the whole sheet: new analysis and a new workbook. */
  private load(sheet: Sheet): EditResult {
    this.rowErrors = undefined;
    this.staleShown = undefined;
    this.workbook.destroy();
    this.budget = sheet.budget;
    this.analysis = analyseSheet(sheet);
    this.contents = this.analysis.rows.map((_, index) => this.contentOf(index));
    this.workbook = buildWorkbook(this.contents);
    this.results = this.readAll();
    return { ok: true, recomputed: this.rows.map((row) => row.parameter.key) };
  }

  private get rows(): readonly AnalysedRow[] {
    return this.analysis.rows;
  }

  private readonly cellIndex = (key: string): number => this.analysis.indexOf.get(key) ?? -1;

  private contentOf(index: number): readonly [RawCellContent, RawCellContent] {
    const row = this.rows[index];
    if (row === undefined) return [null, null];
    return [cellContent(row, this.analysis.graph.cycles.has(index), this.cellIndex), row.allowance ?? null];
  }

  /** Each row's error, worked out once per state of the sheet: values() and errors() both read it. */
  private rowErrors: (EngineError | undefined)[] | undefined;

  private states(): (EngineError | undefined)[] {
    if (this.rowErrors !== undefined) return this.rowErrors;
    const before = this.staleShown === undefined ? undefined : this.shownStates;
    const states = rowStates(this.analysis, (index) => this.results[index]);
    // A row whose error came or went shows a value, or stops showing one, though nothing recomputed it.
    if (before !== undefined) {
      states.forEach((state, index) => {
        if ((state === undefined) !== (before[index] === undefined)) this.staleShown?.add(index);
      });
    }
    this.rowErrors = states;
    return states;
  }

  /** The states `shown` was last brought up to date with. */
  private shownStates: (EngineError | undefined)[] = [];

  /** Brings `shown` up to date: the stale rows, or every row after a rebuild. */
  private refreshShown(): (EvaluatedValue | undefined)[] {
    const states = this.states();
    const stale = this.staleShown;
    if (stale === undefined) {
      this.shown = this.rows.map((_, index) => this.shownValue(index, states, undefined));
    } else {
      for (const index of stale) this.shown[index] = this.shownValue(index, states, this.shown[index]);
    }
    this.staleShown = new Set();
    this.shownStates = states;
    return this.shown;
  }

  /** A row's value in its own unit, or undefined when it has none; `before` is kept when the value is the same. */
  private shownValue(
    index: number,
    states: readonly (EngineError | undefined)[],
    before: EvaluatedValue | undefined,
  ): EvaluatedValue | undefined {
    const row = this.rows[index];
    const result = this.results[index];
    if (row === undefined || states[index] !== undefined || typeof result !== 'number' || row.unit === undefined) return undefined;
    // An input reads back as typed: converting it to SI and back would add float noise.
    const value = row.parameter.value ?? fromSI(result, row.unit);
    const unit = row.parameter.unit;
    return before?.value === value && before.unit === unit ? before : { value, unit };
  }

  values(): Record<string, EvaluatedValue> {
    const shown = this.refreshShown();
    const values: Record<string, EvaluatedValue> = {};
    for (let index = 0; index < shown.length; index += 1) {
      const value = shown[index];
      const key = this.rows[index]?.parameter.key;
      if (value !== undefined && key !== undefined) values[key] = value;
    }
    return values;
  }

  errors(): EngineError[] {
    return this.states().filter((state): state is EngineError => state !== undefined);
  }

  sheet(): Sheet {
    const sheet: Sheet = { name: this.name, parameters: this.rows.map((row) => row.parameter) };
    return this.budget === undefined ? sheet : { ...sheet, budget: this.budget };
  }

  private editable(key: string): { ok: true; index: number; parameter: Parameter } | { ok: false; error: EngineError } {
    const index = this.analysis.indexOf.get(key);
    const parameter = index === undefined ? undefined : this.rows[index]?.parameter;
    if (index === undefined || parameter === undefined) return { ok: false, error: rowError(key, 'unknown_key', 'no row has this key') };
    if (parameter.protected === true) return { ok: false, error: rowError(key, 'protected', 'the row is protected and cannot be edited') };
    return { ok: true, index, parameter };
  }

  setInput(key: string, value: number | string): EditResult {
    const target = this.editable(key);
    if (!target.ok) return target;
    const converted = valueInRowUnit(target.parameter, value);
    if (!converted.ok) return converted;
    const { formula: _formula, material: _material, ...rest } = target.parameter;
    return this.record(target.index, target.parameter, { ...rest, value: converted.value });
  }

  setFormula(key: string, formula: string): EditResult {
    const target = this.editable(key);
    if (!target.ok) return target;
    const { value: _value, material: _material, ...rest } = target.parameter;
    return this.record(target.index, target.parameter, { ...rest, formula });
  }

  updateParameter(key: string, parameter: Parameter): EditResult {
    const target = this.editable(key);
    if (!target.ok) return target;
    if (parameter.key !== key)
      return { ok: false, error: rowError(key, 'invalid_key', `an edit cannot change the key (to "${parameter.key}")`) };
    return this.record(target.index, target.parameter, parameter);
  }

  insertParameter(parameter: Parameter, beforeKey?: string): EditResult {
    const problem = parameterKeyProblem(parameter.key);
    if (problem !== undefined) return { ok: false, error: rowError(parameter.key, 'invalid_key', `key ${problem}`) };
    if (this.analysis.indexOf.has(parameter.key)) {
      return { ok: false, error: rowError(parameter.key, 'duplicate_key', 'a row with this key exists already') };
    }
    const position = beforeKey === undefined ? this.rows.length : this.analysis.indexOf.get(beforeKey);
    if (position === undefined)
      return { ok: false, error: rowError(beforeKey ?? '', 'unknown_key', 'no row has this key to insert before') };
    const current = this.sheet();
    const parameters = [...current.parameters];
    parameters.splice(position, 0, parameter);
    return this.recordSheet(current, { ...current, parameters });
  }

  removeParameter(key: string): EditResult {
    const target = this.editable(key);
    if (!target.ok) return target;
    const current = this.sheet();
    return this.recordSheet(current, { ...current, parameters: current.parameters.filter((_, index) => index !== target.index) });
  }

  setBudget(budget: Sheet['budget']): EditResult {
    const current = this.sheet();
    const { budget: _budget, ...rest } = current;
    return this.recordSheet(current, budget === undefined ? rest : { ...rest, budget });
  }

  private record(index: number, before: Parameter, after: Parameter): EditResult {
    return this.push({ kind: 'row', index, before, after });
  }

  private recordSheet(before: Sheet, after: Sheet): EditResult {
    return this.push({ kind: 'sheet', before, after });
  }

  private push(edit: Edit): EditResult {
    this.undoStack.push(edit);
    this.redoStack.length = 0;
    return this.replay(edit, 'after');
  }

  private replay(edit: Edit, side: 'before' | 'after'): EditResult {
    return edit.kind === 'row' ? this.apply(edit.index, edit[side]) : this.load(edit[side]);
  }

  undo(): EditResult | false {
    const edit = this.undoStack.pop();
    if (edit === undefined) return false;
    this.redoStack.push(edit);
    return this.replay(edit, 'before');
  }

  redo(): EditResult | false {
    const edit = this.redoStack.pop();
    if (edit === undefined) return false;
    this.undoStack.push(edit);
    return this.replay(edit, 'after');
  }

  canUndo(): boolean {
    return this.undoStack.length > 0;
  }

  canRedo(): boolean {
    return this.redoStack.length > 0;
  }

  destroy(): void {
    this.workbook.destroy();
  }

  /** Re-analyses the edited row (and, when its unit or mass category changed, the rows reading it), then updates only the cells that changed. */
  private apply(index: number, parameter: Parameter): EditResult {
    const old = this.rows[index];
    if (old === undefined) return { ok: false, error: rowError(parameter.key, 'unknown_key', 'no row has this key') };
    this.rowErrors = undefined;
    this.analysis.parameters[index] = parameter;
    reanalyseRow(this.analysis, index);
    const touched = new Set<number>([index]);
    if (old.parameter.unit !== parameter.unit || !sameMass(old.parameter.mass, parameter.mass)) {
      for (const dependent of this.analysis.graph.dependents[index] ?? []) {
        reanalyseRow(this.analysis, dependent);
        touched.add(dependent);
      }
    }
    // A row that becomes (or stops being) a mass row changes what TOTAL_CBE() and TOTAL_PREDICTED() read.
    let totalsChanged = false;
    if ((old.parameter.mass === undefined) !== (parameter.mass === undefined)) {
      this.rows.forEach((row, candidate) => {
        if (candidate === index || !mentionsMassTotals(row.parameter.formula)) return;
        reanalyseRow(this.analysis, candidate);
        touched.add(candidate);
        totalsChanged = true;
      });
    }
    const graphChanged = totalsChanged || !sameList(old.dependencies, this.rows[index]?.dependencies ?? []);
    if (graphChanged) this.analysis.graph = buildGraph(this.rows, this.analysis.indexOf);
    const candidates = graphChanged ? this.rows.map((_, row) => row) : [...touched];
    const changes = this.workbook.batch(() => {
      for (const candidate of candidates) {
        const content = this.contentOf(candidate);
        const current = this.contents[candidate];
        if (current !== undefined && current[0] === content[0] && current[1] === content[1]) continue;
        this.contents[candidate] = content;
        this.workbook.setCellContents({ sheet: 0, col: 0, row: candidate }, [[content[0], content[1]]]);
      }
    });
    const recomputed = new Set<number>(touched);
    for (const change of changes) {
      if (!(change instanceof ExportedCellChange) || change.col !== 0) continue;
      const row = this.rows[change.row];
      if (row === undefined) continue;
      this.results[change.row] = readCell(row.parameter.key, change.newValue);
      recomputed.add(change.row);
    }
    for (const row of recomputed) this.staleShown?.add(row);
    return {
      ok: true,
      recomputed: [...recomputed].sort((a, b) => a - b).map((row) => this.rows[row]?.parameter.key ?? ''),
    };
  }
}

/** Opens a live session on a sheet. Call destroy() when done to free the workbook. */
export function createSheetSession(sheet: Sheet): SheetSession {
  return new Session(sheet);
}
