import crypto from 'node:crypto';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { Parameter } from '@/shared/schemas/sheet';

/**
 * The rows of a revision's sheet, one table row per parameter (`revision_parameters`), and the history of
 * their changes (`parameter_changes`). Plain SQL rather than model instances: the revision GET is on a
 * hot path, and writes lock and check versions explicitly.
 */

/** A stored row: the parameter's fields plus where it sits, its version and its last change. */
export interface StoredRow {
  id: string;
  subsystemId: string;
  subsystemName: string;
  key: string;
  position: number;
  label: string;
  unit: string;
  value: number | null;
  formula: string | null;
  material: Parameter['material'] | null;
  mass: Parameter['mass'] | null;
  note: string | null;
  source: string | null;
  protected: boolean;
  role: string | null;
  version: number;
  updatedById: string | null;
  updatedByName: string | null;
  updatedAt: Date;
}

/** Each field of StoredRow and the SQL it is read with. */
const rowFields: readonly (readonly [keyof StoredRow, string])[] = [
  ['id', 'p.id'],
  ['subsystemId', 'p.subsystem_id'],
  ['subsystemName', 's.name'],
  ['key', 'p.key'],
  ['position', 'p.position'],
  ['label', 'p.label'],
  ['unit', 'p.unit'],
  ['value', 'p.value'],
  ['formula', 'p.formula'],
  ['material', 'p.material'],
  ['mass', 'p.mass'],
  ['note', 'p.note'],
  ['source', 'p.source'],
  ['protected', 'p.protected'],
  ['role', 'p.role'],
  ['version', 'p.version'],
  ['updatedById', 'p.updated_by_id'],
  ['updatedByName', 'u.name'],
  ['updatedAt', 'p.updated_at'],
];
const rowColumns = rowFields.map(([field, sql]) => `${sql} AS "${field}"`).join(', ');
const rowSource = `revision_parameters p JOIN subsystems s ON s.id = p.subsystem_id LEFT JOIN users u ON u.id = p.updated_by_id`;

/** Every row of the revision in sheet order. */
export function selectRows(sequelize: Sequelize, revisionId: string, transaction?: Transaction): Promise<StoredRow[]> {
  return sequelize.query<StoredRow>(`SELECT ${rowColumns} FROM ${rowSource} WHERE p.revision_id = $1 ORDER BY p.position`, {
    bind: [revisionId],
    type: QueryTypes.SELECT,
    transaction,
  });
}

/**
 * A column expression giving the rows of the revision `revisionColumn` names, in sheet order, as the text of
 * a JSON array of `RevisionParameter` (the API's row), written by PostgreSQL: the revision GET sends it to a
 * reader of the whole sheet as it is, parsing and serialising nothing. It says what `toRevisionParameter`
 * says (same fields, absent rather than null, `protected` only when true, times as ISO strings in UTC);
 * tests/server/sheets/revision-read.test.ts holds the two equal.
 */
export function parametersJsonColumn(revisionColumn: string): string {
  // Built as text rather than with json_build_object and json_strip_nulls: PostgreSQL writes it in about half the time.
  const text = (sql: string) => `to_json(${sql})::text`;
  const optional = (field: string, json: string) => `coalesce(',"${field}":' || ${json}, '')`;
  const row = [
    `'{"key":' || ${text('p.key')} || ',"label":' || ${text('p.label')} || ',"subsystem":' || ${text('s.name')} || ',"unit":' || ${text('p.unit')}`,
    optional('value', text('p.value')),
    optional('formula', text('p.formula')),
    optional('material', 'p.material::text'),
    optional('note', text('p.note')),
    optional('source', text('p.source')),
    optional('mass', 'p.mass::text'),
    `CASE WHEN p.protected THEN ',"protected":true' ELSE '' END`,
    optional('role', text('p.role')),
    `',"subsystemId":"' || p.subsystem_id || '","version":' || p.version`,
    `',"updatedBy":' || coalesce('{"id":"' || u.id || '","name":' || ${text('u.name')} || '}', 'null')`,
    `',"updatedAt":"' || to_char(p.updated_at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"') || '"}'`,
  ].join(' || ');
  return `(SELECT '[' || coalesce(string_agg(${row}, ',' ORDER BY p.position), '') || ']' FROM ${rowSource} WHERE p.revision_id = ${revisionColumn})`;
}

/**
 * A column expression giving a stamp of what `parametersJsonColumn` writes for the revision `revisionColumn`
 * names: a hash of the versions of the table rows it reads (PostgreSQL's `xmin`, the transaction that wrote
 * each version, of every row, its subsystem and the person who last changed it, in order). Any change to
 * them, a rename of a subsystem or a person included, writes a new version and so a new stamp; reading the
 * stamp costs a fraction of writing the JSON.
 */
export function parametersStampColumn(revisionColumn: string): string {
  return `(SELECT md5(coalesce(string_agg(concat_ws(',', p.xmin, s.xmin, u.xmin), ';' ORDER BY p.position), ''))
     FROM ${rowSource} WHERE p.revision_id = ${revisionColumn})`;
}

/** The row as the sheet format writes it (no version, no ids). */
export function toParameter(row: StoredRow): Parameter {
  return {
    key: row.key,
    label: row.label,
    subsystem: row.subsystemName,
    unit: row.unit,
    ...(row.value !== null ? { value: row.value } : {}),
    ...(row.formula !== null ? { formula: row.formula } : {}),
    ...(row.material !== null ? { material: row.material } : {}),
    ...(row.note !== null ? { note: row.note } : {}),
    ...(row.source !== null ? { source: row.source } : {}),
    ...(row.mass !== null ? { mass: row.mass } : {}),
    ...(row.protected ? { protected: true } : {}),
    ...(row.role !== null ? { role: row.role } : {}),
  };
}

/** What a write stores of a row: the parameter's fields, its subsystem and its place. */
export interface RowContent {
  parameter: Parameter;
  subsystemId: string;
  position: number;
}

function contentBinds({ parameter, subsystemId, position }: RowContent) {
  return [
    subsystemId,
    parameter.key,
    position,
    parameter.label,
    parameter.unit,
    parameter.value ?? null,
    parameter.formula ?? null,
    parameter.material ? JSON.stringify(parameter.material) : null,
    parameter.mass ? JSON.stringify(parameter.mass) : null,
    parameter.note ?? null,
    parameter.source ?? null,
    parameter.protected === true,
    parameter.role ?? null,
  ];
}

/** PostgreSQL takes at most 65,535 bind parameters a statement: rows go in batches well under it. */
const ROWS_PER_INSERT = 1000;

/** Inserts rows at version 1, a batch of rows a statement. */
export async function insertRows(
  sequelize: Sequelize,
  revisionId: string,
  rows: readonly RowContent[],
  userId: string | null,
  transaction: Transaction,
): Promise<void> {
  for (let start = 0; start < rows.length; start += ROWS_PER_INSERT) {
    const binds: unknown[] = [revisionId, userId];
    const tuples = rows.slice(start, start + ROWS_PER_INSERT).map((row) => {
      const values = [crypto.randomUUID(), ...contentBinds(row)];
      const placeholders = values.map((value) => {
        binds.push(value);
        return `$${binds.length}`;
      });
      return `(${placeholders.join(', ')}, $1, $2)`;
    });
    await sequelize.query(
      `INSERT INTO revision_parameters
         (id, subsystem_id, key, position, label, unit, value, formula, material, mass, note, source, protected, role, revision_id, updated_by_id)
       VALUES ${tuples.join(', ')}`,
      { bind: binds, transaction },
    );
  }
}

/**
 * Rewrites a row's content and bumps its version by one, only if it is still at `version` (the caller has
 * checked it under the revision's lock; this keeps the check in the statement too). False when it was not.
 */
export async function updateRow(
  sequelize: Sequelize,
  rowId: string,
  version: number,
  content: RowContent,
  userId: string,
  transaction: Transaction,
): Promise<boolean> {
  const updated = await sequelize.query<{ id: string }>(
    `UPDATE revision_parameters SET subsystem_id = $1, key = $2, position = $3, label = $4, unit = $5, value = $6, formula = $7,
       material = $8, mass = $9, note = $10, source = $11, protected = $12, role = $13,
       version = version + 1, updated_by_id = $14, updated_at = now()
     WHERE id = $15 AND version = $16
     RETURNING id`,
    { bind: [...contentBinds(content), userId, rowId, version], type: QueryTypes.SELECT, transaction },
  );
  return updated.length === 1;
}

/** Sets the sheet order (keys in their new order) without touching versions: a reorder changes no row's content. */
export async function setOrder(sequelize: Sequelize, revisionId: string, keys: readonly string[], transaction: Transaction) {
  await sequelize.query(
    `UPDATE revision_parameters p SET position = ordered.position
     FROM unnest($2::text[]) WITH ORDINALITY AS ordered (key, position)
     WHERE p.revision_id = $1 AND p.key = ordered.key AND p.position <> ordered.position`,
    { bind: [revisionId, keys], transaction },
  );
}

/** Deletes one row. */
export async function deleteRow(sequelize: Sequelize, rowId: string, transaction: Transaction) {
  await sequelize.query('DELETE FROM revision_parameters WHERE id = $1', { bind: [rowId], transaction });
}

/** One entry of a row's history. */
export interface RowChange {
  key: string;
  action: 'create' | 'update' | 'rename' | 'move' | 'delete';
  before: unknown;
  after: unknown;
}

/** Records changes of rows in the history, in the transaction of the write. */
export async function recordChanges(
  sequelize: Sequelize,
  revisionId: string,
  changes: readonly RowChange[],
  userId: string | null,
  transaction: Transaction,
  at?: Date,
): Promise<void> {
  for (const change of changes) {
    await sequelize.query(
      `INSERT INTO parameter_changes (id, revision_id, key, action, before, after, changed_by_id, changed_at)
       VALUES ($1, $2, $3, $4, $5, $6, $7, coalesce($8, now()))`,
      {
        bind: [
          crypto.randomUUID(),
          revisionId,
          change.key,
          change.action,
          change.before === null ? null : JSON.stringify(change.before),
          change.after === null ? null : JSON.stringify(change.after),
          userId,
          at ?? null,
        ],
        transaction,
      },
    );
  }
}
