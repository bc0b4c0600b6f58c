import { z } from 'zod';
import { idSchema, textLine } from './common';
import { parameterSchema } from './sheet';

/**
 * Spreadsheet exchange: the preview of a workbook imported against a revision (what would change, what cannot be
 * taken and why), and accepting it as a study. Every entry names the cell it comes from ("Parameters!D7").
 */

export const importFieldSchema = z.enum(['label', 'subsystem', 'unit', 'value', 'formula', 'note', 'source']);
export type ImportField = z.infer<typeof importFieldSchema>;

/** One field of a row, before and after; values carry their units ("12 kg → 14 kg"). */
export const importFieldChangeSchema = z.object({ field: importFieldSchema, from: z.string().nullable(), to: z.string().nullable() });

export const importChangedRowSchema = z.object({
  key: z.string(),
  label: z.string(),
  subsystem: z.string(),
  /** The row's key cell in the workbook. */
  cell: z.string(),
  changes: z.array(importFieldChangeSchema),
});

export const importAddedRowSchema = z.object({
  key: z.string(),
  label: z.string(),
  subsystem: z.string(),
  cell: z.string(),
  /** Its value with unit, or its formula. */
  definition: z.string(),
});

export const importRemovedRowSchema = z.object({ key: z.string(), label: z.string(), subsystem: z.string() });

export const importProblemCodes = [
  'invalid_key',
  'duplicate_key',
  'missing_key',
  'unknown_subsystem',
  'unknown_unit',
  'invalid_value',
  'formula_unreadable',
  'stale_row',
  'breaks_sheet',
  'syntax_error',
  'unknown_key',
  'unknown_function',
  'wrong_argument_count',
  'invalid_argument',
  'dimension_mismatch',
  'cycle',
  'unknown_material',
  'budget_error',
] as const;

/** A row that cannot be taken as it is, and why: left out of the study. */
export const importProblemSchema = z.object({
  cell: z.string(),
  key: z.string().nullable(),
  code: z.enum(importProblemCodes),
  message: z.string(),
});
export type ImportProblem = z.infer<typeof importProblemSchema>;

/** A row the importer may not change (a partner's rows outside the subsystems shared with them): left out. */
export const importIgnoredRowSchema = z.object({ cell: z.string(), key: z.string(), reason: z.string() });

export const importPreviewSchema = z.object({
  id: idSchema,
  craftId: idSchema,
  revisionId: idSchema,
  revisionLabel: z.string(),
  fileName: z.string(),
  state: z.enum(['pending', 'accepted']),
  createdAt: z.string(),
  /** A pending preview may be accepted until then. */
  expiresAt: z.string(),
  /** The study accepting it opened. */
  studyId: idSchema.nullable(),
  changed: z.array(importChangedRowSchema),
  added: z.array(importAddedRowSchema),
  removed: z.array(importRemovedRowSchema),
  problems: z.array(importProblemSchema),
  ignored: z.array(importIgnoredRowSchema),
});
export type ImportPreview = z.infer<typeof importPreviewSchema>;
export type ImportPreviewContent = Pick<ImportPreview, 'changed' | 'added' | 'removed' | 'problems' | 'ignored'>;

/** What accepting a preview applies to the study, step by step (kept on the server with the preview). */
export const importStepSchema = z.discriminatedUnion('action', [
  z.object({ action: z.literal('update'), key: z.string(), version: z.number().int(), parameter: parameterSchema }),
  z.object({ action: z.literal('create'), parameter: parameterSchema, afterKey: z.string().nullable() }),
  z.object({ action: z.literal('delete'), key: z.string(), version: z.number().int() }),
]);
export type ImportStep = z.infer<typeof importStepSchema>;

export const importParamsSchema = z.object({ craftId: idSchema, importId: idSchema });

/** POST .../imports/:importId/accept: the study's name (default "Import of <file>") and note. */
export const acceptImportBodySchema = z
  .object({ name: textLine(100).optional(), note: z.string().max(2000, { message: 'must be at most 2000 characters' }).default('') })
  .strict();
export type AcceptImportBody = z.infer<typeof acceptImportBodySchema>;

/** The export formats of a revision. */
export const exportFormats = ['xlsx', 'json', 'csv'] as const;
export type ExportFormat = (typeof exportFormats)[number];
