import { z } from 'zod';
import { idSchema, textBlock, textLine } from './common';
import { craftRoleSchema } from './roles';

export const craftSchema = z.object({
  id: idSchema,
  organisationId: idSchema,
  name: z.string(),
  description: z.string(),
  /** The caller's role on this craft; null for an organisation admin who is not a member. */
  myRole: craftRoleSchema.nullable(),
  /** The template the craft started from. */
  templateId: z.string(),
  /** The working draft's revision id: the sheet people edit. */
  draftRevisionId: idSchema.nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Craft = z.infer<typeof craftSchema>;

export const craftListSchema = z.object({ crafts: z.array(craftSchema) });
export type CraftList = z.infer<typeof craftListSchema>;

export const craftParamsSchema = z.object({ craftId: idSchema });

const craftName = textLine(120);
const craftDescription = textBlock(2000).trim();

/**
 * A new craft starts from a template (`templateId`, the square sail when neither is given) or as a copy
 * of another craft's current sheet (`copyOf`, a craft id), never both.
 */
export const createCraftBodySchema = z
  .object({
    name: craftName,
    description: craftDescription.default(''),
    templateId: z.string().min(1).max(60).optional(),
    copyOf: idSchema.optional(),
  })
  .refine((body) => body.templateId === undefined || body.copyOf === undefined, {
    message: 'give templateId or copyOf, not both',
    path: ['copyOf'],
  });
export type CreateCraftBody = z.infer<typeof createCraftBodySchema>;

export const updateCraftBodySchema = z
  .object({ name: craftName.optional(), description: craftDescription.optional() })
  .refine((body) => body.name !== undefined || body.description !== undefined, { message: 'give at least one of name, description' });
export type UpdateCraftBody = z.infer<typeof updateCraftBodySchema>;
