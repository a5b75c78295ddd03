import type { ReviewDecision, ReviewStateView, VerificationSummary } from '@cribra/contracts';
import { Alert, Button, Stack, TextField, Typography } from '@mui/material';
import { useState } from 'react';
import { errorMessage } from '../../../lib/api-error';
import { useCreateReview } from '../api/create-review';

interface Props {
  notebookId: string;
  state: ReviewStateView;
  verification: VerificationSummary | null;
  onChanged: () => void;
}

/** A reviewer's decision on this revision: sign off (after a clean re-verify of it) or ask for changes. */
export function ReviewForm({ notebookId, state, verification, onChanged }: Props) {
  const [comment, setComment] = useState('');
  const [problem, setProblem] = useState<string>();
  const review = useCreateReview(notebookId, onChanged);
  const cleanVerify = !!verification && verification.status === 'done' && verification.allSame && verification.revisionDigest === state.revisionDigest;

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
      {!cleanVerify && (
        <Typography variant="body2" color="text.secondary">A sign-off needs a re-verify of this revision in which every cell gave the same outputs.</Typography>
      )}
      <Stack direction="row" spacing={1}>
        <Button variant="contained" onClick={() => decide('signoff')} disabled={!cleanVerify || review.isPending}>Sign off</Button>
        <Button variant="outlined" onClick={() => decide('changes_requested')} disabled={review.isPending}>Ask for changes</Button>
      </Stack>
    </Stack>
  );
}
