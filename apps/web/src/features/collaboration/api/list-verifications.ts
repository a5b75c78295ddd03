import type { VerificationSummary } from '@cribra/contracts';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { collabKeys } from './keys';

/** The notebook's re-verifications and lock re-checks, newest first. */
export function listVerifications(notebookId: string, signal?: AbortSignal): Promise<VerificationSummary[]> {
  return api.get<VerificationSummary[]>(`/notebooks/${notebookId}/verifications`, { signal });
}

export function useVerifications(notebookId: string, enabled = true) {
  return useQuery({
    queryKey: collabKeys.verifications(notebookId),
    queryFn: ({ signal }) => listVerifications(notebookId, signal),
    enabled,
  });
}
