import type { PublishedRecordView } from '@cribra/contracts';
import { useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { ApiRequestError } from '../../../lib/api-error';
import { recordKeys } from './keys';

export function getRecord(id: string, signal?: AbortSignal): Promise<PublishedRecordView> {
  return api.get<PublishedRecordView>(`/records/${encodeURIComponent(id)}`, { signal });
}

/** A published record (public: works signed out). A 404 is final, not retried. */
export function useRecord(id: string) {
  return useQuery({
    queryKey: recordKeys.record(id),
    queryFn: ({ signal }) => getRecord(id, signal),
    retry: (n, e) => !(e instanceof ApiRequestError && e.statusCode === 404) && n < 2,
  });
}
