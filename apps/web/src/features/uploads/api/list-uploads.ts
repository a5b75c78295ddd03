import type { UploadView } from '@cribra/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export const uploadsKey = (notebookId: string) => ['notebooks', notebookId, 'uploads'] as const;

export function listUploads(notebookId: string, signal?: AbortSignal): Promise<UploadView[]> {
  return api.get<UploadView[]>(`/notebooks/${notebookId}/uploads`, { signal });
}

export const uploadsQueryOptions = (notebookId: string) =>
  queryOptions({ queryKey: uploadsKey(notebookId), queryFn: ({ signal }) => listUploads(notebookId, signal) });

export function useUploads(notebookId: string) {
  return useQuery(uploadsQueryOptions(notebookId));
}
