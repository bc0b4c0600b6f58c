import { QueryTypes } from 'sequelize';
import { createDatabase } from '@/server/db';
import { compareResponseSchema } from '@/shared/schemas/compare';
import { copyAsBaseline } from '@/tests/server/helpers/copy-revision';
import type { ApiSession } from './api';
import { createLargeCraft } from './large-craft';
import { medianMilliseconds } from './statistics';

/** One input in this many has a new value in the draft after the baseline. */
const CHANGED_ONE_IN = 5;

/**
 * Two revisions of a craft of `rows` rows: a locked baseline copied from the draft with SQL, then the draft
 * after a fifth of its inputs changed (by SQL too: thousands of PATCHes would outlast the benchmark). Returns
 * them, the last formula row (the output whose change is explained) and how many rows changed.
 */
async function revisionPair(api: ApiSession, databaseUrl: string, rows: number) {
  const craft = await createLargeCraft(api, databaseUrl, rows);
  const sequelize = createDatabase({ databaseUrl, databasePoolMax: 1 });
  try {
    const baselineId = await copyAsBaseline(sequelize, craft.revisionId, 'Benchmark baseline');
    const changed = await sequelize.query(
      `UPDATE revision_parameters SET value = value * 1.25, version = version + 1
       WHERE revision_id = $1 AND value IS NOT NULL AND position % ${CHANGED_ONE_IN} = 0 RETURNING key`,
      { bind: [craft.revisionId], type: QueryTypes.SELECT },
    );
    const [last] = await sequelize.query<{ key: string }>(
      'SELECT key FROM revision_parameters WHERE revision_id = $1 AND formula IS NOT NULL ORDER BY position DESC LIMIT 1',
      { bind: [craft.revisionId], type: QueryTypes.SELECT },
    );
    if (last === undefined) throw new Error('the benchmark craft has no formula row');
    return { craftId: craft.craftId, baselineId, draftId: craft.revisionId, output: last.key, changedRows: changed.length };
  } finally {
    await sequelize.close();
  }
}

/** What the comparison benchmark measured, in milliseconds. */
export interface CompareFigures {
  changedRows: number;
  /** The very first comparison of the craft: no earlier analysis of its sheet to reuse (one sample). */
  first: number;
  /** Median of the comparison. */
  compare: number;
  /** Median of the comparison with what moved the last formula row. */
  whatMoved: number;
}

/**
 * `GET /api/crafts/:craftId/compare?from=<baseline>&to=<draft>[&output=<key>]` on two revisions of `rows` rows,
 * one request at a time with a bearer token, through the route: both revisions read from PostgreSQL, each
 * compiled and evaluated, every row and output compared, and with `output` what moved the last formula row.
 * Each answer is checked once (every changed row and output there), so a fast refusal cannot pass for a fast
 * comparison; the timed requests read the whole body.
 */
export async function benchCompare(
  appUrl: string,
  token: string,
  api: ApiSession,
  databaseUrl: string,
  rows: number,
): Promise<CompareFigures> {
  const pair = await revisionPair(api, databaseUrl, rows);
  const comparison = (output: boolean) => {
    const url = `${appUrl}/api/crafts/${pair.craftId}/compare?from=${pair.baselineId}&to=${pair.draftId}${output ? `&output=${pair.output}` : ''}`;
    const get = async () => {
      const response = await fetch(url, { headers: { authorization: `Bearer ${token}` } });
      const text = await response.text();
      if (!response.ok) throw new Error(`GET ${url}: ${response.status} ${text.slice(0, 300)}`);
      return text;
    };
    const check = (text: string) => {
      const answer = compareResponseSchema.parse(JSON.parse(text));
      if (answer.rows.changed.length !== pair.changedRows || answer.outputs.length < rows / 2 || (answer.moved === undefined) === output) {
        throw new Error(
          `GET ${url} compared ${answer.rows.changed.length} of ${pair.changedRows} changed rows and ${answer.outputs.length} outputs`,
        );
      }
    };
    return { get, check };
  };
  const plain = comparison(false);
  const start = performance.now();
  const firstAnswer = await plain.get();
  const first = performance.now() - start;
  plain.check(firstAnswer);
  const moved = comparison(true);
  moved.check(await moved.get());
  return {
    changedRows: pair.changedRows,
    first,
    compare: await medianMilliseconds(10, async () => void (await plain.get())),
    whatMoved: await medianMilliseconds(10, async () => void (await moved.get())),
  };
}
