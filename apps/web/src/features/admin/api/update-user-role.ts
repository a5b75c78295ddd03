import type { SiteRole, UserView } from '@cribra/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { usersKey } from './list-users';

export interface UpdateUserRoleInput {
  id: string;
  siteRole: SiteRole;
}

export function updateUserRole({ id, siteRole }: UpdateUserRoleInput): Promise<UserView> {
  return api.patch<UserView>(`/admin/users/${encodeURIComponent(id)}`, { siteRole });
}

export function useUpdateUserRole() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateUserRole,
    onSuccess: (user) => {
      qc.setQueryData<UserView[]>(usersKey, (list) => list?.map((u) => (u.id === user.id ? user : u)));
    },
  });
}
