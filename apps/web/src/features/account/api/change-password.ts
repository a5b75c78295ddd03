import type { ChangePasswordBody } from '@cribra/contracts';
import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

export function changePassword(body: ChangePasswordBody): Promise<void> {
  return api.post<void>('/auth/password', body);
}

export function useChangePassword() {
  return useMutation({ mutationFn: changePassword });
}
