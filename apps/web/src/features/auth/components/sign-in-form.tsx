import type { UserView } from '@cribra/contracts';
import { Alert, Button, Stack, TextField } from '@mui/material';
import { type FormEvent, useState } from 'react';
import { ApiRequestError, errorMessage } from '../../../lib/api-error';
import { emailProblem, requiredProblem } from '../../../lib/validation';
import { useSignIn } from '../api/sign-in';

interface Props {
  onSignedIn: (user: UserView) => void;
  /** Filled in when the page was reached from an invitation (the invited address). */
  initialEmail?: string;
}

function serverMessage(err: unknown): string {
  if (err instanceof ApiRequestError && err.statusCode === 429) return 'Too many sign-in attempts. Wait a minute and try again.';
  return errorMessage(err);
}

export function SignInForm({ onSignedIn, initialEmail = '' }: Props) {
  const [email, setEmail] = useState(initialEmail);
  const [password, setPassword] = useState('');
  const [problems, setProblems] = useState<{ email?: string; password?: string }>({});
  const signIn = useSignIn();

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const found = { email: emailProblem(email), password: requiredProblem(password, 'your password') };
    setProblems(found);
    if (found.email || found.password) return;
    signIn.mutate({ email: email.trim(), password }, { onSuccess: onSignedIn });
  };

  return (
    <Stack component="form" noValidate onSubmit={submit} spacing={2} aria-label="Sign in">
      {signIn.isError && <Alert severity="error">{serverMessage(signIn.error)}</Alert>}
      <TextField
        label="E-mail"
        type="email"
        autoComplete="username"
        value={email}
        onChange={(e) => setEmail(e.target.value)}
        error={!!problems.email}
        helperText={problems.email}
        autoFocus
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="current-password"
        value={password}
        onChange={(e) => setPassword(e.target.value)}
        error={!!problems.password}
        helperText={problems.password}
      />
      <Button type="submit" variant="contained" size="medium" disabled={signIn.isPending}>
        {signIn.isPending ? 'Signing in…' : 'Sign in'}
      </Button>
    </Stack>
  );
}
