import type { ComputationView, LedgerComputationBody } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { ledgerKey } from './list-ledger-blocks';

export function requestLedger(body: LedgerComputationBody): Promise<ComputationView> {
  return api.post<ComputationView>('/ledger/computations', body);
}

export function useRequestLedger() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: requestLedger,
    // The new computation joins the followed list (which then polls while it runs).
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: ledgerKey }), qc.invalidateQueries({ queryKey: ['computations'] })]),
  });
}
