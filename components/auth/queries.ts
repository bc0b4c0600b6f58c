import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { fetchSession, signOut } from './api';

/** Query keys for the session: one resource, so one key. */
export const sessionKeys = {
  all: ['session'] as const,
};

/** The session query, shared by the guard, the screens and the sign-in buttons. */
export const sessionQueryOptions = queryOptions({
  queryKey: sessionKeys.all,
  queryFn: fetchSession,
  staleTime: 60_000,
});

/** The current session (user may be null when signed out). */
export function useSession() {
  return useQuery(sessionQueryOptions);
}

/** The signed-in person, or null while loading or when signed out. */
export function useSessionUser() {
  return useSession().data?.user ?? null;
}

/** Signs out (this session or everywhere), then drops all cached data and refetches the session. */
export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: async () => {
      // Nothing fetched for the old person may be shown to the next one.
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== sessionKeys.all[0] });
      await queryClient.invalidateQueries({ queryKey: sessionKeys.all });
    },
  });
}
