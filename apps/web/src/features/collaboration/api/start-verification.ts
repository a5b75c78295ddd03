import type { VerificationView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { collabKeys } from './keys';

export function startVerification(notebookId: string): Promise<VerificationView> {
  return api.post<VerificationView>(`/notebooks/${notebookId}/verifications`);
}

/** Re-verify: re-run every cell from source and compare output digests. */
export function useStartVerification(notebookId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => startVerification(notebookId),
    onSuccess: (v) => {
      qc.setQueryData(collabKeys.verification(v.id), v);
      void qc.invalidateQueries({ queryKey: collabKeys.review(notebookId) });
    },
  });
}
