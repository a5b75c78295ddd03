import { INVITABLE_ROLES, type InvitableRole, type NotebookView } from '@cribra/contracts';
import { Alert, Box, Button, Chip, List, ListItem, ListItemText, MenuItem, Select, Typography } from '@mui/material';
import { errorMessage } from '../../../lib/api-error';
import { formatDateTime } from '../../../lib/format';
import { useInvitations } from '../api/list-invitations';
import { useMemberActions } from '../api/member-actions';
import { useRevokeInvitation } from '../api/revoke-invitation';
import { InviteForm } from './invite-form';

interface Props {
  notebook: NotebookView;
  canManage: boolean;
  onChanged: () => void;
}

export function MembersSection({ notebook, canManage, onChanged }: Props) {
  const invitations = useInvitations(notebook.id, canManage);
  const revoke = useRevokeInvitation(notebook.id);
  const members = useMemberActions(notebook.id, onChanged);
  const editable = canManage && notebook.status !== 'locked';
  const memberError = members.setRole.error ?? members.remove.error;
  return (
    <Box>
      <Typography variant="h4" component="h3" sx={{ mb: 1 }}>Members</Typography>
      {memberError && <Alert severity="error">{errorMessage(memberError)}</Alert>}
      <List dense disablePadding aria-label="Members">
        {notebook.members.map((m) => (
          <ListItem key={m.userId} disableGutters sx={{ gap: 1 }}>
            <ListItemText primary={m.displayName} secondary={m.email} sx={{ minWidth: 0 }} />
            {editable && m.role !== 'owner' ? (
              <>
                <Select size="small" value={m.role} onChange={(e) => members.setRole.mutate({ userId: m.userId, role: e.target.value as InvitableRole })}
                  inputProps={{ 'aria-label': `Role of ${m.displayName}` }}>
                  {INVITABLE_ROLES.map((r) => <MenuItem key={r} value={r}>{r}</MenuItem>)}
                </Select>
                <Button size="small" onClick={() => members.remove.mutate(m.userId)} aria-label={`Remove ${m.displayName}`}>Remove</Button>
              </>
            ) : (
              <Chip size="small" label={m.role} />
            )}
          </ListItem>
        ))}
      </List>
      {canManage && notebook.status !== 'locked' && (
        <Box sx={{ mt: 2 }}>
          <InviteForm notebookId={notebook.id} />
        </Box>
      )}
      {canManage && (
        <Box sx={{ mt: 2 }}>
          <Typography variant="h4" component="h3" sx={{ mb: 1 }}>Invitations</Typography>
          {invitations.isError && <Alert severity="error">{errorMessage(invitations.error)}</Alert>}
          {invitations.data?.length === 0 && <Typography color="text.secondary">No invitations yet.</Typography>}
          <List dense disablePadding aria-label="Invitations">
            {invitations.data?.map((inv) => (
              <ListItem
                key={inv.id}
                disableGutters
                secondaryAction={inv.status === 'pending' && (
                  <Button size="small" onClick={() => revoke.mutate(inv.id)} aria-label={`Revoke the invitation of ${inv.email}`}>Revoke</Button>
                )}
              >
                <ListItemText
                  primary={`${inv.email} · ${inv.role}`}
                  secondary={`${inv.status}${inv.status === 'pending' ? ` · mail ${inv.delivery}${inv.deliveryError ? ` (${inv.deliveryError})` : ''}` : ''} · expires ${formatDateTime(inv.expiresAt)}`}
                />
              </ListItem>
            ))}
          </List>
        </Box>
      )}
    </Box>
  );
}
