import type { AcceptInvitationResponse } from '@cribra/contracts';
import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export function acceptInvitation(token: string): Promise<AcceptInvitationResponse> {
  return api.post<AcceptInvitationResponse>('/invitations/accept', { token });
}

export function useAcceptInvitation() {
  return useMutation({ mutationFn: acceptInvitation });
}
