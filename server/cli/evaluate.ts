/**
 * Command-line evaluator: `npm run --silent evaluate -- FILE [--set key=VALUE]...`
 * Prints {"values":{...},"errors":[...]} as JSON on stdout. Exit code 0 when there is no error,
 * 1 when any row has an error, 2 when the command line or the file cannot be used.
 */
import { readFileSync } from 'node:fs';
import { evaluateSheet } from '@/shared/engine/evaluate';
import { readSheet } from '@/shared/engine/read-sheet';

const USAGE = 'usage: evaluate FILE [--set key=VALUE]...   (VALUE may carry a unit: --set sail_side="60 m")';

interface Output {
  values: Record<string, { value: number; unit: string }>;
  errors: { key: string; code: string; message: string }[];
}

function finish(output: Output, code: number): never {
  process.stdout.write(`${JSON.stringify(output, null, 2)}\n`);
  process.exit(code);
}

function fail(code: string, message: string, exitCode: number): never {
  if (code === 'usage') process.stderr.write(`${USAGE}\n`);
  return finish({ values: {}, errors: [{ key: '', code, message }] }, exitCode);
}

function parseArguments(args: readonly string[]): { file: string; overrides: Record<string, string> } {
  const overrides: Record<string, string> = {};
  let file: string | undefined;
  for (let index = 0; index < args.length; index += 1) {
    const arg = args[index] ?? '';
    if (arg === '--set' || arg.startsWith('--set=')) {
      const assignment = arg === '--set' ? args[(index += 1)] : arg.slice('--set='.length);
      const equals = assignment?.indexOf('=') ?? -1;
      if (assignment === undefined || equals <= 0) fail('usage', `--set needs key=VALUE, got ${assignment ?? 'nothing'}`, 2);
      overrides[assignment.slice(0, equals).trim()] = assignment.slice(equals + 1);
    } else if (arg.startsWith('-')) {
      fail('usage', `unknown option ${arg}`, 2);
    } else if (file === undefined) {
      file = arg;
    } else {
      fail('usage', `only one FILE may be given, got ${file} and ${arg}`, 2);
    }
  }
  if (file === undefined) fail('usage', 'no FILE given', 2);
  return { file, overrides };
}

function main(): void {
  const { file, overrides } = parseArguments(process.argv.slice(2));
  let data: unknown;
  try {
    data = JSON.parse(readFileSync(file, 'utf8'));
  } catch (error) {
    fail('invalid_file', `${file}: ${error instanceof Error ? error.message : String(error)}`, 2);
  }
  const read = readSheet(data);
  if (read.sheet === undefined) finish({ values: {}, errors: read.errors }, 2);
  const result = evaluateSheet(read.sheet, overrides);
  const errors = [...read.errors, ...result.errors];
  finish({ values: result.values, errors }, errors.length > 0 ? 1 : 0);
}

main();
