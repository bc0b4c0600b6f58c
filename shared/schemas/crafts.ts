import { z } from 'zod';
import { idSchema, textLine } from './common';
import { craftRoleSchema } from './roles';

export const craftSchema = z.object({
  id: idSchema,
  organisationId: idSchema,
  name: z.string(),
  description: z.string(),
  /** The caller's role on this craft; null for an organisation admin who is not a member. */
  myRole: craftRoleSchema.nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Craft = z.infer<typeof craftSchema>;

export const craftListSchema = z.object({ crafts: z.array(craftSchema) });
export type CraftList = z.infer<typeof craftListSchema>;

export const craftParamsSchema = z.object({ craftId: idSchema });

const craftName = textLine(120);
const craftDescription = z.string().trim().max(2000, { message: 'must be at most 2000 characters' });

export const createCraftBodySchema = z.object({ name: craftName, description: craftDescription.default('') });
export type CreateCraftBody = z.infer<typeof createCraftBodySchema>;

export const updateCraftBodySchema = z
  .object({ name: craftName.optional(), description: craftDescription.optional() })
  .refine((body) => body.name !== undefined || body.description !== undefined, { message: 'give at least one of name, description' });
export type UpdateCraftBody = z.infer<typeof updateCraftBodySchema>;
