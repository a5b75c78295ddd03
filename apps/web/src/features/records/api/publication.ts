import type { PublicationView } from '@cribra/contracts';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { ApiRequestError } from '../../../lib/api-error';
import { recordKeys } from './keys';

/** The notebook's publication, or null when its record is not published. */
export async function getPublication(notebookId: string, signal?: AbortSignal): Promise<PublicationView | null> {
  try {
    return await api.get<PublicationView>(`/notebooks/${notebookId}/publication`, { signal });
  } catch (e) {
    if (e instanceof ApiRequestError && e.statusCode === 404) return null;
    throw e;
  }
}

export function usePublication(notebookId: string) {
  return useQuery({ queryKey: recordKeys.publication(notebookId), queryFn: ({ signal }) => getPublication(notebookId, signal) });
}

export function usePublishRecord(notebookId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<PublicationView>(`/notebooks/${notebookId}/publication`),
    onSuccess: (p) => qc.setQueryData(recordKeys.publication(notebookId), p),
  });
}

export function useWithdrawRecord(notebookId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (reason: string) => api.post<PublicationView>(`/notebooks/${notebookId}/publication/withdrawal`, { reason }),
    onSuccess: (p) => qc.setQueryData(recordKeys.publication(notebookId), p),
  });
}
