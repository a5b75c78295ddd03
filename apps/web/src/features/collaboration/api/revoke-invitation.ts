import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { collabKeys } from './keys';

export function revokeInvitation(id: string): Promise<void> {
  return api.delete<void>(`/invitations/${id}`);
}

export function useRevokeInvitation(notebookId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: revokeInvitation,
    onSettled: () => qc.invalidateQueries({ queryKey: collabKeys.invitations(notebookId) }),
  });
}
