import { MIN_PASSWORD_LENGTH, type UserView } from '@cribra/contracts';
import { Alert, Button, Stack, TextField } from '@mui/material';
import { type FormEvent, useState } from 'react';
import { ApiRequestError, errorMessage } from '../../../lib/api-error';
import { emailProblem, newPasswordProblem, requiredProblem } from '../../../lib/validation';
import { useSignUp } from '../api/sign-up';

interface Props {
  invitationToken?: string;
  onSignedUp: (user: UserView) => void;
  /** Filled in when the page was reached from an invitation (the invited address). */
  initialEmail?: string;
}

type Field = 'email' | 'displayName' | 'password';

export function SignUpForm({ invitationToken, onSignedUp, initialEmail = '' }: Props) {
  const [values, setValues] = useState<Record<Field, string>>({ email: initialEmail, displayName: '', password: '' });
  const [problems, setProblems] = useState<Partial<Record<Field, string>>>({});
  const signUp = useSignUp();
  const serverFields = signUp.error instanceof ApiRequestError ? signUp.error.fieldErrors : {};

  const set = (f: Field) => (e: { target: { value: string } }) => setValues((v) => ({ ...v, [f]: e.target.value }));

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const found = {
      email: emailProblem(values.email),
      displayName: requiredProblem(values.displayName, 'the name others will see'),
      password: newPasswordProblem(values.password),
    };
    setProblems(found);
    if (Object.values(found).some(Boolean)) return;
    signUp.mutate(
      { email: values.email.trim(), displayName: values.displayName.trim(), password: values.password, invitationToken },
      { onSuccess: onSignedUp },
    );
  };

  const problem = (f: Field) => problems[f] ?? serverFields[f];

  return (
    <Stack component="form" noValidate onSubmit={submit} spacing={2} aria-label="Create an account">
      {signUp.isError && <Alert severity="error">{errorMessage(signUp.error)}</Alert>}
      <TextField label="E-mail" type="email" autoComplete="email" value={values.email} onChange={set('email')}
        error={!!problem('email')} helperText={problem('email')} autoFocus />
      <TextField label="Display name" autoComplete="name" value={values.displayName} onChange={set('displayName')}
        error={!!problem('displayName')} helperText={problem('displayName') ?? 'Shown to your co-authors and reviewers.'} />
      <TextField label="Password" type="password" autoComplete="new-password" value={values.password} onChange={set('password')}
        error={!!problem('password')} helperText={problem('password') ?? `At least ${MIN_PASSWORD_LENGTH} characters.`} />
      <Button type="submit" variant="contained" size="medium" disabled={signUp.isPending}>
        {signUp.isPending ? 'Creating account…' : 'Create account'}
      </Button>
    </Stack>
  );
}
