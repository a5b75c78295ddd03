import { QueryCache, QueryClient } from '@tanstack/react-query';
import { ApiRequestError } from './api-error';
import { currentUserKey } from './current-user';

/** Retries only what may succeed on a second try: never 4xx answers. */
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (error instanceof ApiRequestError && error.statusCode >= 400 && error.statusCode < 500) return false;
  return failureCount < 2;
}

/**
 * The app's query client. A 401 on any query means the session ended (expired, signed out elsewhere):
 * the current user becomes null, so the route guard sends the reader to sign-in.
 */
export function createQueryClient(): QueryClient {
  const qc: QueryClient = new QueryClient({
    queryCache: new QueryCache({
      onError: (error) => {
        if (error instanceof ApiRequestError && error.isUnauthorized) qc.setQueryData(currentUserKey, null);
      },
    }),
    defaultOptions: {
      queries: { retry: shouldRetry, staleTime: 30_000, refetchOnWindowFocus: false },
      mutations: { retry: false },
    },
  });
  return qc;
}
