import type { NotebookListQuery, NotebookSummary, Page } from '@cribra/contracts';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { notebookKeys } from './keys';

export function listNotebooks(q: NotebookListQuery, signal?: AbortSignal): Promise<Page<NotebookSummary>> {
  return api.get<Page<NotebookSummary>>('/notebooks', { signal, query: { ...q } });
}

export const notebooksQueryOptions = (q: NotebookListQuery) =>
  queryOptions({
    queryKey: notebookKeys.list(q),
    queryFn: ({ signal }) => listNotebooks(q, signal),
    placeholderData: keepPreviousData,
  });

export function useNotebooks(q: NotebookListQuery) {
  return useQuery(notebooksQueryOptions(q));
}
