import { Alert, Box, Button, Link, Paper, Typography } from '@mui/material';
import { Link as RouterLink, useNavigate, useParams } from 'react-router-dom';
import { LoadingState } from '../../../components/loading-state';
import { useDocumentTitle } from '../../../hooks/use-document-title';
import { ApiRequestError, errorMessage } from '../../../lib/api-error';
import { useCurrentUser } from '../../../lib/current-user';
import { monoFont } from '../../../lib/design-tokens';
import { formatDateTime } from '../../../lib/format';
import { useAcceptInvitation } from '../api/accept-invitation';
import { useInvitationPreview } from '../api/get-invitation-preview';
import { InvitedSignUpForm } from '../components/invited-sign-up-form';

function refusal(err: unknown): string {
  if (err instanceof ApiRequestError && err.statusCode === 404) return 'This invitation link is not known. Check that it was copied whole.';
  if (err instanceof ApiRequestError && err.statusCode === 410) return 'This invitation was already used, revoked or has expired. Ask the notebook owner for a new one.';
  return errorMessage(err);
}

/** Reached from the e-mailed link: accept, signing in or creating an account on the way. */
export default function InvitationPage() {
  useDocumentTitle('Invitation');
  const { token = '' } = useParams();
  const navigate = useNavigate();
  const preview = useInvitationPreview(token);
  const me = useCurrentUser();
  const accept = useAcceptInvitation();
  const here = `/invitations/${encodeURIComponent(token)}`;
  const open = (notebookId: string) => navigate(`/notebooks/${notebookId}`, { replace: true });

  let body;
  if (preview.isPending || me.isPending) body = <LoadingState />;
  else if (preview.isError) body = <Alert severity="error">{refusal(preview.error)}</Alert>;
  else {
    const p = preview.data;
    const wrongAccount = me.data && me.data.email.toLowerCase() !== p.email.toLowerCase();
    body = (
      <>
        <Typography sx={{ mb: 2 }}>
          {p.invitedBy.displayName} invites <strong>{p.email}</strong> to join <strong>{p.notebookTitle}</strong> as {p.role}.
          The link works until {formatDateTime(p.expiresAt)}.
        </Typography>
        {accept.isError && <Alert severity="error" sx={{ mb: 2 }}>{refusal(accept.error)}</Alert>}
        {me.data && !wrongAccount && (
          <Button variant="contained" size="medium" onClick={() => accept.mutate(token, { onSuccess: (r) => open(r.notebookId) })} disabled={accept.isPending}>
            Accept and open the notebook
          </Button>
        )}
        {wrongAccount && (
          <Alert severity="warning">You are signed in as {me.data!.email}. Sign out and sign in as {p.email} to accept.</Alert>
        )}
        {!me.data && p.accountExists && (
          <Button variant="contained" size="medium" component={RouterLink} to={`/sign-in?next=${encodeURIComponent(here)}&email=${encodeURIComponent(p.email)}`}>
            Sign in as {p.email} to accept
          </Button>
        )}
        {!me.data && !p.accountExists && <InvitedSignUpForm token={token} preview={p} onJoined={() => open(p.notebookId)} />}
      </>
    );
  }

  return (
    <Box component="main" sx={{ minHeight: '100vh', display: 'grid', placeItems: 'center', p: 2 }}>
      <Box sx={{ width: '100%', maxWidth: 520 }}>
        <Typography sx={{ fontFamily: monoFont, fontWeight: 600, letterSpacing: '0.12em', fontSize: 20, mb: 2 }}>CRIBRA</Typography>
        <Paper sx={{ p: 3 }}>
          <Typography variant="h2" component="h1" sx={{ mb: 2 }}>Invitation to a notebook</Typography>
          {body}
        </Paper>
        <Link component={RouterLink} to="/notebooks" sx={{ display: 'inline-block', mt: 2 }}>Go to my notebooks</Link>
      </Box>
    </Box>
  );
}
