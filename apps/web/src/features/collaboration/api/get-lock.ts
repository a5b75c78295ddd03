import type { LockRecord } from '@cribra/contracts';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { collabKeys } from './keys';

export function getLock(notebookId: string, signal?: AbortSignal): Promise<LockRecord> {
  return api.get<LockRecord>(`/notebooks/${notebookId}/lock`, { signal });
}

/** The lock record of a locked notebook. */
export function useLockRecord(notebookId: string, locked: boolean) {
  return useQuery({ queryKey: collabKeys.lock(notebookId), queryFn: ({ signal }) => getLock(notebookId, signal), enabled: locked });
}
