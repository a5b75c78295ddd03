import type { VerificationView } from '@cribra/contracts';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { api } from '../../../lib/api-client';
import { collabKeys } from './keys';

export function getVerification(id: string, signal?: AbortSignal): Promise<VerificationView> {
  return api.get<VerificationView>(`/verifications/${id}`, { signal });
}

/** A re-verify, polled every second until it is done; then the review state is refreshed. */
export function useVerification(id: string | null | undefined, notebookId: string) {
  const qc = useQueryClient();
  const q = useQuery({
    queryKey: collabKeys.verification(id ?? ''),
    queryFn: ({ signal }) => getVerification(id!, signal),
    enabled: !!id,
    refetchInterval: (query) => (query.state.data?.status === 'done' ? false : 1000),
  });
  const done = q.data?.status === 'done';
  useEffect(() => {
    if (!done) return;
    void qc.invalidateQueries({ queryKey: collabKeys.review(notebookId) });
    void qc.invalidateQueries({ queryKey: collabKeys.verifications(notebookId) });
  }, [done, notebookId, qc]);
  return q;
}
