import { Alert, Button, Link, Stack, TextField } from '@mui/material';
import { type FormEvent, useState } from 'react';
import { Link as RouterLink } from 'react-router-dom';
import { errorMessage } from '../../../lib/api-error';
import { newPasswordProblem } from '../../../lib/validation';
import { useConfirmReset } from '../api/confirm-reset';

export function ResetPasswordForm({ token }: { token: string }) {
  const [password, setPassword] = useState('');
  const [repeat, setRepeat] = useState('');
  const [problems, setProblems] = useState<{ password?: string; repeat?: string }>({});
  const confirm = useConfirmReset();

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const found = {
      password: newPasswordProblem(password),
      repeat: repeat === password ? undefined : 'The two passwords differ.',
    };
    setProblems(found);
    if (!found.password && !found.repeat) confirm.mutate({ token, newPassword: password });
  };

  if (confirm.isSuccess) {
    return (
      <Alert severity="success" role="status">
        Your password is changed. <Link component={RouterLink} to="/sign-in">Sign in</Link> with the new one.
      </Alert>
    );
  }
  return (
    <Stack component="form" noValidate onSubmit={submit} spacing={2} aria-label="Choose a new password">
      {confirm.isError && (
        <Alert severity="error">
          {errorMessage(confirm.error)} <Link component={RouterLink} to="/reset">Ask for a new link</Link>.
        </Alert>
      )}
      <TextField label="New password" type="password" autoComplete="new-password" value={password}
        onChange={(e) => setPassword(e.target.value)} error={!!problems.password} helperText={problems.password} autoFocus />
      <TextField label="Repeat the new password" type="password" autoComplete="new-password" value={repeat}
        onChange={(e) => setRepeat(e.target.value)} error={!!problems.repeat} helperText={problems.repeat} />
      <Button type="submit" variant="contained" size="medium" disabled={confirm.isPending}>
        Set new password
      </Button>
    </Stack>
  );
}
