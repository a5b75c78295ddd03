import type { UserView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { currentUserKey } from '../../../lib/current-user';

export interface UpdateProfileBody {
  displayName: string;
}

// PATCH /api/auth/me is not yet in libs/contracts/src/auth.ts; asked of the foundation (see report).
export function updateProfile(body: UpdateProfileBody): Promise<UserView> {
  return api.patch<UserView>('/auth/me', body);
}

export function useUpdateProfile() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateProfile,
    onSuccess: (user) => qc.setQueryData(currentUserKey, user),
  });
}
