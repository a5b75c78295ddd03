import type { WheelLevelSummary } from '@cribra/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export const levelsKey = ['levels'] as const;

export function listLevels(signal?: AbortSignal): Promise<WheelLevelSummary[]> {
  return api.get<WheelLevelSummary[]>('/levels', { signal });
}

const busy = (levels: WheelLevelSummary[] | undefined) => !!levels?.some((l) => l.status === 'pending' || l.status === 'computing');

export const levelsQueryOptions = () =>
  queryOptions({
    queryKey: levelsKey,
    queryFn: ({ signal }) => listLevels(signal),
    // While a level is being computed its chunk count moves: poll until nothing is in progress.
    refetchInterval: (q) => (busy(q.state.data) ? 2000 : false),
  });

export function useLevels() {
  return useQuery(levelsQueryOptions());
}
