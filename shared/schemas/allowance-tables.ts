import { z } from 'zod';
import { validatePreset } from '@/shared/budget/validate-preset';
import { craftParamsSchema } from './crafts';

// Ids are checked once, by the budget's validator below; keys of the table must look like ids (zod drops a
// "__proto__" key before it could become the object's prototype).
const idSchema = z.string().max(60);
const tableKeySchema = z
  .string()
  .regex(/^[a-z][a-z0-9_-]*$/, { message: 'must be an id of lower-case letters, digits, _ or -' })
  .max(60);
const labelledIdSchema = z.object({ id: idSchema, label: z.string().trim().min(1).max(120) }).strict();

/**
 * A team's own allowance table for a craft: an allowance preset of its own (maturities, categories, the allowance
 * fraction of each cell, the required system margin and what it is a share of). Every cell is checked with the
 * budget's own validator, so a table the server stores is one the roll-up accepts.
 */
export const allowanceTableSchema = z
  .object({
    id: idSchema,
    name: z.string().trim().min(1).max(120),
    source: z.string().trim().min(1).max(500),
    caveat: z.string().trim().min(1).max(2000),
    maturities: z.array(labelledIdSchema).min(1).max(30),
    categories: z.array(labelledIdSchema).min(1).max(40),
    table: z.record(tableKeySchema, z.record(tableKeySchema, z.number())),
    systemMarginPercent: z.number(),
    systemMarginBasis: z.enum(['allocation', 'predicted']),
  })
  .strict()
  .superRefine((table, ctx) => {
    for (const issue of validatePreset(table)) {
      ctx.addIssue({ code: 'custom', path: issue.path.split(/[.[\]]/).filter((part) => part !== ''), message: issue.message });
    }
  });

/** PUT /api/crafts/:craftId/allowance-table: the table to keep for the craft. */
export const putAllowanceTableBodySchema = z.object({ table: allowanceTableSchema }).strict();

/** GET and PUT /api/crafts/:craftId/allowance-table: the craft's own table (null while it has none), who saved it and when. */
export const allowanceTableResponseSchema = z.object({
  table: allowanceTableSchema.nullable(),
  updatedBy: z.object({ id: z.string(), name: z.string() }).nullable(),
  updatedAt: z.string().nullable(),
});

export const allowanceTableParamsSchema = craftParamsSchema;

export type AllowanceTable = z.infer<typeof allowanceTableSchema>;
export type AllowanceTableResponse = z.infer<typeof allowanceTableResponseSchema>;
