import type { Page, RunView } from '@cribra/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { notebookKeys } from './keys';

export function listCellRuns(cellId: string, signal?: AbortSignal): Promise<Page<RunView>> {
  return api.get<Page<RunView>>(`/cells/${cellId}/runs`, { signal, query: { page: 1, pageSize: 20 } });
}

export const cellRunsQueryOptions = (cellId: string) =>
  queryOptions({ queryKey: notebookKeys.cellRuns(cellId), queryFn: ({ signal }) => listCellRuns(cellId, signal) });

/** Run history of one cell, newest first; fetched only when the history is opened. */
export function useCellRuns(cellId: string, enabled: boolean) {
  return useQuery({ ...cellRunsQueryOptions(cellId), enabled });
}
