import type { CellView, NotebookView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { createNotebook } from './create-notebook';
import { notebookKeys } from './keys';

/**
 * Copies a notebook: a new notebook (you own it) with the same title, summary, tags and cell
 * sources in order. Runs, members and reviews are not copied; the copy starts as a draft.
 */
export async function duplicateNotebook(id: string): Promise<NotebookView> {
  const source = await api.get<NotebookView>(`/notebooks/${id}`);
  const copy = await createNotebook({
    title: `${source.title} (copy)`.slice(0, 200),
    summary: source.summary,
    tags: source.tags,
    requiredSignoffs: source.requiredSignoffs,
  });
  for (const cell of [...source.cells].sort((a, b) => a.position - b.position)) {
    await api.post<CellView>(`/notebooks/${copy.id}/cells`, { kind: cell.kind, source: cell.source });
  }
  return api.get<NotebookView>(`/notebooks/${copy.id}`);
}

export function useDuplicateNotebook() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: duplicateNotebook,
    onSuccess: (nb) => {
      qc.setQueryData(notebookKeys.detail(nb.id), nb);
      void qc.invalidateQueries({ queryKey: notebookKeys.lists() });
    },
  });
}
