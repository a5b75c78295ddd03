import type { UserView } from '@cribra/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from './api-client';
import { ApiRequestError } from './api-error';

// The signed-in user is needed by the frame, the guards and several features, so it lives in lib.
export const currentUserKey = ['auth', 'me'] as const;

/** GET /api/auth/me; a 401 means "signed out" and resolves to null rather than an error. */
export async function fetchCurrentUser(signal?: AbortSignal): Promise<UserView | null> {
  try {
    return await api.get<UserView>('/auth/me', { signal });
  } catch (err) {
    if (err instanceof ApiRequestError && err.isUnauthorized) return null;
    throw err;
  }
}

export const currentUserQueryOptions = () =>
  queryOptions({
    queryKey: currentUserKey,
    queryFn: ({ signal }) => fetchCurrentUser(signal),
    staleTime: 5 * 60_000,
  });

export function useCurrentUser() {
  return useQuery(currentUserQueryOptions());
}
