import type { LockedNotebookDetails, NotebookSummary, NotebookView, StaleNotebookDetails, UpdateNotebookBody } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { ApiRequestError } from '../../../lib/api-error';
import { notebookKeys } from './keys';

export function updateNotebook(id: string, body: UpdateNotebookBody): Promise<NotebookView> {
  return api.patch<NotebookView>(`/notebooks/${id}`, body);
}

/** The current notebook when an edit was refused as stale (409), else null. */
export function staleNotebook(err: unknown): NotebookSummary | null {
  if (!(err instanceof ApiRequestError) || err.statusCode !== 409) return null;
  const d = err.details as StaleNotebookDetails | undefined;
  return d?.reason === 'stale_revision' && d.current ? d.current : null;
}

/** True when an edit was refused because the notebook is locked (409 notebook_locked). */
export function lockedNotebook(err: unknown): boolean {
  return err instanceof ApiRequestError && err.statusCode === 409 && (err.details as LockedNotebookDetails | undefined)?.reason === 'notebook_locked';
}

export function useUpdateNotebook(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateNotebookBody) => updateNotebook(id, body),
    onSuccess: (nb) => {
      qc.setQueryData(notebookKeys.detail(id), nb);
      void qc.invalidateQueries({ queryKey: notebookKeys.lists() });
    },
    onError: (err) => {
      // Someone else changed the notebook: show the page their version (the dialog keeps the input).
      if (staleNotebook(err) || lockedNotebook(err)) void qc.invalidateQueries({ queryKey: notebookKeys.detail(id) });
    },
  });
}
