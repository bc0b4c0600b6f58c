import type { CompiledSheet } from '@/shared/engine';
import { compareSheets, evaluatePair, whatMoved } from '@/shared/revisions/compare';
import type { CompareQuery, CompareResponse, MovedOutput } from '@/shared/schemas/compare';
import type { User } from '../models';
import { HttpError, notFound } from '../http-error';
import { readRevision, type ReadableRevision } from './revisions';
import { toRevisionDto } from './sheet-store';

/** How many crafts' last compiled sheets this process keeps (a few MB each at 5,000 rows). */
const CRAFTS_KEPT = 8;

/**
 * The sheet this process compiled last for each craft, most recently used last. Comparing two revisions of
 * a craft then parses and checks only the rows that differ from it, and generates no code when the formulas
 * are the same: the revisions of one craft share most rows. Reuse never changes a result (see evaluatePair):
 * each side is still evaluated at its own inputs on every request.
 */
const lastCompiled = new Map<string, CompiledSheet>();

function rememberCompiled(craftId: string, compiled: CompiledSheet): void {
  lastCompiled.delete(craftId);
  lastCompiled.set(craftId, compiled);
  for (const oldest of lastCompiled.keys()) {
    if (lastCompiled.size <= CRAFTS_KEPT) break;
    lastCompiled.delete(oldest);
  }
}

/**
 * Whether the reader may see the row of this key in the comparison: on every side that has it, it must be
 * a row they may see there (a row moved out of a subsystem shared with a partner leaves their comparison).
 * Undefined when they see every row of both sides.
 */
function rowVisibility(sides: readonly ReadableRevision[]): ((key: string) => boolean) | undefined {
  if (sides.every((side) => side.seesEveryRow)) return undefined;
  const hidden = new Set<string>();
  for (const side of sides) {
    const visible = new Set(side.visibleRows().map((row) => row.key));
    for (const row of side.rows()) if (!visible.has(row.key)) hidden.add(row.key);
  }
  return (key) => !hidden.has(key);
}

/** Stands in for the engine's messages for a reader who sees only some rows: those name the rows a formula reads. */
const NO_VALUE_ON_ONE_SIDE = 'has no value in one of the revisions';

/** What moved the output for a reader who sees only some rows: the changed inputs they cannot see are summed, unnamed. */
function movedAsSeen(moved: MovedOutput, sees: (key: string) => boolean): MovedOutput {
  const hidden = moved.inputs.filter((input) => !sees(input.key));
  return {
    ...moved,
    inputs: moved.inputs.filter((input) => sees(input.key)),
    otherChanges: moved.otherChanges.filter((change) => sees(change.key)),
    ...(hidden.length > 0 ? { hiddenShare: hidden.reduce((sum, input) => sum + input.share, 0) } : {}),
  };
}

/**
 * Compares two revisions of a craft (either may be any kind), each evaluated once on the server with the
 * shared engine's compiled evaluation, and with `output` what moved that output. Whoever may view the craft;
 * partners get only the rows of the subsystems shared with them and the outputs among those rows.
 * 404 for a revision of another craft or an output the reader does not see in `to`; 400 for an output
 * that has no old or new value to compare.
 */
export async function compareRevisions(user: User, craftId: string, query: CompareQuery): Promise<CompareResponse> {
  const [from, to] = await Promise.all([readRevision(user, craftId, query.from), readRevision(user, craftId, query.to)]);
  const sees = rowVisibility([from, to]);
  const pair = evaluatePair(from.sheet(), to.sheet(), lastCompiled.get(craftId));
  rememberCompiled(craftId, pair.to.compiled);

  let moved: MovedOutput | undefined;
  if (query.output !== undefined) {
    const outputNotFound = notFound(`Output "${query.output}" in the "to" revision`);
    if (sees !== undefined && !sees(query.output)) throw outputNotFound;
    const result = whatMoved(pair, query.output);
    if (!result.ok) {
      if (result.problem.kind === 'unknown_output') throw outputNotFound;
      const message = sees === undefined ? result.problem.message : `${query.output} ${NO_VALUE_ON_ONE_SIDE}`;
      throw new HttpError(400, 'invalid_output', `Invalid input: query.output ${message}`, [{ path: 'query.output', message }]);
    }
    moved = sees === undefined ? result.moved : movedAsSeen(result.moved, sees);
  }

  const comparison = compareSheets(pair);
  const revisions = { from: toRevisionDto(from.revision), to: toRevisionDto(to.revision) };
  const withMoved = moved === undefined ? {} : { moved };
  if (sees === undefined) return { ...revisions, ...comparison, ...withMoved };
  return {
    ...revisions,
    header: comparison.header,
    rows: {
      added: comparison.rows.added.filter((row) => sees(row.key)),
      removed: comparison.rows.removed.filter((row) => sees(row.key)),
      changed: comparison.rows.changed.filter((row) => sees(row.key)),
    },
    outputs: comparison.outputs
      .filter((output) => sees(output.key))
      .map((output) => (output.problem === undefined ? output : { ...output, problem: NO_VALUE_ON_ONE_SIDE })),
    ...withMoved,
  };
}
