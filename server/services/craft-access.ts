import { mayOnCraft, type CraftAction, type Who } from '@/shared/access/permissions';
import type { CraftRole } from '@/shared/schemas/roles';
import { forbidden, notFound } from '../http-error';
import { Craft, type User } from '../models';
import { preparedQuery } from '../models/prepared-query';

/** A craft as one person sees it: their role, admin flag and the subsystems their membership names. */
export interface CraftAccess extends Who {
  craft: Craft;
  role: CraftRole | null;
  isOrgAdmin: boolean;
  subsystemIds: string[];
  userId: string;
}

/**
 * A further column read in the same query as the craft (`extra`): SQL that may use the craft as `c` and
 * its own binds as $4, $5, ... A hot path saves a round trip to PostgreSQL this way.
 */
export interface AlongWithCraft {
  /** A constant: the access query is prepared once for each. */
  sql: string;
  binds: unknown[];
}

/** The access query's text for each further column, built once (the same text every time is one prepared statement). */
const craftAccessSqlByAlong = new Map<string, string>();

function craftAccessSql(alongSql = 'NULL'): string {
  let sql = craftAccessSqlByAlong.get(alongSql);
  if (sql === undefined) {
    sql = `SELECT c.id, c.organisation_id AS "organisationId", c.created_by_id AS "createdById", c.name, c.description,
                  c.template_id AS "templateId", c.created_at AS "createdAt", c.updated_at AS "updatedAt",
                  m.role, m.subsystem_ids AS "subsystemIds", ${alongSql} AS extra
           FROM crafts c LEFT JOIN memberships m ON m.craft_id = c.id AND m.user_id = $2
           WHERE c.id = $1 AND c.organisation_id = $3`;
    craftAccessSqlByAlong.set(alongSql, sql);
  }
  return sql;
}

/**
 * Loads a craft and the person's membership in one query (every craft request makes it). A craft of
 * another organisation, or one the person is neither a member nor an admin of, is reported as not found
 * so its existence does not leak.
 */
export async function loadCraftAccess(user: User, craftId: string, along?: AlongWithCraft): Promise<CraftAccess & { extra: unknown }> {
  const sequelize = Craft.sequelize;
  if (!sequelize) throw new Error('loadCraftAccess: the models are not initialised on a connection');
  const [found] = await preparedQuery<CraftAccessRecord>(sequelize, craftAccessSql(along?.sql), [
    craftId,
    user.id,
    user.organisationId,
    ...(along?.binds ?? []),
  ]);
  if (!found || (found.role === null && !user.isOrgAdmin)) throw notFound('Craft');
  const { role, subsystemIds, extra, ...columns } = found;
  const craft = Craft.build(columns, { isNewRecord: false, raw: true });
  return { craft, role, isOrgAdmin: user.isOrgAdmin, subsystemIds: subsystemIds ?? [], userId: user.id, extra };
}

interface CraftAccessRecord {
  id: string;
  organisationId: string;
  createdById: string | null;
  name: string;
  description: string;
  templateId: string;
  createdAt: Date;
  updatedAt: Date;
  role: CraftRole | null;
  subsystemIds: string[] | null;
  extra: unknown;
}

/** Loads the craft and checks the action against the permission table: 404 if invisible, 403 if not allowed. */
export async function authorizeCraft(
  user: User,
  craftId: string,
  action: CraftAction,
  along?: AlongWithCraft,
): Promise<CraftAccess & { extra: unknown }> {
  const access = await loadCraftAccess(user, craftId, along);
  if (!mayOnCraft(action, access)) throw forbidden(`Your role on this craft does not allow this (${action})`);
  return access;
}
