import type { InvitationPreview } from '@cribra/contracts';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export function getInvitationPreview(token: string, signal?: AbortSignal): Promise<InvitationPreview> {
  return api.get<InvitationPreview>(`/invitations/token/${encodeURIComponent(token)}`, { signal });
}

export const invitationPreviewQueryOptions = (token: string) =>
  queryOptions({ queryKey: ['invitations', 'token', token], queryFn: ({ signal }) => getInvitationPreview(token, signal) });

/** What the invitation is for; works signed out (404 unknown, 410 used, revoked or expired). */
export function useInvitationPreview(token: string) {
  return useQuery(invitationPreviewQueryOptions(token));
}
