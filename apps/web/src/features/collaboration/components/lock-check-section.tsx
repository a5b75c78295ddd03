import { Alert, Box, Button, CircularProgress, Stack, Typography } from '@mui/material';
import { useState } from 'react';
import { errorMessage } from '../../../lib/api-error';
import { formatDateTime } from '../../../lib/format';
import { useVerification } from '../api/get-verification';
import { useVerifications } from '../api/list-verifications';
import { useStartLockCheck } from '../api/start-lock-check';
import { VerificationResults } from './verification-results';

/**
 * Re-runs a locked notebook against its lock record and shows, per cell, whether the outputs are the
 * same, differ or the re-run failed. The check is queued; it is followed by polling, as re-verify is.
 * Until one is started here, the latest earlier check is shown (also one still running, e.g. after a
 * reload of the page).
 */
export function LockCheckSection({ notebookId }: { notebookId: string }) {
  const start = useStartLockCheck(notebookId);
  const [checkId, setCheckId] = useState<string | null>(null);
  const earlier = useVerifications(notebookId).data?.find((v) => v.purpose === 'lock');
  const shownId = checkId ?? earlier?.id ?? null;
  const check = useVerification(shownId, notebookId);
  const running = start.isPending || check.data?.status === 'running';

  return (
    <Stack spacing={1} component="section" aria-label="Re-check the record" sx={{ mt: 2 }}>
      <Typography variant="h4" component="h3">Re-check</Typography>
      <Typography variant="body2" color="text.secondary">
        Runs every cell again from its locked source and compares the outputs with the record. The record itself is not changed.
      </Typography>
      <Box>
        <Button variant="outlined" disabled={running} onClick={() => start.mutate(undefined, { onSuccess: (v) => setCheckId(v.id) })}
          startIcon={running ? <CircularProgress size={14} aria-hidden /> : undefined}>
          Re-check the record
        </Button>
      </Box>
      {start.isError && <Alert severity="error">{errorMessage(start.error)}</Alert>}
      {check.isError && !check.data && <Alert severity="error">Could not follow the re-check: {errorMessage(check.error)}</Alert>}
      {check.data && !checkId && (
        <Typography variant="body2" color="text.secondary">
          Last re-check, started {formatDateTime(check.data.createdAt)} by {check.data.requestedBy.displayName}:
        </Typography>
      )}
      {check.data && <VerificationResults verification={check.data} />}
      {check.data && (
        <Typography variant="body2" sx={{ fontStyle: 'italic' }}>
          Matching outputs show that the computation repeats as recorded. Computed evidence is not a proof.
        </Typography>
      )}
    </Stack>
  );
}
