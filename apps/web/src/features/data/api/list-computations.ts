import { ACTIVE_COMPUTATION_STATUSES, type ComputationKind, type ComputationView } from '@cribra/contracts';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export const computationsKey = (kind: ComputationKind) => ['computations', kind] as const;

export function listComputations(kind: ComputationKind, signal?: AbortSignal): Promise<ComputationView[]> {
  return api.get<ComputationView[]>('/computations', { signal, query: { kind } });
}

export const isActive = (c: ComputationView) => ACTIVE_COMPUTATION_STATUSES.includes(c.status);

/** Recent computations of one kind, polled every second while one of them is queued or running. */
export function useComputations(kind: ComputationKind) {
  return useQuery({
    queryKey: computationsKey(kind),
    queryFn: ({ signal }) => listComputations(kind, signal),
    refetchInterval: (q) => (q.state.data?.some(isActive) ? 1000 : false),
  });
}
