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

/** GET /api/auth/session: who is signed in (or null) and the CSRF token to send back. */
export const sessionResponseSchema = z.object({
  user: sessionUserSchema.nullable(),
  csrfToken: z.string(),
  providers: z.array(z.object({ id: z.enum(['google', 'sso']), label: z.string(), startUrl: z.string() })),
});
export type SessionResponse = z.infer<typeof sessionResponseSchema>;

/** Why a sign-in ended back on the sign-in page (`/sign-in?error=<code>`); the client shows a message for each. */
export const signInErrorCodes = [
  'no_account',
  'email_not_verified',
  'missing_email',
  'state_mismatch',
  'access_denied',
  'provider_error',
  'too_many_requests',
] as const;
export const signInErrorCodeSchema = z.enum(signInErrorCodes);
export type SignInErrorCode = z.infer<typeof signInErrorCodeSchema>;
