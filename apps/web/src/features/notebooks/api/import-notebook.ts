import type { NotebookImportDetails, NotebookView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { ApiRequestError } from '../../../lib/api-error';
import { notebookKeys } from './keys';

/** POST /api/notebooks/import: a new notebook from a `.sift` notebook file. */
export function importNotebook(file: File): Promise<NotebookView> {
  const form = new FormData();
  form.append('file', file);
  return apiRequest<NotebookView>('/notebooks/import', { method: 'POST', body: form });
}

/** The per-line problems of a refused notebook file (400), or null for any other error. */
export function importProblems(err: unknown): NotebookImportDetails | null {
  if (!(err instanceof ApiRequestError) || err.statusCode !== 400) return null;
  const d = err.details as NotebookImportDetails | undefined;
  return d && Array.isArray(d.errors) ? d : null;
}

export function useImportNotebook() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: importNotebook,
    onSuccess: (nb) => {
      qc.setQueryData(notebookKeys.detail(nb.id), nb);
      void qc.invalidateQueries({ queryKey: notebookKeys.lists() });
    },
  });
}
