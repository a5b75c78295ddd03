import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { uploadsKey } from './list-uploads';

export function deleteUpload(id: string): Promise<void> {
  return api.delete<void>(`/uploads/${id}`);
}

export function useDeleteUpload(notebookId: string) {
  const qc = useQueryClient();
  return useMutation({ mutationFn: deleteUpload, onSettled: () => qc.invalidateQueries({ queryKey: uploadsKey(notebookId) }) });
}
