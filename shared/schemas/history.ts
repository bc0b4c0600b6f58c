import { z } from 'zod';
import { idSchema } from './common';
import { personRefSchema, revisionKindSchema } from './revisions';
import { parameterKeySchema, parameterSchema } from './sheet';

/** How a row changed: added, content changed, renamed (its key), moved (its place only) or deleted. */
export const rowChangeActions = ['create', 'update', 'rename', 'move', 'delete'] as const;
export const rowChangeActionSchema = z.enum(rowChangeActions);
export type RowChangeAction = z.infer<typeof rowChangeActionSchema>;

/** A row as a change found or left it: the parameter in the sheet format and its version then. */
export const rowStateSchema = parameterSchema.and(z.object({ version: z.number().int().min(1) }));
export type RowState = z.infer<typeof rowStateSchema>;

/** At most this many changes come back, the newest. */
export const HISTORY_LIMIT = 200;

/** One change of a row: who, when, what it was before and after, and in which revision it was made. */
export const rowHistoryEntrySchema = z.object({
  id: idSchema,
  at: z.string(),
  action: rowChangeActionSchema,
  /** The row's key after the change (a deleted row's last key). */
  key: z.string(),
  /** Null for a row created. */
  before: rowStateSchema.nullable(),
  /** Null for a row deleted. */
  after: rowStateSchema.nullable(),
  /** Null once the person is gone. */
  by: personRefSchema.nullable(),
  /** The revision the change was made in: a baseline's history is its draft's, a study's starts with its source's. */
  revision: z.object({ id: idSchema, kind: revisionKindSchema, label: z.string() }),
});
export type RowHistoryEntry = z.infer<typeof rowHistoryEntrySchema>;

/** GET /api/crafts/:craftId/revisions/:revisionId/history: newest first, at most `limit` (`truncated` when there were more). */
export const rowHistorySchema = z.object({
  changes: z.array(rowHistoryEntrySchema),
  limit: z.number().int(),
  truncated: z.boolean(),
});
export type RowHistory = z.infer<typeof rowHistorySchema>;

/** `key` narrows the history to one row, following its renames back to its earlier keys. */
export const rowHistoryQuerySchema = z.object({ key: parameterKeySchema.optional() }).strict();
export type RowHistoryQuery = z.infer<typeof rowHistoryQuerySchema>;
