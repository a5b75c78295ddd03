import type { InvitableRole, MemberView } from '@cribra/contracts';
import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export const updateMemberRole = (notebookId: string, userId: string, role: InvitableRole) =>
  api.patch<MemberView>(`/notebooks/${notebookId}/members/${userId}`, { role });
export const removeMember = (notebookId: string, userId: string) => api.delete<void>(`/notebooks/${notebookId}/members/${userId}`);

/** Owner's changes to the member list; the notebook (which carries the members) is refreshed after each. */
export function useMemberActions(notebookId: string, onChanged: () => void) {
  return {
    setRole: useMutation({
      mutationFn: ({ userId, role }: { userId: string; role: InvitableRole }) => updateMemberRole(notebookId, userId, role),
      onSuccess: onChanged,
    }),
    remove: useMutation({ mutationFn: (userId: string) => removeMember(notebookId, userId), onSuccess: onChanged }),
  };
}
