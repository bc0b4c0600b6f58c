import { QueryTypes, type Sequelize } from 'sequelize';
import type { LockBaselineBody, Revision as RevisionDto } from '@/shared/schemas/revisions';
import { HttpError } from '../http-error';
import type { User } from '../models';
import { recordAudit } from './audit';
import { authorizeCraft } from './craft-access';
import { notifySubsystemOwners } from './notifications';
import { announceRevision, copyRevision, lockRevision } from './revision-writes';
import { selectRevision, toRevisionDto } from './sheet-store';

/**
 * Locks the working draft as a baseline for a design review, in one transaction: the draft's rows are
 * copied into a new baseline (locked, with label, note, who and when; its parent is the previous baseline),
 * and the draft continues from it (its parent becomes the baseline). Rows keep their versions in both, so
 * nobody's edit of the draft goes stale. Chief engineers; 403, 404, 409 not_a_draft or duplicate_label.
 */
export async function lockBaseline(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  revisionId: string,
  body: LockBaselineBody,
): Promise<RevisionDto> {
  const { craft } = await authorizeCraft(user, craftId, 'lockBaseline');
  return sequelize.transaction(async (transaction) => {
    // The draft's lock: no write to it runs while its rows are copied.
    const draft = await selectRevision(sequelize, craftId, revisionId, { transaction, lock: true });
    if (draft.kind !== 'draft') {
      throw new HttpError(409, 'not_a_draft', `Only the working draft is locked as a baseline; this revision is a ${draft.kind}`);
    }
    const [taken] = await sequelize.query<{ label: string }>(
      `SELECT label FROM revisions WHERE craft_id = $1 AND kind = 'baseline' AND lower(label) = lower($2)`,
      { bind: [craftId, body.label], type: QueryTypes.SELECT, transaction },
    );
    if (taken) {
      throw new HttpError(409, 'duplicate_label', `The craft has a baseline "${taken.label}" already; name this review differently`, [
        { path: 'body.label', message: 'names another baseline of the craft' },
      ]);
    }
    const baselineId = await copyRevision(sequelize, transaction, draft.id, {
      kind: 'baseline',
      label: body.label,
      note: body.note,
      parentId: draft.parentId,
      createdById: user.id,
    });
    await lockRevision(sequelize, transaction, baselineId, user.id);
    await sequelize.query('UPDATE revisions SET parent_id = $2, updated_at = now() WHERE id = $1', {
      bind: [draft.id, baselineId],
      transaction,
    });
    const [{ rows } = { rows: '0' }] = await sequelize.query<{ rows: string }>(
      'SELECT count(*) AS rows FROM revision_parameters WHERE revision_id = $1',
      { bind: [baselineId], type: QueryTypes.SELECT, transaction },
    );
    await recordAudit(sequelize, transaction, {
      organisationId: craft.organisationId,
      craftId,
      actorId: user.id,
      action: 'baseline_locked',
      subject: body.label,
      details: { revisionId: baselineId, draftId: draft.id, note: body.note, rows: Number(rows) },
    });
    const locked = await sequelize.query<{ subsystemId: string }>(
      'SELECT DISTINCT subsystem_id AS "subsystemId" FROM revision_parameters WHERE revision_id = $1',
      { bind: [baselineId], type: QueryTypes.SELECT, transaction },
    );
    await notifySubsystemOwners(sequelize, transaction, {
      craftId,
      kind: 'baseline_locked',
      title: `Baseline "${body.label}" locked on ${craft.name}`,
      body: `${user.name} locked the working draft of ${craft.name} as baseline "${body.label}"; your rows are in it as they stand.${body.note.trim() === '' ? '' : `\n\n${body.note}`}`,
      actorId: user.id,
      subsystemIds: locked.map((row) => row.subsystemId),
    });
    const baseline = await selectRevision(sequelize, craftId, baselineId, { transaction });
    await announceRevision(sequelize, transaction, user, craftId, baselineId);
    return toRevisionDto(baseline);
  });
}
