import type { CommentThreadView, CommentView, CreateCommentBody, CreateThreadBody } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { collabKeys } from './keys';

export const createThread = (notebookId: string, body: CreateThreadBody) => api.post<CommentThreadView>(`/notebooks/${notebookId}/threads`, body);
export const addComment = (threadId: string, body: CreateCommentBody) => api.post<CommentView>(`/threads/${threadId}/comments`, body);
export const setThreadResolved = (threadId: string, resolved: boolean) =>
  api.post<CommentThreadView>(`/threads/${threadId}/${resolved ? 'resolve' : 'reopen'}`);

/** The comment mutations of one notebook; each refreshes its thread list. */
export function useCommentActions(notebookId: string) {
  const qc = useQueryClient();
  const refresh = () => qc.invalidateQueries({ queryKey: collabKeys.threads(notebookId) });
  return {
    createThread: useMutation({ mutationFn: (b: CreateThreadBody) => createThread(notebookId, b), onSuccess: refresh }),
    addComment: useMutation({ mutationFn: ({ threadId, ...body }: CreateCommentBody & { threadId: string }) => addComment(threadId, body), onSuccess: refresh }),
    resolve: useMutation({ mutationFn: ({ threadId, resolved }: { threadId: string; resolved: boolean }) => setThreadResolved(threadId, resolved), onSuccess: refresh }),
  };
}
