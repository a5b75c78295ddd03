import type { ReviewDecision, ReviewStateView, VerificationSummary } from '@cribra/contracts';
import { Alert, Button, Stack, TextField, Typography } from '@mui/material';
import { useState } from 'react';
import { errorMessage } from '../../../lib/api-error';
import { useCreateReview } from '../api/create-review';

interface Props {
  notebookId: string;
  state: ReviewStateView;
  /** The reviewer's own latest re-verify of the current revision, if any. */
  verification: VerificationSummary | null;
  onChanged: () => void;
  /** Starts a re-verify (offered in the sign-off button's place until the reviewer has run one). */
  onReverify: () => void;
  reverifying: boolean;
}

/** What the reviewer must do before a sign-off, or null when they may sign off now. */
function signoffBlocker(v: VerificationSummary | null, state: ReviewStateView): 'reverify' | 'running' | 'differs' | null {
  if (!v || v.revisionDigest !== state.revisionDigest) return 'reverify';
  if (v.status !== 'done') return 'running';
  return v.allSame ? null : 'differs';
}

/**
 * A reviewer's decision on this revision: sign off (only after a clean re-verify of it that the
 * reviewer ran: the API refuses any other) or ask for changes.
 */
export function ReviewForm({ notebookId, state, verification, onChanged, onReverify, reverifying }: Props) {
  const [comment, setComment] = useState('');
  const [problem, setProblem] = useState<string>();
  const review = useCreateReview(notebookId, onChanged);
  const blocker = signoffBlocker(verification, state);

  const decide = (decision: ReviewDecision) => {
    if (!comment.trim()) return setProblem('Say what you checked (or what must change).');
    setProblem(undefined);
    review.mutate(
      { decision, comment: comment.trim(), revisionDigest: state.revisionDigest, verificationId: decision === 'signoff' ? verification?.id : undefined },
      { onSuccess: () => setComment('') },
    );
  };

  return (
    <Stack spacing={1.5} component="section" aria-label="Your review">
      <Typography variant="h4" component="h3">Your review</Typography>
      {review.isError && <Alert severity="error">{errorMessage(review.error)}</Alert>}
      {review.isSuccess && <Alert severity="success" role="status">{review.data.decision === 'signoff' ? 'Signed off.' : 'Changes asked for.'}</Alert>}
      <TextField label="Review comment" value={comment} onChange={(e) => setComment(e.target.value)} multiline minRows={3}
        error={!!problem} helperText={problem ?? 'Markdown; kept with the sign-off.'} />
      <Stack direction="row" spacing={1} sx={{ alignItems: 'center' }}>
        {blocker === null && <Button variant="contained" onClick={() => decide('signoff')} disabled={review.isPending}>Sign off</Button>}
        {blocker === 'reverify' && (
          <Button variant="contained" onClick={onReverify} disabled={reverifying}>Re-verify this revision yourself</Button>
        )}
        {blocker === 'running' && <Typography variant="body2" role="status">Your re-verify of this revision is running; sign off when it is done.</Typography>}
        {blocker === 'differs' && <Typography variant="body2">Your re-verify did not reproduce every cell: ask for changes.</Typography>}
        <Button variant="outlined" onClick={() => decide('changes_requested')} disabled={review.isPending}>Ask for changes</Button>
      </Stack>
    </Stack>
  );
}
