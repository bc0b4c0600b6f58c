import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateTokenBody } from '@/shared/schemas/tokens';
import { createToken, listTokens, revokeToken } from './api';

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
