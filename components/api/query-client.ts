import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { ApiError } from './client';
import { sessionKeys } from '@/components/auth/queries';

/**
 * Builds the app's query client. A 401 on any query or mutation means the session ended elsewhere, so
 * the session query is refetched and the signed-in guard sends the person to sign-in. Client errors
 * (4xx) are not retried; network and server failures are, twice.
 */
export function createQueryClient(options: { retry?: boolean } = {}): QueryClient {
  const refetchSessionOn401 = (error: Error, key?: readonly unknown[]) => {
    const isSessionQuery = key?.[0] === sessionKeys.all[0];
    if (error instanceof ApiError && error.status === 401 && !isSessionQuery) {
      void client.invalidateQueries({ queryKey: sessionKeys.all });
    }
  };
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError: (error, query) => refetchSessionOn401(error, query.queryKey) }),
    mutationCache: new MutationCache({ onError: (error) => refetchSessionOn401(error) }),
    defaultOptions: {
      queries: {
        retry:
          options.retry === false
            ? false
            : (count, error) => !(error instanceof ApiError && error.status >= 400 && error.status < 500) && count < 2,
        staleTime: 30_000,
      },
    },
  });
  return client;
}
