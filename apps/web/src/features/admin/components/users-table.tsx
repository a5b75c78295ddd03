import type { SiteRole, UserView } from '@cribra/contracts';
import { MenuItem, Select, Table, TableBody, TableCell, TableHead, TableRow } from '@mui/material';
import { formatDateTime } from '../../../lib/format';

interface Props {
  users: UserView[];
  currentUserId: string;
  pendingId?: string;
  onRoleChange: (id: string, role: SiteRole) => void;
}

const roles: SiteRole[] = ['member', 'admin'];

export function UsersTable({ users, currentUserId, pendingId, onRoleChange }: Props) {
  return (
    <Table size="small" aria-label="Users">
      <TableHead>
        <TableRow>
          <TableCell>Display name</TableCell>
          <TableCell>E-mail</TableCell>
          <TableCell>Joined</TableCell>
          <TableCell sx={{ width: 160 }}>Site role</TableCell>
        </TableRow>
      </TableHead>
      <TableBody>
        {users.map((u) => (
          <TableRow key={u.id} hover>
            <TableCell>{u.displayName}{u.id === currentUserId && ' (you)'}</TableCell>
            <TableCell className="mono">{u.email}</TableCell>
            <TableCell>{formatDateTime(u.createdAt)}</TableCell>
            <TableCell>
              <Select
                value={u.siteRole}
                onChange={(e) => onRoleChange(u.id, e.target.value as SiteRole)}
                disabled={pendingId === u.id}
                inputProps={{ 'aria-label': `Site role of ${u.displayName}` }}
                fullWidth
              >
                {roles.map((r) => <MenuItem key={r} value={r}>{r}</MenuItem>)}
              </Select>
            </TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}
