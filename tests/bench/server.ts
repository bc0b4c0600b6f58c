import autocannon, { type Result } from 'autocannon';
import path from 'node:path';
import { inheritedEnvironment } from '@/server/env';
import { evaluationResponseSchema } from '@/shared/schemas/revisions';
import { revisionPath } from './api';
import { benchPorts, spawnTypeScript, waitUntilAnswering, type BenchStack } from './stack';
import { medianMilliseconds } from './statistics';

/** The yardstick server's port, beside the bench stack's own (shifted with them by TRIMSHEET_BENCH_PORT_OFFSET). */
const BARE_PORT = benchPorts.app + 1;

/**
 * Median of `GET .../evaluation` (values, errors and budget computed on the server) of a revision, one
 * request at a time with a bearer token. Checks that every row came back evaluated, so a fast refusal
 * cannot pass for a fast evaluation.
 */
export async function benchServerEvaluation(
  appUrl: string,
  token: string,
  revision: { craftId: string; revisionId: string; rows: number },
): Promise<number> {
  const url = `${appUrl}${revisionPath(revision.craftId, revision.revisionId)}/evaluation`;
  return medianMilliseconds(10, async () => {
    const response = await fetch(url, { headers: { authorization: `Bearer ${token}` } });
    if (!response.ok) throw new Error(`GET ${url}: ${response.status} ${(await response.text()).slice(0, 300)}`);
    const evaluation = evaluationResponseSchema.parse(await response.json());
    const evaluated = Object.keys(evaluation.values).length + evaluation.errors.length;
    if (evaluated < revision.rows) throw new Error(`GET ${url} evaluated ${evaluated} of ${revision.rows} rows`);
  });
}

/** What one load run measured. */
export interface LoadFigures {
  requestsPerSecond: number;
  p99Milliseconds: number;
  /** Connection errors, timeouts and non-2xx answers together. */
  failures: number;
}

const LOAD = { connections: 50, duration: 20 } as const;

/** Requests per second over whole runs (completed requests over their time), p99 of the worst run, failures of all. */
function figuresOf(results: readonly Result[]): LoadFigures {
  const total = (pick: (result: Result) => number) => results.reduce((sum, result) => sum + pick(result), 0);
  return {
    requestsPerSecond: total((result) => result.requests.total) / total((result) => result.duration),
    p99Milliseconds: Math.max(...results.map((result) => result.latency.p99)),
    failures: total((result) => result.errors + result.timeouts + result.non2xx),
  };
}

function load(url: string, headers: Record<string, string>, duration: number): Promise<Result> {
  return autocannon({ url, headers, connections: LOAD.connections, duration });
}

/** A signed-in GET to put under load: its URL and the headers that sign it in (a session cookie or a bearer token). */
export interface LoadTarget {
  url: string;
  headers: Record<string, string>;
}

/**
 * Each target under 50 connections for 20 s, beside the same load on a bare Express + pg `SELECT 1` endpoint
 * started here on the same database cluster. The machine is shared (other work comes and goes, and a 2-core
 * machine feels every bit of it), so the bare endpoint's 20 s are split around each target's, half before and
 * half after: measured one after the other, whichever ran in the quieter moment looked better. Each target
 * is checked first with one request, which must answer 2xx.
 */
export async function benchReadsUnderLoad(
  stack: BenchStack,
  targets: readonly LoadTarget[],
): Promise<{ target: LoadFigures; bare: LoadFigures }[]> {
  for (const { url, headers } of targets) {
    const check = await fetch(url, { headers });
    if (!check.ok) throw new Error(`GET ${url}: ${check.status} ${(await check.text()).slice(0, 300)}`);
  }
  const bare = spawnTypeScript(path.join(__dirname, 'bare-server.ts'), [], {
    ...inheritedEnvironment(),
    DATABASE_URL: stack.databaseUrl,
    HOST: '127.0.0.1',
    PORT: String(BARE_PORT),
  });
  try {
    const bareUrl = `http://127.0.0.1:${BARE_PORT}/select-one`;
    await waitUntilAnswering(bareUrl, bare.child);
    // A short run of each first, so every server is measured warm (JIT, pool connections open).
    await load(bareUrl, {}, 2);
    const figures: { target: LoadFigures; bare: LoadFigures }[] = [];
    for (const { url, headers } of targets) {
      await load(url, headers, 2);
      const bareBefore = await load(bareUrl, {}, LOAD.duration / 2);
      const targetRun = await load(url, headers, LOAD.duration);
      const bareAfter = await load(bareUrl, {}, LOAD.duration / 2);
      figures.push({ target: figuresOf([targetRun]), bare: figuresOf([bareBefore, bareAfter]) });
    }
    return figures;
  } finally {
    await bare.stop();
  }
}
