import type { UserView } from '@cribra/contracts';
import { Alert, Button, Stack, TextField } from '@mui/material';
import { type FormEvent, useState } from 'react';
import { errorMessage } from '../../../lib/api-error';
import { requiredProblem } from '../../../lib/validation';
import { useUpdateProfile } from '../api/update-profile';

export function ProfileForm({ user }: { user: UserView }) {
  const [displayName, setDisplayName] = useState(user.displayName);
  const [problem, setProblem] = useState<string | undefined>();
  const update = useUpdateProfile();
  const unchanged = displayName.trim() === user.displayName;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const found = requiredProblem(displayName, 'a display name');
    setProblem(found);
    if (!found) update.mutate({ displayName: displayName.trim() });
  };

  return (
    <Stack component="form" noValidate onSubmit={submit} spacing={2} aria-label="Profile">
      <TextField label="E-mail" value={user.email} helperText="Your sign-in address." slotProps={{ htmlInput: { readOnly: true } }} />
      <TextField label="Display name" value={displayName} onChange={(e) => setDisplayName(e.target.value)}
        error={!!problem} helperText={problem ?? 'Shown beside your cells, comments and sign-offs.'} />
      {update.isSuccess && unchanged && <Alert severity="success" role="status">Display name saved.</Alert>}
      {update.isError && <Alert severity="error">{errorMessage(update.error)}</Alert>}
      <div>
        <Button type="submit" variant="contained" disabled={unchanged || update.isPending}>Save display name</Button>
      </div>
    </Stack>
  );
}
