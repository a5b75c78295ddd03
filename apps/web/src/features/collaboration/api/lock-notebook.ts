import type { LockRecord } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { collabKeys } from './keys';

export function lockNotebook(notebookId: string): Promise<LockRecord> {
  return api.post<LockRecord>(`/notebooks/${notebookId}/lock`);
}

export function useLockNotebook(notebookId: string, onChanged: () => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => lockNotebook(notebookId),
    onSuccess: (record) => {
      qc.setQueryData(collabKeys.lock(notebookId), record);
      void qc.invalidateQueries({ queryKey: collabKeys.review(notebookId) });
      onChanged();
    },
  });
}
