import crypto from 'node:crypto';
import {
  DataTypes,
  Model,
  QueryTypes,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
  type Transaction,
} from 'sequelize';
import { WEIGHING_REPORT, type AttachmentKind } from '@/shared/schemas/attachments';
import type { Craft } from './craft';
import type { User } from './user';

/**
 * A file of evidence (`attachments`): its name, sniffed type, size, kind, who uploaded it and when. Its bytes
 * are in `attachment_contents`, read only to download them; rows name it through `row_attachments`, and a
 * copy of a revision copies those links (see migration 0006).
 */
export class Attachment extends Model<InferAttributes<Attachment>, InferCreationAttributes<Attachment>> {
  declare id: CreationOptional<string>;
  declare craftId: ForeignKey<Craft['id']>;
  declare name: string;
  declare mediaType: string;
  declare size: number;
  declare kind: AttachmentKind;
  declare sha256: Buffer;
  declare uploadedById: ForeignKey<User['id']> | null;
  declare uploadedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Attachment.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        name: { type: DataTypes.TEXT, allowNull: false },
        mediaType: { type: DataTypes.TEXT, allowNull: false },
        size: { type: DataTypes.INTEGER, allowNull: false },
        kind: { type: DataTypes.TEXT, allowNull: false },
        sha256: { type: DataTypes.BLOB, allowNull: false },
        uploadedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      // The upload time is the record's only time: a file never changes.
      { sequelize, tableName: 'attachments', timestamps: false, underscored: true },
    );
  }
}

/** A row of a revision as evidence needs it: where it is, and its maturity. */
export interface EvidenceRow {
  id: string;
  key: string;
  subsystemId: string;
  subsystemName: string;
  maturity: string | null;
}

/** The row with this key in the revision, or undefined. */
export async function selectEvidenceRow(
  sequelize: Sequelize,
  revisionId: string,
  key: string,
  transaction?: Transaction,
): Promise<EvidenceRow | undefined> {
  const [row] = await sequelize.query<EvidenceRow>(
    `SELECT p.id, p.key, p.subsystem_id AS "subsystemId", s.name AS "subsystemName", p.mass->>'maturity' AS maturity
     FROM revision_parameters p JOIN subsystems s ON s.id = p.subsystem_id
     WHERE p.revision_id = $1 AND p.key = $2`,
    { bind: [revisionId, key], type: QueryTypes.SELECT, transaction },
  );
  return row;
}

/** An attachment as a row lists it, with the name of who uploaded it. */
export interface ListedAttachment {
  id: string;
  name: string;
  mediaType: string;
  size: number;
  kind: AttachmentKind;
  uploadedById: string | null;
  uploadedByName: string | null;
  uploadedAt: Date;
}

const listedColumns = `a.id, a.name, a.media_type AS "mediaType", a.size, a.kind, a.uploaded_by_id AS "uploadedById",
  u.name AS "uploadedByName", a.uploaded_at AS "uploadedAt"`;

/** The files linked to a row, newest first; never their bytes. */
export function selectRowAttachments(sequelize: Sequelize, parameterId: string, transaction?: Transaction): Promise<ListedAttachment[]> {
  return sequelize.query<ListedAttachment>(
    `SELECT ${listedColumns}
     FROM row_attachments l JOIN attachments a ON a.id = l.attachment_id LEFT JOIN users u ON u.id = a.uploaded_by_id
     WHERE l.parameter_id = $1 ORDER BY a.uploaded_at DESC, a.id`,
    { bind: [parameterId], type: QueryTypes.SELECT, transaction },
  );
}

/** How many weighing reports are linked to the row. */
export async function countWeighingReports(sequelize: Sequelize, parameterId: string, transaction: Transaction): Promise<number> {
  const [found] = await sequelize.query<{ count: string }>(
    `SELECT count(*) AS count FROM row_attachments l JOIN attachments a ON a.id = l.attachment_id
     WHERE l.parameter_id = $1 AND a.kind = $2`,
    { bind: [parameterId, WEIGHING_REPORT], type: QueryTypes.SELECT, transaction },
  );
  return Number(found?.count ?? 0);
}

/** A new file, its bytes and its link to the row, in the caller's transaction. Returns the file's id. */
export async function insertRowAttachment(
  sequelize: Sequelize,
  transaction: Transaction,
  file: {
    craftId: string;
    parameterId: string;
    name: string;
    mediaType: string;
    kind: AttachmentKind;
    bytes: Buffer;
    uploadedById: string;
  },
): Promise<string> {
  const { id } = await Attachment.create(
    {
      craftId: file.craftId,
      name: file.name,
      mediaType: file.mediaType,
      size: file.bytes.length,
      kind: file.kind,
      sha256: crypto.createHash('sha256').update(file.bytes).digest(),
      uploadedById: file.uploadedById,
    },
    { transaction },
  );
  await sequelize.query('INSERT INTO attachment_contents (attachment_id, bytes) VALUES ($1, $2)', { bind: [id, file.bytes], transaction });
  await sequelize.query('INSERT INTO row_attachments (parameter_id, attachment_id) VALUES ($1, $2)', {
    bind: [file.parameterId, id],
    transaction,
  });
  return id;
}

/** Unlinks the file from the row (the database deletes a file no row links to any more). */
export async function unlinkRowAttachment(
  sequelize: Sequelize,
  transaction: Transaction,
  parameterId: string,
  attachmentId: string,
): Promise<void> {
  await sequelize.query('DELETE FROM row_attachments WHERE parameter_id = $1 AND attachment_id = $2', {
    bind: [parameterId, attachmentId],
    transaction,
  });
}

/**
 * Links each row of `targetRevisionId` to the files the row of the same key in `sourceRevisionId` has, for
 * `keys` (all keys when omitted): what a copy of a revision (baseline, study) and a promotion do. Links the
 * target has already stay; no bytes are copied.
 */
export async function copyRowLinks(
  sequelize: Sequelize,
  transaction: Transaction,
  sourceRevisionId: string,
  targetRevisionId: string,
  keys?: readonly string[],
): Promise<void> {
  await sequelize.query(
    `INSERT INTO row_attachments (parameter_id, attachment_id)
     SELECT target.id, l.attachment_id
     FROM row_attachments l
       JOIN revision_parameters source ON source.id = l.parameter_id AND source.revision_id = $1
       JOIN revision_parameters target ON target.revision_id = $2 AND target.key = source.key
     WHERE $3::text[] IS NULL OR source.key = ANY ($3::text[])
     ON CONFLICT DO NOTHING`,
    { bind: [sourceRevisionId, targetRevisionId, keys === undefined ? null : [...keys]], transaction },
  );
}

/** Where a file is linked: each row's subsystem and its revision's standing, for the permission table. */
export interface AttachmentPlace {
  subsystemId: string;
  kind: 'draft' | 'baseline' | 'study';
  state: 'open' | 'locked';
  createdById: string | null;
}

/** A file of the craft and the places it is linked (not its bytes); undefined when the craft has no such file. */
export async function selectAttachmentPlaces(
  sequelize: Sequelize,
  craftId: string,
  attachmentId: string,
): Promise<{ name: string; mediaType: string; places: AttachmentPlace[] } | undefined> {
  const [found] = await sequelize.query<{ name: string; mediaType: string; places: AttachmentPlace[] }>(
    `SELECT a.name, a.media_type AS "mediaType",
            (SELECT coalesce(json_agg(json_build_object('subsystemId', p.subsystem_id, 'kind', r.kind, 'state', r.state,
                                                        'createdById', r.created_by_id)), '[]')
             FROM row_attachments l JOIN revision_parameters p ON p.id = l.parameter_id JOIN revisions r ON r.id = p.revision_id
             WHERE l.attachment_id = a.id) AS places
     FROM attachments a WHERE a.id = $1 AND a.craft_id = $2`,
    { bind: [attachmentId, craftId], type: QueryTypes.SELECT },
  );
  return found;
}

/** The bytes of a file. */
export async function selectAttachmentBytes(sequelize: Sequelize, attachmentId: string): Promise<Buffer | undefined> {
  const [found] = await sequelize.query<{ bytes: Buffer }>('SELECT bytes FROM attachment_contents WHERE attachment_id = $1', {
    bind: [attachmentId],
    type: QueryTypes.SELECT,
  });
  return found?.bytes;
}
