import type { DuplicateNotebookBody, DuplicateNotebookResponse } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { notebookKeys } from './keys';

/** A new draft you own with the same cells (no runs, members or reviews). */
export function duplicateNotebook(id: string, body: DuplicateNotebookBody = {}): Promise<DuplicateNotebookResponse> {
  return api.post<DuplicateNotebookResponse>(`/notebooks/${id}/duplicate`, body);
}

export function useDuplicateNotebook() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => duplicateNotebook(id),
    onSuccess: () => qc.invalidateQueries({ queryKey: notebookKeys.lists() }),
  });
}
