import { apiRequest } from '@/components/api/client';
import { mailPreferencesSchema, notificationListSchema, type MailPreferences } from '@/shared/schemas/notifications';
import { linkedIdentityListSchema, linkIdentityStartSchema, type SignInProvider } from '@/shared/schemas/session';
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

/** GET /api/notifications: the caller's latest notifications, newest first, and how many are unread. */
export function listNotifications(): Promise<z.infer<typeof notificationListSchema>> {
  return apiRequest('GET', '/api/notifications', { schema: notificationListSchema });
}

/** POST /api/notifications/read: marks these notifications read, or all of the caller's. */
export function markNotificationsRead(ids?: readonly string[]): Promise<void> {
  return apiRequest('POST', '/api/notifications/read', { body: ids === undefined ? {} : { ids } });
}

/** GET /api/account/mail-preferences: which kinds of notification also come by mail. */
export function getMailPreferences(): Promise<MailPreferences> {
  return apiRequest('GET', '/api/account/mail-preferences', { schema: mailPreferencesSchema });
}

/** PUT /api/account/mail-preferences: turns kinds of notification mail on or off. */
export function setMailPreferences(preferences: MailPreferences): Promise<MailPreferences> {
  return apiRequest('PUT', '/api/account/mail-preferences', { body: preferences, schema: mailPreferencesSchema });
}

/** GET /api/account/identities: the ways the caller signs in (linked providers). */
export async function listIdentities(): Promise<z.infer<typeof linkedIdentityListSchema>['identities']> {
  const { identities } = await apiRequest('GET', '/api/account/identities', { schema: linkedIdentityListSchema });
  return identities;
}

/** POST /api/account/identities: asks to link the provider's sign-in; the answer says where the browser goes next. */
export function requestIdentityLink(provider: SignInProvider): Promise<z.infer<typeof linkIdentityStartSchema>> {
  return apiRequest('POST', '/api/account/identities', { body: { provider }, schema: linkIdentityStartSchema });
}
