import crypto from 'node:crypto';
import { QueryTypes, UniqueConstraintError, type Sequelize, type Transaction } from 'sequelize';
import type { Subsystem } from '@/shared/schemas/revisions';
import { HttpError, notFound } from '../http-error';
import type { User } from '../models';
import { authorizeCraft } from './craft-access';
import { announce } from './sheet-events';

/**
 * Runs a change of the craft's subsystems (manageSubsystems) and announces it at commit. A name the craft
 * already uses is a 409 duplicate_name.
 */
async function changeSubsystems<T>(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  change: (transaction: Transaction) => Promise<T>,
): Promise<T> {
  await authorizeCraft(user, craftId, 'manageSubsystems');
  try {
    return await sequelize.transaction(async (transaction) => {
      const result = await change(transaction);
      await announce(sequelize, transaction, {
        type: 'subsystems_changed',
        craftId,
        revisionId: null,
        keys: [],
        by: { id: user.id, name: user.name },
        at: new Date().toISOString(),
      });
      return result;
    });
  } catch (error) {
    if (error instanceof UniqueConstraintError) {
      throw new HttpError(409, 'duplicate_name', 'The craft has a subsystem of that name already', [
        { path: 'body.name', message: 'is taken' },
      ]);
    }
    throw error;
  }
}

/** Adds a subsystem after the craft's others. */
export function createSubsystem(sequelize: Sequelize, user: User, craftId: string, name: string): Promise<Subsystem> {
  return changeSubsystems(sequelize, user, craftId, async (transaction) => {
    const [created] = await sequelize.query<Subsystem>(
      `INSERT INTO subsystems (id, craft_id, name, position)
       VALUES ($1, $2, $3, (SELECT coalesce(max(position), 0) + 1 FROM subsystems WHERE craft_id = $2))
       RETURNING id, name, position`,
      { bind: [crypto.randomUUID(), craftId, name], type: QueryTypes.SELECT, transaction },
    );
    if (!created) throw new Error('INSERT ... RETURNING gave no row');
    return created;
  });
}

/** Renames a subsystem; its rows, owners and partners stay with it (they hold its id). */
export function renameSubsystem(sequelize: Sequelize, user: User, craftId: string, subsystemId: string, name: string): Promise<Subsystem> {
  return changeSubsystems(sequelize, user, craftId, async (transaction) => {
    const [renamed] = await sequelize.query<Subsystem>(
      `UPDATE subsystems SET name = $3, updated_at = now() WHERE id = $1 AND craft_id = $2 RETURNING id, name, position`,
      { bind: [subsystemId, craftId, name], type: QueryTypes.SELECT, transaction },
    );
    if (!renamed) throw notFound('Subsystem');
    return renamed;
  });
}

/** Removes a subsystem no row uses (409 in_use listing the rows otherwise) and takes it off memberships. */
export function deleteSubsystem(sequelize: Sequelize, user: User, craftId: string, subsystemId: string): Promise<void> {
  return changeSubsystems(sequelize, user, craftId, async (transaction) => {
    const [subsystem] = await sequelize.query<{ id: string }>('SELECT id FROM subsystems WHERE id = $1 AND craft_id = $2 FOR UPDATE', {
      bind: [subsystemId, craftId],
      type: QueryTypes.SELECT,
      transaction,
    });
    if (!subsystem) throw notFound('Subsystem');
    const users = await sequelize.query<{ key: string }>(
      'SELECT DISTINCT key FROM revision_parameters WHERE subsystem_id = $1 ORDER BY key',
      { bind: [subsystemId], type: QueryTypes.SELECT, transaction },
    );
    if (users.length > 0) {
      const keys = users.map((row) => row.key);
      throw new HttpError(409, 'in_use', `Rows ${keys.join(', ')} belong to this subsystem; move or delete them first`, { keys });
    }
    await sequelize.query('UPDATE memberships SET subsystem_ids = array_remove(subsystem_ids, $1::uuid) WHERE craft_id = $2', {
      bind: [subsystemId, craftId],
      transaction,
    });
    await sequelize.query('DELETE FROM subsystems WHERE id = $1', { bind: [subsystemId], transaction });
  });
}
