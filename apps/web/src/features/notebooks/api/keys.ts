import type { NotebookListQuery } from '@cribra/contracts';

/** Query keys of the notebooks feature, one factory so invalidation stays consistent. */
export const notebookKeys = {
  all: ['notebooks'] as const,
  lists: () => [...notebookKeys.all, 'list'] as const,
  list: (q: NotebookListQuery) => [...notebookKeys.lists(), q] as const,
  detail: (id: string) => [...notebookKeys.all, 'detail', id] as const,
  cellRuns: (cellId: string) => ['cells', cellId, 'runs'] as const,
  run: (runId: string) => ['runs', runId] as const,
};
