import { QueryCache, QueryClient } from '@tanstack/react-query';

import { isApiStatus } from './client';
import { sessionKeys } from './query-keys';

/**
 * The app's one QueryClient. Client errors (4xx) are not retried; a 401 from any query means the
 * session ended (signed out elsewhere, role changed, disabled), so the cached user is cleared and the
 * signed-in shell redirects to sign-in.
 */
export function createQueryClient(): QueryClient {
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({
      onError: (error, query) => {
        if (isApiStatus(error, 401) && query.queryKey[0] !== sessionKeys.all[0]) {
          client.setQueryData(sessionKeys.me(), null);
        }
      },
    }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        retry: (failureCount, error) => !isApiStatus(error, 400, 401, 403, 404, 409, 422) && failureCount < 2,
        refetchOnWindowFocus: true,
      },
      mutations: { retry: false },
    },
  });
  return client;
}
