import type { UploadParseDetails, UploadView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '../../../lib/api-client';
import { ApiRequestError } from '../../../lib/api-error';
import { uploadsKey } from './list-uploads';

export function createUpload(notebookId: string, file: File, name?: string): Promise<UploadView> {
  const form = new FormData();
  form.append('file', file);
  if (name) form.append('name', name);
  return apiRequest<UploadView>(`/notebooks/${notebookId}/uploads`, { method: 'POST', body: form });
}

/** The per-line problems of a refused upload (400), or null for any other error. */
export function uploadProblems(err: unknown): UploadParseDetails | null {
  if (!(err instanceof ApiRequestError) || err.statusCode !== 400) return null;
  const d = err.details as UploadParseDetails | undefined;
  return d && Array.isArray(d.errors) ? d : null;
}

export function useCreateUpload(notebookId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ file, name }: { file: File; name?: string }) => createUpload(notebookId, file, name),
    onSuccess: () => qc.invalidateQueries({ queryKey: uploadsKey(notebookId) }),
  });
}
