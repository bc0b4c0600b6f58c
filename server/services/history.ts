import { QueryTypes, type Sequelize } from 'sequelize';
import { mayOnCraft, mayOnRow, standingOf } from '@/shared/access/permissions';
import {
  HISTORY_LIMIT,
  rowStateSchema,
  type RowChangeAction,
  type RowHistory,
  type RowHistoryEntry,
  type RowHistoryQuery,
} from '@/shared/schemas/history';
import { notFound } from '../http-error';
import type { User } from '../models';
import { authorizeCraft } from './craft-access';
import { selectRevisions, selectSubsystems } from './sheet-store';

type RevisionRecord = Awaited<ReturnType<typeof selectRevisions>>[number];

/** Changes recorded in one revision, up to a moment (null: all of them). */
interface HistorySource {
  revision: RevisionRecord;
  until: Date | null;
}

const earlier = (a: Date | null, b: Date | null): Date | null => (a === null ? b : b === null ? a : a < b ? a : b);

/**
 * Where a revision's history is recorded. The draft records its own. A baseline is a copy of the draft at its
 * lock and records nothing itself: its history is the draft's up to `locked_at`. A study records its own
 * changes, and before it was opened it was its source (the source's history up to the study's creation).
 */
function historySources(revision: RevisionRecord, byId: ReadonlyMap<string, RevisionRecord>, until: Date | null): HistorySource[] {
  if (revision.kind === 'draft') return [{ revision, until }];
  if (revision.kind === 'baseline') {
    const draft = [...byId.values()].find((candidate) => candidate.kind === 'draft');
    return draft ? [{ revision: draft, until: earlier(until, revision.lockedAt) }] : [];
  }
  const source = revision.parentId === null ? undefined : byId.get(revision.parentId);
  return [{ revision, until }, ...(source ? historySources(source, byId, earlier(until, revision.createdAt)) : [])];
}

interface ChangeRecord {
  id: string;
  at: Date;
  action: RowChangeAction;
  key: string;
  before: unknown;
  after: unknown;
  byId: string | null;
  byName: string | null;
  revisionId: string;
}

/**
 * The changes of the sources' rows, newest first. With `key`: that key's changes and those of the keys it was
 * renamed from (a recursive walk over renames). With `subsystems`: only changes whose row was in one of them
 * before and after (what a partner may see). `limit` null: all.
 */
const changesSql = `
  WITH RECURSIVE sources (revision_id, until) AS (SELECT * FROM unnest($1::uuid[], $2::timestamptz[])),
  aliases (key) AS (
    SELECT $3::text
    UNION
    SELECT c.before ->> 'key' FROM parameter_changes c JOIN aliases a ON c.key = a.key
    WHERE $3::text IS NOT NULL AND c.action = 'rename' AND c.revision_id = ANY ($1::uuid[])
  )
  SELECT c.id, c.changed_at AS at, c.action, c.key, c.before, c.after, c.changed_by_id AS "byId", u.name AS "byName",
         c.revision_id AS "revisionId"
  FROM sources s
  JOIN parameter_changes c ON c.revision_id = s.revision_id AND (s.until IS NULL OR c.changed_at <= s.until)
  LEFT JOIN users u ON u.id = c.changed_by_id
  WHERE ($3::text IS NULL OR c.key IN (SELECT key FROM aliases))
    AND ($4::text[] IS NULL OR ((c.before IS NULL OR c.before ->> 'subsystem' = ANY ($4)) AND (c.after IS NULL OR c.after ->> 'subsystem' = ANY ($4))))
  ORDER BY c.changed_at DESC, c.id DESC
  LIMIT $5`;

/**
 * Follows one row back through its renames, newest first: a change belongs to it while it carried the key
 * then (a later row that reused an old key is not it).
 */
function lineageOf(key: string, records: readonly ChangeRecord[]): ChangeRecord[] {
  let current = key;
  return records.filter((record) => {
    if (record.key !== current) return false;
    const before = record.before as { key?: unknown } | null;
    if (record.action === 'rename' && typeof before?.key === 'string') current = before.key;
    return true;
  });
}

/**
 * A revision's history of row changes, newest first, at most `HISTORY_LIMIT` (`truncated` says there were more):
 * who, when, the row before and after, and the revision the change was made in (see `historySources`).
 * `key` narrows it to one row, its earlier keys included. Whoever may view the craft; a partner gets only the
 * changes of rows in subsystems they may see (before and after). 404 for a craft or revision they cannot see.
 */
export async function rowHistory(
  sequelize: Sequelize,
  user: User,
  craftId: string,
  revisionId: string,
  query: RowHistoryQuery,
): Promise<RowHistory> {
  const who = await authorizeCraft(user, craftId, 'viewCraft');
  const revisions = await selectRevisions(sequelize, craftId);
  const byId = new Map(revisions.map((revision) => [revision.id, revision]));
  const revision = byId.get(revisionId);
  if (!revision) throw notFound('Revision');
  const standing = standingOf(revision);
  // The same rule as a revision's rows: viewRow by subsystem. Changes name a row's subsystem by its name then.
  const visibleSubsystems = mayOnCraft('viewWholeSheet', who)
    ? null
    : (await selectSubsystems(sequelize, craftId))
        .filter((subsystem) => mayOnRow('viewRow', who, { subsystemId: subsystem.id }, standing))
        .map((subsystem) => subsystem.name);
  const sources = historySources(revision, byId, null);
  const records = await sequelize.query<ChangeRecord>(changesSql, {
    bind: [
      sources.map((source) => source.revision.id),
      sources.map((source) => source.until?.toISOString() ?? null),
      query.key ?? null,
      visibleSubsystems,
      // One more than the limit tells whether there were more; a row's lineage is read whole, then cut.
      query.key === undefined ? HISTORY_LIMIT + 1 : null,
    ],
    type: QueryTypes.SELECT,
  });
  const changes = query.key === undefined ? records : lineageOf(query.key, records);
  return {
    changes: changes.slice(0, HISTORY_LIMIT).map((record) => toEntry(record, byId)),
    limit: HISTORY_LIMIT,
    truncated: changes.length > HISTORY_LIMIT,
  };
}

function toEntry(record: ChangeRecord, byId: ReadonlyMap<string, RevisionRecord>): RowHistoryEntry {
  const madeIn = byId.get(record.revisionId);
  if (!madeIn) throw new Error(`change ${record.id} names a revision outside the craft`);
  return {
    id: record.id,
    at: record.at.toISOString(),
    action: record.action,
    key: record.key,
    // What the write paths stored, checked against the row format on the way out.
    before: record.before === null ? null : rowStateSchema.parse(record.before),
    after: record.after === null ? null : rowStateSchema.parse(record.after),
    by: record.byId !== null && record.byName !== null ? { id: record.byId, name: record.byName } : null,
    revision: { id: madeIn.id, kind: madeIn.kind, label: madeIn.label },
  };
}
