import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import { mergedOrder, resolveMerge, threeWayMerge, type MergeConflict, type MergeRow, type MergeStep } from '@/shared/revisions/merge';
import type { MergeConflictDto, PromoteStudyBody, Promotion } from '@/shared/schemas/revisions';
import { HttpError } from '../http-error';
import type { User } from '../models';
import {
  deleteRow,
  insertRows,
  recordChanges,
  selectRows,
  setOrder,
  updateRow,
  type RowChange,
  type StoredRow,
} from '../models/sheet-rows';
import { copyRowLinks } from '../models/attachment';
import { recordAudit } from './audit';
import { notifySubsystemOwners } from './notifications';
import { authorizeCraft } from './craft-access';
import { introducedError } from './parameters';
import { announceRevision, lockRevision, mergeRowOf } from './revision-writes';
import { announce } from './sheet-events';
import { draftIdOf, selectRevision, selectSubsystems, sheetHeaderOf, toRevisionDto, type SubsystemRecord } from './sheet-store';

/** The row without its subsystem id: the sheet's parameter. */
function parameterOf({ subsystemId: _subsystemId, ...parameter }: MergeRow) {
  return parameter;
}

/** A conflict as the API shows it: every side's subsystem by its name now (the base was kept under the names of then). */
function conflictDto(conflict: MergeConflict, subsystems: readonly SubsystemRecord[]): MergeConflictDto {
  const named = (row: MergeRow | null) =>
    row === null ? null : { ...row, subsystem: subsystems.find((subsystem) => subsystem.id === row.subsystemId)?.name ?? row.subsystem };
  return { key: conflict.key, base: named(conflict.base), draft: named(conflict.draft), study: named(conflict.study) };
}

/** The study's rows as they were when it was opened. */
async function branchBaseOf(sequelize: Sequelize, studyId: string, transaction: Transaction): Promise<MergeRow[]> {
  const [found] = await sequelize.query<{ base: MergeRow[] | null }>('SELECT branch_base AS base FROM revisions WHERE id = $1', {
    bind: [studyId],
    type: QueryTypes.SELECT,
    transaction,
  });
  return found?.base ?? [];
}

/**
 * Applies the merge's steps to the draft: rows changed get the next version of the draft's row, new rows
 * start at 1 and go where the study has them, each change is written to the history. Returns the history
 * entries and each changed key's subsystem (for the event).
 */
async function applySteps(
  sequelize: Sequelize,
  transaction: Transaction,
  user: User,
  draftId: string,
  draftRows: readonly StoredRow[],
  studyKeys: readonly string[],
  steps: readonly MergeStep[],
): Promise<{ changes: RowChange[]; subsystemOf: Record<string, string> }> {
  const stored = new Map(draftRows.map((row) => [row.key, row]));
  const changes: RowChange[] = [];
  const subsystemOf: Record<string, string> = {};
  const created: MergeRow[] = [];
  for (const step of steps) {
    if (step.action === 'create') {
      created.push(step.row);
      changes.push({ key: step.key, action: 'create', before: null, after: { ...parameterOf(step.row), version: 1 } });
      subsystemOf[step.key] = step.row.subsystemId;
      continue;
    }
    // The merge read the draft under its lock: a row it updates or deletes is there.
    const current = stored.get(step.key);
    if (current === undefined) throw new Error(`the draft has no row ${step.key} to ${step.action}`);
    if (step.action === 'update') {
      const content = { parameter: parameterOf(step.row), subsystemId: step.row.subsystemId, position: current.position };
      if (!(await updateRow(sequelize, current.id, current.version, content, user.id, transaction))) {
        throw new Error(`row ${step.key} changed under the draft's lock`);
      }
      changes.push({
        key: step.key,
        action: 'update',
        before: { ...parameterOf(step.from), version: current.version },
        after: { ...parameterOf(step.row), version: current.version + 1 },
      });
      subsystemOf[step.key] = step.row.subsystemId;
    } else {
      await deleteRow(sequelize, current.id, transaction);
      changes.push({ key: step.key, action: 'delete', before: { ...parameterOf(step.from), version: current.version }, after: null });
      subsystemOf[step.key] = current.subsystemId;
    }
  }
  if (created.length > 0) {
    const last = draftRows.reduce((highest, row) => Math.max(highest, row.position), 0);
    const rows = created.map((row, index) => ({ parameter: parameterOf(row), subsystemId: row.subsystemId, position: last + index + 1 }));
    await insertRows(sequelize, draftId, rows, user.id, transaction);
  }
  if (steps.some((step) => step.action !== 'update')) {
    await setOrder(sequelize, draftId, mergedOrder([...stored.keys()], studyKeys, steps), transaction);
  }
  return { changes, subsystemOf };
}

/**
 * Promotes a study into the craft's working draft, in one transaction: a row-by-row three-way merge of the
 * study into the draft against the study's rows as they were when it was opened. Rows changed only in the
 * study are taken, rows changed only in the draft stay; rows changed in both to different content need a
 * resolution each ('draft' or 'study'), else 409 merge_conflicts lists them and nothing is written. A merge
 * that would leave the draft with an error of the kinds a row edit may not introduce is 409 merge_breaks_sheet.
 * The study is then locked (a promoted study is a locked study: locked_by and locked_at say who promoted it
 * and when). Chief engineers; 400 (a resolution for a row not in conflict), 403, 404, 409 not_a_study,
 * already_promoted, merge_conflicts, merge_breaks_sheet.
 */
export async function promoteStudy(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  studyId: string,
  body: PromoteStudyBody,
): Promise<Promotion> {
  const { craft } = await authorizeCraft(user, craftId, 'promoteStudy');
  return sequelize.transaction(async (transaction) => {
    // The study first, then the draft: the only order in which any transaction holds both.
    const study = await selectRevision(sequelize, craftId, studyId, { transaction, lock: true });
    if (study.kind !== 'study') throw new HttpError(409, 'not_a_study', `Only a study is promoted; this revision is a ${study.kind}`);
    if (study.state === 'locked') {
      throw new HttpError(409, 'already_promoted', `Study "${study.label}" was promoted already; open a new study to carry on`);
    }
    const draftId = await draftIdOf(sequelize, craftId, transaction);
    if (draftId === null) throw new HttpError(409, 'no_draft', 'The craft has no working draft to promote into');
    const draft = await selectRevision(sequelize, craftId, draftId, { transaction, lock: true });
    const [draftRows, studyRows, base, subsystems] = [
      await selectRows(sequelize, draftId, transaction),
      await selectRows(sequelize, studyId, transaction),
      await branchBaseOf(sequelize, studyId, transaction),
      await selectSubsystems(sequelize, craftId, transaction),
    ];
    const plan = threeWayMerge(base, draftRows.map(mergeRowOf), studyRows.map(mergeRowOf));
    const resolved = resolveMerge(plan, body.resolutions);
    if (!resolved.ok && resolved.unresolved.length > 0) {
      const keys = resolved.unresolved.map((conflict) => conflict.key);
      throw new HttpError(
        409,
        'merge_conflicts',
        `Rows changed in both the draft and the study: ${keys.join(', ')}; resolve each (draft or study) and promote again`,
        { conflicts: plan.conflicts.map((conflict) => conflictDto(conflict, subsystems)), unresolved: keys },
      );
    }
    if (!resolved.ok) {
      const problems = resolved.notConflicts.map((key) => ({ path: `body.resolutions.${key}`, message: 'this row is not in conflict' }));
      throw new HttpError(400, 'invalid_input', `Invalid input: ${problems.map((p) => `${p.path} ${p.message}`).join('; ')}`, problems);
    }

    const header = sheetHeaderOf(draft);
    const draftSheet = { ...header, parameters: draftRows.map((row) => parameterOf(mergeRowOf(row))) };
    const mergedRows = new Map(draftRows.map((row) => [row.key, parameterOf(mergeRowOf(row))]));
    for (const step of resolved.steps) {
      if (step.action === 'delete') mergedRows.delete(step.key);
      else mergedRows.set(step.key, parameterOf(step.row));
    }
    const broken = introducedError(draftSheet, { ...header, parameters: [...mergedRows.values()] });
    if (broken) {
      throw new HttpError(409, 'merge_breaks_sheet', `Promoting would leave the draft with an error: ${broken.message}`, {
        key: broken.key,
        code: broken.code,
      });
    }

    const studyKeys = studyRows.map((row) => row.key);
    const { changes, subsystemOf } = await applySteps(sequelize, transaction, user, draftId, draftRows, studyKeys, resolved.steps);
    // Evidence attached in the study comes along with the rows taken from it (removals in the study do not).
    const taken = resolved.steps.filter((step) => step.action !== 'delete').map((step) => step.key);
    if (taken.length > 0) await copyRowLinks(sequelize, transaction, studyId, draftId, taken);
    if (changes.length > 0) {
      await recordChanges(sequelize, draftId, changes, user.id, transaction);
      await sequelize.query('UPDATE revisions SET updated_at = now() WHERE id = $1', { bind: [draftId], transaction });
      await announce(
        sequelize,
        transaction,
        {
          type: 'parameters_changed',
          craftId,
          revisionId: draftId,
          keys: Object.keys(subsystemOf),
          by: { id: user.id, name: user.name },
          at: new Date().toISOString(),
        },
        subsystemOf,
      );
    }
    await lockRevision(sequelize, transaction, studyId, user.id);
    const applied = resolved.steps.map((step) => ({ key: step.key, action: step.action }));
    await notifySubsystemOwners(sequelize, transaction, {
      craftId,
      kind: 'study_promoted',
      title: `Study "${study.label}" promoted into the draft of ${craft.name}`,
      body: `${user.name} promoted study "${study.label}" into the working draft of ${craft.name}. Rows changed: ${applied.map((step) => `${step.key} (${step.action})`).join(', ') || 'none'}.`,
      actorId: user.id,
      subsystemIds: [...new Set(Object.values(subsystemOf))],
    });
    await recordAudit(sequelize, transaction, {
      organisationId: craft.organisationId,
      craftId,
      actorId: user.id,
      action: 'study_promoted',
      subject: study.label,
      details: { revisionId: studyId, draftId, applied, resolutions: body.resolutions },
    });
    await announceRevision(sequelize, transaction, user, craftId, studyId);
    return {
      study: toRevisionDto(await selectRevision(sequelize, craftId, studyId, { transaction })),
      draft: toRevisionDto(await selectRevision(sequelize, craftId, draftId, { transaction })),
      applied,
    };
  });
}
