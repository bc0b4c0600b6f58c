import type { Sequelize, Transaction } from 'sequelize';
import type { OpenStudyBody, Revision as RevisionDto } from '@/shared/schemas/revisions';
import type { Craft, User } from '../models';
import { selectRows } from '../models/sheet-rows';
import { recordAudit } from './audit';
import { authorizeCraft } from './craft-access';
import { announceRevision, copyRevision, mergeRowOf } from './revision-writes';
import { selectRevision, toRevisionDto, type RevisionRecord } from './sheet-store';

/**
 * Opens a study from any revision of the craft (the draft, a baseline, another study), in one transaction:
 * a new open revision of kind study, owned by the person, its parent the source, with the source's rows
 * copied and kept as they are now (`branch_base`, the base its promotion merges against, since a draft
 * moves on). Whoever may edit rows (subsystem owners, systems and chief engineers); 403, 404.
 */
export async function openStudy(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  sourceId: string,
  body: OpenStudyBody,
): Promise<RevisionDto> {
  const { craft } = await authorizeCraft(user, craftId, 'openStudy');
  return sequelize.transaction(async (transaction) => {
    // The source's lock: the copy and the kept base are the same rows, whatever writes wait on the source.
    const source = await selectRevision(sequelize, craftId, sourceId, { transaction, lock: true });
    const studyId = await openStudyIn(sequelize, transaction, user, craft, source, body);
    return toRevisionDto(await selectRevision(sequelize, craftId, studyId, { transaction }));
  });
}

/**
 * Opens a study of `source` (already locked by the caller's transaction) owned by the person: the copy, its kept
 * base, the audit entry and the announcement. Whoever calls it has checked that the person may. Returns its id.
 */
export async function openStudyIn(
  sequelize: Sequelize,
  transaction: Transaction,
  user: User,
  craft: Pick<Craft, 'id' | 'organisationId'>,
  source: Pick<RevisionRecord, 'id' | 'kind' | 'label'>,
  body: OpenStudyBody,
): Promise<string> {
  const base = (await selectRows(sequelize, source.id, transaction)).map(mergeRowOf);
  const studyId = await copyRevision(sequelize, transaction, source.id, {
    kind: 'study',
    label: body.name,
    note: body.note,
    parentId: source.id,
    createdById: user.id,
    branchBase: base,
  });
  await recordAudit(sequelize, transaction, {
    organisationId: craft.organisationId,
    craftId: craft.id,
    actorId: user.id,
    action: 'study_opened',
    subject: body.name,
    details: { revisionId: studyId, sourceId: source.id, sourceKind: source.kind, sourceLabel: source.label },
  });
  await announceRevision(sequelize, transaction, user, craft.id, studyId);
  return studyId;
}
