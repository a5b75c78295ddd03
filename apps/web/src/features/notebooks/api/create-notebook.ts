import type { CreateNotebookBody, NotebookView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { notebookKeys } from './keys';

export function createNotebook(body: CreateNotebookBody): Promise<NotebookView> {
  return api.post<NotebookView>('/notebooks', body);
}

export function useCreateNotebook() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createNotebook,
    onSuccess: (nb) => {
      qc.setQueryData(notebookKeys.detail(nb.id), nb);
      void qc.invalidateQueries({ queryKey: notebookKeys.lists() });
    },
  });
}
