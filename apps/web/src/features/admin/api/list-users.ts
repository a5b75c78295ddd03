import type { UserView } from '@cribra/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export const usersKey = ['admin', 'users'] as const;

export function listUsers(signal?: AbortSignal): Promise<UserView[]> {
  return api.get<UserView[]>('/admin/users', { signal });
}

export const usersQueryOptions = () => queryOptions({ queryKey: usersKey, queryFn: ({ signal }) => listUsers(signal) });

export function useUsers() {
  return useQuery(usersQueryOptions());
}
