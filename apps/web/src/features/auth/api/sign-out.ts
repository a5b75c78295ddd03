import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, resetCsrfToken } from '../../../lib/api-client';
import { currentUserKey } from '../../../lib/current-user';

export function signOut(): Promise<void> {
  return api.post<void>('/auth/signout');
}

/** Signs out and drops every cached answer (they belonged to the previous user). */
export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: () => {
      resetCsrfToken();
      qc.clear();
      qc.setQueryData(currentUserKey, null);
    },
  });
}
