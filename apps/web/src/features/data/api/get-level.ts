import type { WheelLevelView } from '@cribra/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export function getLevel(prime: number, signal?: AbortSignal): Promise<WheelLevelView> {
  return api.get<WheelLevelView>(`/levels/${prime}`, { signal });
}

export const levelQueryOptions = (prime: number) =>
  queryOptions({ queryKey: ['levels', prime], queryFn: ({ signal }) => getLevel(prime, signal) });

export function useLevel(prime: number | null) {
  return useQuery({ ...levelQueryOptions(prime ?? 0), enabled: prime !== null });
}
