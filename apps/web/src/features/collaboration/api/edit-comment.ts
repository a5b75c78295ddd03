import type { CommentThreadView, CommentView, UpdateCommentBody } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { collabKeys } from './keys';

/** PATCH /api/comments/:id — the author edits their comment (text and mentions). */
export const editComment = (commentId: string, body: UpdateCommentBody) => api.patch<CommentView>(`/comments/${commentId}`, body);

/** One comment's edit; on success the edited comment replaces the old one in the thread list, which is then refreshed. */
export function useEditComment(notebookId: string, commentId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateCommentBody) => editComment(commentId, body),
    onSuccess: (edited) => {
      qc.setQueryData(collabKeys.threads(notebookId), (threads: CommentThreadView[] | undefined) =>
        threads?.map((t) => (t.id === edited.threadId ? { ...t, comments: t.comments.map((c) => (c.id === edited.id ? edited : c)) } : t)),
      );
      void qc.invalidateQueries({ queryKey: collabKeys.threads(notebookId) });
    },
  });
}
