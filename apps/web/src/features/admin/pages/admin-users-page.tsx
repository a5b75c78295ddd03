import { Alert, Paper, TextField } from '@mui/material';
import { useMemo, useState } from 'react';
import { EmptyState } from '../../../components/empty-state';
import { ErrorState } from '../../../components/error-state';
import { LoadingState } from '../../../components/loading-state';
import { PageHeader } from '../../../components/page-header';
import { useDocumentTitle } from '../../../hooks/use-document-title';
import { errorMessage } from '../../../lib/api-error';
import { useCurrentUser } from '../../../lib/current-user';
import { useUsers } from '../api/list-users';
import { useUpdateUserRole } from '../api/update-user-role';
import { UsersTable } from '../components/users-table';

export default function AdminUsersPage() {
  useDocumentTitle('Users');
  const me = useCurrentUser();
  const users = useUsers();
  const update = useUpdateUserRole();
  const [filter, setFilter] = useState('');
  const shown = useMemo(() => {
    const f = filter.trim().toLowerCase();
    return (users.data ?? []).filter((u) => !f || u.email.toLowerCase().includes(f) || u.displayName.toLowerCase().includes(f));
  }, [users.data, filter]);

  return (
    <>
      <PageHeader
        title="Users"
        subtitle="Site administrators manage accounts and site roles. Notebook roles are set inside each notebook."
        actions={<TextField label="Filter by name or e-mail" value={filter} onChange={(e) => setFilter(e.target.value)} sx={{ width: 280 }} />}
      />
      {update.isError && <Alert severity="error" sx={{ mb: 2 }}>Role not changed: {errorMessage(update.error)}</Alert>}
      {users.isPending && <LoadingState label="Loading users…" />}
      {users.isError && <ErrorState error={users.error} title="Could not load users" onRetry={() => users.refetch()} />}
      {users.isSuccess && shown.length === 0 && (
        <EmptyState title={filter ? 'No user matches this filter' : 'No users yet'} />
      )}
      {users.isSuccess && shown.length > 0 && (
        <Paper sx={{ overflowX: 'auto' }}>
          <UsersTable
            users={shown}
            currentUserId={me.data?.id ?? ''}
            pendingId={update.isPending ? update.variables?.id : undefined}
            onRoleChange={(id, siteRole) => update.mutate({ id, siteRole })}
          />
        </Paper>
      )}
    </>
  );
}
