import type { ReviewView } from '@cribra/contracts';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { collabKeys } from './keys';

export function listReviews(notebookId: string, signal?: AbortSignal): Promise<ReviewView[]> {
  return api.get<ReviewView[]>(`/notebooks/${notebookId}/reviews`, { signal });
}

export function useReviews(notebookId: string) {
  return useQuery({ queryKey: collabKeys.reviews(notebookId), queryFn: ({ signal }) => listReviews(notebookId, signal) });
}
