import { SIZING_CAUTION } from '@/shared/analyses/caution';
import { marginBelowRequired, rollUpBudget } from '@/shared/budget/rollup';
import { systemMarginBases, type BudgetRollUp } from '@/shared/budget/types';
import { compileSheet, type CompileOptions } from '@/shared/engine/compile';
import { valueInRowUnit } from '@/shared/engine/session';
import { sheetPreset } from '@/shared/engine/sheet-model';
import { formatDimension, fromSI, parseUnit, sameDimension, toSI, type ParsedUnit } from '@/shared/engine/units';
import { formatNumber, formatQuantity } from '@/shared/format/quantity';
import type { FieldError } from '@/shared/schemas/common';
import type { Parameter, Sheet } from '@/shared/schemas/sheet';
import {
  STANDARD_PERCENTILES,
  type Distribution,
  type RequirementResult,
  type UncertainOutput,
  type UncertaintyRequest,
  type UncertaintyResult,
} from '@/shared/schemas/uncertainty';
import { isRowRole, rowRoleDefinitions, sheetRoles, sheetTemplate } from '@/shared/templates';
import { distributionInSI, draw, seededRandom, type SIDistribution } from '@/shared/uncertainty/random';
import { extentOf, histogramOf, meanAndDeviation, percentilesOf } from '@/shared/uncertainty/statistics';

/**
 * A Monte Carlo study of a sheet: each sample draws every uncertain input from its distribution, evaluates
 * the sheet through the engine's compiled formulas (only the rows between those inputs and the figures read),
 * and records the figures and whether each requirement holds. Nothing here restates a formula of the sheet.
 * A study runs in steps, so a worker or a screen can report progress and stop between them; the samples drawn
 * do not depend on how it is split.
 */
export interface Study {
  readonly total: number;
  /** Samples evaluated so far. */
  readonly done: number;
  /** Evaluates up to `count` more samples; returns how many are done. */
  step(count: number): number;
  /** The figures, percentiles, histograms and probabilities of the samples evaluated (all of them once done). */
  result(): UncertaintyResult;
}

/** A study ready to run, or what is wrong with the request, each problem with its path in the request ("inputs.0.key"). */
export type PreparedStudy = { ok: true; study: Study } | { ok: false; problems: FieldError[] };

export interface StudyOptions {
  readonly compile?: CompileOptions;
  /**
   * Whether the person may see the row of a key (a partner sees only some rows): a row they may not see is
   * named in no answer, as if it did not exist. By default every row.
   */
  readonly sees?: (key: string) => boolean;
}

/** A row of the compiled sheet the study reads or sets. */
interface StudyRow {
  readonly index: number;
  readonly parameter: Parameter;
  readonly unit: ParsedUnit;
}

interface Figure extends StudyRow {
  readonly output: string;
  readonly role: string | null;
  readonly label: string;
}

/** A requirement as the study judges it on each sample's SI values. */
interface Check {
  readonly id: string;
  readonly label: string;
  readonly from: RequirementResult['from'];
  readonly holds: (values: Float64Array) => boolean;
  readonly reads: readonly number[];
}

/** The sheet's compiled rows, found by key for what the person may see. */
class Rows {
  constructor(
    private readonly compiled: ReturnType<typeof compileSheet>,
    private readonly sees: (key: string) => boolean,
  ) {}

  find(key: string): StudyRow | undefined {
    const index = this.compiled.analysis.indexOf.get(key);
    const row = index === undefined ? undefined : this.compiled.analysis.rows[index];
    if (index === undefined || row === undefined || row.unit === undefined || !this.sees(key)) return undefined;
    return { index, parameter: row.parameter, unit: row.unit };
  }

  problemOf(key: string): string | undefined {
    return this.compiled.errors.find((error) => error.key === key)?.message;
  }
}

/** The sheet's rows: all of them, and those the person may see. */
interface SheetRows {
  readonly all: Rows;
  readonly visible: Rows;
}

/**
 * Finds a figure by the role its row plays, else by key. Headline figures are read over the whole sheet
 * (everyone who views a craft gets them); any other figure must be a row the person may see.
 */
function findFigure(sheet: Sheet, rows: SheetRows, name: string): Figure | undefined {
  const roles = sheetRoles(sheet);
  const headline = isRowRole(name) && sheetTemplate(sheet).roles.headline.includes(name);
  const key = isRowRole(name) ? (roles[name] ?? name) : name;
  const row = (headline ? rows.all : rows.visible).find(key);
  if (row === undefined) return undefined;
  const role = row.parameter.role !== undefined && isRowRole(row.parameter.role) ? row.parameter.role : null;
  const label = role !== null && roles[role] === key ? rowRoleDefinitions[role].label : row.parameter.label;
  return { ...row, output: name, role, label };
}

/** The figures read by default: the headline figures of the sheet's template that the sheet has rows for. */
function defaultOutputs(sheet: Sheet): string[] {
  const roles = sheetRoles(sheet);
  return sheetTemplate(sheet).roles.headline.filter((role) => roles[role] !== undefined);
}

/**
 * The requirements a sheet states itself: the checks its template's contract names (a row that is 1 when the
 * requirement holds), its film temperature limit and its required system margin.
 */
function sheetChecks(sheet: Sheet, { all, visible }: SheetRows, base: Float64Array): Check[] {
  const roles = sheetRoles(sheet);
  // A check's row is judged only for those who may see it; the margin and the temperature limit qualify
  // headline figures, which everyone who views the craft gets.
  const checks: Check[] = sheetTemplate(sheet).roles.checks.flatMap((check) => {
    const key = roles[check.role];
    const row = key === undefined ? undefined : visible.find(key);
    if (row === undefined) return [];
    return [
      {
        id: check.role,
        label: check.holds,
        from: 'sheet' as const,
        holds: (values: Float64Array) => values[row.index] === 1,
        reads: [row.index],
      },
    ];
  });
  const temperature = roles.sail_temperature === undefined ? undefined : all.find(roles.sail_temperature);
  const limit = roles.film_temperature_limit === undefined ? undefined : all.find(roles.film_temperature_limit);
  if (temperature !== undefined && limit !== undefined) {
    checks.push({
      id: 'temperature',
      label: `${rowRoleDefinitions.sail_temperature.label} at most the ${rowRoleDefinitions.film_temperature_limit.label.toLowerCase()}`,
      from: 'sheet',
      holds: (values) => (values[temperature.index] ?? Number.NaN) <= (values[limit.index] ?? Number.NaN),
      reads: [temperature.index, limit.index],
    });
  }
  const margin = marginCheck(sheet, all, base);
  if (margin !== undefined) checks.push(margin);
  return checks;
}

/**
 * The required system margin, judged on each sample by the budget's own rule (marginBelowRequired, which the
 * roll-up applies) on the sheet's allocation and predicted total (its TOTAL_PREDICTED() row), both found by role.
 * The required percentage and its basis are the roll-up's, read once at the sheet's own values. None when the
 * sheet lacks those rows or its budget does not roll up.
 */
function marginCheck(sheet: Sheet, rows: Rows, base: Float64Array): Check | undefined {
  const roles = sheetRoles(sheet);
  const [allocation, predicted] = (['mass_allocation', 'predicted_mass'] as const).map((role) => {
    const key = roles[role];
    return key === undefined ? undefined : rows.find(key);
  });
  const preset = sheetPreset(sheet.budget);
  if (allocation === undefined || predicted === undefined || !preset.ok) return undefined;
  const required = sheet.budget?.requiredMarginPercent;
  let margin: BudgetRollUp['systemMargin'];
  try {
    // One line holding the predicted total, so the roll-up states the requirement as it would for the sheet.
    const predictedKg = base[predicted.index] ?? Number.NaN;
    const line = [{ key: 'total', subsystem: 'total', cbe: predictedKg, maturity: 'total', category: 'total' }];
    const totals = {
      ...preset.value,
      maturities: [{ id: 'total', label: 'Total' }],
      categories: [{ id: 'total', label: 'Total' }],
      table: { total: { total: 0 } },
    };
    const options = { allocation: base[allocation.index] ?? Number.NaN };
    margin = rollUpBudget(line, totals, required === undefined ? options : { ...options, requiredMarginPercent: required }).systemMargin;
  } catch {
    return undefined;
  }
  const { requiredPercentOfBasis, requiredBasis } = margin;
  return {
    id: 'margin',
    label: `${rowRoleDefinitions.system_margin.label} at least the required ${formatNumber(requiredPercentOfBasis)} % ${systemMarginBases[requiredBasis]}`,
    from: 'sheet',
    holds: (values) => {
      const allocationKg = values[allocation.index] ?? Number.NaN;
      const predictedKg = values[predicted.index] ?? Number.NaN;
      // An allocation the roll-up refuses (none left, or no number) meets no requirement.
      if (!(allocationKg > 0) || !Number.isFinite(allocationKg) || !Number.isFinite(predictedKg)) return false;
      return !marginBelowRequired(allocationKg, predictedKg, requiredPercentOfBasis, requiredBasis);
    },
    reads: [allocation.index, predicted.index],
  };
}

/** The requirements a request adds: a figure at least or at most a value. */
function requestChecks(sheet: Sheet, rows: SheetRows, request: UncertaintyRequest, problems: FieldError[]): Check[] {
  return request.requirements.flatMap((requirement, at) => {
    const figure = findFigure(sheet, rows, requirement.output);
    if (figure === undefined) {
      problems.push({
        path: `requirements.${at}.output`,
        message: `no row of the sheet plays the role or has the key "${requirement.output}"`,
      });
      return [];
    }
    const atLeast = requirement.atLeast !== undefined;
    const given = requirement.atLeast ?? requirement.atMost ?? Number.NaN;
    const limit = valueInRowUnit(figure.parameter, given);
    if (!limit.ok) {
      problems.push({ path: `requirements.${at}.${atLeast ? 'atLeast' : 'atMost'}`, message: `${figure.label}: ${limit.error.message}` });
      return [];
    }
    const limitSI = toSI(limit.value, figure.unit);
    return [
      {
        id: `request-${at}`,
        label: `${figure.label} at ${atLeast ? 'least' : 'most'} ${formatQuantity(limit.value, figure.parameter.unit)}`,
        from: 'request' as const,
        holds: atLeast
          ? (values: Float64Array) => (values[figure.index] ?? Number.NaN) >= limitSI
          : (values: Float64Array) => (values[figure.index] ?? Number.NaN) <= limitSI,
        reads: [figure.index],
      },
    ];
  });
}

/** The uncertain inputs, each row found and its distribution in SI. */
function studyInputs(
  rows: Rows,
  request: UncertaintyRequest,
  problems: FieldError[],
): { row: StudyRow; si: SIDistribution; distribution: Distribution }[] {
  return request.inputs.flatMap(({ key, distribution }, at) => {
    const row = rows.find(key);
    const problem = rows.problemOf(key);
    const fail = (where: string, message: string) => {
      problems.push({ path: `inputs.${at}.${where}`, message });
      return [];
    };
    if (row === undefined) return fail('key', problem ?? `no row has the key "${key}"`);
    if (row.parameter.formula !== undefined)
      return fail('key', `${key} is a formula, not an input: give a distribution to an input it reads`);
    if (row.parameter.protected === true) return fail('key', `${key} is protected (a constant), so it cannot vary`);
    if (problem !== undefined) return fail('key', problem);
    let unit = row.unit;
    if (distribution.unit !== undefined) {
      const given = parseUnit(distribution.unit);
      if (!given.ok) return fail('distribution.unit', given.message);
      if (!sameDimension(given.value.dimension, row.unit.dimension)) {
        return fail(
          'distribution.unit',
          `${key} is in "${row.parameter.unit}" (${formatDimension(row.unit.dimension)}), but "${distribution.unit}" is ${formatDimension(given.value.dimension)}`,
        );
      }
      unit = given.value;
    }
    const si = distributionInSI(distribution, (value) => toSI(value, unit));
    if (!Object.values(si).every((value) => typeof value === 'string' || Number.isFinite(value))) {
      return fail('distribution', `${key}: the distribution is out of range once converted to SI`);
    }
    return [{ row, si, distribution }];
  });
}

/**
 * Prepares a study of `sheet`: finds the inputs, figures and requirements and compiles the program that
 * evaluates a sample. Problems name where in the request they are.
 */
export function prepareStudy(sheet: Sheet, request: UncertaintyRequest, options: StudyOptions = {}): PreparedStudy {
  const compiled = compileSheet(sheet, options.compile);
  const rows: SheetRows = { all: new Rows(compiled, () => true), visible: new Rows(compiled, options.sees ?? (() => true)) };
  const problems: FieldError[] = [];
  const inputs = studyInputs(rows.visible, request, problems);
  const outputNames = request.outputs ?? defaultOutputs(sheet);
  const figures = outputNames.flatMap((name, at) => {
    const figure = findFigure(sheet, rows, name);
    if (figure === undefined) {
      const path = request.outputs === undefined ? 'outputs' : `outputs.${at}`;
      problems.push({ path, message: `no row of the sheet plays the role or has the key "${name}"` });
      return [];
    }
    return [figure];
  });
  if (figures.length === 0 && problems.length === 0) {
    problems.push({ path: 'outputs', message: 'the sheet has no headline figures by role: name the outputs to read' });
  }
  const checks = [...sheetChecks(sheet, rows, compiled.base), ...requestChecks(sheet, rows, request, problems)];
  if (problems.length > 0) return { ok: false, problems };

  const inputIndices = inputs.map((input) => input.row.index);
  const program = compiled.program(inputIndices, [...figures.map((figure) => figure.index), ...checks.flatMap((check) => check.reads)]);
  const values = compiled.base.slice();
  const random = seededRandom(request.seed);
  const total = request.samples;
  const samples = figures.map(() => new Float64Array(total));
  const met = checks.map(() => 0);
  let done = 0;

  const step = (count: number): number => {
    const end = Math.min(total, done + Math.max(0, Math.floor(count)));
    for (let sample = done; sample < end; sample += 1) {
      for (const input of inputs) values[input.row.index] = draw(input.si, random);
      program(values);
      for (let k = 0; k < figures.length; k += 1) {
        const series = samples[k];
        if (series !== undefined) series[sample] = values[figures[k]?.index ?? -1] ?? Number.NaN;
      }
      for (let k = 0; k < checks.length; k += 1) if (checks[k]?.holds(values) === true) met[k] = (met[k] ?? 0) + 1;
    }
    done = end;
    return done;
  };

  const percentiles = [...new Set([...STANDARD_PERCENTILES, ...request.percentiles])].sort((a, b) => a - b);
  const result = (): UncertaintyResult => {
    const invalid = new Uint8Array(done);
    const outputs = figures.map((figure, k): UncertainOutput => {
      const series = samples[k]?.subarray(0, done) ?? new Float64Array();
      const shown = new Float64Array(done);
      let count = 0;
      for (let sample = 0; sample < done; sample += 1) {
        const value = fromSI(series[sample] ?? Number.NaN, figure.unit);
        if (Number.isFinite(value)) shown[count++] = value;
        else invalid[sample] = 1;
      }
      const finite = shown.subarray(0, count);
      const nominal = fromSI(compiled.base[figure.index] ?? Number.NaN, figure.unit);
      const { mean, sd } = meanAndDeviation(finite);
      const { min, max } = extentOf(finite);
      const histogram = histogramOf(finite, request.bins);
      const orNull = (value: number) => (Number.isFinite(value) ? value : null);
      const values = percentilesOf(finite, percentiles);
      return {
        output: figure.output,
        role: figure.role,
        key: figure.parameter.key,
        label: figure.label,
        unit: figure.parameter.unit,
        nominal: orNull(nominal),
        mean: orNull(mean),
        sd: orNull(sd),
        min: orNull(min),
        max: orNull(max),
        percentiles: count === 0 ? [] : percentiles.map((percentile, at) => ({ percentile, value: values[at] ?? Number.NaN })),
        histogram,
        invalid: done - count,
      };
    });
    return {
      samples: done,
      seed: request.seed,
      inputs: inputs.map(({ row, distribution }) => ({
        key: row.parameter.key,
        label: row.parameter.label,
        unit: row.parameter.unit,
        role: row.parameter.role ?? null,
        distribution,
      })),
      outputs,
      requirements: checks.map((check, k) => ({
        id: check.id,
        label: check.label,
        from: check.from,
        probability: done === 0 ? 0 : (met[k] ?? 0) / done,
        met: met[k] ?? 0,
        samples: done,
      })),
      invalidSamples: invalid.reduce((sum, flag) => sum + flag, 0),
      caution: SIZING_CAUTION,
    };
  };

  return {
    ok: true,
    study: {
      total,
      get done() {
        return done;
      },
      step,
      result,
    },
  };
}

/** Runs a whole study at once (the server and the command line); problems as prepareStudy gives them. */
export function runStudy(
  sheet: Sheet,
  request: UncertaintyRequest,
  options: StudyOptions = {},
): { ok: true; result: UncertaintyResult } | { ok: false; problems: FieldError[] } {
  const prepared = prepareStudy(sheet, request, options);
  if (!prepared.ok) return prepared;
  prepared.study.step(prepared.study.total);
  return { ok: true, result: prepared.study.result() };
}
