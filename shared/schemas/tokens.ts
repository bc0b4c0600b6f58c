import { z } from 'zod';
import { idSchema, textLine } from './common';

/** What a personal access token lets a script do: read, or read and write the rows the person may edit. */
export const tokenScopes = ['read', 'read_write'] as const;
export const tokenScopeSchema = z.enum(tokenScopes);
export type TokenScope = z.infer<typeof tokenScopeSchema>;

/** A personal access token as listed: never its secret, which is shown once at creation. */
export const accessTokenSchema = z.object({
  id: idSchema,
  name: z.string(),
  scope: tokenScopeSchema,
  /** The first characters of the token, so a person can tell tokens apart. */
  prefix: z.string(),
  createdAt: z.string(),
  lastUsedAt: z.string().nullable(),
  revokedAt: z.string().nullable(),
});
export type AccessToken = z.infer<typeof accessTokenSchema>;

export const accessTokenListSchema = z.object({ tokens: z.array(accessTokenSchema) });

export const createTokenBodySchema = z.object({ name: textLine(80), scope: tokenScopeSchema });
export type CreateTokenBody = z.infer<typeof createTokenBodySchema>;

/** The answer to creating a token: the listed token and, this once, its secret. */
export const createdTokenSchema = z.object({ token: accessTokenSchema, secret: z.string() });

export const tokenParamsSchema = z.object({ tokenId: idSchema });
