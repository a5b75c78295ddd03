import type { NotebookView, SiteRole, VerificationSummary } from '@cribra/contracts';
import { Alert, Box, Button, Chip, List, ListItem, ListItemText, Stack, Typography } from '@mui/material';
import { useState } from 'react';
import { LoadingState } from '../../../components/loading-state';
import { errorMessage } from '../../../lib/api-error';
import { formatDateTime } from '../../../lib/format';
import { useReviewState } from '../api/get-review-state';
import { useVerification } from '../api/get-verification';
import { useVerifications } from '../api/list-verifications';
import { useRequestReview } from '../api/request-review';
import { useStartVerification } from '../api/start-verification';
import { canCheckLock } from '../lib/who-may';
import { LockDialog } from './lock-dialog';
import { LockRecordView } from './lock-record-view';
import { ReviewForm } from './review-form';
import { VerificationResults } from './verification-results';

interface Props {
  notebook: NotebookView;
  userId?: string;
  siteRole?: SiteRole;
  onChanged: () => void;
}

export function ReviewSection({ notebook, userId, siteRole, onChanged }: Props) {
  const state = useReviewState(notebook.id, notebook.revision);
  const request = useRequestReview(notebook.id, onChanged);
  const reverify = useStartVerification(notebook.id);
  const [verificationId, setVerificationId] = useState<string | null>(null);
  const shownId = verificationId ?? state.data?.latestVerification?.id ?? null;
  const verification = useVerification(shownId, notebook.id);
  const [locking, setLocking] = useState(false);
  const isReviewer = notebook.myRole === 'reviewer';
  const all = useVerifications(notebook.id, isReviewer);

  if (notebook.status === 'locked') return <LockRecordView notebookId={notebook.id} canCheck={canCheckLock({ myRole: notebook.myRole, siteRole })} />;
  if (state.isPending) return <LoadingState label="Loading the review…" />;
  if (state.isError) return <Alert severity="error">{errorMessage(state.error)}</Alert>;
  const s = state.data;
  const role = notebook.myRole;
  const isOwner = role === 'owner';
  const canVerify = role === 'owner' || role === 'editor' || role === 'reviewer' || siteRole === 'admin';
  const error = request.error ?? reverify.error;
  const startReverify = () => reverify.mutate(undefined, { onSuccess: (v) => setVerificationId(v.id) });
  // A sign-off rests on a re-verify the reviewer ran on this revision (the API checks the same).
  const isMineNow = (v: VerificationSummary | null | undefined): v is VerificationSummary =>
    !!v && v.requestedBy.id === userId && v.purpose === 'review' && v.revisionDigest === s.revisionDigest;
  const myVerification = [verification.data, ...(all.data ?? [])].find(isMineNow) ?? null;
  const showForm = role === 'reviewer' && s.status === 'in_review' && !s.validSignoffs.some((r) => r.reviewer.id === userId);
  // The review form then offers "Re-verify this revision yourself" itself: one button, not two.
  const formOffersReverify = showForm && myVerification === null;

  return (
    <Stack spacing={2}>
      <Box>
        <Typography variant="h4" component="h3">Review</Typography>
        <Typography variant="body2" color="text.secondary">
          {s.status === 'draft' ? 'Draft: not yet sent for review.' : `In review since ${s.reviewRequestedAt ? formatDateTime(s.reviewRequestedAt) : '—'}.`}
        </Typography>
        <Typography className="mono" sx={{ fontSize: 11, wordBreak: 'break-all' }} title="Revision digest">rev {s.notebookRevision} · {s.revisionDigest.slice(0, 16)}</Typography>
        <Typography variant="body2" sx={{ mt: 0.5 }}>
          Sign-offs on this revision: <strong>{s.validSignoffs.length}</strong> of {s.requiredSignoffs}
        </Typography>
        <List dense disablePadding>
          {s.validSignoffs.map((r) => (
            <ListItem key={r.id} disableGutters><ListItemText primary={`✓ ${r.reviewer.displayName}`} secondary={formatDateTime(r.createdAt)} /></ListItem>
          ))}
        </List>
      </Box>
      {error && <Alert severity="error">{errorMessage(error)}</Alert>}
      <Stack direction="row" spacing={1} useFlexGap sx={{ flexWrap: "wrap" }}>
        {isOwner && s.status === 'draft' && (
          <Button variant="contained" onClick={() => request.mutate({})} disabled={request.isPending}>Ask for review</Button>
        )}
        {canVerify && !formOffersReverify && (
          <Button variant="outlined" onClick={startReverify}
            disabled={reverify.isPending || verification.data?.status === 'running'}>
            Re-verify
          </Button>
        )}
        {(isOwner || siteRole === 'admin') && (
          <Button variant="contained" onClick={() => setLocking(true)} disabled={!s.canLock}>Lock…</Button>
        )}
      </Stack>
      {(isOwner || siteRole === 'admin') && !s.canLock && s.lockBlockers.length > 0 && (
        <Box>
          <Typography variant="body2" color="text.secondary">Before locking:</Typography>
          <List dense disablePadding>
            {s.lockBlockers.map((b) => <ListItem key={b} disableGutters sx={{ display: 'list-item', ml: 2 }}><Typography variant="body2">{b}</Typography></ListItem>)}
          </List>
        </Box>
      )}
      {verification.data && (
        <Box>
          <Typography variant="h4" component="h3" sx={{ mb: 0.5 }}>
            Re-verify <Chip size="small" label={verification.data.status} />
          </Typography>
          <VerificationResults verification={verification.data} />
        </Box>
      )}
      {role === 'reviewer' && s.status === 'in_review' && s.validSignoffs.some((r) => r.reviewer.id === userId) && (
        <Alert severity="success" role="status">You signed off this revision.</Alert>
      )}
      {showForm && (
        <ReviewForm notebookId={notebook.id} state={s} verification={myVerification} onChanged={onChanged}
          onReverify={startReverify} reverifying={reverify.isPending || verification.data?.status === 'running'} />
      )}
      {locking && <LockDialog notebookId={notebook.id} cellCount={notebook.cells.length} state={s} onClose={() => setLocking(false)} onChanged={onChanged} />}
    </Stack>
  );
}
