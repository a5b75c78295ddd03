import type { RunView } from '@cribra/contracts';
import { Box, LinearProgress, Typography } from '@mui/material';

/** A queued or running run: a bar (indeterminate until the runner reports a fraction) and its note. */
export function RunProgress({ run }: { run: RunView }) {
  const pct = Math.round(run.progress * 100);
  const known = run.status === 'running' && run.progress > 0;
  return (
    <Box role="status" aria-live="polite" sx={{ my: 1 }}>
      <LinearProgress
        variant={known ? 'determinate' : 'indeterminate'}
        value={pct}
        aria-label={run.status === 'queued' ? 'Waiting for a runner' : 'Running'}
      />
      <Typography variant="caption" color="text.secondary">
        {run.status === 'queued' ? 'Queued, waiting for a runner…' : `Running${known ? ` · ${pct}%` : '…'}`}
        {run.progressNote ? ` · ${run.progressNote}` : ''}
      </Typography>
    </Box>
  );
}
