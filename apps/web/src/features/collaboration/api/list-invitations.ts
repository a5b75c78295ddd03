import type { InvitationView } from '@cribra/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { collabKeys } from './keys';

export function listInvitations(notebookId: string, signal?: AbortSignal): Promise<InvitationView[]> {
  return api.get<InvitationView[]>(`/notebooks/${notebookId}/invitations`, { signal, query: { status: 'all' } });
}

export const invitationsQueryOptions = (notebookId: string) =>
  queryOptions({ queryKey: collabKeys.invitations(notebookId), queryFn: ({ signal }) => listInvitations(notebookId, signal) });

/** Owners only; delivery states change in the background, so the list refreshes while open. */
export function useInvitations(notebookId: string, enabled: boolean) {
  return useQuery({ ...invitationsQueryOptions(notebookId), enabled, refetchInterval: 5000 });
}
