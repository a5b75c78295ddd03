import type { UpdateProfileBody, UserView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { currentUserKey } from '../../../lib/current-user';

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
