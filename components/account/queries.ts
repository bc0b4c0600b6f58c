import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import type { MailPreferences } from '@/shared/schemas/notifications';
import type { CreateTokenBody } from '@/shared/schemas/tokens';
import {
  createToken,
  getMailPreferences,
  listIdentities,
  listNotifications,
  listTokens,
  markNotificationsRead,
  revokeToken,
  setMailPreferences,
} from './api';

/** Query keys for the caller's personal access tokens, general to specific. */
export const tokenKeys = {
  all: ['account-tokens'] as const,
  list: () => [...tokenKeys.all, 'list'] as const,
};

/** The caller's tokens. */
export const tokenListOptions = () => queryOptions({ queryKey: tokenKeys.list(), queryFn: listTokens });

/** Creates a token and refreshes the list; the secret is in the mutation's data, and nowhere else. */
export function useCreateToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateTokenBody) => createToken(body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: tokenKeys.all }),
  });
}

/** Revokes a token and refreshes the list. */
export function useRevokeToken() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (tokenId: string) => revokeToken(tokenId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: tokenKeys.all }),
  });
}

/** Query keys for the caller's notifications and mail preferences. */
export const notificationKeys = {
  all: ['notifications'] as const,
  list: () => [...notificationKeys.all, 'list'] as const,
  mail: () => [...notificationKeys.all, 'mail-preferences'] as const,
};

/** The caller's latest notifications; refreshed every half minute while shown. */
export const notificationListOptions = () =>
  queryOptions({ queryKey: notificationKeys.list(), queryFn: listNotifications, refetchInterval: 30_000 });

/** Marks notifications read (all when no ids) and refreshes the list. */
export function useMarkNotificationsRead() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (ids?: readonly string[]) => markNotificationsRead(ids),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: notificationKeys.list() }),
  });
}

/** Which kinds of notification come by mail. */
export const mailPreferencesOptions = () => queryOptions({ queryKey: notificationKeys.mail(), queryFn: getMailPreferences });

/** Saves the mail preferences, shown at once and put back if the server refuses. */
export function useSetMailPreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (preferences: MailPreferences) => setMailPreferences(preferences),
    onMutate: async (preferences) => {
      await queryClient.cancelQueries({ queryKey: notificationKeys.mail() });
      const previous = queryClient.getQueryData<MailPreferences>(notificationKeys.mail());
      queryClient.setQueryData(notificationKeys.mail(), preferences);
      return { previous };
    },
    onError: (_error, _preferences, context) => queryClient.setQueryData(notificationKeys.mail(), context?.previous),
    onSettled: () => queryClient.invalidateQueries({ queryKey: notificationKeys.mail() }),
  });
}

/** Query keys for the caller's linked sign-ins. */
export const identityKeys = {
  all: ['account-identities'] as const,
  list: () => [...identityKeys.all, 'list'] as const,
};

/** The caller's linked sign-ins. */
export const identityListOptions = () => queryOptions({ queryKey: identityKeys.list(), queryFn: listIdentities });
