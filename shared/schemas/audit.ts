import { z } from 'zod';
import { idSchema } from './common';
import { personRefSchema } from './revisions';

/** What the audit log records. */
export const auditActions = [
  'baseline_locked',
  'study_opened',
  'study_promoted',
  'role_changed',
  'token_created',
  'token_revoked',
] as const;
export const auditActionSchema = z.enum(auditActions);
export type AuditAction = z.infer<typeof auditActionSchema>;

/** One entry of a craft's audit log. */
export const auditEventSchema = z.object({
  id: idSchema,
  at: z.string(),
  action: auditActionSchema,
  /** Who did it; null once the person is gone. */
  actor: personRefSchema.nullable(),
  /** Null for what belongs to a person rather than the craft (their access tokens). */
  craftId: idSchema.nullable(),
  /** What it was done to, in words: a baseline's label, a study's name, a person's name, a token's name. */
  subject: z.string(),
  details: z.record(z.string(), z.unknown()),
});
export type AuditEvent = z.infer<typeof auditEventSchema>;

export const auditListSchema = z.object({ events: z.array(auditEventSchema) });

/** A moment: a date and time with its offset, or a date (UTC midnight; as `to`, the end of that day). */
const momentSchema = z
  .union([z.iso.datetime({ offset: true }), z.iso.date()], { message: 'must be a date (2025-06-30) or a date and time' })
  // There was no year 0 (PostgreSQL refuses it).
  .refine((text) => !text.startsWith('0000'), { message: 'must be in the year 1 or later' });

/**
 * GET /api/crafts/:craftId/audit: newest first, at most `limit` entries, from `from` (inclusive) to `to`;
 * `format=csv` (or `Accept: text/csv`) exports them as CSV.
 */
export const auditQuerySchema = z
  .object({
    action: auditActionSchema.optional(),
    actor: idSchema.optional(),
    from: momentSchema.optional(),
    to: momentSchema.optional(),
    format: z.enum(['json', 'csv']).optional(),
    limit: z.coerce.number().int().min(1).max(5000).default(1000),
  })
  .strict();
export type AuditQuery = z.infer<typeof auditQuerySchema>;
