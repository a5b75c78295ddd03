import { MIN_PASSWORD_LENGTH } from '@cribra/contracts';
import { Alert, Button, Stack, TextField } from '@mui/material';
import { type FormEvent, useState } from 'react';
import { errorMessage } from '../../../lib/api-error';
import { newPasswordProblem, requiredProblem } from '../../../lib/validation';
import { useChangePassword } from '../api/change-password';

type Field = 'currentPassword' | 'newPassword' | 'repeat';
const empty: Record<Field, string> = { currentPassword: '', newPassword: '', repeat: '' };

export function ChangePasswordForm() {
  const [values, setValues] = useState(empty);
  const [problems, setProblems] = useState<Partial<Record<Field, string>>>({});
  const change = useChangePassword();
  const set = (f: Field) => (e: { target: { value: string } }) => setValues((v) => ({ ...v, [f]: e.target.value }));

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const found = {
      currentPassword: requiredProblem(values.currentPassword, 'your current password'),
      newPassword: newPasswordProblem(values.newPassword),
      repeat: values.repeat === values.newPassword ? undefined : 'The two passwords differ.',
    };
    setProblems(found);
    if (Object.values(found).some(Boolean)) return;
    change.mutate(
      { currentPassword: values.currentPassword, newPassword: values.newPassword },
      { onSuccess: () => setValues(empty) },
    );
  };

  return (
    <Stack component="form" noValidate onSubmit={submit} spacing={2} aria-label="Change password">
      {change.isSuccess && <Alert severity="success" role="status">Password changed.</Alert>}
      {change.isError && <Alert severity="error">{errorMessage(change.error)}</Alert>}
      <TextField label="Current password" type="password" autoComplete="current-password" value={values.currentPassword}
        onChange={set('currentPassword')} error={!!problems.currentPassword} helperText={problems.currentPassword} />
      <TextField label="New password" type="password" autoComplete="new-password" value={values.newPassword}
        onChange={set('newPassword')} error={!!problems.newPassword} helperText={problems.newPassword ?? `At least ${MIN_PASSWORD_LENGTH} characters.`} />
      <TextField label="Repeat the new password" type="password" autoComplete="new-password" value={values.repeat}
        onChange={set('repeat')} error={!!problems.repeat} helperText={problems.repeat} />
      <div>
        <Button type="submit" variant="contained" disabled={change.isPending}>Change password</Button>
      </div>
    </Stack>
  );
}
