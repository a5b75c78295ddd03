import type { ComputationView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { ledgerKey } from './list-ledger-blocks';
import { levelsKey } from './list-levels';

export function cancelComputation(id: string): Promise<ComputationView> {
  return api.post<ComputationView>(`/computations/${id}/cancel`, {});
}

export function useCancelComputation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: cancelComputation,
    onSettled: () => {
      void qc.invalidateQueries({ queryKey: ['computations'] });
      void qc.invalidateQueries({ queryKey: levelsKey });
      void qc.invalidateQueries({ queryKey: ledgerKey });
    },
  });
}
