import type { VerificationView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { collabKeys } from './keys';

/** Queues a re-run of the locked notebook against its lock record (202; follow it with `useVerification`). */
export function startLockCheck(notebookId: string): Promise<VerificationView> {
  return api.post<VerificationView>(`/notebooks/${notebookId}/lock/checks`);
}

export function useStartLockCheck(notebookId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => startLockCheck(notebookId),
    onSuccess: (v) => {
      qc.setQueryData(collabKeys.verification(v.id), v);
      // The check is recorded in the notebook's history and its list of checks.
      void qc.invalidateQueries({ queryKey: collabKeys.audit(notebookId) });
      void qc.invalidateQueries({ queryKey: collabKeys.verifications(notebookId) });
    },
  });
}
