import { apiRequest } from '@/components/api/client';
import { accessTokenListSchema, createdTokenSchema, type AccessToken, type CreateTokenBody } from '@/shared/schemas/tokens';
import type { z } from 'zod';

/** A token just created: the listed token and its secret, which the server shows this once. */
export type CreatedToken = z.infer<typeof createdTokenSchema>;

/** GET /api/account/tokens: the caller's personal access tokens (never their secrets). */
export async function listTokens(): Promise<AccessToken[]> {
  const { tokens } = await apiRequest('GET', '/api/account/tokens', { schema: accessTokenListSchema });
  return tokens;
}

/** POST /api/account/tokens: creates a token; the answer carries its secret this once. */
export function createToken(body: CreateTokenBody): Promise<CreatedToken> {
  return apiRequest('POST', '/api/account/tokens', { body, schema: createdTokenSchema });
}

/** DELETE /api/account/tokens/:tokenId: revokes the token; scripts using it are refused from then on. */
export function revokeToken(tokenId: string): Promise<void> {
  return apiRequest('DELETE', `/api/account/tokens/${encodeURIComponent(tokenId)}`);
}
