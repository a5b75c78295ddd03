import type { ComputationView, LedgerComputationBody } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { ledgerKey } from './list-ledger-blocks';

export function requestLedger(body: LedgerComputationBody): Promise<ComputationView> {
  return api.post<ComputationView>('/ledger/computations', body);
}

export function useRequestLedger() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: requestLedger, onSuccess: () => qc.invalidateQueries({ queryKey: ledgerKey }) });
}
