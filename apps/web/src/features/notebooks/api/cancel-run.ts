import type { RunView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { putCachedRun } from './notebook-cache';

export function cancelRun(runId: string): Promise<RunView> {
  return api.post<RunView>(`/runs/${runId}/cancel`);
}

export function useCancelRun() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: cancelRun, onSuccess: (run) => putCachedRun(qc, run) });
}
