import type { NotebookView } from '@cribra/contracts';
import { Alert, Box, Button, Chip, List, ListItem, ListItemText, Typography } from '@mui/material';
import { errorMessage } from '../../../lib/api-error';
import { formatDateTime } from '../../../lib/format';
import { useInvitations } from '../api/list-invitations';
import { useRevokeInvitation } from '../api/revoke-invitation';
import { InviteForm } from './invite-form';

export function MembersSection({ notebook, canManage }: { notebook: NotebookView; canManage: boolean }) {
  const invitations = useInvitations(notebook.id, canManage);
  const revoke = useRevokeInvitation(notebook.id);
  return (
    <Box>
      <Typography variant="h4" component="h3" sx={{ mb: 1 }}>Members</Typography>
      <List dense disablePadding aria-label="Members">
        {notebook.members.map((m) => (
          <ListItem key={m.userId} disableGutters secondaryAction={<Chip size="small" label={m.role} />}>
            <ListItemText primary={m.displayName} secondary={m.email} />
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
