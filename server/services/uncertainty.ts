import type { UncertaintyRequest, UncertaintyResult } from '@/shared/schemas/uncertainty';
import { prepareStudy } from '@/shared/uncertainty';
import type { User } from '../models';
import { HttpError } from '../http-error';
import { readRevision } from './revisions';

/** Samples evaluated between two turns of the event loop, so other requests are served during a long study. */
const SAMPLES_PER_TURN = 10_000;

/**
 * An uncertainty study of a revision, run here with the shared code the browser runs: whoever may view the
 * craft. A partner varies and reads only the rows shared with them, plus the headline figures everyone gets;
 * a row they may not see is answered as a row that does not exist. 400 naming the field for a request the
 * sheet cannot run (an input that is a formula or protected, a unit of another dimension, an unknown figure).
 */
export async function runUncertainty(
  user: User,
  craftId: string,
  revisionId: string,
  request: UncertaintyRequest,
): Promise<UncertaintyResult> {
  const readable = await readRevision(user, craftId, revisionId);
  const visible = readable.seesEveryRow ? undefined : new Set(readable.visibleRows().map((row) => row.key));
  const prepared = prepareStudy(readable.sheet(), request, visible === undefined ? {} : { sees: (key) => visible.has(key) });
  if (!prepared.ok) {
    const details = prepared.problems.map((problem) => ({ path: `body.${problem.path}`, message: problem.message }));
    throw new HttpError(
      400,
      'invalid_input',
      `Invalid input: ${details.map((detail) => `${detail.path} ${detail.message}`).join('; ')}`,
      details,
    );
  }
  const { study } = prepared;
  while (study.done < study.total) {
    study.step(SAMPLES_PER_TURN);
    if (study.done < study.total) await new Promise((resolve) => setImmediate(resolve));
  }
  return study.result();
}
