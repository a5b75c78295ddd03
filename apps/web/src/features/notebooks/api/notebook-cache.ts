import type { CellView, NotebookView, RunView } from '@cribra/contracts';
import type { QueryClient } from '@tanstack/react-query';
import { notebookKeys } from './keys';

/** Rewrites the cached notebook's cells (kept sorted by position). */
export function updateCachedCells(qc: QueryClient, notebookId: string, fn: (cells: CellView[]) => CellView[]): void {
  qc.setQueryData<NotebookView>(notebookKeys.detail(notebookId), (nb) =>
    nb ? { ...nb, cells: fn(nb.cells).sort((a, b) => a.position - b.position), cellCount: fn(nb.cells).length } : nb,
  );
}

/** Puts one cell (new or changed) into the cached notebook. */
export function putCachedCell(qc: QueryClient, cell: CellView): void {
  updateCachedCells(qc, cell.notebookId, (cells) =>
    cells.some((c) => c.id === cell.id) ? cells.map((c) => (c.id === cell.id ? cell : c)) : [...cells, cell],
  );
}

/** Sets a run as its cell's latest run, unless the cache holds a newer one. */
export function putCachedRun(qc: QueryClient, run: RunView): void {
  updateCachedCells(qc, run.notebookId, (cells) =>
    cells.map((c) => {
      if (c.id !== run.cellId) return c;
      const current = c.latestRun;
      if (current && current.id !== run.id && current.queuedAt > run.queuedAt) return c;
      return { ...c, latestRun: run };
    }),
  );
}
