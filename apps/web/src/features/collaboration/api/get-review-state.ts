import type { ReviewStateView } from '@cribra/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { collabKeys } from './keys';

export function getReviewState(notebookId: string, signal?: AbortSignal): Promise<ReviewStateView> {
  return api.get<ReviewStateView>(`/notebooks/${notebookId}/review`, { signal });
}

// The notebook revision is part of the key so that an edit (a new revision) refreshes the state.
export const reviewStateQueryOptions = (notebookId: string, revision: number) =>
  queryOptions({
    queryKey: [...collabKeys.review(notebookId), revision] as const,
    queryFn: ({ signal }) => getReviewState(notebookId, signal),
  });

export function useReviewState(notebookId: string, revision: number) {
  return useQuery(reviewStateQueryOptions(notebookId, revision));
}
