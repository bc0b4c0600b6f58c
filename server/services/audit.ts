import crypto from 'node:crypto';
import { QueryTypes, type Sequelize, type Transaction } from 'sequelize';
import type { AuditAction, AuditEvent, AuditQuery } from '@/shared/schemas/audit';
import type { User } from '../models';
import { authorizeCraft } from './craft-access';

/** One entry for the audit log, written in the transaction of what it records. */
export interface AuditEntry {
  organisationId: string;
  /** Null for what belongs to a person rather than a craft (their access tokens). */
  craftId: string | null;
  actorId: string | null;
  action: AuditAction;
  subject: string;
  details: Record<string, unknown>;
}

/** Records an entry in the audit log, in the transaction of the change: it is written if and only if the change is. */
export async function recordAudit(sequelize: Sequelize, transaction: Transaction, entry: AuditEntry): Promise<void> {
  await sequelize.query(
    `INSERT INTO audit_events (id, organisation_id, craft_id, actor_id, action, subject, details) VALUES ($1, $2, $3, $4, $5, $6, $7::jsonb)`,
    {
      bind: [
        crypto.randomUUID(),
        entry.organisationId,
        entry.craftId,
        entry.actorId,
        entry.action,
        entry.subject,
        JSON.stringify(entry.details),
      ],
      transaction,
    },
  );
}

interface AuditRecord {
  id: string;
  at: Date;
  action: AuditAction;
  actorId: string | null;
  actorName: string | null;
  craftId: string | null;
  subject: string;
  details: Record<string, unknown>;
}

const DATE_ONLY = /^\d{4}-\d{2}-\d{2}$/;

/**
 * The craft's audit log, newest first, filtered: its own entries, and the personal ones (access tokens) of
 * its current members, whose tokens reach the craft. Organisation admins and chief engineers; 403, 404.
 * A date without a time is UTC: `from` its start, `to` its end.
 */
export async function listAudit(sequelize: Sequelize, user: User, craftId: string, query: AuditQuery): Promise<AuditEvent[]> {
  const { craft } = await authorizeCraft(user, craftId, 'viewAudit');
  const from = query.from && DATE_ONLY.test(query.from) ? `${query.from}T00:00:00Z` : query.from;
  const to = query.to && DATE_ONLY.test(query.to) ? `${query.to}T23:59:59.999999Z` : query.to;
  const records = await sequelize.query<AuditRecord>(
    `SELECT a.id, a.at, a.action, a.actor_id AS "actorId", u.name AS "actorName", a.craft_id AS "craftId", a.subject, a.details
     FROM audit_events a LEFT JOIN users u ON u.id = a.actor_id
     WHERE a.organisation_id = $1
       AND (a.craft_id = $2 OR (a.craft_id IS NULL AND a.actor_id IN (SELECT m.user_id FROM memberships m WHERE m.craft_id = $2)))
       AND ($3::text IS NULL OR a.action = $3)
       AND ($4::uuid IS NULL OR a.actor_id = $4)
       AND ($5::timestamptz IS NULL OR a.at >= $5)
       AND ($6::timestamptz IS NULL OR a.at <= $6)
     ORDER BY a.at DESC, a.id
     LIMIT $7`,
    {
      bind: [craft.organisationId, craftId, query.action ?? null, query.actor ?? null, from ?? null, to ?? null, query.limit],
      type: QueryTypes.SELECT,
    },
  );
  return records.map((record) => ({
    id: record.id,
    at: record.at.toISOString(),
    action: record.action,
    actor: record.actorId !== null && record.actorName !== null ? { id: record.actorId, name: record.actorName } : null,
    craftId: record.craftId,
    subject: record.subject,
    details: record.details,
  }));
}

/**
 * One CSV cell (RFC 4180): quoted when it holds a comma, quote, line break or outer space. A cell a
 * spreadsheet would read as a formula (starting with = + - @, a tab or a carriage return) is
 * prefixed with a quote so that it stays text: an export must never run what someone typed into a label.
 */
export function csvCell(text: string): string {
  const inert = /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
  return /[",\r\n]|^\s|\s$/.test(inert) ? `"${inert.replaceAll('"', '""')}"` : inert;
}

/** The audit entries as CSV: a header line, then one line an entry; details as JSON. */
export function auditCsv(events: readonly AuditEvent[]): string {
  const lines = [
    ['at', 'action', 'actor', 'actor_id', 'subject', 'details'],
    ...events.map((event) => [
      event.at,
      event.action,
      event.actor?.name ?? '',
      event.actor?.id ?? '',
      event.subject,
      JSON.stringify(event.details),
    ]),
  ];
  return lines.map((cells) => cells.map(csvCell).join(',')).join('\r\n') + '\r\n';
}
