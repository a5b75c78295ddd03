import type { ComputationView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { levelsKey } from './list-levels';

export function requestLevel(prime: number): Promise<ComputationView> {
  return api.post<ComputationView>(`/levels/${prime}/computations`);
}

export function useRequestLevel() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: requestLevel,
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: levelsKey }), qc.invalidateQueries({ queryKey: ['computations'] })]),
  });
}
