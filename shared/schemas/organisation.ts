import { z } from 'zod';
import { idSchema, textLine } from './common';
import { signInProviderSchema } from './session';

/** Someone of the organisation; the e-mail address and admin flag are left out for those who see only names (partners). */
export const personSchema = z.object({
  id: idSchema,
  name: z.string(),
  email: z.string().optional(),
  isOrgAdmin: z.boolean().optional(),
});
export type Person = z.infer<typeof personSchema>;

export const invitationSchema = z.object({
  id: idSchema,
  email: z.string(),
  name: z.string(),
  /** The sign-in provider the invitation is for; null: either (for a new person). */
  provider: signInProviderSchema.nullable(),
  invitedBy: z.string(),
  createdAt: z.string(),
  acceptedAt: z.string().nullable(),
  withdrawnAt: z.string().nullable(),
});
export type Invitation = z.infer<typeof invitationSchema>;

/**
 * GET /api/organisation: the caller's organisation and its people: everyone with e-mail and admin flag, or for
 * partners (`directory: 'craft_members'`) the names of the people on their crafts; invitations only for admins.
 */
export const organisationResponseSchema = z.object({
  organisation: z.object({ id: idSchema, name: z.string() }),
  directory: z.enum(['organisation', 'craft_members']),
  people: z.array(personSchema),
  invitations: z.array(invitationSchema),
});
export type OrganisationResponse = z.infer<typeof organisationResponseSchema>;

/** The longest address SMTP carries (RFC 5321 §4.5.3.1.3: a 256-octet path less its angle brackets). */
export const MAX_EMAIL_LENGTH = 254;

export const inviteBodySchema = z.object({
  email: z
    .string()
    .trim()
    .toLowerCase()
    .max(MAX_EMAIL_LENGTH, { message: `must be at most ${MAX_EMAIL_LENGTH} characters` })
    .pipe(z.email({ message: 'must be an e-mail address' })),
  name: textLine(120),
  /**
   * The sign-in provider the invitation is for. Null: either, for a new person. Naming one also lets a person
   * of the organisation who has the address link that provider's sign-in.
   */
  provider: signInProviderSchema.nullable().default(null),
});
export type InviteBody = z.infer<typeof inviteBodySchema>;

export const personParamsSchema = z.object({ userId: idSchema });

export const invitationParamsSchema = z.object({ invitationId: idSchema });

export const setOrgAdminBodySchema = z.object({ isOrgAdmin: z.boolean() });
