import { z } from 'zod';
import { idSchema, textLine } from './common';

export const personSchema = z.object({
  id: idSchema,
  name: z.string(),
  email: z.string(),
  isOrgAdmin: z.boolean(),
});
export type Person = z.infer<typeof personSchema>;

export const invitationSchema = z.object({
  id: idSchema,
  email: z.string(),
  name: z.string(),
  invitedBy: z.string(),
  createdAt: z.string(),
  acceptedAt: z.string().nullable(),
});
export type Invitation = z.infer<typeof invitationSchema>;

/** GET /api/organisation: the caller's organisation, its people and open invitations (admins only see invitations). */
export const organisationResponseSchema = z.object({
  organisation: z.object({ id: idSchema, name: z.string() }),
  people: z.array(personSchema),
  invitations: z.array(invitationSchema),
});
export type OrganisationResponse = z.infer<typeof organisationResponseSchema>;

export const inviteBodySchema = z.object({
  email: z.string().trim().toLowerCase().pipe(z.email({ message: 'must be an e-mail address' })),
  name: textLine(120),
});
export type InviteBody = z.infer<typeof inviteBodySchema>;

export const personParamsSchema = z.object({ userId: idSchema });

export const setOrgAdminBodySchema = z.object({ isOrgAdmin: z.boolean() });
