import { MIN_PASSWORD_LENGTH, type InvitationPreview } from '@cribra/contracts';
import { Alert, Button, Stack, TextField } from '@mui/material';
import { type FormEvent, useState } from 'react';
import { errorMessage } from '../../../lib/api-error';
import { newPasswordProblem, requiredProblem } from '../../../lib/validation';
import { useSignUpInvited } from '../api/sign-up-invited';

interface Props {
  token: string;
  preview: InvitationPreview;
  onJoined: () => void;
}

/** Create an account for the invited address; it joins the notebook on creation. */
export function InvitedSignUpForm({ token, preview, onJoined }: Props) {
  const [displayName, setDisplayName] = useState('');
  const [password, setPassword] = useState('');
  const [problems, setProblems] = useState<{ displayName?: string; password?: string }>({});
  const signUp = useSignUpInvited();

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const found = { displayName: requiredProblem(displayName, 'the name others will see'), password: newPasswordProblem(password) };
    setProblems(found);
    if (found.displayName || found.password) return;
    signUp.mutate({ email: preview.email, displayName: displayName.trim(), password, invitationToken: token }, { onSuccess: onJoined });
  };

  return (
    <Stack component="form" noValidate spacing={2} onSubmit={submit} aria-label="Create your account">
      {signUp.isError && <Alert severity="error">{errorMessage(signUp.error)}</Alert>}
      <TextField label="E-mail" value={preview.email} helperText="The invited address." slotProps={{ htmlInput: { readOnly: true } }} />
      <TextField label="Display name" value={displayName} onChange={(e) => setDisplayName(e.target.value)} autoFocus
        error={!!problems.displayName} helperText={problems.displayName} />
      <TextField label="Password" type="password" autoComplete="new-password" value={password} onChange={(e) => setPassword(e.target.value)}
        error={!!problems.password} helperText={problems.password ?? `At least ${MIN_PASSWORD_LENGTH} characters.`} />
      <Button type="submit" variant="contained" size="medium" disabled={signUp.isPending}>Create account and join</Button>
    </Stack>
  );
}
