import { z } from 'zod';
import { idSchema, textLine } from './common';
import { craftRoleSchema } from './roles';

/**
 * A person's membership of one craft. Subsystems matter for subsystem owners: the rows they may edit. The
 * e-mail address is left out for those who see names only (partners).
 */
export const memberSchema = z.object({
  userId: idSchema,
  name: z.string(),
  email: z.string().optional(),
  role: craftRoleSchema,
  subsystems: z.array(z.string()),
});
export type Member = z.infer<typeof memberSchema>;

export const memberListSchema = z.object({ members: z.array(memberSchema) });

export const memberParamsSchema = z.object({ craftId: idSchema, userId: idSchema });

export const setMemberBodySchema = z
  .object({
    role: craftRoleSchema,
    subsystems: z.array(textLine(60)).max(50).default([]),
  })
  .refine((body) => body.role !== 'subsystem_owner' || body.subsystems.length > 0, {
    message: 'a subsystem owner needs at least one subsystem',
    path: ['subsystems'],
  });
export type SetMemberBody = z.infer<typeof setMemberBodySchema>;
