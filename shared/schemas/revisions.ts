import { z } from 'zod';
import { idSchema, textBlock, textLine } from './common';
import { parameterKeySchema, parameterSchema, sheetHeaderSchema } from './sheet';

/**
 * The API's view of a craft's sheet: revisions (drafts, locked baselines, studies), their rows with
 * versions for optimistic concurrency, the craft's subsystems, and the bodies of row edits.
 */

export const revisionKinds = ['draft', 'baseline', 'study'] as const;
export const revisionKindSchema = z.enum(revisionKinds);
export const revisionStates = ['open', 'locked'] as const;
export const revisionStateSchema = z.enum(revisionStates);

/** A person as the API names them beside a change. */
export const personRefSchema = z.object({ id: idSchema, name: z.string() });
export type PersonRef = z.infer<typeof personRefSchema>;

/** One revision of a craft's sheet, without its rows. */
export const revisionSchema = z.object({
  id: idSchema,
  craftId: idSchema,
  kind: revisionKindSchema,
  state: revisionStateSchema,
  /** The revision this one was branched or continued from; null for the first draft. */
  parentId: idSchema.nullable(),
  /** A baseline's label ("PDR") or a study's name; the draft's is "Working draft". */
  label: z.string(),
  note: z.string(),
  createdBy: personRefSchema.nullable(),
  createdAt: z.string(),
  lockedBy: personRefSchema.nullable(),
  lockedAt: z.string().nullable(),
  updatedAt: z.string(),
});
export type Revision = z.infer<typeof revisionSchema>;

export const revisionListSchema = z.object({ revisions: z.array(revisionSchema) });

/** A subsystem of a craft: rows are grouped by it, owners and partners are named by its id. */
export const subsystemSchema = z.object({ id: idSchema, name: z.string(), position: z.number().int() });
export type Subsystem = z.infer<typeof subsystemSchema>;

/** A row as stored in a revision: the documented sheet parameter plus its version and last change. */
export const revisionParameterSchema = parameterSchema.and(
  z.object({
    subsystemId: idSchema,
    /** Starts at 1 and grows by one with every change; a write must carry the version it was read at. */
    version: z.number().int().min(1),
    updatedBy: personRefSchema.nullable(),
    updatedAt: z.string(),
  }),
);
export type RevisionParameter = z.infer<typeof revisionParameterSchema>;

/** What the caller may do in this revision, worked out from the permission table for the screen to hide controls. */
export const revisionAbilitiesSchema = z.object({
  /** Subsystem ids whose rows the caller may edit. */
  editableSubsystemIds: z.array(idSchema),
  manageRows: z.boolean(),
  manageSubsystems: z.boolean(),
  /** False for partners: they see only the rows shared with them and the headline figures. */
  wholeSheet: z.boolean(),
});
export type RevisionAbilities = z.infer<typeof revisionAbilitiesSchema>;

/** A headline figure computed on the server, for readers who do not see every row (partners). */
export const headlineFigureSchema = z.object({
  role: z.string(),
  /** The row playing the role (the role's name when no row does). */
  key: z.string(),
  label: z.string(),
  /** In `unit`; null when the row is missing or has an error (then `problem` says why). */
  value: z.number().nullable(),
  unit: z.string(),
  problem: z.string().optional(),
  /** A warning on the value, e.g. "below the required margin" on the system margin. */
  flag: z.string().optional(),
});

/** GET /api/crafts/:craftId/revisions/:revisionId: the revision and its sheet in the documented format. */
export const revisionDetailSchema = z.object({
  revision: revisionSchema,
  sheet: sheetHeaderSchema.extend({ parameters: z.array(revisionParameterSchema) }),
  subsystems: z.array(subsystemSchema),
  abilities: revisionAbilitiesSchema,
  /** Present when the caller does not see the whole sheet: the figures they may read. */
  headlineFigures: z.array(headlineFigureSchema).optional(),
  /**
   * Present when the caller does not see the whole sheet: the values of the rows they see, computed on the
   * server over the whole sheet (their formulas read rows they cannot see), each in its row's unit; a row
   * with an error on the server is absent.
   */
  serverValues: z.record(z.string(), z.object({ value: z.number(), unit: z.string() })).optional(),
});
export type RevisionDetail = z.infer<typeof revisionDetailSchema>;

export const revisionParamsSchema = z.object({ craftId: idSchema, revisionId: idSchema });
export const parameterParamsSchema = revisionParamsSchema.extend({ key: z.string().min(1).max(100) });

/** A row's value as typed: a number in the row's unit, or text with a unit ("60 m", "25 um"). */
export const typedValueSchema = z.union([
  z.number().refine(Number.isFinite, { message: 'must be a finite number' }),
  z.string().trim().min(1, { message: 'must not be empty' }).max(100),
]);

const massSchema = z.object({ maturity: z.string().min(1).max(60), category: z.string().min(1).max(60) }).strict();

/** POST .../parameters: a new row in the sheet format, placed before `before` (a key) or at the end of its subsystem. */
export const createParameterBodySchema = z.object({
  parameter: parameterSchema,
  before: parameterKeySchema.optional(),
});
export type CreateParameterBody = z.infer<typeof createParameterBodySchema>;

/**
 * PATCH .../parameters/:key: any of these fields and the version the row was read at. `value` and `formula`
 * replace each other (a row holds one of them); `mass: null` takes the row out of the mass budget; `key`
 * renames the row and rewrites the formulas that use it; `before` moves it before another row (null: to the end).
 */
export const updateParameterBodySchema = z
  .object({
    version: z.number().int().min(1),
    value: typedValueSchema.optional(),
    formula: z.string().trim().max(4000).optional(),
    unit: z.string().trim().max(60).optional(),
    label: textLine(200).optional(),
    note: textBlock(4000).optional(),
    source: textBlock(1000).optional(),
    subsystem: textLine(60).optional(),
    mass: massSchema.nullable().optional(),
    key: parameterKeySchema.optional(),
    before: parameterKeySchema.nullable().optional(),
  })
  .strict()
  .refine((body) => Object.keys(body).length > 1, { message: 'give at least one field to change besides version' })
  .refine((body) => body.value === undefined || body.formula === undefined, {
    message: 'give value or formula, not both',
    path: ['formula'],
  });
export type UpdateParameterBody = z.infer<typeof updateParameterBodySchema>;

export const deleteParameterQuerySchema = z.object({ version: z.coerce.number().int().min(1) });

/** The `details` of a 409 version_conflict: the row as it is now, for the screen to show beside the person's own. */
export const versionConflictDetailsSchema = z.object({ current: revisionParameterSchema });

/** POST /api/crafts/:craftId/subsystems and PATCH .../subsystems/:subsystemId. */
export const subsystemBodySchema = z.object({ name: textLine(60) });
export const subsystemParamsSchema = z.object({ craftId: idSchema, subsystemId: idSchema });

/**
 * An event on GET /api/crafts/:craftId/events: which rows of which revision changed, and who changed
 * them. Screens refetch what they show; the payload stays small (PostgreSQL NOTIFY carries it).
 */
export const sheetEventSchema = z.object({
  type: z.enum(['parameters_changed', 'subsystems_changed', 'revision_changed']),
  craftId: idSchema,
  revisionId: idSchema.nullable(),
  keys: z.array(z.string()),
  by: personRefSchema.nullable(),
  at: z.string(),
});
export type SheetEvent = z.infer<typeof sheetEventSchema>;

const evaluatedValueSchema = z.object({ value: z.number(), unit: z.string() });
const engineErrorSchema = z.object({ key: z.string(), code: z.string(), message: z.string() });

/** The mass-budget roll-up as the API gives it (kg; allowances as fractions). */
export const budgetRollUpSchema = z.object({
  rows: z.array(
    z.object({
      key: z.string(),
      subsystem: z.string(),
      cbe: z.number(),
      maturity: z.string(),
      category: z.string(),
      allowance: z.number(),
      predicted: z.number(),
    }),
  ),
  bySubsystem: z.array(z.object({ subsystem: z.string(), cbe: z.number(), predicted: z.number() })),
  total: z.object({ cbe: z.number(), predicted: z.number() }),
  systemMargin: z.object({
    kg: z.number(),
    percentOfAllocation: z.number(),
    percentOfPredicted: z.number().nullable(),
    requiredPercent: z.number(),
    requiredPercentOfBasis: z.number(),
    requiredBasis: z.enum(['allocation', 'predicted']),
    belowRequired: z.boolean(),
  }),
});

/** GET .../evaluation: the CLI's JSON shape plus the mass budget, computed on the server with the shared engine. */
export const evaluationResponseSchema = z.object({
  values: z.record(z.string(), evaluatedValueSchema),
  errors: z.array(engineErrorSchema),
  budget: z.union([
    z.object({ ok: z.literal(true), result: budgetRollUpSchema }),
    z.object({ ok: z.literal(false), errors: z.array(engineErrorSchema) }),
  ]),
});
export type EvaluationResponse = z.infer<typeof evaluationResponseSchema>;

const revisionName = textLine(100);
const revisionNote = textBlock(4000).trim();

/** POST .../revisions/:revisionId/lock: the working draft locked as a baseline, `label` naming the design review. */
export const lockBaselineBodySchema = z.object({ label: revisionName, note: revisionNote.default('') }).strict();
export type LockBaselineBody = z.infer<typeof lockBaselineBodySchema>;

/** POST .../revisions/:revisionId/studies: a study opened from that revision, under a name. */
export const openStudyBodySchema = z.object({ name: revisionName, note: revisionNote.default('') }).strict();
export type OpenStudyBody = z.infer<typeof openStudyBodySchema>;

export const studyParamsSchema = z.object({ craftId: idSchema, studyId: idSchema });

/** How a conflict of a promotion is resolved: keep the draft's row, or take the study's. */
export const mergeSideSchema = z.enum(['draft', 'study']);
export type MergeSide = z.infer<typeof mergeSideSchema>;

/** POST .../revisions/:studyId/promote: a resolution for every row in conflict, by key (none when there is no conflict). */
export const promoteStudyBodySchema = z.object({ resolutions: z.record(z.string().min(1).max(100), mergeSideSchema).default({}) }).strict();
export type PromoteStudyBody = z.infer<typeof promoteStudyBodySchema>;

/** A row as a merge shows it: the sheet's row and its subsystem id. */
const mergeRowSchema = parameterSchema.and(z.object({ subsystemId: idSchema }));

/**
 * A row changed in both the draft and the study since the study was opened: as it was then (`base`), in
 * the draft now and in the study; null where the row is absent.
 */
export const mergeConflictSchema = z.object({
  key: z.string(),
  base: mergeRowSchema.nullable(),
  draft: mergeRowSchema.nullable(),
  study: mergeRowSchema.nullable(),
});
export type MergeConflictDto = z.infer<typeof mergeConflictSchema>;

/** The `details` of a 409 merge_conflicts: every conflict, and which of them the request left unresolved. */
export const mergeConflictDetailsSchema = z.object({ conflicts: z.array(mergeConflictSchema), unresolved: z.array(z.string()) });

/** The answer to a promotion: the study (now locked), the draft, and what was done to the draft's rows. */
export const promotionSchema = z.object({
  study: revisionSchema,
  draft: revisionSchema,
  applied: z.array(z.object({ key: z.string(), action: z.enum(['create', 'update', 'delete']) })),
});
export type Promotion = z.infer<typeof promotionSchema>;
