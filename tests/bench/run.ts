/**
 * `npm run bench`: medians of the engine's timings on this machine. Targets: single-edit
 * recompute on 1,000 parameters under 2 ms; a 10,000-point sweep of one input reading three
 * outputs under 200 ms; each sandbox analysis on the template under 50 ms. A script, not a test: jest never runs it.
 */
import { coneAngleSeries, filmThicknessTrade, temperatureVersusDistance } from '@/shared/analyses';
import { sweep, type SweepAxis } from '@/shared/engine/analyses';
import type { Sheet } from '@/shared/schemas/sheet';
import { evaluateSheet } from '@/shared/engine/evaluate';
import { createSheetSession } from '@/shared/engine/session';
import { squareSailTemplate } from '@/shared/templates';
import { runProductBenchmarks } from '@/tests/bench/product';
import { benchUncertainty } from '@/tests/bench/uncertainty';
import { syntheticSheet } from '@/tests/bench/synthetic-sheet';

function median(samples: number[]): number {
  const sorted = [...samples].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? (sorted[middle] ?? 0) : ((sorted[middle - 1] ?? 0) + (sorted[middle] ?? 0)) / 2;
}

function time(runs: number, work: () => void): number {
  work();
  const samples: number[] = [];
  for (let run = 0; run < runs; run += 1) {
    const start = performance.now();
    work();
    samples.push(performance.now() - start);
  }
  return median(samples);
}

function report(name: string, milliseconds: number, target?: number): void {
  const verdict =
    target === undefined ? '' : milliseconds < target ? `  (target < ${target} ms: met)` : `  (target < ${target} ms: MISSED)`;
  console.log(`${name.padEnd(84)} ${milliseconds.toFixed(3).padStart(10)} ms${verdict}`);
}

function requireOk<T>(result: { ok: true; result: T } | { ok: false; errors: unknown[] }): T {
  if (!result.ok) throw new Error(`bench setup failed: ${JSON.stringify(result.errors)}`);
  return result.result;
}

console.log('median of several runs each, after one warm-up run');
// TRIMSHEET_BENCH_ONLY=uncertainty: only the uncertainty study, on the engine (no product stack).
if (process.env.TRIMSHEET_BENCH_ONLY === 'uncertainty') {
  benchUncertainty(report, time);
  process.exit(0);
}
for (const [size, runs] of [
  [100, 30],
  [1000, 10],
  [10_000, 5],
] as const) {
  const sheet = syntheticSheet(size);
  report(
    `build and evaluate a ${size.toLocaleString('en')}-parameter sheet`,
    time(runs, () => {
      const result = evaluateSheet(sheet);
      if (result.errors.length > 0) throw new Error('synthetic sheet has errors');
    }),
  );
}

{
  const sheet = syntheticSheet(1000);
  const inputs = sheet.parameters.filter((parameter) => parameter.value !== undefined).map((parameter) => parameter.key);
  const session = createSheetSession(sheet);
  let edit = 0;
  const coneSizes: number[] = [];
  const editOnce = (): void => {
    const key = inputs[edit % inputs.length] ?? 'p_0';
    edit += 1;
    const result = session.setInput(key, 1 + (edit % 97));
    if (!result.ok) throw new Error(result.error.message);
    coneSizes.push(result.recomputed.length);
  };
  for (let warm = 0; warm < 50; warm += 1) editOnce();
  const milliseconds = time(500, editOnce);
  report(`single-edit recompute, 1,000-parameter sheet (median ${median(coneSizes)} rows recomputed)`, milliseconds, 2);
  session.destroy();
}

function benchSweep(name: string, sheet: Sheet, axis: SweepAxis, outputs: readonly string[], runs: number, target?: number): void {
  report(
    `10,000-point sweep, ${name}, 3 outputs`,
    time(runs, () => {
      requireOk(sweep(sheet, axis, outputs));
    }),
    target,
  );
}

const lastThree = (sheet: Sheet): string[] => sheet.parameters.slice(-3).map((parameter) => parameter.key);
const sweepOfFirst: SweepAxis = { key: 'p_0', from: 1, to: 100, steps: 10_000 };
benchSweep(
  'square-sail template',
  squareSailTemplate(),
  { key: 'sail_side', from: 10, to: 1000, steps: 10_000 },
  ['srp_force', 'characteristic_acceleration', 'sail_temperature'],
  10,
  200,
);
const thousand = syntheticSheet(1000);
benchSweep('1,000-parameter sheet (p_0)', thousand, sweepOfFirst, lastThree(thousand), 10, 200);
const tenThousand = syntheticSheet(10_000);
benchSweep('10,000-parameter sheet (p_0)', tenThousand, sweepOfFirst, lastThree(tenThousand), 3);

// The sandbox and Sheet screens rerun these after every edit: each must fit well inside a frame budget of a few tens of ms.
{
  const template = squareSailTemplate();
  report(
    'coneAngleSeries on the square-sail template (91 points and the maximum)',
    time(20, () => requireOk(coneAngleSeries(template))),
    50,
  );
  report(
    'temperatureVersusDistance on the square-sail template (39 points and the closest approach)',
    time(20, () => requireOk(temperatureVersusDistance(template))),
    50,
  );
  report(
    'filmThicknessTrade on the square-sail template (3 x 60 points)',
    time(20, () => requireOk(filmThicknessTrade(template))),
    50,
  );
}

benchUncertainty(report, time);

// The running product (web build, browser, server under load), on a stack of its own.
runProductBenchmarks().catch((error: unknown) => {
  console.error('[bench]', error);
  process.exitCode = 1;
});
