import { z } from 'zod';
import { idSchema } from './common';

export const sessionUserSchema = z.object({
  id: idSchema,
  name: z.string(),
  email: z.string(),
  isOrgAdmin: z.boolean(),
  organisation: z.object({ id: idSchema, name: z.string() }),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

/** The identity providers Trimsheet signs people in with. */
export const signInProviderSchema = z.enum(['google', 'sso']);
export type SignInProvider = z.infer<typeof signInProviderSchema>;

/**
 * Invitations of several organisations for the address a sign-in just proved: the invitee chooses one
 * (nothing silently wins). Each is accepted by signing in again from `startUrl`.
 */
export const invitationChoiceSchema = z.object({
  email: z.string(),
  invitations: z.array(z.object({ id: idSchema, organisation: z.string(), invitedBy: z.string(), startUrl: z.string() })),
});
export type InvitationChoice = z.infer<typeof invitationChoiceSchema>;

/** GET /api/auth/session: who is signed in (or null) and the CSRF token to send back. */
export const sessionResponseSchema = z.object({
  user: sessionUserSchema.nullable(),
  csrfToken: z.string(),
  providers: z.array(z.object({ id: signInProviderSchema, label: z.string(), startUrl: z.string() })),
  /** Set after a sign-in that found invitations of several organisations, until one is chosen. */
  invitationChoice: invitationChoiceSchema.nullable().default(null),
});
export type SessionResponse = z.infer<typeof sessionResponseSchema>;

/** Why a sign-in ended back on the sign-in page (`/sign-in?error=<code>`); the client shows a message for each. */
export const signInErrorCodes = [
  'no_account',
  'identity_not_linked',
  'choose_invitation',
  'invitation_unavailable',
  'other_provider',
  'email_not_verified',
  'missing_email',
  'state_mismatch',
  'access_denied',
  'provider_error',
  'too_many_requests',
] as const;
export const signInErrorCodeSchema = z.enum(signInErrorCodes);
export type SignInErrorCode = z.infer<typeof signInErrorCodeSchema>;

/**
 * How linking another sign-in to the signed-in person ended (`/account?link=<result>`): linked, already
 * linked to them, linked to someone else, the link request expired or was never made, or a provider-side refusal.
 */
export const identityLinkResults = [
  'linked',
  'already_linked',
  'identity_in_use',
  'link_expired',
  'state_mismatch',
  'access_denied',
  'provider_error',
  'too_many_requests',
] as const;
export const identityLinkResultSchema = z.enum(identityLinkResults);
export type IdentityLinkResult = z.infer<typeof identityLinkResultSchema>;

/** A sign-in linked to the person: its provider and when it was linked. */
export const linkedIdentitySchema = z.object({ provider: signInProviderSchema, linkedAt: z.string() });

/** GET /api/account/identities: the person's linked sign-ins. */
export const linkedIdentityListSchema = z.object({ identities: z.array(linkedIdentitySchema) });

/** POST /api/account/identities: which provider to link. */
export const linkIdentityBodySchema = z.object({ provider: signInProviderSchema });

/** The answer to a link request: where the browser goes next (the provider's sign-in, returning to /account). */
export const linkIdentityStartSchema = z.object({ startUrl: z.string() });
