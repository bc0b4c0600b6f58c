import crypto from 'node:crypto';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { RevisionDetail, Revision as RevisionDto, RevisionParameter } from '@/shared/schemas/revisions';
import type { Sheet } from '@/shared/schemas/sheet';
import { notFound } from '../http-error';
import { Revision } from '../models';
import { preparedQuery } from '../models/prepared-query';
import type { AlongWithCraft } from './craft-access';
import { insertRows, parametersJsonColumn, parametersStampColumn, selectRows, toParameter, type StoredRow } from '../models/sheet-rows';

/** A craft's subsystem as stored. */
export interface SubsystemRecord {
  id: string;
  name: string;
  position: number;
}

/** The craft's subsystems in their order. */
export function selectSubsystems(sequelize: Sequelize, craftId: string, transaction?: Transaction): Promise<SubsystemRecord[]> {
  return sequelize.query<SubsystemRecord>('SELECT id, name, position FROM subsystems WHERE craft_id = $1 ORDER BY position, name', {
    bind: [craftId],
    type: QueryTypes.SELECT,
    transaction,
  });
}

/** The ids of the subsystems with these names, creating those the craft does not have yet (after the others). */
export async function ensureSubsystems(
  sequelize: Sequelize,
  craftId: string,
  names: readonly string[],
  transaction: Transaction,
): Promise<Map<string, string>> {
  const existing = await selectSubsystems(sequelize, craftId, transaction);
  const idByName = new Map(existing.map((subsystem) => [subsystem.name, subsystem.id]));
  let position = existing.reduce((last, subsystem) => Math.max(last, subsystem.position), 0);
  for (const name of names) {
    if (idByName.has(name)) continue;
    const id = crypto.randomUUID();
    position += 1;
    await sequelize.query('INSERT INTO subsystems (id, craft_id, name, position) VALUES ($1, $2, $3, $4)', {
      bind: [id, craftId, name, position],
      transaction,
    });
    idByName.set(name, id);
  }
  return idByName;
}

/** A revision's row as the API reads it, with the names of who created and locked it. */
export interface RevisionRecord {
  id: string;
  craftId: string;
  kind: RevisionDto['kind'];
  state: RevisionDto['state'];
  parentId: string | null;
  label: string;
  note: string;
  sheetName: string;
  budgetPreset: string | null;
  requiredMarginPercent: number | null;
  createdById: string | null;
  createdByName: string | null;
  lockedById: string | null;
  lockedByName: string | null;
  lockedAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
  /** The craft's subsystems, when read with the revision (`revisionAlongWithCraft`). */
  subsystems?: SubsystemRecord[];
}

const revisionColumns = `
  r.id, r.craft_id AS "craftId", r.kind, r.state, r.parent_id AS "parentId", r.label, r.note, r.sheet_name AS "sheetName",
  r.budget_preset AS "budgetPreset", r.required_margin_percent AS "requiredMarginPercent",
  r.created_by_id AS "createdById", cu.name AS "createdByName", r.locked_by_id AS "lockedById", lu.name AS "lockedByName",
  r.locked_at AS "lockedAt", r.created_at AS "createdAt", r.updated_at AS "updatedAt"`;
const revisionSource = `revisions r LEFT JOIN users cu ON cu.id = r.created_by_id LEFT JOIN users lu ON lu.id = r.locked_by_id`;
const subsystemsJsonColumn = `(SELECT coalesce(json_agg(json_build_object('id', s.id, 'name', s.name, 'position', s.position) ORDER BY s.position, s.name), '[]')
  FROM subsystems s WHERE s.craft_id = r.craft_id)`;

/** The craft's revisions, oldest first. */
export function selectRevisions(sequelize: Sequelize, craftId: string): Promise<RevisionRecord[]> {
  return sequelize.query<RevisionRecord>(
    `SELECT ${revisionColumns} FROM ${revisionSource} WHERE r.craft_id = $1 ORDER BY r.created_at, r.id`,
    {
      bind: [craftId],
      type: QueryTypes.SELECT,
    },
  );
}

/**
 * One revision of the craft, 404 when the craft has no such revision. With `lock`, the revision's row is
 * locked for the transaction: every write to a revision takes this lock first, so writes to one revision
 * run one after another and each sees the sheet as the previous one left it.
 */
export async function selectRevision(
  sequelize: Sequelize,
  craftId: string,
  revisionId: string,
  options: { transaction?: Transaction; lock?: boolean } = {},
): Promise<RevisionRecord> {
  const [revision] = await sequelize.query<RevisionRecord>(
    `SELECT ${revisionColumns} FROM ${revisionSource} WHERE r.id = $1 AND r.craft_id = $2 ${options.lock ? 'FOR UPDATE OF r' : ''}`,
    { bind: [revisionId, craftId], type: QueryTypes.SELECT, transaction: options.transaction },
  );
  if (!revision) throw notFound('Revision');
  return revision;
}

/**
 * The revision $4 of the craft `c` as JSON, with the craft's subsystems and the stamp of its rows
 * (`parametersStampColumn`); null when the craft has no such revision.
 */
const revisionAlongSql = `(SELECT row_to_json(found) FROM (SELECT ${revisionColumns}, ${subsystemsJsonColumn} AS subsystems,
    ${parametersStampColumn('r.id')} AS "rowsStamp" FROM ${revisionSource} WHERE r.id = $4 AND r.craft_id = c.id) AS found)`;

/**
 * What `loadCraftAccess` reads along with the craft for a revision GET: the revision, its subsystems and the
 * stamp of its rows, so that craft access and revision take one query. Read it with `revisionFromAlong`.
 */
export function revisionAlongWithCraft(revisionId: string): AlongWithCraft {
  return { sql: revisionAlongSql, binds: [revisionId] };
}

/** A revision's rows in the API's format as UTF-8 JSON (`parametersJsonColumn`), and the stamp they were written at. */
interface RowsJson {
  stamp: string;
  json: Buffer;
}

const rowsJsonSql = `SELECT ${parametersStampColumn('r.id')} AS stamp, ${parametersJsonColumn('r.id')} AS json FROM revisions r WHERE r.id = $1`;

/**
 * The rows of recently read revisions, by revision id. A revision GET compares the stamp its one query read
 * (in the snapshot of the access check) with the stamp of the rows held here, and has PostgreSQL write the
 * rows again, in a second statement, only when they differ: held rows are never sent once the table rows
 * they were written from have changed. Least recently read revisions go first beyond the budget.
 */
const rowsCache = new Map<string, RowsJson>();
const ROWS_CACHE_BYTES = 32 * 1024 * 1024;
let rowsCacheBytes = 0;

function keepRows(revisionId: string, rows: RowsJson): void {
  const previous = rowsCache.get(revisionId);
  if (previous) rowsCacheBytes -= previous.json.length;
  rowsCache.delete(revisionId);
  rowsCache.set(revisionId, rows);
  rowsCacheBytes += rows.json.length;
  for (const [oldest, { json }] of rowsCache) {
    if (rowsCacheBytes <= ROWS_CACHE_BYTES) break;
    rowsCache.delete(oldest);
    rowsCacheBytes -= json.length;
  }
}

/** The revision's rows as UTF-8 JSON: those held here when their stamp is `stamp`, else written afresh (and held). */
async function rowsJsonAt(revisionId: string, stamp: string): Promise<Buffer> {
  const held = rowsCache.get(revisionId);
  if (held?.stamp === stamp) {
    rowsCache.delete(revisionId);
    rowsCache.set(revisionId, held);
    return held.json;
  }
  const sequelize = Revision.sequelize;
  if (!sequelize) throw new Error('rowsJsonAt: the models are not initialised on a connection');
  // Read a moment after the revision record: rows changed in between come out newer than it, never older.
  const [written] = await preparedQuery<{ stamp: string; json: string }>(sequelize, rowsJsonSql, [revisionId]);
  if (!written) throw notFound('Revision'); // deleted in that moment
  const rows = { stamp: written.stamp, json: Buffer.from(written.json) };
  keepRows(revisionId, rows);
  return rows.json;
}

type Timestamps = 'createdAt' | 'updatedAt' | 'lockedAt';

/**
 * The revision read by `revisionAlongWithCraft` (JSON gives timestamps as text), and its rows as UTF-8 JSON
 * text; 404 when there was none.
 */
export async function revisionFromAlong(extra: unknown): Promise<{ revision: RevisionRecord; parametersJson: Buffer }> {
  if (extra === null || typeof extra !== 'object') throw notFound('Revision');
  const { rowsStamp, ...revision } = extra as Omit<RevisionRecord, Timestamps> & Record<Timestamps, string | null> & { rowsStamp: string };
  return {
    revision: {
      ...revision,
      createdAt: new Date(revision.createdAt ?? 0),
      updatedAt: new Date(revision.updatedAt ?? 0),
      lockedAt: revision.lockedAt === null ? null : new Date(revision.lockedAt),
    },
    parametersJson: await rowsJsonAt(revision.id, rowsStamp),
  };
}

/** The revision as the API gives it. */
export function toRevisionDto(revision: RevisionRecord): RevisionDto {
  const person = (id: string | null, name: string | null) => (id !== null && name !== null ? { id, name } : null);
  return {
    id: revision.id,
    craftId: revision.craftId,
    kind: revision.kind,
    state: revision.state,
    parentId: revision.parentId,
    label: revision.label,
    note: revision.note,
    createdBy: person(revision.createdById, revision.createdByName),
    createdAt: revision.createdAt.toISOString(),
    lockedBy: person(revision.lockedById, revision.lockedByName),
    lockedAt: revision.lockedAt ? revision.lockedAt.toISOString() : null,
    updatedAt: revision.updatedAt.toISOString(),
  };
}

/** The sheet's header stored on the revision. */
export function sheetHeaderOf(
  revision: Pick<RevisionRecord, 'sheetName' | 'budgetPreset' | 'requiredMarginPercent'>,
): Omit<Sheet, 'parameters'> {
  if (revision.budgetPreset === null) return { name: revision.sheetName };
  return {
    name: revision.sheetName,
    budget: {
      preset: revision.budgetPreset,
      ...(revision.requiredMarginPercent !== null ? { requiredMarginPercent: revision.requiredMarginPercent } : {}),
    },
  };
}

/** The whole sheet of a revision in the documented format, from its header and stored rows. */
export function sheetOf(revision: Parameters<typeof sheetHeaderOf>[0], rows: readonly StoredRow[]): Sheet {
  return { ...sheetHeaderOf(revision), parameters: rows.map(toParameter) };
}

/** The whole sheet of a revision in the documented format, from its header and its rows as the API gives them. */
export function sheetOfParameters(revision: Parameters<typeof sheetHeaderOf>[0], rows: readonly RevisionParameter[]): Sheet {
  return {
    ...sheetHeaderOf(revision),
    parameters: rows.map(
      ({ subsystemId: _subsystemId, version: _version, updatedBy: _updatedBy, updatedAt: _updatedAt, ...parameter }) => parameter,
    ),
  };
}

/** A stored row as the API gives it: the parameter, its subsystem id, version and last change. */
export function toRevisionParameter(row: StoredRow): RevisionParameter {
  return {
    ...toParameter(row),
    subsystemId: row.subsystemId,
    version: row.version,
    updatedBy: row.updatedById !== null && row.updatedByName !== null ? { id: row.updatedById, name: row.updatedByName } : null,
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** A revision's detail before its rows go in: everything but `sheet.parameters`. */
export type RevisionDetailWithoutRows = Omit<RevisionDetail, 'sheet'> & { sheet: Omit<RevisionDetail['sheet'], 'parameters'> };

/**
 * A revision's detail as UTF-8 JSON, its rows given as UTF-8 JSON already (`parametersJsonColumn`, or the rows
 * a reader may see serialised): they go in as they are, parsed, serialised and encoded again by no one.
 */
export function revisionDetailJson(detail: RevisionDetailWithoutRows, parametersJson: Buffer): Buffer {
  const { sheet, ...rest } = detail;
  // Both objects have members (a sheet always has a name, a detail a revision), so the splices stay valid JSON.
  return Buffer.concat([
    Buffer.from(`{"sheet":${JSON.stringify(sheet).slice(0, -1)},"parameters":`),
    parametersJson,
    Buffer.from(`},${JSON.stringify(rest).slice(1)}`),
  ]);
}

/** The craft's working draft id, or null when it has none (a craft made before sheets were stored). */
export async function draftIdOf(sequelize: Sequelize, craftId: string, transaction?: Transaction): Promise<string | null> {
  const [draft] = await sequelize.query<{ id: string }>(`SELECT id FROM revisions WHERE craft_id = $1 AND kind = 'draft'`, {
    bind: [craftId],
    type: QueryTypes.SELECT,
    transaction,
  });
  return draft?.id ?? null;
}

/**
 * Stores a sheet as the craft's new working draft: its subsystems (created as needed, in the sheet's order)
 * and one record per row at version 1. Returns the draft's id.
 */
export async function createDraft(
  sequelize: Sequelize,
  craftId: string,
  sheet: Sheet,
  userId: string | null,
  transaction: Transaction,
): Promise<string> {
  const names = [...new Set(sheet.parameters.map((parameter) => parameter.subsystem))];
  const idByName = await ensureSubsystems(sequelize, craftId, names, transaction);
  const revisionId = crypto.randomUUID();
  await sequelize.query(
    `INSERT INTO revisions (id, craft_id, kind, state, label, sheet_name, budget_preset, required_margin_percent, created_by_id)
     VALUES ($1, $2, 'draft', 'open', 'Working draft', $3, $4, $5, $6)`,
    {
      bind: [revisionId, craftId, sheet.name, sheet.budget?.preset ?? null, sheet.budget?.requiredMarginPercent ?? null, userId],
      transaction,
    },
  );
  const rows = sheet.parameters.map((parameter, index) => ({
    parameter,
    subsystemId: idByName.get(parameter.subsystem) ?? '',
    position: index + 1,
  }));
  await insertRows(sequelize, revisionId, rows, userId, transaction);
  return revisionId;
}

/** The current sheet of the craft's working draft (for copies), 404 when it has none. */
export async function draftSheet(sequelize: Sequelize, craftId: string, transaction?: Transaction): Promise<Sheet> {
  const draftId = await draftIdOf(sequelize, craftId, transaction);
  if (draftId === null) throw notFound('Working draft');
  const revision = await selectRevision(sequelize, craftId, draftId, { transaction });
  return sheetOf(revision, await selectRows(sequelize, draftId, transaction));
}
