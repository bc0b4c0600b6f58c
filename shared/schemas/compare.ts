import { z } from 'zod';
import { idSchema } from './common';
import { revisionSchema } from './revisions';
import { parameterKeySchema, parameterSchema } from './sheet';

/**
 * Comparing two revisions of a craft's sheet: the rows added, removed and changed, every output's old
 * and new value, and, for one output, the changed inputs upstream of it with their share of its change.
 */

/** GET /api/crafts/:craftId/compare?from=&to=[&output=]. */
export const compareQuerySchema = z
  .object({
    from: idSchema,
    to: idSchema,
    /** An output's key: adds what moved it (`moved`). */
    output: parameterKeySchema.optional(),
  })
  .strict();
export type CompareQuery = z.infer<typeof compareQuerySchema>;

/** A change of the sheet's own settings. */
export const headerChangeSchema = z.object({
  field: z.enum(['name', 'budgetPreset', 'requiredMarginPercent']),
  from: z.union([z.string(), z.number()]).nullable(),
  to: z.union([z.string(), z.number()]).nullable(),
});
export type HeaderChange = z.infer<typeof headerChangeSchema>;

/** The fields of a row a change can touch, other than its value (which carries units, see `valueChangeSchema`). */
export const textFields = [
  'formula',
  'material',
  'unit',
  'maturity',
  'category',
  'subsystem',
  'label',
  'note',
  'source',
  'role',
  'protected',
] as const;

/** A changed input value, each side in its own unit; null on a side where the row holds a formula or material. */
export const valueChangeSchema = z.object({
  field: z.literal('value'),
  from: z.number().nullable(),
  fromUnit: z.string(),
  to: z.number().nullable(),
  toUnit: z.string(),
});

/** A changed text field; null on a side where the row has none. A material reads "id property", `protected` "true" or "false". */
export const textChangeSchema = z.object({
  field: z.enum(textFields),
  from: z.string().nullable(),
  to: z.string().nullable(),
});

export const fieldChangeSchema = z.discriminatedUnion('field', [valueChangeSchema, textChangeSchema]);
export type FieldChange = z.infer<typeof fieldChangeSchema>;

/** A row in both revisions whose definition changed: its label and subsystem in `to`, and what changed. */
export const rowChangeSchema = z.object({
  key: z.string(),
  label: z.string(),
  subsystem: z.string(),
  changes: z.array(fieldChangeSchema).min(1),
});
export type RowChange = z.infer<typeof rowChangeSchema>;

/**
 * A computed row (a formula on either side) present in both revisions: its value in each, in the row's unit
 * in `to`. When the unit's dimension changed, `from` stays in `fromUnit` and there is no change to report.
 * `change` and `changePercent` are null when a side has no value; `changePercent` also when `from` is 0.
 */
export const outputChangeSchema = z.object({
  key: z.string(),
  label: z.string(),
  subsystem: z.string(),
  unit: z.string(),
  from: z.number().nullable(),
  fromUnit: z.string(),
  to: z.number().nullable(),
  change: z.number().nullable(),
  /** change / |from| × 100: positive when the value rose. */
  changePercent: z.number().nullable(),
  dimensionChanged: z.boolean(),
  /** Why a side has no value (the engine's message). */
  problem: z.string().optional(),
});
export type OutputChange = z.infer<typeof outputChangeSchema>;

/** A changed input upstream of the output and its share: the output now minus the output with only this input at its old value. */
export const inputShareSchema = z.object({
  key: z.string(),
  label: z.string(),
  subsystem: z.string(),
  /** The input's unit in `to`; `from` is converted to it. */
  unit: z.string(),
  from: z.number(),
  to: z.number(),
  /** In the output's unit. */
  share: z.number(),
});
export type InputShare = z.infer<typeof inputShareSchema>;

/** A change upstream of the output that is not an input's value (a formula, an allowance, a new row): part of the remainder. */
export const upstreamChangeSchema = z.object({ key: z.string(), reason: z.string() });
export type UpstreamChange = z.infer<typeof upstreamChangeSchema>;

/**
 * What moved one output: its change, the changed inputs upstream of it with their shares (largest first),
 * the other changes upstream, and the remainder (change minus every share: the inputs' interaction and
 * the other changes). Every number is in the output's unit in `to`, but the inputs' own values.
 */
export const movedOutputSchema = z.object({
  key: z.string(),
  unit: z.string(),
  from: z.number(),
  to: z.number(),
  change: z.number(),
  inputs: z.array(inputShareSchema),
  otherChanges: z.array(upstreamChangeSchema),
  /** Present for a reader who does not see every row: the summed shares of the changed inputs they cannot see. */
  hiddenShare: z.number().optional(),
  remainder: z.number(),
});
export type MovedOutput = z.infer<typeof movedOutputSchema>;

/** The rows of two revisions compared: `added` as in `to`, `removed` as in `from`, both in sheet order. */
export const rowDiffSchema = z.object({
  added: z.array(parameterSchema),
  removed: z.array(parameterSchema),
  changed: z.array(rowChangeSchema),
});
export type RowDiff = z.infer<typeof rowDiffSchema>;

/** The comparison of two sheets, as the shared domain computes it. */
export const sheetComparisonSchema = z.object({
  header: z.array(headerChangeSchema),
  rows: rowDiffSchema,
  outputs: z.array(outputChangeSchema),
});
export type SheetComparison = z.infer<typeof sheetComparisonSchema>;

/** GET /api/crafts/:craftId/compare: both revisions, the comparison (partners: of the rows shared with them) and, when asked, what moved the output. */
export const compareResponseSchema = sheetComparisonSchema.extend({
  from: revisionSchema,
  to: revisionSchema,
  moved: movedOutputSchema.optional(),
});
export type CompareResponse = z.infer<typeof compareResponseSchema>;
