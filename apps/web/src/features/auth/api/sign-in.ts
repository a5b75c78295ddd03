import type { SignInBody, UserView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, resetCsrfToken } from '../../../lib/api-client';
import { currentUserKey } from '../../../lib/current-user';

export function signIn(body: SignInBody): Promise<UserView> {
  return api.post<UserView>('/auth/signin', body);
}

/** Signs in; the session id changes at sign-in, so the CSRF token is fetched afresh afterwards. */
export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (user) => {
      resetCsrfToken();
      qc.setQueryData(currentUserKey, user);
    },
  });
}
