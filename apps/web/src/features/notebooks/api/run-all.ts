import type { RunAllResponse } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { putCachedRun } from './notebook-cache';

export function runAll(notebookId: string): Promise<RunAllResponse> {
  return api.post<RunAllResponse>(`/notebooks/${notebookId}/runs`);
}

export function useRunAll(notebookId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => runAll(notebookId),
    onSuccess: ({ runs }) => runs.forEach((r) => putCachedRun(qc, r)),
  });
}
