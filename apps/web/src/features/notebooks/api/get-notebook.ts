import type { NotebookView } from '@cribra/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { notebookKeys } from './keys';

export function getNotebook(id: string, signal?: AbortSignal): Promise<NotebookView> {
  return api.get<NotebookView>(`/notebooks/${encodeURIComponent(id)}`, { signal });
}

export const notebookQueryOptions = (id: string) =>
  queryOptions({ queryKey: notebookKeys.detail(id), queryFn: ({ signal }) => getNotebook(id, signal) });

export function useNotebook(id: string) {
  return useQuery(notebookQueryOptions(id));
}
