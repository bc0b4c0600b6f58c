/**
 * `npm run bench`: medians of the engine's timings on this machine. Targets: single-edit
 * recompute on 1,000 parameters under 2 ms; a 10,000-point sweep of one input reading three
 * outputs under 200 ms. A script, not a test: jest never runs it.
 */
import { sweep } from '@/shared/engine/analyses';
import { evaluateSheet } from '@/shared/engine/evaluate';
import { createSheetSession } from '@/shared/engine/session';
import { squareSailTemplate } from '@/shared/templates';
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
  console.log(`${name.padEnd(62)} ${milliseconds.toFixed(3).padStart(10)} ms${verdict}`);
}

function requireOk<T>(result: { ok: true; result: T } | { ok: false; errors: unknown[] }): T {
  if (!result.ok) throw new Error(`bench setup failed: ${JSON.stringify(result.errors)}`);
  return result.result;
}

console.log('median of several runs each, after one warm-up run');
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
  const editOnce = (): void => {
    const key = inputs[edit % inputs.length] ?? 'p_0';
    edit += 1;
    const result = session.setInput(key, 1 + (edit % 97));
    if (!result.ok) throw new Error(result.error.message);
  };
  for (let warm = 0; warm < 50; warm += 1) editOnce();
  report('single-edit recompute, 1,000-parameter sheet', time(500, editOnce), 2);
  session.destroy();
}

{
  const template = squareSailTemplate();
  const outputs = ['srp_force', 'characteristic_acceleration', 'sail_temperature'];
  report(
    '10,000-point sweep, square-sail template, 3 outputs',
    time(10, () => {
      requireOk(sweep(template, { key: 'sail_side', from: 10, to: 1000, steps: 10_000 }, outputs));
    }),
    200,
  );
  const sheet = syntheticSheet(1000);
  const last = sheet.parameters.slice(-3).map((parameter) => parameter.key);
  report(
    '10,000-point sweep, 1,000-parameter sheet (p_0), 3 outputs',
    time(10, () => {
      requireOk(sweep(sheet, { key: 'p_0', from: 1, to: 100, steps: 10_000 }, last));
    }),
    200,
  );
  const big = syntheticSheet(10_000);
  const bigLast = big.parameters.slice(-3).map((parameter) => parameter.key);
  report(
    '10,000-point sweep, 10,000-parameter sheet (p_0), 3 outputs',
    time(3, () => {
      requireOk(sweep(big, { key: 'p_0', from: 1, to: 100, steps: 10_000 }, bigLast));
    }),
  );
}
