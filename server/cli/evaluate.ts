/**
 * Command-line evaluator and analyses (README.md, "Command line"; the JSON printed is described by the schemas
 * in shared/schemas/cli.ts):
 *
 *   npm run --silent evaluate -- (FILE | --template ID) [--input key=VALUE]...
 *       [--sweep KEY [--from V --to V] [--steps N] --output KEY...]
 *       [--size KEY [--from V --to V] --output KEY --target V]
 *       [--vary KEY=DISTRIBUTION... [--samples N] [--seed S] [--percentile P]... [--output FIGURE]... [--require FIGURE>=V]...]
 *
 * `--set` is the earlier name of `--input` and still works. Exit code 0 when there is no error, 1 when a row or
 * the analysis has one (listed in `errors`), 2 when the command line or the file cannot be used.
 */
import { readFileSync } from 'node:fs';
import { applyOverrides, evaluateSheet, solveForTarget, sweep } from '@/shared/engine';
import { readSheet } from '@/shared/engine/read-sheet';
import type { FieldError } from '@/shared/schemas/common';
import type { Sheet } from '@/shared/schemas/sheet';
import { uncertaintyRequestSchema, type UncertaintyRequestInput } from '@/shared/schemas/uncertainty';
import { findTemplate, instantiateTemplate, isRowRole, sizingRange, templates } from '@/shared/templates';
import { runStudy } from '@/shared/uncertainty';

const USAGE = [
  'usage: evaluate (FILE | --template ID) [--input key=VALUE]...   (VALUE may carry a unit: --input sail_side="60 m")',
  '  sweep:       --sweep KEY [--from V --to V] [--steps N] --output KEY [--output KEY]...',
  '  size:        --size KEY [--from V --to V] --output KEY --target V',
  '  uncertainty: --vary KEY=uniform:MIN,MAX | triangular:MIN,MODE,MAX | normal:MEAN,SD [UNIT]  (repeatable)',
  '               [--samples N] [--seed S] [--percentile P]... [--output FIGURE]... [--require FIGURE>=V | FIGURE<=V]...',
  `  templates:   ${templates.map((template) => template.id).join(', ')}`,
].join('\n');

interface CliError {
  key: string;
  code: string;
  message: string;
}

function print(document: object, code: number): never {
  process.stdout.write(`${JSON.stringify(document, null, 2)}\n`);
  process.exit(code);
}

function usage(message: string): never {
  process.stderr.write(`${USAGE}\n`);
  return print({ values: {}, errors: [{ key: '', code: 'usage', message }] }, 2);
}

/** Options that take a value, and whether they may be given more than once. */
const optionsTaking = {
  input: true,
  template: false,
  sweep: false,
  size: false,
  vary: true,
  from: false,
  to: false,
  steps: false,
  target: false,
  output: true,
  samples: false,
  seed: false,
  percentile: true,
  require: true,
} as const;
type OptionName = keyof typeof optionsTaking;
/** Earlier names of options. */
const aliases: Readonly<Record<string, OptionName>> = { set: 'input' };

interface CommandLine {
  file: string | undefined;
  values: Partial<Record<OptionName, string[]>>;
}

function parseArguments(args: readonly string[]): CommandLine {
  const values: CommandLine['values'] = {};
  let file: string | undefined;
  for (let index = 0; index < args.length; index += 1) {
    const arg = args[index] ?? '';
    if (!arg.startsWith('--')) {
      if (arg.startsWith('-')) usage(`unknown option ${arg}`);
      if (file !== undefined) usage(`only one FILE may be given, got ${file} and ${arg}`);
      file = arg;
      continue;
    }
    const equals = arg.indexOf('=');
    const written = arg.slice(2, equals < 0 ? undefined : equals);
    const name = aliases[written] ?? (Object.hasOwn(optionsTaking, written) ? (written as OptionName) : undefined);
    if (name === undefined) usage(`unknown option ${arg}`);
    const value = equals < 0 ? args[(index += 1)] : arg.slice(equals + 1);
    if (value === undefined) usage(`--${written} needs a value`);
    const given = values[name] ?? [];
    if (!optionsTaking[name] && given.length > 0) usage(`--${written} may be given only once`);
    values[name] = [...given, value];
  }
  return { file, values };
}

/** The sheet of the file or template, and the rows of the file that could not be read (left out of the sheet). */
function loadSheet(line: CommandLine): { sheet: Sheet; fileErrors: CliError[] } {
  const [templateId] = line.values.template ?? [];
  if (templateId !== undefined) {
    if (line.file !== undefined) usage(`give a FILE or --template, not both (got ${line.file} and --template ${templateId})`);
    const template = findTemplate(templateId);
    if (template === undefined) usage(`unknown template "${templateId}" (known: ${templates.map((known) => known.id).join(', ')})`);
    return { sheet: instantiateTemplate(template), fileErrors: [] };
  }
  if (line.file === undefined) usage('no FILE or --template given');
  let data: unknown;
  try {
    data = JSON.parse(readFileSync(line.file, 'utf8'));
  } catch (error) {
    print(
      {
        values: {},
        errors: [{ key: '', code: 'invalid_file', message: `${line.file}: ${error instanceof Error ? error.message : String(error)}` }],
      },
      2,
    );
  }
  const read = readSheet(data);
  if (read.sheet === undefined) print({ values: {}, errors: read.errors }, 2);
  return { sheet: read.sheet, fileErrors: read.errors };
}

/** `key=VALUE` pairs of --input. */
function assignments(texts: readonly string[]): Record<string, string> {
  const overrides: Record<string, string> = {};
  for (const text of texts) {
    const equals = text.indexOf('=');
    if (equals <= 0) usage(`--input needs key=VALUE, got ${text}`);
    overrides[text.slice(0, equals).trim()] = text.slice(equals + 1);
  }
  return overrides;
}

function wholeNumber(option: OptionName, text: string | undefined): number | undefined {
  if (text === undefined) return undefined;
  const value = Number(text);
  if (!Number.isInteger(value)) usage(`--${option} needs a whole number, got ${text}`);
  return value;
}

/** Options only one kind of analysis reads, so a typo in the analysis is not silently ignored. */
function refuseOthers(line: CommandLine, analysis: string, allowed: readonly OptionName[]): void {
  const always: readonly OptionName[] = ['input', 'template'];
  for (const name of Object.keys(line.values) as OptionName[]) {
    if (!always.includes(name) && !allowed.includes(name)) usage(`--${name} does not apply to ${analysis}`);
  }
}

/** The range of a swept or sized input: --from and --to, or the range the templates declare for its row's role. */
function rangeOf(sheet: Sheet, key: string, line: CommandLine): { from: string; to: string } {
  const [from] = line.values.from ?? [];
  const [to] = line.values.to ?? [];
  if (from !== undefined && to !== undefined) return { from, to };
  const role = sheet.parameters.find((parameter) => parameter.key === key)?.role;
  const declared = role !== undefined && isRowRole(role) ? sizingRange(role) : undefined;
  if (declared === undefined) usage(`--from and --to are needed: no template declares a range for ${key}`);
  return { from: from ?? `${declared.min} ${declared.unit}`, to: to ?? `${declared.max} ${declared.unit}` };
}

const finiteOrNull = (values: Float64Array) => Array.from(values, (value) => (Number.isFinite(value) ? value : null));

function runSweep(sheet: Sheet, key: string, line: CommandLine): never {
  refuseOthers(line, '--sweep', ['sweep', 'from', 'to', 'steps', 'output']);
  const outputs = line.values.output ?? usage('--sweep needs at least one --output KEY');
  const swept = sweep(sheet, { key, ...rangeOf(sheet, key, line), steps: wholeNumber('steps', line.values.steps?.[0]) ?? 50 }, outputs);
  if (!swept.ok) print({ analysis: 'sweep', result: null, errors: swept.errors }, 1);
  const series = ({ key: row, unit, values }: { key: string; unit: string; values: Float64Array }) => ({
    key: row,
    unit,
    values: finiteOrNull(values),
  });
  const { input, outputs: read, invalidPoints } = swept.result;
  return print({ analysis: 'sweep', result: { input: series(input), outputs: read.map(series), invalidPoints }, errors: [] }, 0);
}

function runSize(sheet: Sheet, key: string, line: CommandLine): never {
  refuseOthers(line, '--size', ['size', 'from', 'to', 'output', 'target']);
  const [output, more] = line.values.output ?? [];
  const [target] = line.values.target ?? [];
  if (output === undefined || more !== undefined) usage('--size reads one --output KEY');
  if (target === undefined) usage('--size needs --target VALUE');
  const solved = solveForTarget(sheet, { input: key, ...rangeOf(sheet, key, line), output, target });
  if (!solved.ok) print({ analysis: 'size', result: null, errors: solved.errors }, 1);
  return print({ analysis: 'size', result: solved.result, errors: [] }, 0);
}

/** `KEY=KIND:A,B[,C] [UNIT]` as an input of the study. */
function distributionOf(text: string): UncertaintyRequestInput['inputs'][number] {
  const match = /^([^=]+)=\s*(uniform|triangular|normal)\s*:\s*([^\s]+)\s*(.*)$/.exec(text);
  if (match === null) usage(`--vary needs KEY=uniform:MIN,MAX, KEY=triangular:MIN,MODE,MAX or KEY=normal:MEAN,SD, got ${text}`);
  const [, key = '', kind = '', list = '', unit = ''] = match;
  const numbers = list.split(',').map(Number);
  const names = { uniform: ['min', 'max'], triangular: ['min', 'mode', 'max'], normal: ['mean', 'sd'] }[kind] ?? [];
  if (numbers.length !== names.length || !numbers.every(Number.isFinite)) {
    usage(`--vary ${key.trim()}: ${kind} needs ${names.length} numbers (${names.join(', ')}), got "${list}"`);
  }
  const distribution = Object.fromEntries(names.map((name, at) => [name, numbers[at]]));
  return {
    key: key.trim(),
    distribution: { kind, ...distribution, ...(unit.trim() === '' ? {} : { unit: unit.trim() }) },
  } as UncertaintyRequestInput['inputs'][number];
}

/** `FIGURE>=VALUE` or `FIGURE<=VALUE`. */
function requirementOf(text: string): { output: string; atLeast?: string; atMost?: string } {
  const match = /^([^<>=]+)(>=|<=)(.+)$/.exec(text);
  if (match === null) usage(`--require needs FIGURE>=VALUE or FIGURE<=VALUE, got ${text}`);
  const [, output = '', comparison, value = ''] = match;
  return comparison === '>=' ? { output: output.trim(), atLeast: value.trim() } : { output: output.trim(), atMost: value.trim() };
}

/** Where a problem of the study's request is on the command line. */
function problemOnCommandLine(request: UncertaintyRequestInput, problem: FieldError): CliError {
  const [part, index] = problem.path.split('.');
  const at = Number(index);
  if (part === 'inputs') {
    const key = request.inputs[at]?.key ?? '';
    return { key, code: 'invalid_argument', message: `--vary ${key}: ${problem.message}` };
  }
  if (part === 'outputs' && Number.isInteger(at))
    return { key: '', code: 'invalid_argument', message: `--output ${request.outputs?.[at] ?? ''}: ${problem.message}` };
  if (part === 'requirements')
    return { key: '', code: 'invalid_argument', message: `--require ${request.requirements?.[at]?.output ?? ''}: ${problem.message}` };
  return { key: '', code: 'invalid_argument', message: problem.path === '' ? problem.message : `--${part}: ${problem.message}` };
}

function runUncertainty(sheet: Sheet, line: CommandLine): never {
  refuseOthers(line, '--vary', ['vary', 'samples', 'seed', 'percentile', 'output', 'require']);
  const percentiles = (line.values.percentile ?? []).map((text) => {
    const value = Number(text);
    return Number.isFinite(value) ? value : usage(`--percentile needs a number, got ${text}`);
  });
  const input: UncertaintyRequestInput = {
    inputs: (line.values.vary ?? []).map(distributionOf),
    samples: wholeNumber('samples', line.values.samples?.[0]),
    seed: wholeNumber('seed', line.values.seed?.[0]),
    percentiles,
    requirements: (line.values.require ?? []).map(requirementOf),
    ...(line.values.output === undefined ? {} : { outputs: line.values.output }),
  };
  const parsed = uncertaintyRequestSchema.safeParse(input);
  if (!parsed.success) {
    const [first] = parsed.error.issues.map((issue) => problemOnCommandLine(input, { path: issue.path.join('.'), message: issue.message }));
    usage(first?.message ?? 'the study cannot run');
  }
  const ran = runStudy(sheet, parsed.data);
  if (!ran.ok)
    print({ analysis: 'uncertainty', result: null, errors: ran.problems.map((problem) => problemOnCommandLine(input, problem)) }, 1);
  return print({ analysis: 'uncertainty', result: ran.result, errors: [] }, 0);
}

function main(): void {
  const line = parseArguments(process.argv.slice(2));
  const { sheet, fileErrors } = loadSheet(line);
  const overrides = assignments(line.values.input ?? []);
  const [sweepKey] = line.values.sweep ?? [];
  const [sizeKey] = line.values.size ?? [];
  const varies = line.values.vary !== undefined;
  const analyses = [sweepKey, sizeKey].filter((key) => key !== undefined).length + (varies ? 1 : 0);
  if (analyses > 1) usage('give one analysis at a time: --sweep, --size or --vary');
  if (analyses === 0) {
    refuseOthers(line, 'an evaluation (name an analysis: --sweep, --size or --vary)', []);
    const result = evaluateSheet(sheet, overrides);
    const errors = [...fileErrors, ...result.errors];
    print({ values: result.values, errors }, errors.length > 0 ? 1 : 0);
  }
  const overridden = applyOverrides(sheet, overrides);
  const analysis = sweepKey !== undefined ? 'sweep' : sizeKey !== undefined ? 'size' : 'uncertainty';
  const refused = [...fileErrors, ...overridden.errors];
  if (refused.length > 0) print({ analysis, result: null, errors: refused }, 1);
  if (sweepKey !== undefined) runSweep(overridden.sheet, sweepKey, line);
  if (sizeKey !== undefined) runSize(overridden.sheet, sizeKey, line);
  runUncertainty(overridden.sheet, line);
}

main();
