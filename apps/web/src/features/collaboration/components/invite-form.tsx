import { INVITABLE_ROLES, type InvitableRole } from '@cribra/contracts';
import { Alert, Button, MenuItem, Stack, TextField } from '@mui/material';
import { type FormEvent, useState } from 'react';
import { errorMessage } from '../../../lib/api-error';
import { emailProblem } from '../../../lib/validation';
import { useCreateInvitation } from '../api/create-invitation';

export function InviteForm({ notebookId }: { notebookId: string }) {
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<InvitableRole>('reviewer');
  const [message, setMessage] = useState('');
  const [problem, setProblem] = useState<string>();
  const invite = useCreateInvitation(notebookId);

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const found = emailProblem(email);
    setProblem(found);
    if (found) return;
    invite.mutate(
      { email: email.trim(), role, message: message.trim() || undefined },
      { onSuccess: () => { setEmail(''); setMessage(''); } },
    );
  };

  return (
    <Stack component="form" spacing={1.5} noValidate onSubmit={submit} aria-label="New invitation">
      {invite.isError && <Alert severity="error">{errorMessage(invite.error)}</Alert>}
      {invite.isSuccess && <Alert severity="success" role="status">Invitation sent to {invite.data.email}.</Alert>}
      <TextField label="Invite by e-mail" type="email" value={email} onChange={(e) => setEmail(e.target.value)} error={!!problem} helperText={problem} />
      <TextField select label="Role" value={role} onChange={(e) => setRole(e.target.value as InvitableRole)}>
        {INVITABLE_ROLES.map((r) => <MenuItem key={r} value={r}>{r}</MenuItem>)}
      </TextField>
      <TextField label="Personal note (optional)" value={message} onChange={(e) => setMessage(e.target.value)} multiline minRows={2} />
      <Button type="submit" variant="contained" disabled={invite.isPending}>Send invitation</Button>
    </Stack>
  );
}
