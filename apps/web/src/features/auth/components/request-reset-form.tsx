import { Alert, Button, Stack, TextField } from '@mui/material';
import { type FormEvent, useState } from 'react';
import { errorMessage } from '../../../lib/api-error';
import { emailProblem } from '../../../lib/validation';
import { useRequestReset } from '../api/request-reset';

export function RequestResetForm() {
  const [email, setEmail] = useState('');
  const [problem, setProblem] = useState<string | undefined>();
  const request = useRequestReset();

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const found = emailProblem(email);
    setProblem(found);
    if (!found) request.mutate({ email: email.trim() });
  };

  if (request.isSuccess) {
    return (
      <Alert severity="success" role="status">
        If an account uses {email.trim()}, a reset link is on its way. The link works once, for one hour.
      </Alert>
    );
  }
  return (
    <Stack component="form" noValidate onSubmit={submit} spacing={2} aria-label="Request a password reset">
      {request.isError && <Alert severity="error">{errorMessage(request.error)}</Alert>}
      <TextField label="E-mail" type="email" autoComplete="email" value={email} onChange={(e) => setEmail(e.target.value)}
        error={!!problem} helperText={problem} autoFocus />
      <Button type="submit" variant="contained" size="medium" disabled={request.isPending}>
        Send reset link
      </Button>
    </Stack>
  );
}
