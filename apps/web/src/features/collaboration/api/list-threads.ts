import type { CommentThreadView } from '@cribra/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { collabKeys } from './keys';

export function listThreads(notebookId: string, signal?: AbortSignal): Promise<CommentThreadView[]> {
  return api.get<CommentThreadView[]>(`/notebooks/${notebookId}/threads`, { signal });
}

export const threadsQueryOptions = (notebookId: string) =>
  queryOptions({ queryKey: collabKeys.threads(notebookId), queryFn: ({ signal }) => listThreads(notebookId, signal) });

export function useThreads(notebookId: string) {
  return useQuery(threadsQueryOptions(notebookId));
}
