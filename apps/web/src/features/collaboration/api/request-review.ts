import type { RequestReviewBody, ReviewStateView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { collabKeys } from './keys';

export function requestReview(notebookId: string, body: RequestReviewBody): Promise<ReviewStateView> {
  return api.post<ReviewStateView>(`/notebooks/${notebookId}/review/request`, body);
}

export function useRequestReview(notebookId: string, onChanged: () => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: RequestReviewBody) => requestReview(notebookId, body),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: collabKeys.review(notebookId) });
      onChanged();
    },
  });
}
