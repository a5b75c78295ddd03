import type { CreateInvitationBody, InvitationView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { collabKeys } from './keys';

export function createInvitation(notebookId: string, body: CreateInvitationBody): Promise<InvitationView> {
  return api.post<InvitationView>(`/notebooks/${notebookId}/invitations`, body);
}

export function useCreateInvitation(notebookId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateInvitationBody) => createInvitation(notebookId, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: collabKeys.invitations(notebookId) }),
  });
}
