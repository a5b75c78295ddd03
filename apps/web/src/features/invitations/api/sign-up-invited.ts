import type { SignUpBody, UserView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, resetCsrfToken } from '../../../lib/api-client';
import { currentUserKey } from '../../../lib/current-user';

/** Sign-up with the invitation token: the new account joins the notebook at once. */
export function signUpInvited(body: SignUpBody & { invitationToken: string }): Promise<UserView> {
  return api.post<UserView>('/auth/signup', body);
}

export function useSignUpInvited() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: signUpInvited,
    onSuccess: (user) => {
      resetCsrfToken();
      qc.setQueryData(currentUserKey, user);
    },
  });
}
