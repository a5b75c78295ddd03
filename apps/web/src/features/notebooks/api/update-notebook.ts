import type { NotebookView, UpdateNotebookBody } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { notebookKeys } from './keys';

export function updateNotebook(id: string, body: UpdateNotebookBody): Promise<NotebookView> {
  return api.patch<NotebookView>(`/notebooks/${id}`, body);
}

export function useUpdateNotebook(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateNotebookBody) => updateNotebook(id, body),
    onSuccess: (nb) => {
      qc.setQueryData(notebookKeys.detail(id), nb);
      void qc.invalidateQueries({ queryKey: notebookKeys.lists() });
    },
  });
}
