import crypto from 'node:crypto';
import type { Sequelize, Transaction } from 'sequelize';
import type { RevisionStanding } from '@/shared/access/permissions';
import type { MergeRow } from '@/shared/revisions/merge';
import type { User } from '../models';
import { copyRowLinks } from '../models/attachment';
import { toParameter, type StoredRow } from '../models/sheet-rows';
import { announce } from './sheet-events';

/**
 * Writes of whole revisions shared by locking, studies and promotion: a copy of a revision with its rows,
 * and the lock that makes a revision immutable (the database refuses every later change of it).
 */

/** What a copy is: its kind, name, note, parent, creator, and (a study) the rows of its source when it was opened. */
export interface RevisionCopy {
  kind: RevisionStanding['kind'];
  label: string;
  note: string;
  parentId: string | null;
  createdById: string;
  branchBase?: readonly MergeRow[];
}

/**
 * A new open revision with the source's sheet header and a copy of each of its rows and their evidence. Rows keep their
 * versions, last editor and time: a baseline says of each row what the draft said when it was locked, and
 * a study starts where its source was (its own edits count on from there). Returns the new revision's id.
 */
export async function copyRevision(sequelize: Sequelize, transaction: Transaction, sourceId: string, copy: RevisionCopy): Promise<string> {
  const id = crypto.randomUUID();
  await sequelize.query(
    `INSERT INTO revisions (id, craft_id, kind, state, parent_id, label, note, sheet_name, budget_preset, required_margin_percent,
                            created_by_id, branch_base)
     SELECT $1, craft_id, $3, 'open', $4, $5, $6, sheet_name, budget_preset, required_margin_percent, $7, $8::jsonb
     FROM revisions WHERE id = $2`,
    {
      bind: [
        id,
        sourceId,
        copy.kind,
        copy.parentId,
        copy.label,
        copy.note,
        copy.createdById,
        copy.branchBase ? JSON.stringify(copy.branchBase) : null,
      ],
      transaction,
    },
  );
  await sequelize.query(
    `INSERT INTO revision_parameters (id, revision_id, subsystem_id, key, position, label, unit, value, formula, material, mass, note,
                                      source, protected, role, version, updated_by_id, created_at, updated_at)
     SELECT gen_random_uuid(), $2, subsystem_id, key, position, label, unit, value, formula, material, mass, note,
            source, protected, role, version, updated_by_id, created_at, updated_at
     FROM revision_parameters WHERE revision_id = $1`,
    { bind: [sourceId, id], transaction },
  );
  // Evidence follows its rows by link: the copy names the same files, whose bytes are stored once.
  await copyRowLinks(sequelize, transaction, sourceId, id);
  return id;
}

/** Locks a revision for good, naming who locked it: from here on the database refuses any change of it or its rows. */
export async function lockRevision(sequelize: Sequelize, transaction: Transaction, revisionId: string, userId: string): Promise<void> {
  await sequelize.query(`UPDATE revisions SET state = 'locked', locked_by_id = $2, locked_at = now(), updated_at = now() WHERE id = $1`, {
    bind: [revisionId, userId],
    transaction,
  });
}

/** A stored row as the merge compares it. */
export function mergeRowOf(row: StoredRow): MergeRow {
  return { ...toParameter(row), subsystemId: row.subsystemId };
}

/** Announces at commit that a revision came or changed as a whole (locked, opened): screens refetch the revision list. */
export async function announceRevision(
  sequelize: Sequelize,
  transaction: Transaction,
  user: User,
  craftId: string,
  revisionId: string,
): Promise<void> {
  await announce(sequelize, transaction, {
    type: 'revision_changed',
    craftId,
    revisionId,
    keys: [],
    by: { id: user.id, name: user.name },
    at: new Date().toISOString(),
  });
}
