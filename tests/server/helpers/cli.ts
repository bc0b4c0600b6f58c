import { spawnSync } from 'node:child_process';
import path from 'node:path';

/** The repository's root, where `npm run evaluate` runs. */
export const repositoryRoot = path.resolve(__dirname, '..', '..', '..');

/**
 * Runs `npm run --silent evaluate -- ...args` as a person would: its exit status and its standard output
 * parsed as JSON (typed by the caller, who checks it).
 */
export function runEvaluate<Output = unknown>(...args: string[]): { status: number | null; output: Output } {
  const result = spawnSync('npm', ['run', '--silent', 'evaluate', '--', ...args], { cwd: repositoryRoot, encoding: 'utf8' });
  return { status: result.status, output: JSON.parse(result.stdout) as Output };
}
