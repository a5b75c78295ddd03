import type { CellView, ReorderCellsBody } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { notebookKeys } from './keys';

export function reorderCells(notebookId: string, body: ReorderCellsBody): Promise<CellView[]> {
  return api.put<CellView[]>(`/notebooks/${notebookId}/cells/order`, body);
}

/** Moves cells; the notebook revision changes, so the notebook is fetched again afterwards. */
export function useReorderCells(notebookId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: ReorderCellsBody) => reorderCells(notebookId, body),
    onSettled: () => qc.invalidateQueries({ queryKey: notebookKeys.detail(notebookId) }),
  });
}
