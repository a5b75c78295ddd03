import type { CreateReviewBody, ReviewView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { collabKeys } from './keys';

export function createReview(notebookId: string, body: CreateReviewBody): Promise<ReviewView> {
  return api.post<ReviewView>(`/notebooks/${notebookId}/reviews`, body);
}

/** A reviewer signs off (bound to the revision digest and a clean re-verify) or asks for changes. */
export function useCreateReview(notebookId: string, onChanged: () => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateReviewBody) => createReview(notebookId, body),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: collabKeys.review(notebookId) });
      void qc.invalidateQueries({ queryKey: collabKeys.reviews(notebookId) });
      onChanged();
    },
  });
}
