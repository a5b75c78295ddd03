import type { SignUpBody, UserView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, resetCsrfToken } from '../../../lib/api-client';
import { currentUserKey } from '../../../lib/current-user';

export function signUp(body: SignUpBody): Promise<UserView> {
  return api.post<UserView>('/auth/signup', body);
}

/** Creates an account; the API signs the new user in, so the current user is set from the answer. */
export function useSignUp() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: (user) => {
      resetCsrfToken();
      qc.setQueryData(currentUserKey, user);
    },
  });
}
