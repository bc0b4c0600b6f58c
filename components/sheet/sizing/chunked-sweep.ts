import { useCallback, useEffect, useRef, useState } from 'react';
import { roleSweep, type RoleSeries, type RoleSweepResult } from '@/shared/analyses';
import type { Sheet } from '@/shared/schemas/sheet';
import type { RowRole } from '@/shared/templates';

/**
 * Points evaluated between two yields to the screen. Each chunk compiles the sheet again (about 15 ms for
 * the template here), and a point costs microseconds, so a chunk of this size stays a few frames long.
 */
export const POINTS_PER_CHUNK = 2000;

/** A sweep to run: the input role over [from, to] (numbers in its row's unit) in `steps` points, reading the output roles. */
export interface ChunkedSweepRequest {
  readonly sheet: Sheet;
  readonly input: RowRole;
  readonly outputs: readonly RowRole[];
  readonly from: number;
  readonly to: number;
  readonly steps: number;
}

/** Where a chunked sweep stands. */
export type ChunkedSweepState =
  | { readonly status: 'idle' }
  | { readonly status: 'running'; readonly done: number; readonly total: number }
  | { readonly status: 'done'; readonly result: RoleSweepResult }
  | { readonly status: 'failed'; readonly problems: readonly string[] };

/**
 * The points of a sweep split into chunks of about `size` points, each at least two points long (a
 * sweep needs two): [first index, last index] of each chunk.
 */
export function chunkBounds(steps: number, size: number): [number, number][] {
  const count = Math.max(1, Math.min(Math.ceil(steps / size), Math.floor(steps / 2)));
  return Array.from({ length: count }, (_, k): [number, number] => [
    Math.round((k * steps) / count),
    Math.round(((k + 1) * steps) / count) - 1,
  ]);
}

function joined(parts: readonly RoleSeries[]): RoleSeries | undefined {
  const [first] = parts;
  return first === undefined ? undefined : { ...first, values: parts.flatMap((part) => part.values) };
}

/** Concatenates the results of consecutive chunks into one sweep. */
function concatenate(chunks: readonly RoleSweepResult[]): RoleSweepResult | undefined {
  const input = joined(chunks.map((chunk) => chunk.input));
  if (input === undefined) return undefined;
  const outputs = (chunks[0]?.outputs ?? []).flatMap((_, k) => joined(chunks.flatMap((chunk) => chunk.outputs[k] ?? [])) ?? []);
  return { input, outputs, invalidPoints: chunks.reduce((sum, chunk) => sum + chunk.invalidPoints, 0) };
}

/**
 * Runs a role sweep in chunks, yielding to the screen between them so it stays responsive and shows
 * progress; a new run or leaving the screen abandons the one under way.
 */
export function useChunkedSweep(): { state: ChunkedSweepState; run: (request: ChunkedSweepRequest) => void; cancel: () => void } {
  const [state, setState] = useState<ChunkedSweepState>({ status: 'idle' });
  const generation = useRef(0);
  useEffect(
    () => () => {
      generation.current += 1;
    },
    [],
  );

  const cancel = useCallback(() => {
    generation.current += 1;
    setState({ status: 'idle' });
  }, []);

  const run = useCallback((request: ChunkedSweepRequest) => {
    generation.current += 1;
    const mine = generation.current;
    const bounds = chunkBounds(request.steps, POINTS_PER_CHUNK);
    const span = request.to - request.from;
    const at = (index: number) => request.from + (span * index) / (request.steps - 1);
    const results: RoleSweepResult[] = [];
    setState({ status: 'running', done: 0, total: request.steps });
    const step = (chunk: number) => {
      if (generation.current !== mine) return;
      const [first, last] = bounds[chunk] ?? [0, 0];
      const swept = roleSweep(request.sheet, {
        input: request.input,
        outputs: request.outputs,
        from: at(first),
        to: at(last),
        steps: last - first + 1,
      });
      if (!swept.ok) {
        setState({ status: 'failed', problems: swept.errors.map((error) => error.message) });
        return;
      }
      results.push(swept.result);
      if (chunk + 1 < bounds.length) {
        setState({ status: 'running', done: last + 1, total: request.steps });
        setTimeout(() => step(chunk + 1), 0);
        return;
      }
      const result = concatenate(results);
      setState(result === undefined ? { status: 'failed', problems: ['the sweep gave no points'] } : { status: 'done', result });
    };
    setTimeout(() => step(0), 0);
  }, []);

  return { state, run, cancel };
}
