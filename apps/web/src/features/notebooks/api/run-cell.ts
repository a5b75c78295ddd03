import type { RunView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { putCachedRun } from './notebook-cache';

export function runCell(cellId: string): Promise<RunView> {
  return api.post<RunView>(`/cells/${cellId}/runs`);
}

export function useRunCell() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: runCell, onSuccess: (run) => putCachedRun(qc, run) });
}
