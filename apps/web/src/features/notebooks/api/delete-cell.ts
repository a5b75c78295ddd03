import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { notebookKeys } from './keys';

export function deleteCell(id: string, revision: number): Promise<void> {
  return api.delete<void>(`/cells/${id}?revision=${revision}`);
}

export function useDeleteCell(notebookId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, revision }: { id: string; revision: number }) => deleteCell(id, revision),
    onSettled: () => qc.invalidateQueries({ queryKey: notebookKeys.detail(notebookId) }),
  });
}
