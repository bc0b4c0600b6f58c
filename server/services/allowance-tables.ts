import crypto from 'node:crypto';
import type { Sequelize, Transaction } from 'sequelize';
import {
  allowanceTableSchema,
  type AllowanceTable as AllowanceTableData,
  type AllowanceTableResponse,
} from '@/shared/schemas/allowance-tables';
import { AllowanceTable, type User } from '../models';
import { authorizeCraft } from './craft-access';

type StoredTable = AllowanceTable & { updatedBy?: User | null };

function selectTable(craftId: string, transaction?: Transaction): Promise<StoredTable | null> {
  return AllowanceTable.findOne({
    where: { craftId },
    include: [{ association: 'updatedBy', attributes: ['id', 'name'] }],
    ...(transaction === undefined ? {} : { transaction }),
  });
}

function toResponse(stored: StoredTable | null): AllowanceTableResponse {
  if (stored === null) return { table: null, updatedBy: null, updatedAt: null };
  return {
    // Parsed on the way out, as every stored JSON is: what the roll-up reads is always a valid table.
    table: allowanceTableSchema.parse(stored.preset),
    updatedBy: stored.updatedBy ? { id: stored.updatedBy.id, name: stored.updatedBy.name } : null,
    updatedAt: stored.updatedAt.toISOString(),
  };
}

/** The craft's own allowance table (null while it has none), for whoever may view the craft; 404 otherwise. */
export async function getAllowanceTable(user: User, craftId: string): Promise<AllowanceTableResponse> {
  await authorizeCraft(user, craftId, 'viewCraft');
  return toResponse(await selectTable(craftId));
}

/**
 * Saves the craft's own allowance table (systems and chief engineers): from now on the budget of every sheet of
 * the craft rolls up with it. The table was checked by the route's schema; 403 for other roles, 404 as for the craft.
 */
export async function putAllowanceTable(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  table: AllowanceTableData,
): Promise<AllowanceTableResponse> {
  await authorizeCraft(user, craftId, 'editAllowanceTable');
  await sequelize.query(
    `INSERT INTO allowance_tables (id, craft_id, preset, updated_by_id) VALUES ($1, $2, $3::jsonb, $4)
     ON CONFLICT (craft_id) DO UPDATE SET preset = EXCLUDED.preset, updated_by_id = EXCLUDED.updated_by_id, updated_at = now()`,
    { bind: [crypto.randomUUID(), craftId, JSON.stringify(table), user.id] },
  );
  return toResponse(await selectTable(craftId));
}

/**
 * The craft's own allowance table for the evaluations and checks made on the server, or undefined while it has
 * none; in the caller's transaction when it gives one.
 */
export async function craftAllowanceTable(craftId: string, transaction?: Transaction): Promise<AllowanceTableData | undefined> {
  return toResponse(await selectTable(craftId, transaction)).table ?? undefined;
}
