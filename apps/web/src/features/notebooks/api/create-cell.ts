import type { CellView, CreateCellBody } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { notebookKeys } from './keys';

export function createCell(notebookId: string, body: CreateCellBody): Promise<CellView> {
  return api.post<CellView>(`/notebooks/${notebookId}/cells`, body);
}

/** Adds a cell; positions of later cells shift, so the notebook is fetched again. */
export function useCreateCell(notebookId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateCellBody) => createCell(notebookId, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: notebookKeys.detail(notebookId) }),
  });
}
