import type { Sequelize, Transaction } from 'sequelize';
import { mayOnRow, mayRemoveEvidence, standingOf, whyNotOnRow, type RevisionStanding } from '@/shared/access/permissions';
import { needsWeighingReport, whyNotMeasured } from '@/shared/budget/measured-evidence';
import { WEIGHING_REPORT, type Attachment as AttachmentDto, type AttachmentKind, type RowAttachments } from '@/shared/schemas/attachments';
import { HttpError, notFound } from '../http-error';
import type { Upload } from '../middleware/upload';
import type { User } from '../models';
import {
  countWeighingReports,
  insertRowAttachment,
  selectAttachmentBytes,
  selectAttachmentPlaces,
  selectEvidenceRow,
  selectRowAttachments,
  unlinkRowAttachment,
  type EvidenceRow,
  type ListedAttachment,
} from '../models/attachment';
import { authorizeCraft, type CraftAccess } from './craft-access';
import { announce } from './sheet-events';
import { selectRevision } from './sheet-store';

/**
 * Evidence on rows: files attached to a row of a revision (datasheets, weighing and test reports). Who may
 * attach and remove is the permission table's `attachEvidence` and `mayRemoveEvidence`; a row the caller may
 * not see is 404. Changes take the revision's lock, as row writes do, so a maturity change and the removal of
 * the weighing report it rests on never pass each other.
 */

interface RowInRevision {
  who: CraftAccess;
  standing: RevisionStanding;
  row: EvidenceRow;
}

/** The craft, revision and row as the caller sees them: 404 for any the caller may not see. */
async function findRow(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  revisionId: string,
  key: string,
  transaction?: Transaction,
): Promise<RowInRevision> {
  const who = await authorizeCraft(user, craftId, 'viewCraft');
  const revision = await selectRevision(sequelize, craftId, revisionId, { transaction, lock: transaction !== undefined });
  const standing = standingOf(revision);
  const row = await selectEvidenceRow(sequelize, revisionId, key, transaction);
  if (!row || !mayOnRow('viewRow', who, row, standing)) throw notFound(`Parameter "${key}"`);
  return { who, standing, row };
}

function toAttachmentDto(attachment: ListedAttachment, removable: boolean): AttachmentDto {
  return {
    id: attachment.id,
    name: attachment.name,
    mediaType: attachment.mediaType,
    size: attachment.size,
    kind: attachment.kind,
    uploadedBy: attachment.uploadedById === null ? null : { id: attachment.uploadedById, name: attachment.uploadedByName ?? '' },
    uploadedAt: new Date(attachment.uploadedAt).toISOString(),
    removable,
  };
}

/** Tells the craft's screens at commit that the row's evidence changed (partners hear of their rows only). */
async function announceEvidence(
  sequelize: Sequelize,
  transaction: Transaction,
  user: User,
  craftId: string,
  revisionId: string,
  row: EvidenceRow,
) {
  await announce(
    sequelize,
    transaction,
    {
      type: 'parameters_changed',
      craftId,
      revisionId,
      keys: [row.key],
      by: { id: user.id, name: user.name },
      at: new Date().toISOString(),
    },
    { [row.key]: row.subsystemId },
  );
}

/** The row's files, newest first, each with whether the caller may remove it, and why the caller may not attach (if so). */
export async function listRowAttachments(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  revisionId: string,
  key: string,
): Promise<RowAttachments> {
  const { who, standing, row } = await findRow(sequelize, user, craftId, revisionId, key);
  const attachments = await selectRowAttachments(sequelize, row.id);
  const attachRefusal = whyNotOnRow('attachEvidence', who, row, standing);
  return {
    attachments: attachments.map((attachment) =>
      toAttachmentDto(attachment, mayRemoveEvidence(who, row, standing, { uploadedById: attachment.uploadedById })),
    ),
    ...(attachRefusal === undefined ? {} : { attachRefusal }),
  };
}

/** 404 or 403 unless the caller may attach to the row: checked before an upload is read, and again with it. */
async function requireAttach(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  revisionId: string,
  key: string,
  transaction?: Transaction,
) {
  const found = await findRow(sequelize, user, craftId, revisionId, key, transaction);
  const why = whyNotOnRow('attachEvidence', found.who, found.row, found.standing);
  if (why !== undefined) throw new HttpError(403, 'forbidden', why);
  return found;
}

/** Whether the caller may attach to the row, before the file is read: 404, 403 (a locked revision, the caller's role). */
export async function authorizeAttach(sequelize: Sequelize, user: User, craftId: string, revisionId: string, key: string): Promise<void> {
  await requireAttach(sequelize, user, craftId, revisionId, key);
}

/** Attaches an uploaded file to the row: `attachEvidence`; 403 (a locked revision, the caller's role), 404. */
export async function attachToRow(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  revisionId: string,
  key: string,
  kind: AttachmentKind,
  upload: Upload,
): Promise<AttachmentDto> {
  return sequelize.transaction(async (transaction) => {
    const { who, standing, row } = await requireAttach(sequelize, user, craftId, revisionId, key, transaction);
    const id = await insertRowAttachment(sequelize, transaction, {
      craftId,
      parameterId: row.id,
      name: upload.name,
      mediaType: upload.type.mime,
      kind,
      bytes: upload.bytes,
      uploadedById: user.id,
    });
    await announceEvidence(sequelize, transaction, user, craftId, revisionId, row);
    const stored = (await selectRowAttachments(sequelize, row.id, transaction)).find((attachment) => attachment.id === id);
    if (!stored) throw new Error(`attachment ${id} vanished in its own transaction`);
    return toAttachmentDto(stored, mayRemoveEvidence(who, row, standing, { uploadedById: user.id }));
  });
}

/**
 * Removes a file from the row (other revisions that name it keep it; the file goes when no row names it):
 * `mayRemoveEvidence`; 403, 404, 409 evidence_required for the last weighing report of a measured row.
 */
export async function removeFromRow(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  revisionId: string,
  key: string,
  attachmentId: string,
): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const { who, standing, row } = await findRow(sequelize, user, craftId, revisionId, key, transaction);
    // Someone who may neither remove evidence nor attach (and so remove their own) learns nothing of the file.
    if (!mayOnRow('removeEvidence', who, row, standing) && !mayOnRow('attachEvidence', who, row, standing)) {
      throw new HttpError(403, 'forbidden', whyNotOnRow('removeEvidence', who, row, standing) ?? 'You may not remove evidence here');
    }
    const attachment = (await selectRowAttachments(sequelize, row.id, transaction)).find((candidate) => candidate.id === attachmentId);
    if (!attachment) throw notFound(`Attachment ${attachmentId} on row "${key}"`);
    if (!mayRemoveEvidence(who, row, standing, { uploadedById: attachment.uploadedById })) {
      throw new HttpError(403, 'forbidden', whyNotOnRow('removeEvidence', who, row, standing) ?? 'You may not remove this file');
    }
    // The measured maturity rests on a weighing report: the last one stays until the maturity changes.
    if (attachment.kind === WEIGHING_REPORT) {
      const remaining = (await countWeighingReports(sequelize, row.id, transaction)) - 1;
      if (whyNotMeasured(row.key, row.maturity ?? undefined, remaining) !== undefined) {
        throw new HttpError(
          409,
          'evidence_required',
          `Row "${row.key}" is measured and "${attachment.name}" is its only weighing report; change the maturity first or attach another report`,
        );
      }
    }
    await unlinkRowAttachment(sequelize, transaction, row.id, attachmentId);
    await announceEvidence(sequelize, transaction, user, craftId, revisionId, row);
  });
}

/**
 * Refuses (409 evidence_required, naming the row, filed under body.mass.maturity) a row write that would
 * make a mass row measured without a weighing report. `parameterId` is null for a row not stored yet. Run in
 * the write's transaction, under the revision's lock.
 */
export async function requireMeasuredEvidence(
  sequelize: Sequelize,
  transaction: Transaction,
  row: { parameterId: string | null; key: string; maturityBefore: string | undefined; maturityAfter: string | undefined; field: string },
): Promise<void> {
  // Only a change to measured is checked: the last weighing report of a measured row cannot be removed.
  if (row.maturityAfter === row.maturityBefore || !needsWeighingReport(row.maturityAfter)) return;
  const reports = row.parameterId === null ? 0 : await countWeighingReports(sequelize, row.parameterId, transaction);
  const why = whyNotMeasured(row.key, row.maturityAfter, reports);
  if (why !== undefined) throw new HttpError(409, 'evidence_required', why, [{ path: row.field, message: why }]);
}

/**
 * A file to download: whoever may view a row it is attached to (in any revision of the craft; partners only
 * rows of subsystems shared with them); 404 otherwise.
 */
export async function downloadAttachment(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  attachmentId: string,
): Promise<{ name: string; mediaType: string; bytes: Buffer }> {
  const who = await authorizeCraft(user, craftId, 'viewCraft');
  const found = await selectAttachmentPlaces(sequelize, craftId, attachmentId);
  const visible = found?.places.some((place) => mayOnRow('viewRow', who, place, standingOf(place)));
  if (!found || !visible) throw notFound('Attachment');
  const bytes = await selectAttachmentBytes(sequelize, attachmentId);
  if (!bytes) throw notFound('Attachment');
  return { name: found.name, mediaType: found.mediaType, bytes };
}
