import { analyseSheet, rowStates, type SheetAnalysis } from '@/shared/engine/sheet-model';
import type { EngineError } from '@/shared/engine/errors';
import { parseFormula, referencedKeys, type FormulaNode } from '@/shared/engine/formula-parser';
import { fromSI, parseUnit } from '@/shared/engine/units';
import { PARAMETERS_SHEET, PARAMETER_COLUMNS, cellName, type ParameterColumn } from '@/shared/exchange/layout';
import { fromSpreadsheetFormula, printFormula, sameFormula } from '@/shared/exchange/spreadsheet-formulas';
import {
  importProblemCodes,
  type ImportField,
  type ImportPreviewContent,
  type ImportProblem,
  type ImportStep,
} from '@/shared/schemas/exchange';
import { parameterKeyProblem, type Parameter, type Sheet } from '@/shared/schemas/sheet';

/**
 * What a workbook filled in by a partner (or edited offline) would change in a revision: rows changed, added and
 * removed, the rows that cannot be taken (each naming its cell), and those the importer may not change. Also the
 * steps that accepting it applies. Pure: the server reads the cells and the rows and stores the outcome.
 */

/** A cell as read from the workbook. */
export type ReadCell =
  | { readonly kind: 'empty' }
  | { readonly kind: 'number'; readonly value: number }
  | { readonly kind: 'text'; readonly text: string }
  | { readonly kind: 'formula'; readonly formula: string };

/** One row of the Parameters sheet: its row number and its cells by column. */
export interface FileRow {
  readonly row: number;
  readonly cells: Readonly<Record<ParameterColumn, ReadCell>>;
}

/** A row of the revision as it is now. */
export type BaseRow = Parameter & { readonly version: number; readonly subsystemId: string };

export interface ImportContext {
  /** The revision's header and every row in order. */
  readonly header: Omit<Sheet, 'parameters'>;
  readonly rows: readonly BaseRow[];
  readonly subsystems: readonly { readonly id: string; readonly name: string }[];
  /** Whether the importer sees the row (rows they do not see are neither removed nor named). */
  mayView(row: { subsystemId: string }): boolean;
  /** Why the importer may not change rows of this subsystem; undefined when they may. */
  whyNotImport(subsystem: { id: string; name: string }): string | undefined;
  /** The key on a row of the workbook's mass-budget sheet. */
  keyAtBudgetRow(row: number): string | undefined;
}

export interface ImportOutcome {
  readonly preview: ImportPreviewContent;
  readonly steps: ImportStep[];
}

const cellOf = (column: ParameterColumn, row: number) => cellName(PARAMETERS_SHEET, PARAMETER_COLUMNS[column].letter, row);

function textOf(cell: ReadCell): string | undefined {
  switch (cell.kind) {
    case 'empty':
      return undefined;
    case 'number':
      return String(cell.value);
    case 'text':
      return cell.text;
    case 'formula':
      return `=${cell.formula}`;
  }
}

/** A row's value with its unit, its formula or its material, as the preview shows it. */
export function definitionText(parameter: Parameter): string {
  if (parameter.formula !== undefined) return parameter.formula;
  if (parameter.value !== undefined) return parameter.unit === '' ? String(parameter.value) : `${parameter.value} ${parameter.unit}`;
  return parameter.material === undefined ? '' : `material ${parameter.material.id} ${parameter.material.property}`;
}

class RowProblem extends Error {
  constructor(
    readonly column: ParameterColumn,
    readonly code: ImportProblem['code'],
    message: string,
  ) {
    super(message);
  }
}

/** The parameter a file row describes, on top of the revision's row of its key (kept: mass, material, role, protected). */
function readParameter(file: FileRow, key: string, base: BaseRow | undefined, context: ImportContext, materialShown: number | undefined) {
  const { cells } = file;
  const optionalText = (column: ParameterColumn) => {
    const text = textOf(cells[column])?.trim();
    return text === undefined || text === '' ? undefined : text;
  };
  const subsystem = optionalText('subsystem') ?? '';
  if (!context.subsystems.some((candidate) => candidate.name === subsystem)) {
    throw new RowProblem('subsystem', 'unknown_subsystem', `the craft has no subsystem "${subsystem}"`);
  }
  const unit = optionalText('unit') ?? '';
  if (!parseUnit(unit).ok) throw new RowProblem('unit', 'unknown_unit', `unknown unit "${unit}"`);
  const { mass, protected: isProtected, role } = base ?? {};
  const parameter: Parameter = {
    key,
    label: optionalText('label') ?? '',
    subsystem,
    unit,
    ...(mass === undefined ? {} : { mass }),
    ...(isProtected === undefined ? {} : { protected: isProtected }),
    ...(role === undefined ? {} : { role }),
  };
  const note = optionalText('note');
  const generatedSource = base?.material === undefined ? undefined : `material: ${base.material.id} ${base.material.property}`;
  const sourceText = optionalText('source');
  const source = base?.source === undefined && sourceText === generatedSource ? undefined : sourceText;
  const definition = readDefinition(file, base, context, materialShown);
  return { ...parameter, ...definition, ...(note === undefined ? {} : { note }), ...(source === undefined ? {} : { source }) };
}

function readDefinition(
  file: FileRow,
  base: BaseRow | undefined,
  context: ImportContext,
  materialShown: number | undefined,
): Pick<Parameter, 'value' | 'formula' | 'material'> {
  const formulaCell = file.cells.formula;
  const formulaText = formulaCell.kind === 'formula' ? formulaCell.formula : formulaCell.kind === 'text' ? formulaCell.text.trim() : '';
  if (formulaText !== '') {
    if (formulaCell.kind === 'text' && !formulaText.startsWith('=')) {
      throw new RowProblem('formula', 'formula_unreadable', `"${formulaText}" is not a formula (it must start with "=")`);
    }
    const read = fromSpreadsheetFormula(formulaText, context.keyAtBudgetRow);
    if (!read.ok) throw new RowProblem('formula', 'formula_unreadable', `the formula cannot be read: ${read.message}`);
    const baseTree = base?.formula === undefined ? undefined : parsedOrUndefined(base.formula);
    if (base?.formula !== undefined && baseTree !== undefined && sameFormula(baseTree, read.value)) return { formula: base.formula };
    return { formula: printFormula(read.value) };
  }
  const valueCell = file.cells.value;
  const value =
    valueCell.kind === 'number'
      ? valueCell.value
      : valueCell.kind === 'text' && valueCell.text.trim() !== ''
        ? Number(valueCell.text)
        : undefined;
  if (value === undefined) throw new RowProblem('value', 'invalid_value', 'the row has neither a value nor a formula');
  if (!Number.isFinite(value)) throw new RowProblem('value', 'invalid_value', `"${textOf(valueCell) ?? ''}" is not a number`);
  if (base?.material !== undefined && value === materialShown) return { material: base.material };
  return { value };
}

function parsedOrUndefined(formula: string): FormulaNode | undefined {
  try {
    return parseFormula(formula);
  } catch {
    return undefined;
  }
}

function fieldChanges(before: Parameter, after: Parameter) {
  const changes: { field: ImportField; from: string | null; to: string | null }[] = [];
  const add = (field: ImportField, from: string | undefined, to: string | undefined) => {
    if (from !== to) changes.push({ field, from: from ?? null, to: to ?? null });
  };
  add('label', before.label, after.label);
  add('subsystem', before.subsystem, after.subsystem);
  add('unit', before.unit, after.unit);
  const definitionBefore = definitionText(before);
  const definitionAfter = definitionText(after);
  if (definitionBefore !== definitionAfter || before.unit !== after.unit) {
    const field = before.formula !== undefined || after.formula !== undefined ? 'formula' : 'value';
    changes.push({ field, from: definitionBefore, to: definitionAfter });
  }
  add('note', before.note, after.note);
  add('source', before.source, after.source);
  return changes;
}

/** Engine errors (static: parsing, units, dimensions, references, cycles), from an analysis of the sheet. */
function staticErrors(analysis: SheetAnalysis): EngineError[] {
  return rowStates(analysis, () => undefined).filter(
    (state): state is EngineError => state !== undefined && state.code !== 'dependency_error',
  );
}

/** Where an engine error of a changed row shows in the workbook. */
function columnOfError(code: string): ParameterColumn {
  if (code === 'unknown_unit') return 'unit';
  if (code === 'invalid_key' || code === 'duplicate_key') return 'key';
  return 'formula';
}

/** Reads the Parameters rows against the revision: the preview and the steps accepting it applies. */
export function previewImport(fileRows: readonly FileRow[], context: ImportContext): ImportOutcome {
  const problems: ImportProblem[] = [];
  const ignored: ImportPreviewContent['ignored'] = [];
  const baseByKey = new Map(context.rows.map((row) => [row.key, row]));
  const subsystemByName = new Map(context.subsystems.map((subsystem) => [subsystem.name, subsystem]));
  const subsystemById = new Map(context.subsystems.map((subsystem) => [subsystem.id, subsystem]));
  const baseSheet: Sheet = {
    ...context.header,
    parameters: context.rows.map(({ version: _v, subsystemId: _s, ...parameter }) => parameter),
  };
  const baseAnalysis = analyseSheet(baseSheet);
  const materialShown = (key: string) => {
    const row = baseAnalysis.rows[baseAnalysis.indexOf.get(key) ?? -1];
    return row?.siValue === undefined || row.unit === undefined ? undefined : fromSI(row.siValue, row.unit);
  };

  /** Steps by key, with the row of the workbook each came from. */
  const steps = new Map<string, { step: ImportStep; row: number }>();
  const seen = new Set<string>();
  let previousKey: string | null = null;
  for (const file of fileRows) {
    const keyText = textOf(file.cells.key)?.trim() ?? '';
    const problem = (column: ParameterColumn, code: ImportProblem['code'], message: string) =>
      problems.push({ cell: cellOf(column, file.row), key: keyText === '' ? null : keyText, code, message });
    if (keyText === '') {
      const filled = Object.values(file.cells).some((cell) => cell.kind !== 'empty');
      if (filled) problem('key', 'missing_key', 'the row has no key (column A)');
      continue;
    }
    const keyProblem = parameterKeyProblem(keyText);
    if (keyProblem !== undefined) {
      problem('key', 'invalid_key', `"${keyText}" is not a Trimsheet key: it ${keyProblem}`);
      continue;
    }
    if (seen.has(keyText)) {
      problem('key', 'duplicate_key', `the key ${keyText} is on an earlier row too`);
      continue;
    }
    seen.add(keyText);
    const base = baseByKey.get(keyText);
    if (base !== undefined && !context.mayView(base)) {
      ignored.push({ cell: cellOf('key', file.row), key: keyText, reason: 'this key belongs to a row not shared with you' });
      continue;
    }
    let parameter: Parameter;
    try {
      parameter = readParameter(file, keyText, base, context, materialShown(keyText));
    } catch (error) {
      if (!(error instanceof RowProblem)) throw error;
      problem(error.column, error.code, `${keyText}: ${error.message}`);
      if (base !== undefined) previousKey = keyText;
      continue;
    }
    const target = subsystemByName.get(parameter.subsystem);
    const from = base === undefined ? undefined : subsystemById.get(base.subsystemId);
    const refusal = [from, target].flatMap((subsystem) => (subsystem === undefined ? [] : [context.whyNotImport(subsystem)])).find(Boolean);
    const changed = base === undefined || fieldChanges(base, parameter).length > 0;
    if (changed && refusal !== undefined) {
      ignored.push({ cell: cellOf('key', file.row), key: keyText, reason: refusal });
    } else if (base === undefined) {
      steps.set(keyText, { step: { action: 'create', parameter, afterKey: previousKey }, row: file.row });
    } else if (changed) {
      const fileVersion = file.cells.version.kind === 'number' ? file.cells.version.value : undefined;
      if (fileVersion !== undefined && fileVersion !== base.version) {
        problem(
          'version',
          'stale_row',
          `${keyText} changed in Trimsheet since this file was exported (version ${fileVersion} in the file, ${base.version} now); export again to change it`,
        );
      } else {
        steps.set(keyText, { step: { action: 'update', key: keyText, version: base.version, parameter }, row: file.row });
      }
    }
    previousKey = keyText;
  }
  const removed: ImportPreviewContent['removed'] = [];
  for (const base of context.rows) {
    if (seen.has(base.key) || !context.mayView(base)) continue;
    const subsystem = subsystemById.get(base.subsystemId);
    const refusal = subsystem === undefined ? 'its subsystem is unknown' : context.whyNotImport(subsystem);
    if (refusal !== undefined) {
      ignored.push({ cell: PARAMETERS_SHEET, key: base.key, reason: `not in the file, but not removed: ${refusal}` });
      continue;
    }
    steps.set(base.key, { step: { action: 'delete', key: base.key, version: base.version }, row: 0 });
    removed.push({ key: base.key, label: base.label, subsystem: base.subsystem });
  }

  dropStepsThatBreakTheSheet(steps, baseSheet, baseAnalysis, problems);
  return { preview: previewOf(steps, context, removed, problems, ignored), steps: [...steps.values()].map(({ step }) => step) };
}

/** The sheet with the steps applied: changed rows in place, new rows after the row before them in the file. */
export function applySteps(sheet: Sheet, steps: Iterable<ImportStep>): Sheet {
  const parameters = [...sheet.parameters];
  for (const step of steps) {
    if (step.action === 'delete') {
      const at = parameters.findIndex((parameter) => parameter.key === step.key);
      if (at >= 0) parameters.splice(at, 1);
    } else if (step.action === 'update') {
      const at = parameters.findIndex((parameter) => parameter.key === step.key);
      if (at >= 0) parameters[at] = step.parameter;
    } else {
      const after = step.afterKey === null ? -1 : parameters.findIndex((parameter) => parameter.key === step.afterKey);
      parameters.splice(after + 1, 0, step.parameter);
    }
  }
  return { ...sheet, parameters };
}

/**
 * Leaves out the steps that would give the sheet an error of the kinds a row edit may not introduce (the engine's
 * static checks), each as a problem on its row; a step that breaks a row it does not change is blamed for it.
 */
function dropStepsThatBreakTheSheet(
  steps: Map<string, { step: ImportStep; row: number }>,
  baseSheet: Sheet,
  baseAnalysis: SheetAnalysis,
  problems: ImportProblem[],
) {
  const existing = new Set(staticErrors(baseAnalysis).map((error) => `${error.key}\u0000${error.code}`));
  for (let round = 0; round < 20 && steps.size > 0; round += 1) {
    const after = applySteps(
      baseSheet,
      [...steps.values()].map(({ step }) => step),
    );
    // The rows the steps leave alone are not analysed again.
    const introduced = staticErrors(analyseSheet(after, baseAnalysis)).filter((error) => !existing.has(`${error.key}\u0000${error.code}`));
    if (introduced.length === 0) return;
    const blamed = new Map<string, string>();
    for (const error of introduced) {
      if (steps.has(error.key) && steps.get(error.key)?.step.action !== 'delete') {
        blamed.set(error.key, error.message);
        continue;
      }
      const reader = after.parameters.find((parameter) => parameter.key === error.key);
      const reads = reader?.formula === undefined ? [] : referencedKeysOf(reader.formula);
      const culprits = reads.filter((key) => steps.has(key));
      for (const key of culprits.length > 0 ? culprits : [...steps.keys()]) blamed.set(key, `it would break ${error.message}`);
    }
    for (const [key, message] of blamed) {
      const entry = steps.get(key);
      if (entry === undefined) continue;
      steps.delete(key);
      const code = introduced.find((error) => error.key === key)?.code;
      const column = code === undefined ? 'key' : columnOfError(code);
      problems.push({
        cell: entry.row === 0 ? PARAMETERS_SHEET : cellOf(column, entry.row),
        key,
        code: importProblemCodes.find((known) => known === code) ?? 'breaks_sheet',
        message: message.startsWith(key) ? message : `${key}: ${message}`,
      });
    }
  }
}

function referencedKeysOf(formula: string): string[] {
  const tree = parsedOrUndefined(formula);
  return tree === undefined ? [] : referencedKeys(tree);
}

function previewOf(
  steps: ReadonlyMap<string, { step: ImportStep; row: number }>,
  context: ImportContext,
  removed: ImportPreviewContent['removed'],
  problems: ImportProblem[],
  ignored: ImportPreviewContent['ignored'],
): ImportPreviewContent {
  const baseByKey = new Map(context.rows.map((row) => [row.key, row]));
  const changed: ImportPreviewContent['changed'] = [];
  const added: ImportPreviewContent['added'] = [];
  for (const { step, row } of steps.values()) {
    if (step.action === 'create') {
      const { key, label, subsystem } = step.parameter;
      added.push({ key, label, subsystem, cell: cellOf('key', row), definition: definitionText(step.parameter) });
    } else if (step.action === 'update') {
      const base = baseByKey.get(step.key);
      if (base === undefined) continue;
      const { key, label, subsystem } = step.parameter;
      changed.push({ key, label, subsystem, cell: cellOf('key', row), changes: fieldChanges(base, step.parameter) });
    }
  }
  const stillRemoved = removed.filter((row) => steps.get(row.key)?.step.action === 'delete');
  return { changed, added, removed: stillRemoved, problems, ignored };
}
